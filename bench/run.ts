import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { benchGrowth } from './growth';
import { benchHttp, evaluateBodies } from './http';
import { benchSoak } from './soak';
import { extra, log, median, notAvailable, printTable, record, rows } from './lib';
import { firstLoadJs, lighthouseScores } from './pages';
import { benchSearch } from './search';
import { assertBuilt, seedDemo, startServer } from './server';

// npm run bench — requires an existing build (`npm run build`); builds nothing itself.
// BENCH_SECONDS shortens each HTTP measurement (default 20 s); BENCH_ONLY=http,search,growth,
// cold,pages,lighthouse runs a subset. BENCH_SOAK=1 adds the ten-minute soak, BENCH_BIG=1 the
// growth to a million answers. Prints a table against the targets and writes
// bench/results.json.
const only = process.env.BENCH_ONLY ? new Set(process.env.BENCH_ONLY.split(',')) : null;
const want = (s: string) => !only || only.has(s);
const soak = process.env.BENCH_SOAK === '1';

async function main() {
  assertBuilt();
  const started = new Date();
  const dataDir = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-bench-'));
  try {
    if (want('search')) await benchSearch();
    if (want('growth')) await benchGrowth();

    if (want('http') || want('pages') || want('lighthouse') || want('cold') || soak) {
      log('seeding a fresh demo database');
      seedDemo(dataDir);
      const server = await startServer(dataDir);
      log(`app on ${server.url}`);
      try {
        if (want('http')) await benchHttp(server.url);
        if (want('pages')) await firstLoadJs(server.url);
        if (want('lighthouse')) await lighthouseScores(server.url);
        if (soak) {
          const bodies = await evaluateBodies(server.url);
          if (bodies) await benchSoak(server, bodies);
          else notAvailable('soak', 'mixed traffic', 'the wizard enums are not in this build', '0 errors');
        }
      } finally {
        await server.stop();
      }
      if (want('cold')) {
        // Process start to the first 200 on /api/health, on the data directory that now exists.
        const times: number[] = [];
        for (let i = 0; i < 3; i++) {
          const s = await startServer(dataDir);
          times.push(s.startedInMs);
          await s.stop();
        }
        const m = median(times);
        record({
          section: 'cold start',
          name: 'process start → first 200 /api/health',
          value: m,
          unit: 'ms',
          target: '≤ 2000 ms',
          pass: m <= 2000,
          note: `median of 3: ${times.map((t) => Math.round(t)).join(', ')} ms`,
        });
      }
    }
  } finally {
    fs.rmSync(dataDir, { recursive: true, force: true });
  }

  printTable();
  const results = {
    startedAt: started.toISOString(),
    finishedAt: new Date().toISOString(),
    machine: {
      cpus: os.cpus().length,
      cpuModel: os.cpus()[0]?.model,
      memGb: Math.round(os.totalmem() / 2 ** 30),
      node: process.version,
      loadAverageAtEnd: os.loadavg(),
    },
    rows,
    details: extra,
  };
  const file = path.join(__dirname, 'results.json');
  fs.writeFileSync(file, JSON.stringify(results, null, 2) + '\n');
  const missed = rows.filter((r) => r.pass === false).length;
  const na = rows.filter((r) => r.note?.startsWith('not available')).length;
  console.log(`wrote ${path.relative(process.cwd(), file)}: ${rows.filter((r) => r.pass === true).length} targets met, ${missed} missed, ${na} not available`);
}

main().catch((e) => {
  console.error(e instanceof Error ? e.stack : e);
  process.exit(1);
});
