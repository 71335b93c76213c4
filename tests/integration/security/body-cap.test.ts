import net from 'node:net';
import { describe, expect, inject, it } from 'vitest';

// An oversized body is refused before it is read: a declared Content-Length over the cap gets
// 413 while most of the body has not even been sent, and a chunked body without a length is cut
// off once the counted bytes pass the cap. The client here never finishes its body, so a server
// that reads to the end first never answers at all.
const base = new URL(inject('baseUrl'));

/** Send the head and `prefixBytes` of body, then wait (at most `waitMs`) for the status line. */
function statusBeforeBodyEnds(opts: { path: string; type: string; length?: number; chunked?: number; prefixBytes?: number; waitMs?: number }) {
  return new Promise<number | 'no answer'>((resolve, reject) => {
    const sock = net.connect(Number(base.port), base.hostname);
    let got = '';
    const done = (v: number | 'no answer') => {
      clearTimeout(timer);
      sock.destroy();
      resolve(v);
    };
    const timer = setTimeout(() => done('no answer'), opts.waitMs ?? 8000);
    sock.on('error', (e) => (got ? undefined : reject(e)));
    sock.on('data', (d) => {
      got += d.toString('latin1');
      const m = /^HTTP\/1\.1 (\d{3})/.exec(got);
      if (m) done(Number(m[1]));
    });
    sock.on('connect', () => {
      const head = [
        `POST ${opts.path} HTTP/1.1`,
        `Host: ${base.host}`,
        `Content-Type: ${opts.type}`,
        opts.chunked ? 'Transfer-Encoding: chunked' : `Content-Length: ${opts.length}`,
        '',
        '',
      ].join('\r\n');
      sock.write(head);
      const filler = Buffer.alloc(64 * 1024, 0x61);
      if (opts.chunked) {
        // Chunks up to `chunked` bytes in all, and never the closing zero-length chunk.
        let sent = 0;
        const pump = () => {
          while (sent < opts.chunked!) {
            sent += filler.length;
            if (!sock.write(`${filler.length.toString(16)}\r\n`) || !sock.write(filler) || !sock.write('\r\n')) {
              sock.once('drain', pump);
              return;
            }
          }
        };
        pump();
      } else {
        sock.write(filler.subarray(0, opts.prefixBytes ?? 1024));
      }
    });
  });
}

const SIXTY_FOUR_MB = 64 * 1024 * 1024;
const routes: { path: string; type: string; chunkedOver?: number }[] = [
  { path: '/api/auth/callback/credentials', type: 'application/x-www-form-urlencoded', chunkedOver: 128 * 1024 },
  { path: '/api/auth/signin/email', type: 'application/json', chunkedOver: 128 * 1024 },
  { path: '/api/unsubscribe', type: 'application/json', chunkedOver: 2 * 1024 * 1024 },
  { path: '/api/users', type: 'application/json', chunkedOver: 2 * 1024 * 1024 },
  { path: '/api/notes', type: 'application/json', chunkedOver: 2 * 1024 * 1024 },
  { path: '/api/trees', type: 'application/json', chunkedOver: 2 * 1024 * 1024 },
  { path: '/api/wizard/evaluate', type: 'application/json', chunkedOver: 2 * 1024 * 1024 },
  { path: '/api/uploads', type: 'multipart/form-data; boundary=x' },
];

describe('an oversized body', () => {
  for (const r of routes) {
    it(`declared at 64 MB is refused with 413 before it is sent: POST ${r.path}`, async () => {
      expect(await statusBeforeBodyEnds({ path: r.path, type: r.type, length: SIXTY_FOUR_MB })).toBe(413);
    });
    if (r.chunkedOver) {
      it(`sent chunked without a length is cut off at the cap with 413: POST ${r.path}`, async () => {
        expect(await statusBeforeBodyEnds({ path: r.path, type: r.type, chunked: r.chunkedOver })).toBe(413);
      });
    }
  }
});
