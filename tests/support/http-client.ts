// A small cookie-keeping HTTP client for the integration tests: it signs in the way a browser
// does (CSRF token, then the credentials callback) and sends the session cookie afterwards.

export const DEMO_PASSWORD = 'candlewise-demo';

export class Client {
  cookies = new Map<string, string>();
  constructor(readonly base: string) {}

  cookieHeader() {
    return [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ');
  }

  private keep(res: Response) {
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(';');
      const i = pair.indexOf('=');
      const name = pair.slice(0, i);
      const value = pair.slice(i + 1);
      if (!value || /max-age=0/i.test(c) || /expires=Thu, 01 Jan 1970/i.test(c)) this.cookies.delete(name);
      else this.cookies.set(name, value);
    }
  }

  async request(path: string, init: RequestInit & { json?: unknown } = {}) {
    const headers = new Headers(init.headers);
    if (this.cookies.size) headers.set('cookie', this.cookieHeader());
    let body = init.body;
    if (init.json !== undefined) {
      headers.set('content-type', 'application/json');
      body = JSON.stringify(init.json);
    }
    const res = await fetch(this.base + path, { ...init, body, headers, redirect: 'manual' });
    this.keep(res);
    return res;
  }

  get(path: string, init: RequestInit = {}) {
    return this.request(path, { ...init, method: 'GET' });
  }

  async json<T = any>(path: string, method: string, json?: unknown, headers: Record<string, string> = {}) {
    const res = await this.request(path, { method, json, headers });
    const text = await res.text();
    return { status: res.status, body: (text ? JSON.parse(text) : null) as T, headers: res.headers };
  }

  async csrf() {
    const res = await this.get('/api/auth/csrf');
    return ((await res.json()) as { csrfToken: string }).csrfToken;
  }

  /** Returns the status of the credentials callback (200 with a JSON url, or 401/429). */
  async signIn(email: string, password = DEMO_PASSWORD) {
    const csrfToken = await this.csrf();
    const res = await this.request('/api/auth/callback/credentials', {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded', 'x-auth-return-redirect': '1' },
      body: new URLSearchParams({ email, password, csrfToken, json: 'true' }).toString(),
    });
    const data = (await res.json().catch(() => ({}))) as { url?: string };
    const ok = res.ok && !!data.url && !data.url.includes('error=');
    return { status: res.status, ok, url: data.url };
  }

  async signOut() {
    const csrfToken = await this.csrf();
    return this.request('/api/auth/signout', {
      method: 'POST',
      headers: { 'content-type': 'application/x-www-form-urlencoded' },
      body: new URLSearchParams({ csrfToken, json: 'true' }).toString(),
    });
  }

  async session() {
    const res = await this.get('/api/auth/session');
    return (await res.json()) as { user?: { id: string; role: string; name: string } };
  }
}

export async function signedIn(base: string, email: string) {
  const c = new Client(base);
  const r = await c.signIn(email);
  if (!r.ok) throw new Error(`could not sign in ${email}: ${r.status} ${r.url}`);
  return c;
}

export interface SentMail {
  to: string[];
  subject: string;
  text: string | null;
}

const admins = new Map<string, Promise<Client>>();

/** The mails sent to `email`, newest first, read from the outbox as the demo administrator. */
export async function mailsTo(base: string, email: string): Promise<SentMail[]> {
  let admin = admins.get(base);
  if (!admin) {
    admin = signedIn(base, 'admin@candlewise.test');
    admins.set(base, admin);
  }
  const r = await (await admin).json<{ items: SentMail[] }>('/api/outbox?limit=200', 'GET');
  if (r.status !== 200) throw new Error(`outbox: ${r.status}`);
  return r.body.items.filter((m) => m.to.includes(email.toLowerCase()));
}

/** Wait (up to `ms`) for a mail to `email` whose subject matches; sends are queued after the response. */
export async function waitForMail(base: string, email: string, subject: RegExp, ms = 10_000): Promise<SentMail> {
  const until = Date.now() + ms;
  for (;;) {
    const hit = (await mailsTo(base, email)).find((m) => subject.test(m.subject));
    if (hit) return hit;
    if (Date.now() > until) throw new Error(`no mail "${subject}" to ${email} within ${ms} ms`);
    await new Promise((r) => setTimeout(r, 150));
  }
}

/** The confirmation token in a sign-up mail. */
export function confirmToken(mail: SentMail): string {
  const m = /\/sign-up\/confirm\?token=([A-Za-z0-9_-]+)/.exec(mail.text ?? '');
  if (!m) throw new Error(`no confirmation link in "${mail.subject}"`);
  return m[1];
}

/**
 * Sign up the way a new member does: the form (202), then the link from the e-mail. Returns the
 * new account's id, read from a first sign-in.
 */
export async function signUp(base: string, input: { name: string; email: string; password: string }, headers: Record<string, string> = {}) {
  const r = await new Client(base).json('/api/users', 'POST', input, headers);
  if (r.status !== 202) throw new Error(`sign-up failed: ${r.status} ${JSON.stringify(r.body)}`);
  const token = confirmToken(await waitForMail(base, input.email, /^Confirm your Candlewise account$/));
  const c = await new Client(base).json('/api/users/confirm', 'POST', { token });
  if (c.status !== 200 || !c.body.created) throw new Error(`confirmation failed: ${c.status} ${JSON.stringify(c.body)}`);
  const client = new Client(base);
  if (!(await client.signIn(input.email, input.password)).ok) throw new Error(`sign-in of ${input.email} failed`);
  const id = (await client.session()).user?.id;
  if (!id) throw new Error(`no session for ${input.email}`);
  return { id, client };
}
