// Starts `next dev` or `next start` with the local mail fake and the settings a club's own
// machine needs; flags after the mode are passed to next.
import { spawn } from 'node:child_process';

const [mode = 'start', ...rest] = process.argv.slice(2);
const port = process.env.PORT ?? '3000';
const host = process.env.HOST ?? '127.0.0.1';
const env = {
  ...process.env,
  NEXT_TELEMETRY_DISABLED: '1',
  PORT: port,
  NEXTAUTH_URL: process.env.NEXTAUTH_URL ?? `http://${host}:${port}`,
  MAIL_FAKE: process.env.SMTP_URL ? '0' : (process.env.MAIL_FAKE ?? '1'),
};
// Start next directly (not through npx) so signals reach the server and it can close the database.
const child = spawn('node_modules/.bin/next', [mode, '--hostname', host, '--port', port, ...rest], { stdio: 'inherit', env });
for (const sig of ['SIGINT', 'SIGTERM']) process.on(sig, () => child.kill(sig));
child.on('exit', (code, signal) => process.exit(code ?? (signal ? 1 : 0)));
