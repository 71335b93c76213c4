// npm run demo: migrate, seed the invented club, build, and start on http://127.0.0.1:3000 (PORT overrides)
// with the local mail fake. Each step runs to completion before the server takes the data directory.
import { spawnSync, spawn } from 'node:child_process';

const env = { ...process.env, NEXT_TELEMETRY_DISABLED: '1' };
const tsx = ['node_modules/.bin/tsx', ['--conditions=react-server']];

function step(label, cmd, args) {
  console.log(`\n▶ ${label}`);
  const r = spawnSync(cmd, args, { stdio: 'inherit', env });
  if (r.status !== 0) {
    console.error(`✖ ${label} failed`);
    process.exit(r.status ?? 1);
  }
}

step('migrate', tsx[0], [...tsx[1], 'scripts/db-migrate.ts']);
step('seed the demo club', tsx[0], [...tsx[1], 'scripts/db-seed.ts']);
if (process.env.SKIP_BUILD !== '1') step('build', 'node_modules/.bin/next', ['build']);
const port = process.env.PORT ?? '3000';
console.log(`\n▶ start: http://127.0.0.1:${port}  (demo accounts: see README.md, password candlewise-demo)`);
const child = spawn('node', ['scripts/run-app.mjs', 'start'], { stdio: 'inherit', env });
for (const sig of ['SIGINT', 'SIGTERM']) process.on(sig, () => child.kill(sig));
child.on('exit', (code) => process.exit(code ?? 0));
