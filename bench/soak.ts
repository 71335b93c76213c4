import fs from 'node:fs';
import autocannon from 'autocannon';
import { signedIn } from '../tests/support/http-client';
import { extra, log, record, round } from './lib';
import type { BenchServer } from './server';

// BENCH_SOAK=1: ten minutes (BENCH_SOAK_SECONDS) of mixed traffic at 10 connections — the
// wizard's evaluate, species search, a member's reads and answer saves — then: no errors, the
// server's resident memory at the end within 15 % of its level after the first minute, and every
// answer the soak saved readable afterwards.
const CONNECTIONS = 10;
const SECONDS = Number(process.env.BENCH_SOAK_SECONDS ?? 600);

/** Resident memory of the server and its children, in MB (Linux /proc). */
function rssMb(pid: number): number {
  let kb = 0;
  const visit = (p: number) => {
    try {
      const status = fs.readFileSync(`/proc/${p}/status`, 'utf8');
      kb += Number(/VmRSS:\s+(\d+)/.exec(status)?.[1] ?? 0);
      const kids = fs.readFileSync(`/proc/${p}/task/${p}/children`, 'utf8').trim();
      for (const k of kids ? kids.split(/\s+/) : []) visit(Number(k));
    } catch {
      /* gone */
    }
  };
  visit(pid);
  return kb / 1024;
}

export async function benchSoak(server: BenchServer, evaluateBodies: string[]) {
  const section = 'soak';
  const base = server.url;
  const member = await signedIn(base, 'member@candlewise.test');
  const cookie = member.cookieHeader();
  const trees = (await (await member.get('/api/trees')).json()) as { items?: { id: string }[] };
  const treeId = trees.items?.[0]?.id;
  const queries = ['sylvestris', 'mugo', 'thunbergi', 'blak pine', 'scots', 'larch', 'juniper'];
  const reads = ['/api/answers', '/api/trees', '/api/notes', ...(treeId ? [`/api/trees/${treeId}/plan`] : [])];
  const saved: string[] = [];
  let saveFailures = 0;
  let seed = 11;
  const rnd = () => (seed = (seed * 1103515245 + 12345) & 0x7fffffff) / 0x7fffffff;
  let n = 0;

  const samples: { t: number; mb: number }[] = [];
  const t0 = Date.now();
  const pid = server.proc.pid!;
  const sampler = setInterval(() => samples.push({ t: (Date.now() - t0) / 1000, mb: rssMb(pid) }), 5000);
  log(`soak: ${SECONDS} s of mixed traffic at ${CONNECTIONS} connections`);
  const result = await autocannon({
    url: base,
    connections: CONNECTIONS,
    duration: SECONDS,
    requests: [
      {
        method: 'GET',
        path: '/api/health',
        setupRequest: (req: Record<string, unknown>, context: Record<string, unknown>) => {
          const x = rnd();
          // Each connection has one request in flight: its context says whether that one is a save.
          context.save = x >= 0.9;
          const body = evaluateBodies[n++ % evaluateBodies.length];
          if (x < 0.3) return { ...req, method: 'POST', path: '/api/wizard/evaluate', headers: { 'content-type': 'application/json' }, body };
          if (x < 0.55) return { ...req, method: 'GET', path: `/api/species?q=${encodeURIComponent(queries[n % queries.length])}`, headers: {} };
          if (x < 0.9) return { ...req, method: 'GET', path: reads[n % reads.length], headers: { cookie } };
          return { ...req, method: 'POST', path: '/api/answers', headers: { 'content-type': 'application/json', cookie }, body };
        },
        onResponse: (status: number, body: string, context: Record<string, unknown>) => {
          if (!context.save) return;
          const id = /^\{"id":"([^"]+)"/.exec(body)?.[1];
          if (status === 201 && id) saved.push(id);
          else saveFailures++;
        },
      },
    ],
  } as never);
  clearInterval(sampler);
  samples.push({ t: (Date.now() - t0) / 1000, mb: rssMb(pid) });

  const errors = result.errors + result.timeouts + result.non2xx;
  record({
    section,
    name: 'requests',
    value: result.requests.total,
    unit: `in ${SECONDS} s`,
    pass: null,
    note: `${round(result.requests.average, 0)} req/s, p50 ${result.latency.p50} ms, p99 ${result.latency.p99} ms`,
  });
  record({ section, name: 'errors (network, timeouts, non-2xx)', value: errors, unit: `of ${result.requests.total}`, target: '0', pass: errors === 0 });

  const afterMinute = samples.find((s) => s.t >= 60) ?? samples[0];
  const end = samples[samples.length - 1];
  const growth = afterMinute ? (end.mb - afterMinute.mb) / afterMinute.mb : NaN;
  record({ section, name: 'resident memory after the first minute', value: round(afterMinute?.mb ?? NaN, 0), unit: 'MB', pass: null });
  record({ section, name: 'resident memory at the end', value: round(end.mb, 0), unit: 'MB', pass: null });
  record({ section, name: 'memory growth, end vs first minute', value: round(growth * 100, 1), unit: '%', target: '≤ 15 %', pass: Math.abs(growth) <= 0.15 });

  // Every saved answer reads back.
  let unreadable = 0;
  for (const id of saved) {
    const r = await member.get(`/api/answers/${id}`);
    await r.body?.cancel();
    if (r.status !== 200) unreadable++;
  }
  record({
    section,
    name: 'saved answers readable afterwards',
    value: saved.length - unreadable,
    unit: `of ${saved.length}`,
    target: 'all',
    pass: saved.length > 0 && unreadable === 0,
    note: saveFailures ? `${saveFailures} saves failed` : undefined,
  });
  extra.soak = { connections: CONNECTIONS, seconds: SECONDS, memory: samples, latency: result.latency, saved: saved.length };
}
