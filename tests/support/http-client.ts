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
