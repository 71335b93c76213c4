import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { openDatabase } from '../db/open';
import { setDbHandle } from '../db/client';
import { seed } from '../db/seed';
import { extra, log, median, notAvailable, percentile, record, round } from './lib';
import { optional } from './optional';

interface AnswersLayer {
  listOwnAnswers(user: { id: string }, q: { cursor?: string; limit?: number }): Promise<{ items: unknown[]; nextCursor: string | null }>;
}
interface NotesLayer {
  getBacklinks(type: 'answer' | 'species', id: string): Promise<unknown[]>;
}

// Data growth: one club's PGlite directory filled (directly, not through the server) with
// 1 000, 10 000 and 100 000 answers and meeting notes that link them; at each size, the time of
// one keyset history page and of a species page's backlinks query, through the data layer's own
// functions, with the EXPLAIN plan of the exact SQL they ran. BENCH_BIG=1 goes on to 1 000 000.
const SIZES = process.env.BENCH_BIG === '1' ? [1_000, 10_000, 100_000, 1_000_000] : [1_000, 10_000, 100_000];
const REPEAT = 40;
const TARGET_MS = 20;

type Pg = import('@electric-sql/pglite').PGlite;

/** Capture the SQL and parameters of the last query a data-layer call sent to PGlite. */
function spy(pg: Pg) {
  const calls: { sql: string; params: unknown[] }[] = [];
  const original = pg.query.bind(pg);
  (pg as unknown as { query: Pg['query'] }).query = (async (q: string, params?: unknown[], opts?: unknown) => {
    calls.push({ sql: q, params: params ?? [] });
    return original(q, params as never, opts as never);
  }) as Pg['query'];
  return { calls, restore: () => ((pg as unknown as { query: Pg['query'] }).query = original as Pg['query']) };
}

async function explain(pg: Pg, q: { sql: string; params: unknown[] }) {
  const r = await pg.query<{ 'QUERY PLAN': string }>(`EXPLAIN (ANALYZE, BUFFERS, COSTS OFF) ${q.sql}`, q.params as never);
  return r.rows.map((x) => x['QUERY PLAN']).join('\n');
}

async function timeIt(fn: () => Promise<unknown>) {
  for (let i = 0; i < 5; i++) await fn();
  const t: number[] = [];
  for (let i = 0; i < REPEAT; i++) {
    const t0 = performance.now();
    await fn();
    t.push(performance.now() - t0);
  }
  return { median: median(t), p95: percentile(t, 95) };
}

