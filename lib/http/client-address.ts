import http from 'node:http';

// The client's address as the server's socket saw it. Next passes route handlers no socket, and
// fills `x-forwarded-for` from the socket only when the client did not send one, so a client could
// choose its own address. At start the server stamps every request with the peer address under
// PEER_HEADER (overwriting anything the client sent under that name) and, unless TRUST_PROXY=1,
// drops the client's own forwarding headers before Next reads them.

export const PEER_HEADER = 'x-candlewise-peer';
const FORWARDING = ['x-forwarded-for', 'x-real-ip', 'x-forwarded-host', 'x-forwarded-proto', 'x-forwarded-port', 'forwarded'];

export function trustProxy(): boolean {
  return process.env.TRUST_PROXY === '1';
}

/** Stamp the peer address and strip untrusted forwarding headers: exported for the unit test. */
export function stampPeer(req: http.IncomingMessage, trusted = trustProxy()) {
  req.headers[PEER_HEADER] = req.socket?.remoteAddress ?? 'unknown';
  if (!trusted) for (const h of FORWARDING) delete req.headers[h];
}

const g = globalThis as unknown as { __cwPeerStamp?: boolean };

/** Install once per process, before the first request is served. */
export function installPeerStamp() {
  if (g.__cwPeerStamp) return;
  g.__cwPeerStamp = true;
  const emit = http.Server.prototype.emit;
  http.Server.prototype.emit = function (this: http.Server, event: string, ...args: unknown[]) {
    if (event === 'request' && args[0] instanceof http.IncomingMessage) stampPeer(args[0]);
    return (emit as (this: http.Server, e: string, ...a: unknown[]) => boolean).call(this, event, ...args);
  } as typeof emit;
}
