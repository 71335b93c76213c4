import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { execFileSync, spawn } from 'node:child_process';
import { hkdfSync, randomBytes } from 'node:crypto';
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import { encode } from 'next-auth/jwt';
import { freePort, startApp, type RunningApp } from '../../support/app-server';
import { Client } from './fixtures';

// Finding: with no NEXTAUTH_SECRET, `npm start` signed sessions with a string in the source, so
// anyone could mint a session for any account. Now the server generates its own secret, keeps it
// with the data (owner-only), derives separate keys from it, and refuses unusable secrets.
const root = path.resolve(__dirname, '../../..');
let app: RunningApp;
let adminId: string;

beforeAll(async () => {
  app = await startApp({ env: { NEXTAUTH_SECRET: '' } });
  const admin = new Client(app.url);
  expect((await admin.signIn('admin@candlewise.test', 'candlewise-demo')).ok).toBe(true);
  adminId = ((await admin.json('/api/me', 'GET')).body as { user: { id: string } }).user.id;
}, 120_000);
afterAll(async () => app?.stop());

/** Every string literal in the tracked source that could have served as a secret. */
function repositoryStrings(): string[] {
  const files = execFileSync('git', ['ls-files'], { cwd: root, encoding: 'utf8' })
    .split('\n')
    .filter((f) => /\.(ts|tsx|mjs|js|json|md|sh|yml|yaml)$/.test(f) && !f.startsWith('content/') && !f.includes('fixtures/xss'));
  const found = new Set<string>();
  for (const f of files) {
    const text = fs.readFileSync(path.join(root, f), 'utf8');
    for (const m of text.matchAll(/['"`]([A-Za-z0-9_\-+/=.]{16,128})['"`]/g)) found.add(m[1]);
  }
  return [...found];
}

async function meWith(secret: string, tv: number): Promise<number> {
  const token = await encode({ token: { uid: adminId, tv, role: 'admin', email: 'admin@candlewise.test' }, secret });
  const res = await fetch(`${app.url}/api/me`, { headers: { cookie: `next-auth.session-token=${token}` } });
  return res.status;
}

const sessionKeyOf = (master: string) => Buffer.from(hkdfSync('sha256', master, 'candlewise', 'session tokens v1', 32)).toString('base64url');

describe('the session secret', () => {
  it('is generated at first start and kept with the data, readable by the owner only', () => {
    const file = path.join(app.dataDir, 'candlewise-secret');
    const stat = fs.statSync(file);
    expect(stat.mode & 0o777).toBe(0o600);
    expect(Buffer.byteLength(fs.readFileSync(file, 'utf8').trim())).toBeGreaterThanOrEqual(32);
  });

  it('signs nothing that a token minted with any string in the repository can pass', async () => {
    const candidates = repositoryStrings();
    expect(candidates.length).toBeGreaterThan(50);
    // The forging procedure itself works: with the server's real session key it is accepted,
    // so the refusals below are the secret's doing, not a broken token.
    const master = fs.readFileSync(path.join(app.dataDir, 'candlewise-secret'), 'utf8').trim();
    const accepted = await Promise.all([0, 1, 2].map((tv) => meWith(sessionKeyOf(master), tv)));
    expect(accepted).toContain(200);
    for (const secret of candidates) {
      for (const tv of [0, 1]) expect({ secret, status: await meWith(secret, tv) }).toEqual({ secret, status: 401 });
    }
  }, 120_000);

  it('signs sessions with a derived key, not the master secret itself', async () => {
    const master = fs.readFileSync(path.join(app.dataDir, 'candlewise-secret'), 'utf8').trim();
    expect(await meWith(master, 0)).toBe(401);
    expect(await meWith(master, 1)).toBe(401);
  });
});

async function startExpectingRefusal(env: Record<string, string>) {
  const port = await freePort();
  const dir = fs.mkdtempSync(path.join(os.tmpdir(), 'cw-secret-'));
  const proc = spawn(path.join(root, 'node_modules/.bin/next'), ['start', '--hostname', '127.0.0.1', '--port', String(port)], {
    cwd: root,
    env: {
      ...process.env,
      NODE_ENV: 'production',
      NEXT_TELEMETRY_DISABLED: '1',
      PGLITE_DIR: path.join(dir, 'pglite'),
      DATABASE_URL: '',
      NEXTAUTH_URL: `http://127.0.0.1:${port}`,
      MAIL_FAKE: '0',
      NEXTAUTH_SECRET: '',
      ...env,
    },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  proc.stdout.on('data', (d) => (output += d));
  proc.stderr.on('data', (d) => (output += d));
  const code = await new Promise<number | null>((resolve) => {
    const t = setTimeout(() => (proc.kill('SIGKILL'), resolve(null)), 60_000);
    proc.once('exit', (c) => (clearTimeout(t), resolve(c)));
  });
  fs.rmSync(dir, { recursive: true, force: true });
  return { code, output };
}

describe('start-up refuses a secret it cannot trust', () => {
  it('refuses a secret shorter than 32 bytes in production', async () => {
    const r = await startExpectingRefusal({ NEXTAUTH_SECRET: randomBytes(12).toString('hex').slice(0, 20) });
    expect(r.code).toBe(1);
    expect(r.output).toContain('at least 32 bytes');
  }, 90_000);

  it('refuses to generate its own secret when DATABASE_URL points at a shared database', async () => {
    const r = await startExpectingRefusal({ DATABASE_URL: 'postgres://nobody@127.0.0.1:1/none' });
    expect(r.code).toBe(1);
    expect(r.output).toContain('Set NEXTAUTH_SECRET when DATABASE_URL is set');
  }, 90_000);
});