export async function benchGrowth() {
  const section = 'data growth';
  const answersLayer = await optional<AnswersLayer>('lib/data/answers');
  const notesLayer = await optional<NotesLayer>('lib/data/notes');
  if (!answersLayer?.listOwnAnswers)
    notAvailable(section, 'history page (keyset)', 'lib/data/answers.ts listOwnAnswers is not in this build', `≤ ${TARGET_MS} ms, flat`);
  if (!notesLayer?.getBacklinks) notAvailable(section, 'species backlinks', 'lib/data/notes.ts getBacklinks is not in this build', `≤ ${TARGET_MS} ms, flat`);
  if (!answersLayer?.listOwnAnswers && !notesLayer?.getBacklinks) return;

  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-bench-growth-'));
  const handle = await openDatabase({ pgliteDir: path.join(dir, 'pglite') });
  setDbHandle(handle);
  const pg = handle.pglite!;
  try {
    await seed(handle.db);
    // A club of 40 members; the demo member asks a fifth of all questions (the heavy user).
    await pg.exec(`
      insert into users (id, email, name, role)
      select 'bench-user-' || g, 'bench-' || g || '@candlewise.test', 'Bench member ' || g, 'member' from generate_series(1, 40) g
      on conflict do nothing`);
    const heavy = (await pg.query<{ id: string }>(`select id from users where email = 'member@candlewise.test'`)).rows[0].id;
    const speciesSlugs = (await pg.query<{ slug: string }>(`select slug from species order by slug`)).rows.map((r) => r.slug);
    const slugs = speciesSlugs.length ? speciesSlugs : ['pinus-thunbergii', 'pinus-sylvestris', 'pinus-mugo', 'pinus-parviflora'];
    const target = slugs[0];
    const slugArray = `array[${slugs.map((s) => `'${s.replace(/'/g, "''")}'`).join(',')}]`;
    const results: Record<string, unknown>[] = [];
    let have = 0;
    for (const size of SIZES) {
      const t0 = performance.now();
      await pg.exec(`
        insert into answers (id, user_id, species_slug, species_revision, engine_version, action, stage, season, observed_on, input, result, visibility, created_at)
        select 'bench' || lpad(g::text, 12, '0'),
               case when g % 5 = 0 then '${heavy}' else 'bench-user-' || (1 + g % 40) end,
               (${slugArray})[1 + g % ${slugs.length}], 1, 'bench',
               (array['pinch','prune','let-grow','decandle','wait'])[1 + g % 5], 'refinement', 'spring',
               date '2020-01-01' + (g % 2000),
               '{"branching":"tertiary","shoot":"candle"}'::jsonb,
               jsonb_build_object('action', 'pinch', 'headline', 'Pinch the candle', 'speciesName', 'Bench pine'),
               case when g % 3 = 0 then 'club' else 'private' end,
               timestamptz '2026-01-01' - make_interval(mins => g)
        from generate_series(${have + 1}, ${size}) g`);
      // One meeting note per 100 answers, each linking five shared answers and two species.
      await pg.exec(`
        insert into notes (slug, title, meeting_date, body, status, published_at)
        select 'bench-note-' || n, 'Meeting ' || n, date '2020-01-01' + n, 'Bench note', 'published', now()
        from generate_series(${have / 100 + 1}, ${size / 100}) n
        on conflict do nothing;
        insert into note_links (note_id, target_type, target_id)
        select id, 'answer', 'bench' || lpad((((id * 7 + k) % ${size}) + 1)::text, 12, '0')
        from notes, generate_series(0, 4) k where notes.slug like 'bench-note-%' and notes.id > coalesce((select max(note_id) from note_links where target_type = 'answer'), 0)
        on conflict do nothing;
        insert into note_links (note_id, target_type, target_id)
        select id, 'species', (${slugArray})[1 + (id + k) % ${slugs.length}]
        from notes, generate_series(0, 1) k where notes.slug like 'bench-note-%' and notes.id > coalesce((select max(note_id) from note_links where target_type = 'species'), 0)
        on conflict do nothing;
        analyze;`);
      have = size;
      log(`growth: ${size} answers in place (${round((performance.now() - t0) / 1000, 1)} s)`);

      const entry: Record<string, unknown> = { answers: size, heavyUserAnswers: size / 5, notes: size / 100 };
      if (answersLayer?.listOwnAnswers) {
        // A page from the middle of the heavy member's history: follow the cursor half-way.
        const first = await answersLayer.listOwnAnswers({ id: heavy }, { limit: 20 });
        let cursor = first.nextCursor ?? undefined;
        for (let i = 0; i < Math.min(10, Math.floor(size / 5 / 20 / 2)) && cursor; i++) {
          cursor = (await answersLayer.listOwnAnswers({ id: heavy }, { limit: 20, cursor })).nextCursor ?? undefined;
        }
        const s = spy(pg);
        await answersLayer.listOwnAnswers({ id: heavy }, { limit: 20, cursor });
        s.restore();
        const t = await timeIt(() => answersLayer.listOwnAnswers({ id: heavy }, { limit: 20, cursor }));
        const plan = await explain(pg, s.calls[s.calls.length - 1]);
        entry.history = { ...t, plan };
      }
      if (notesLayer?.getBacklinks) {
        const s = spy(pg);
        const links = await notesLayer.getBacklinks('species', target);
        s.restore();
        const t = await timeIt(() => notesLayer.getBacklinks('species', target));
        const plan = await explain(pg, s.calls[s.calls.length - 1]);
        entry.backlinks = { ...t, rows: links.length, plan };
      }
      results.push(entry);
    }

    const report = (key: 'history' | 'backlinks', name: string) => {
      const at = results.map((r) => r[key] as { median: number; p95: number; plan: string } | undefined);
      if (at.some((x) => !x)) return;
      at.forEach((x, i) =>
        record({
          section,
          name: `${name}, ${SIZES[i].toLocaleString('en')} answers`,
          value: x!.median,
          unit: 'ms',
          target: `≤ ${TARGET_MS} ms`,
          pass: x!.median <= TARGET_MS,
          note: `p95 ${round(x!.p95)} ms`,
        }),
      );
      const ratio = at[at.length - 1]!.median / at[0]!.median;
      // The tables that grow with the club's history must be reached by index; a small table
      // (users, notes: one per hundred answers here) may be scanned when the planner finds it cheaper.
      const scans = at.slice(-1).map((x) => /Seq Scan on (answers|note_links)\b/.test(x!.plan));
      const small = [...new Set(at.slice(-1).flatMap((x) => [...x!.plan.matchAll(/Seq Scan on (\w+)/g)].map((m) => m[1])))].filter(
        (t) => !['answers', 'note_links'].includes(t),
      );
      record({
        section,
        name: `${name}: ${SIZES[SIZES.length - 1].toLocaleString('en')} vs 1 000`,
        value: round(ratio, 2),
        unit: '×',
        target: '≤ 2×, answers/note_links by index',
        pass: ratio <= 2 && !scans.some(Boolean),
        note:
          (scans.some(Boolean) ? 'sequential scan of answers or note_links' : 'answers and note_links by index') +
          (small.length ? `; seq scan of small ${small.join(', ')}` : ''),
      });
      console.log(`\nEXPLAIN ANALYZE — ${name} at ${SIZES[SIZES.length - 1].toLocaleString('en')} answers:\n${at[at.length - 1]!.plan}\n`);
    };
    report('history', 'history page (keyset)');
    report('backlinks', 'species backlinks');
    extra.growth = results;
  } finally {
    await handle.close();
    fs.rmSync(dir, { recursive: true, force: true });
  }
}
