import 'server-only';
import { createHash, hkdfSync, randomBytes } from 'node:crypto';
import fs from 'node:fs';
import path from 'node:path';
import { env } from '@/lib/env';

// The server's one master secret, and the separate keys derived from it.
//
// - NEXTAUTH_SECRET, when set, is the master. In production it must be at least 32 bytes.
// - Unset, the server generates 32 random bytes at first start and keeps them with the data
//   (SECRET_FILE, by default beside the PGlite directory), readable by the owner only, so every
//   restart keeps the same sessions and unsubscribe links. No value in the source is ever a key.
// - With DATABASE_URL set, several processes may share one database: they must share one secret,
//   so an explicit NEXTAUTH_SECRET is required.
// - Sessions and unsubscribe links get their own keys (HKDF-SHA256 with distinct labels), so a
//   key recovered from one cannot sign the other.

const MIN_SECRET_BYTES = 32;

// SHA-256 of secrets that were once written in this repository (development, test and benchmark
// values). Anyone can read them, so they are refused even when configured on purpose.
const PUBLISHED_SECRET_HASHES = new Set([
  '5361960d9a0a8a701850c568969ec86f14c9a72a5b0210092ed951f718b6ab32',
  '37cc48d3df448898996832c972aaf5953c051d6d386be74b7b9fe3be8f052582',
  'ca51202ab7644116221f3d4ea13e85463d8a2a7decc581391bb3797496917354',
  '4498665a5b47faad69b142ece379e6538c4032371e05bbe806838f19d6130211',
]);

class SecretConfigError extends Error {}

/** Why a configured secret cannot be used, or null when it can. */
function secretProblem(secret: string, production: boolean): string | null {
  if (PUBLISHED_SECRET_HASHES.has(createHash('sha256').update(secret).digest('hex'))) {
    return 'NEXTAUTH_SECRET is a value published in the Candlewise source; generate your own (for example `openssl rand -base64 32`).';
  }
  const bytes = Buffer.byteLength(secret, 'utf8');
  if (production && bytes < MIN_SECRET_BYTES) {
    return `NEXTAUTH_SECRET must be at least ${MIN_SECRET_BYTES} bytes in production (it has ${bytes}).`;
  }
  if (new Set(secret).size < 8) return 'NEXTAUTH_SECRET is too repetitive to be a secret.';
  return null;
}

/** Read the stored secret, or create it (exclusively, mode 0600) on first start. */
function loadOrCreateSecretFile(file: string): string {
  try {
    return readSecretFile(file);
  } catch (e) {
    if ((e as NodeJS.ErrnoException).code !== 'ENOENT') throw e;
  }
  fs.mkdirSync(path.dirname(file), { recursive: true });
  const value = randomBytes(MIN_SECRET_BYTES).toString('base64url');
  try {
    fs.writeFileSync(file, `${value}\n`, { flag: 'wx', mode: 0o600 });
    return value;
  } catch (e) {
    // Another start won the race: use its secret.
    if ((e as NodeJS.ErrnoException).code === 'EEXIST') return readSecretFile(file);
    throw e;
  }
}

function readSecretFile(file: string): string {
  const stat = fs.statSync(file);
  if (process.platform !== 'win32' && (stat.mode & 0o077) !== 0) {
    throw new SecretConfigError(`The secret file ${file} is readable by others; run \`chmod 600 ${file}\`.`);
  }
  const value = fs.readFileSync(file, 'utf8').trim();
  if (Buffer.byteLength(value) < MIN_SECRET_BYTES) throw new SecretConfigError(`The secret file ${file} is too short; delete it to generate a new one.`);
  return value;
}

let master: string | null = null;
let buildTime: string | null = null;

/** The master secret, resolved once per process. Throws SecretConfigError when it cannot be used. */
export function masterSecret(): string {
  if (master) return master;
  if (env.building) {
    // `next build` signs nothing that outlives it; never write the data directory while building.
    return (buildTime ??= randomBytes(MIN_SECRET_BYTES).toString('base64url'));
  }
  const configured = env.NEXTAUTH_SECRET;
  if (configured) {
    const problem = secretProblem(configured, env.NODE_ENV === 'production');
    if (problem) throw new SecretConfigError(problem);
    return (master = configured);
  }
  if (env.DATABASE_URL) {
    throw new SecretConfigError('Set NEXTAUTH_SECRET when DATABASE_URL is set: every process on one database must share one secret.');
  }
  return (master = loadOrCreateSecretFile(env.secretFile));
}

function derive(label: string): string {
  return Buffer.from(hkdfSync('sha256', masterSecret(), 'candlewise', label, 32)).toString('base64url');
}

const derived = new Map<string, string>();
const key = (label: string) => derived.get(label) ?? (derived.set(label, derive(label)), derived.get(label)!);

/** The key next-auth signs and encrypts session tokens with. */
export const sessionKey = () => key('session tokens v1');
/** The key unsubscribe links are signed with. */
export const unsubscribeKey = () => key('unsubscribe links v1');
