import autocannon from 'autocannon';
import { Client, signedIn } from '../tests/support/http-client';
import { extra, log, notAvailable, record, round } from './lib';
import { optional } from './optional';

// HTTP throughput with autocannon: 50 connections, a warm-up, then BENCH_SECONDS (default 20)
// per route. Throughput is reported against /api/health, the framework-and-database floor.
// Tail latency is measured apart, at 10 connections (a realistic load): at a fixed concurrency
// the mean latency is concurrency ÷ throughput, so a p99 in milliseconds at 50 connections
// measures the machine; p99 ÷ p50 at 10 says whether some requests wait far longer than most.
const CONNECTIONS = 50;
const TAIL_CONNECTIONS = 10;
const SIGNED_IN_RATIO = 0.6;
const SECONDS = Number(process.env.BENCH_SECONDS ?? 20);
const WARMUP = Math.max(2, Math.round(SECONDS / 5));

interface Measured {
  reqPerSec: number;
  p50: number;
  p99: number;
  errors: number;
  non2xx: number;
  total: number;
}

type BenchRoute = { method: string; path: string; headers?: Record<string, string>; bodies?: () => string; paths?: () => string };

async function run(base: string, route: BenchRoute, seconds: number, connections = CONNECTIONS): Promise<Measured> {
  const result = await autocannon({
    url: base,
    connections,
    duration: seconds,
    requests: [
      {
        method: route.method as 'GET',
        path: route.path,
        headers: route.headers,
        ...(route.bodies || route.paths
          ? {
              setupRequest: (req: Record<string, unknown>) => {
                if (route.bodies) req.body = route.bodies();
                if (route.paths) req.path = route.paths();
                return req;
              },
            }
          : {}),
      },
    ],
  });
  return {
    reqPerSec: result.requests.average,
    p50: result.latency.p50,
    p99: result.latency.p99,
    errors: result.errors + result.timeouts,
    non2xx: result.non2xx,
    total: result.requests.total,
  };
}

/** Realistic evaluate bodies from the wizard's own enums, checked against its schema. */
export async function evaluateBodies(base: string): Promise<string[] | null> {
  const types = await optional<Record<string, readonly string[]>>('lib/wizard/types');
  const validation = await optional<{ evaluateBodySchema: { safeParse(v: unknown): { success: boolean } } }>('lib/validation/wizard');
  if (!types || !validation) return null;
  const list = await fetch(`${base}/api/species?limit=100`)
    .then((r) => (r.ok ? r.json() : null))
    .catch(() => null);
  const slugs: string[] = list?.items?.map((s: { slug: string }) => s.slug) ?? [];
  if (!slugs.length) return null;
  const t = types;
  let seed = 7;
  const rnd = () => (seed = (seed * 1103515245 + 12345) & 0x7fffffff) / 0x7fffffff;
  const pick = <T>(a: readonly T[]) => a[Math.floor(rnd() * a.length)];
  const bodies: string[] = [];
  for (let i = 0; bodies.length < 400 && i < 5000; i++) {
    const month = 1 + Math.floor(rnd() * 12);
    const day = 1 + Math.floor(rnd() * 28);
    const body: Record<string, unknown> = {
      species: pick(slugs),
      branching: pick(t.branchingLevels),
      date: `2026-${String(month).padStart(2, '0')}-${String(day).padStart(2, '0')}`,
      shoot: pick(t.shootStates),
      position: pick(t.positions),
      health: pick(t.healthLevels),
    };
    if (rnd() < 0.3) body.latitude = Math.round((rnd() * 120 - 60) * 10) / 10;
    else if (rnd() < 0.2) body.hemisphere = pick(t.hemispheres);
    if (rnd() < 0.3) body.container = { shape: 'round', lengthCm: 15 + Math.round(rnd() * 40) };
    if (rnd() < 0.2) body.backBuds = rnd() < 0.5;
    if (rnd() < 0.1) body.recentlyCollected = rnd() < 0.3;
    if (validation.evaluateBodySchema.safeParse(body).success) bodies.push(JSON.stringify(body));
  }
  return bodies.length ? bodies : null;
}

