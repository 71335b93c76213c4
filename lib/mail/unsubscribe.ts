import { createHmac, timingSafeEqual } from 'node:crypto';

// Unsubscribe links that work without signing in: the token names the member and an expiry,
// signed with HMAC-SHA256 under the server secret, so it can be neither forged nor altered.
// A token also names the list it stops (meeting notes or the weekly reminders); tokens made
// before lists existed carry none and stop the meeting notes, as they always did.

export const UNSUBSCRIBE_TTL_MS = 180 * 24 * 3600 * 1000;
const PURPOSE = 'digest-unsubscribe';

const mailLists = ['digest', 'reminders'] as const;
export type MailList = (typeof mailLists)[number];

export type UnsubscribeCheck = { ok: true; userId: string; list: MailList } | { ok: false; reason: 'malformed' | 'bad_signature' | 'expired' };

function sign(payload: string, secret: string): string {
  return createHmac('sha256', secret).update(`${PURPOSE}.${payload}`).digest('base64url');
}

export function createUnsubscribeToken(userId: string, secret: string, now = Date.now(), list: MailList = 'digest'): string {
  const data = list === 'digest' ? { u: userId, x: now + UNSUBSCRIBE_TTL_MS } : { u: userId, x: now + UNSUBSCRIBE_TTL_MS, l: list };
  const payload = Buffer.from(JSON.stringify(data)).toString('base64url');
  return `${payload}.${sign(payload, secret)}`;
}

export function verifyUnsubscribeToken(token: string, secret: string, now = Date.now()): UnsubscribeCheck {
  const parts = token.split('.');
  if (parts.length !== 2 || !parts[0] || !parts[1]) return { ok: false, reason: 'malformed' };
  const [payload, mac] = parts;
  const expected = Buffer.from(sign(payload, secret));
  const given = Buffer.from(mac);
  if (given.length !== expected.length || !timingSafeEqual(given, expected)) return { ok: false, reason: 'bad_signature' };
  let data: { u?: unknown; x?: unknown; l?: unknown };
  try {
    data = JSON.parse(Buffer.from(payload, 'base64url').toString('utf8'));
  } catch {
    return { ok: false, reason: 'malformed' };
  }
  if (typeof data.u !== 'string' || typeof data.x !== 'number') return { ok: false, reason: 'malformed' };
  const list = data.l === undefined ? 'digest' : data.l;
  if (!mailLists.includes(list as MailList)) return { ok: false, reason: 'malformed' };
  if (now > data.x) return { ok: false, reason: 'expired' };
  return { ok: true, userId: data.u, list: list as MailList };
}

/** The list a token names, unchecked: only for wording the page before the member confirms. */
export function peekUnsubscribeList(token: string): MailList {
  try {
    const data = JSON.parse(Buffer.from(token.split('.')[0] ?? '', 'base64url').toString('utf8')) as { l?: unknown };
    return data.l === 'reminders' ? 'reminders' : 'digest';
  } catch {
    return 'digest';
  }
}
