import http from 'node:http';
import net from 'node:net';
import { afterAll, afterEach, beforeAll, describe, expect, it } from 'vitest';
import { openDatabase, type DbHandle } from '@/db/open';
import { setDbHandle } from '@/db/client';
import { clientIp, emailKey, isSignInBlocked, MAX_FAILURES_PER_EMAIL, recordSignInFailure } from '@/lib/auth/rate-limit';
import { PEER_HEADER, stampPeer } from '@/lib/http/client-address';

function incoming(headers: Record<string, string>, remoteAddress = '10.1.2.3') {
  const socket = new net.Socket();
  Object.defineProperty(socket, 'remoteAddress', { value: remoteAddress });
  const req = new http.IncomingMessage(socket);
  req.headers = { ...headers };
  return req;
}

afterEach(() => {
  delete process.env.TRUST_PROXY;
});

// The limiter asks which database it runs on (PGlite here: the counts stay in memory).
let handle: DbHandle;
beforeAll(async () => {
  handle = await openDatabase({ pgliteDir: 'memory' });
  setDbHandle(handle);
});
afterAll(() => handle.close());

describe('the client address', () => {
  it('is the socket peer, whatever forwarding headers the client sends', () => {
    const req = incoming({ 'x-forwarded-for': '203.0.113.9', 'x-real-ip': '198.51.100.1', [PEER_HEADER]: '192.0.2.1' });
    stampPeer(req, false);
    expect(req.headers['x-forwarded-for']).toBeUndefined();
    expect(req.headers['x-real-ip']).toBeUndefined();
    expect(clientIp(req.headers as Record<string, unknown>)).toBe('10.1.2.3');
  });

  it('believes X-Forwarded-For only with TRUST_PROXY=1', () => {
    process.env.TRUST_PROXY = '1';
    const req = incoming({ 'x-forwarded-for': '203.0.113.9, 10.0.0.1' });
    stampPeer(req, true);
    expect(clientIp(req.headers as Record<string, unknown>)).toBe('203.0.113.9');
  });
});

describe('the e-mail key', () => {
  it('is one key for every spelling of an address', () => {
    const keys = new Set(['member@candlewise.test', ' Member@Candlewise.TEST ', 'ｍember@candlewise.test'].map(emailKey));
    expect([...keys]).toEqual(['member@candlewise.test']);
    expect(emailKey(['member@candlewise.test'])).toBe('');
  });

  it('blocks an address after its failures, in any spelling', async () => {
    const email = `key-${Date.now()}@candlewise.test`;
    for (let i = 0; i < MAX_FAILURES_PER_EMAIL; i++) await recordSignInFailure(email.toUpperCase(), `10.9.9.${i}`);
    expect(await isSignInBlocked(` ${email}`, '10.8.8.8')).toBe(true);
  });
});