export async function benchHttp(base: string) {
  const section = 'http';
  const out: Record<string, Measured> = {};

  const measure = async (name: string, route: BenchRoute) => {
    log(`warm-up ${name} (${WARMUP} s)`);
    await run(base, route, WARMUP);
    log(`measure ${name} (${SECONDS} s, ${CONNECTIONS} connections)`);
    const m = await run(base, route, SECONDS);
    out[name] = m;
    return m;
  };

  const health = await measure('GET /api/health', { method: 'GET', path: '/api/health' });
  const tails: [string, BenchRoute][] = [];
  const report = (name: string, m: Measured, ratioTarget?: number, p99Target?: number) => {
    const ratio = m.reqPerSec / health.reqPerSec;
    record({ section, name: `${name} req/s`, value: m.reqPerSec, unit: 'req/s', pass: null });
    record({
      section,
      name: `${name} ratio to health`,
      value: round(ratio, 2),
      unit: '×',
      target: ratioTarget ? `≥ ${ratioTarget}×` : undefined,
      pass: ratioTarget ? ratio >= ratioTarget : null,
    });
    record({ section, name: `${name} p50`, value: m.p50, unit: 'ms', pass: null });
    record({
      section,
      name: `${name} p99`,
      value: m.p99,
      unit: 'ms',
      target: p99Target ? `≤ ${p99Target} ms` : undefined,
      pass: p99Target ? m.p99 <= p99Target : null,
    });
    record({ section, name: `${name} errors`, value: m.errors + m.non2xx, unit: `of ${m.total}`, target: '0', pass: m.errors + m.non2xx === 0 });
  };
  record({ section, name: 'GET /api/health req/s', value: health.reqPerSec, unit: 'req/s', pass: null, note: 'the floor' });
  record({ section, name: 'GET /api/health p50', value: health.p50, unit: 'ms', pass: null });
  record({ section, name: 'GET /api/health p99', value: health.p99, unit: 'ms', pass: null });
  record({
    section,
    name: 'GET /api/health errors',
    value: health.errors + health.non2xx,
    unit: `of ${health.total}`,
    target: '0',
    pass: health.errors + health.non2xx === 0,
  });

  // POST /api/wizard/evaluate with a mix of bodies.
  const bodies = await evaluateBodies(base);
  const probe = bodies
    ? await fetch(`${base}/api/wizard/evaluate`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: bodies[0] })
    : null;
  if (!bodies || !probe || probe.status === 404) {
    notAvailable(section, 'POST /api/wizard/evaluate', 'the route or the wizard enums are not in this build', '≥ 0.7× health');
  } else {
    await probe.body?.cancel();
    let i = 0;
    const m = await measure('POST /api/wizard/evaluate', {
      method: 'POST',
      path: '/api/wizard/evaluate',
      headers: { 'content-type': 'application/json' },
      bodies: () => bodies[i++ % bodies.length],
    });
    report('POST /api/wizard/evaluate', m, 0.7);
    tails.push([
      'POST /api/wizard/evaluate',
      { method: 'POST', path: '/api/wizard/evaluate', headers: { 'content-type': 'application/json' }, bodies: () => bodies[i++ % bodies.length] },
    ]);
    extra.evaluateBodies = bodies.length;
  }

  // GET /api/species?q=… with typo'd and partial queries.
  const queries = [
    'sylvestris',
    'mugo',
    'thunbergii',
    'black pine',
    'scots',
    'pinus',
    'parviflora',
    'densiflora',
    'juniper',
    'larch',
    'sylvestri',
    'thunbergi',
    'blak pine',
    'mug',
  ];
  const sp = await fetch(`${base}/api/species?q=mugo`);
  if (sp.status === 404) {
    notAvailable(section, 'GET /api/species?q=', 'the route is not in this build', '≥ 0.7× health');
  } else {
    await sp.body?.cancel();
    let i = 0;
    const route = { method: 'GET', path: '/api/species?q=sylvestris' };
    // autocannon rotates paths through setupRequest as well.
    const m = await measureWithPaths('GET /api/species?q=', () => `/api/species?q=${encodeURIComponent(queries[i++ % queries.length])}`, route);
    report('GET /api/species?q=', m, 0.7);
    tails.push([
      'GET /api/species?q=',
      { method: 'GET', path: route.path, paths: () => `/api/species?q=${encodeURIComponent(queries[i++ % queries.length])}` },
    ]);
  }

  // A signed-in member's first page of answers.
  const member = await signedIn(base, 'member@candlewise.test');
  const answersProbe = await member.get('/api/answers');
  await answersProbe.body?.cancel();
  if (answersProbe.status === 404) {
    notAvailable(section, 'GET /api/answers (signed in)', 'the route is not in this build');
  } else {
    if (bodies) await fillAnswers(member, bodies);
    const cookie = { cookie: member.cookieHeader() };
    const m = await measure('GET /api/answers (signed in)', { method: 'GET', path: '/api/answers', headers: cookie });
    report('GET /api/answers (signed in)', m, SIGNED_IN_RATIO);
    tails.push(['GET /api/answers (signed in)', { method: 'GET', path: '/api/answers', headers: cookie }]);
    // The member's other reads: one answer, the trees, one tree's plan, the notes.
    const first = (await (await member.get('/api/answers')).json()) as { items?: { id: string }[] };
    const trees = (await (await member.get('/api/trees')).json()) as { items?: { id: string }[]; trees?: { id: string }[] };
    const treeId = (trees.items ?? trees.trees ?? [])[0]?.id;
    const reads: [string, string | undefined][] = [
      ['GET /api/answers/[id] (signed in)', first.items?.[0] ? `/api/answers/${first.items[0].id}` : undefined],
      ['GET /api/trees (signed in)', '/api/trees'],
      ['GET /api/trees/[id]/plan (signed in)', treeId ? `/api/trees/${treeId}/plan` : undefined],
      ['GET /api/notes (signed in)', '/api/notes'],
    ];
    for (const [name, path] of reads) {
      const probe = path ? await member.get(path) : null;
      await probe?.body?.cancel();
      if (!path || !probe || probe.status !== 200) {
        notAvailable(section, name, path ? `the probe answered ${probe?.status}` : 'the demo member has none', `≥ ${SIGNED_IN_RATIO}× health`);
        continue;
      }
      report(name, await measure(name, { method: 'GET', path, headers: cookie }), SIGNED_IN_RATIO);
    }
  }

  // Tail latency at 10 connections: p99 within 3× p50.
  for (const [name, r] of tails) {
    log(`tail ${name} (${SECONDS} s, ${TAIL_CONNECTIONS} connections)`);
    await run(base, r, WARMUP, TAIL_CONNECTIONS);
    const m = await run(base, r, SECONDS, TAIL_CONNECTIONS);
    out[`${name} @${TAIL_CONNECTIONS}`] = m;
    const ratio = m.p99 / Math.max(m.p50, 1);
    record({ section: 'tail', name: `${name} p50 @${TAIL_CONNECTIONS}`, value: m.p50, unit: 'ms', pass: null });
    record({ section: 'tail', name: `${name} p99 @${TAIL_CONNECTIONS}`, value: m.p99, unit: 'ms', pass: null });
    record({
      section: 'tail',
      name: `${name} p99 ÷ p50 @${TAIL_CONNECTIONS}`,
      value: round(ratio, 2),
      unit: '×',
      target: '≤ 3×',
      pass: ratio <= 3,
      note: m.p50 < 1 ? 'p50 under 1 ms, counted as 1 ms' : undefined,
    });
    record({
      section: 'tail',
      name: `${name} errors @${TAIL_CONNECTIONS}`,
      value: m.errors + m.non2xx,
      unit: `of ${m.total}`,
      target: '0',
      pass: m.errors + m.non2xx === 0,
    });
  }
  extra.http = { connections: CONNECTIONS, tailConnections: TAIL_CONNECTIONS, seconds: SECONDS, warmupSeconds: WARMUP, results: out };

  async function measureWithPaths(name: string, nextPath: () => string, route: { method: string; path: string }) {
    const go = (seconds: number) =>
      autocannon({
        url: base,
        connections: CONNECTIONS,
        duration: seconds,
        requests: [{ method: route.method as 'GET', path: route.path, setupRequest: (req: Record<string, unknown>) => ({ ...req, path: nextPath() }) }],
      });
    log(`warm-up ${name} (${WARMUP} s)`);
    await go(WARMUP);
    log(`measure ${name} (${SECONDS} s, ${CONNECTIONS} connections)`);
    const r = await go(SECONDS);
    const m = {
      reqPerSec: r.requests.average,
      p50: r.latency.p50,
      p99: r.latency.p99,
      errors: r.errors + r.timeouts,
      non2xx: r.non2xx,
      total: r.requests.total,
    };
    out[name] = m;
    return m;
  }
}

/** Give the member a full history (two pages) so the answers page is a real page. */
async function fillAnswers(member: Client, bodies: string[]) {
  for (let i = 0; i < 45; i++) {
    const r = await member.request('/api/answers', { method: 'POST', headers: { 'content-type': 'application/json' }, body: bodies[i % bodies.length] });
    await r.body?.cancel();
  }
}
