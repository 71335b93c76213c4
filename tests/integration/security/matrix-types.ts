import { ACTORS, type Actor, type Client, type Fixtures } from './fixtures';

// The shape of a row of the role × route matrix (route-matrix.ts) and the expectation shorthands.

type Method = 'GET' | 'POST' | 'PUT' | 'PATCH' | 'DELETE';
export type Expect = number | readonly number[];

interface RequestSpec {
  path: string;
  json?: unknown;
  form?: Record<string, string>;
  multipart?: () => FormData | Promise<FormData>;
  headers?: Record<string, string>;
  /** A client to send with instead of the actor's shared one (for requests that end a session). */
  client?: Client;
}

export interface RouteRow {
  /** `METHOD /path/[param]` as in app/. */
  route: string;
  /** The file in app/ that answers it. */
  file: string;
  method: Method;
  kind: 'api' | 'auth' | 'page' | 'action';
  /** The body a caller sends; JSON rows are fuzzed and sent as text/plain in the CSRF test. */
  body: 'none' | 'json' | 'form' | 'multipart';
  /** Builds the request for one actor, creating first whatever it changes or removes. */
  request(f: Fixtures, actor: Actor): Promise<RequestSpec> | RequestSpec;
  expect: Record<Actor, Expect>;
  /** For fuzzing: who sends the bodies (the actor that gets furthest), and how to undo what a lucky body changed. */
  fuzz?: { as: Actor; restore?: (f: Fixtures) => Promise<void> };
  /**
   * Rows that read a shared record's revision and then write it: requests with the same key are
   * built and sent one at a time, so parallel callers never race each other into a 409.
   */
  serial?: string;
}

// ── expectation shorthands ─────────────────────────────────────────────────────────────────
export const every = (status: Expect): Record<Actor, Expect> => Object.fromEntries(ACTORS.map((a) => [a, status])) as Record<Actor, Expect>;
export const signedIn = (ok: Expect): Record<Actor, Expect> => ({ ...every(ok), anonymous: 401 });
/** At least `role` (admin has every right); 401 for the anonymous, 403 below the role. */
export const atLeast = (role: 'editor' | 'librarian' | 'admin', ok: Expect): Record<Actor, Expect> => ({
  anonymous: 401,
  member: 403,
  editor: role === 'editor' ? ok : 403,
  librarian: role === 'librarian' ? ok : 403,
  admin: ok,
});
// Pages: the anonymous are sent to sign in (307), the wrong role gets the 403 page.
const REDIRECT = 307;
export const pageSignedIn: Record<Actor, Expect> = { ...every(200), anonymous: REDIRECT };
export const pageAtLeast = (role: 'editor' | 'librarian' | 'admin'): Record<Actor, Expect> => ({ ...atLeast(role, 200), anonymous: REDIRECT });

export const isMutating = (row: RouteRow) => row.method !== 'GET';

/** Send one row's request as one actor, with extra headers; returns the response. */
const queues = new Map<string, Promise<unknown>>();

export async function sendRow(f: Fixtures, row: RouteRow, actor: Actor, extra: Record<string, string> = {}): Promise<Response> {
  if (!row.serial) return buildAndSend(f, row, actor, extra);
  const prev = queues.get(row.serial) ?? Promise.resolve();
  // The next caller waits until this response's body has been read to the end.
  const run = prev.then(async () => {
    const res = await buildAndSend(f, row, actor, extra);
    const text = await res.arrayBuffer();
    const nullBody = [101, 204, 205, 304].includes(res.status);
    return new Response(nullBody ? null : text, { status: res.status, statusText: res.statusText, headers: res.headers });
  });
  queues.set(
    row.serial,
    run.catch(() => {}),
  );
  return run;
}

async function buildAndSend(f: Fixtures, row: RouteRow, actor: Actor, extra: Record<string, string>) {
  const spec = await row.request(f, actor);
  const client = spec.client ?? (await f.client(actor));
  const headers: Record<string, string> = { ...spec.headers, ...extra };
  let body: BodyInit | undefined;
  if (spec.json !== undefined) {
    headers['content-type'] ??= 'application/json';
    body = JSON.stringify(spec.json);
  } else if (spec.form) {
    headers['content-type'] ??= 'application/x-www-form-urlencoded';
    body = new URLSearchParams(spec.form).toString();
  } else if (spec.multipart) {
    body = await spec.multipart();
  }
  return client.request(spec.path, { method: row.method, headers, body });
}

export const statusOk = (expected: Expect, status: number) => (Array.isArray(expected) ? expected.includes(status) : expected === status);
