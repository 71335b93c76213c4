import { Client, demoEmail, DEMO_PASSWORD, unique, type Actor, type Fixtures } from './fixtures';
import { atLeast, every, pageAtLeast, pageSignedIn, signedIn, type RouteRow } from './matrix-types';
import { clubRows } from './route-matrix-club';

// THE role × route matrix: every route handler (each exported method of each app/**/route.ts),
// every page and every server action, with the status each actor must get. The walk in
// route-matrix.test.ts checks each cell, then the same requests with middleware-bypass headers;
// csrf.test.ts sends every mutating row cross-site; fuzz.test.ts throws bodies at every JSON row.
// A route added to app/ without a row here fails the coverage test.

export * from './matrix-types';

const demoSettings = { clubName: 'Riverside Pine Study Group', hemisphere: 'north', defaultLatitude: 45.5 } as const;

async function currentName(f: Fixtures, actor: Actor) {
  if (actor === 'anonymous') return 'Nobody';
  const me = await (await f.client(actor)).json('/api/me', 'GET');
  return me.body.user.name as string;
}

/** A throwaway account an admin may change. */
async function throwawayUserId(f: Fixtures) {
  return (await f.newMember('target')).id;
}

/** A reminder run, queued by the admin. */
async function reminderRunId(f: Fixtures) {
  const r = await (await f.client('admin')).json('/api/admin/reminders/run', 'POST', { weekOf: '2020-01-06' });
  return r.body.run.id as string;
}

async function csrfOf(c: Client) {
  return c.csrf();
}

// ── the rows ───────────────────────────────────────────────────────────────────────────────
export const routeMatrix: RouteRow[] = [
  // Foundation API
  {
    route: 'GET /api/health',
    file: 'app/api/health/route.ts',
    method: 'GET',
    kind: 'api',
    body: 'none',
    request: () => ({ path: '/api/health' }),
    expect: every(200),
  },
  { route: 'GET /api/me', file: 'app/api/me/route.ts', method: 'GET', kind: 'api', body: 'none', request: () => ({ path: '/api/me' }), expect: signedIn(200) },
  {
    route: 'PATCH /api/me',
    file: 'app/api/me/route.ts',
    method: 'PATCH',
    kind: 'api',
    body: 'json',
    request: async (f, a) => ({ path: '/api/me', json: { name: await currentName(f, a) } }),
    expect: signedIn(200),
    fuzz: { as: 'member', restore: async (f) => void (await (await f.client('member')).json('/api/me', 'PATCH', { name: 'Wren Alder', digestOptIn: true })) },
  },
  {
    route: 'GET /api/outbox',
    file: 'app/api/outbox/route.ts',
    method: 'GET',
    kind: 'api',
    body: 'none',
    request: () => ({ path: '/api/outbox?limit=5' }),
    expect: atLeast('admin', 200),
  },
  // Weekly reminders (a week long past, so the matrix's runs send nothing due today)
  {
    route: 'POST /api/admin/reminders/run',
    file: 'app/api/admin/reminders/run/route.ts',
    method: 'POST',
    kind: 'api',
    body: 'json',
    request: () => ({ path: '/api/admin/reminders/run', json: { weekOf: '2020-01-06' } }),
    expect: atLeast('admin', 202),
    fuzz: { as: 'admin' },
  },
  {
    route: 'GET /api/admin/reminders/runs',
    file: 'app/api/admin/reminders/runs/route.ts',
    method: 'GET',
    kind: 'api',
    body: 'none',
    request: () => ({ path: '/api/admin/reminders/runs' }),
    expect: atLeast('admin', 200),
  },
  {
    route: 'GET /api/admin/reminders/runs/[id]',
    file: 'app/api/admin/reminders/runs/[id]/route.ts',
    method: 'GET',
    kind: 'api',
    body: 'none',
    request: async (f) => ({ path: `/api/admin/reminders/runs/${await reminderRunId(f)}` }),
    expect: atLeast('admin', 200),
  },
  {
    route: 'GET /api/settings',
    file: 'app/api/settings/route.ts',
    method: 'GET',
    kind: 'api',
    body: 'none',
    request: () => ({ path: '/api/settings' }),
    expect: every(200),
  },
  {
    route: 'PUT /api/settings',
    file: 'app/api/settings/route.ts',
    method: 'PUT',
    kind: 'api',
    body: 'json',
    request: () => ({ path: '/api/settings', json: demoSettings }),
    expect: atLeast('admin', 200),
    fuzz: { as: 'admin', restore: async (f) => void (await (await f.client('admin')).json('/api/settings', 'PUT', demoSettings)) },
  },
  {
    route: 'GET /api/users',
    file: 'app/api/users/route.ts',
    method: 'GET',
    kind: 'api',
    body: 'none',
    request: () => ({ path: '/api/users?sort=email' }),
    expect: atLeast('admin', 200),
  },
  {
    route: 'POST /api/users',
    file: 'app/api/users/route.ts',
    method: 'POST',
    kind: 'api',
    body: 'json',
    // Sign-up is public: anyone may ask for a member account (202; the account comes with the mailed link).
    request: () => ({ path: '/api/users', json: { name: 'New Grower', email: `${unique('signup')}@candlewise.test`, password: 'pine-bark-and-river-sand' } }),
    expect: every(202),
    fuzz: { as: 'anonymous' },
  },
  {
    route: 'POST /api/users/confirm',
    file: 'app/api/users/confirm/route.ts',
    method: 'POST',
    kind: 'api',
    body: 'json',
    // Public: the token from the mailed link is the proof. An unknown token is a 404.
    request: () => ({ path: '/api/users/confirm', json: { token: 'not-a-real-confirmation-token' } }),
    expect: every(404),
    fuzz: { as: 'anonymous' },
  },
  {
    route: 'PATCH /api/users/[id]',
    file: 'app/api/users/[id]/route.ts',
    method: 'PATCH',
    kind: 'api',
    body: 'json',
    request: async (f) => ({ path: `/api/users/${await throwawayUserId(f)}`, json: { role: 'editor' } }),
    expect: atLeast('admin', 200),
    fuzz: { as: 'admin' },
  },

  // next-auth (one handler file, GET and POST on many paths)
  {
    route: 'GET /api/auth/session',
    file: 'app/api/auth/[...nextauth]/route.ts',
    method: 'GET',
    kind: 'auth',
    body: 'none',
    request: () => ({ path: '/api/auth/session' }),
    expect: every(200),
  },
  {
    route: 'GET /api/auth/csrf',
    file: 'app/api/auth/[...nextauth]/route.ts',
    method: 'GET',
    kind: 'auth',
    body: 'none',
    request: () => ({ path: '/api/auth/csrf' }),
    expect: every(200),
  },
  {
    route: 'GET /api/auth/providers',
    file: 'app/api/auth/[...nextauth]/route.ts',
    method: 'GET',
    kind: 'auth',
    body: 'none',
    request: () => ({ path: '/api/auth/providers' }),
    expect: every(200),
  },
  {
    route: 'POST /api/auth/callback/credentials',
    file: 'app/api/auth/[...nextauth]/route.ts',
    method: 'POST',
    kind: 'auth',
    body: 'form',
    request: async (f) => {
      const c = new Client(f.base);
      return {
        path: '/api/auth/callback/credentials',
        client: c,
        headers: { 'x-auth-return-redirect': '1' },
        form: { email: demoEmail.member, password: DEMO_PASSWORD, csrfToken: await csrfOf(c), json: 'true' },
      };
    },
    expect: every(200),
  },
  {
    route: 'POST /api/auth/signin/email',
    file: 'app/api/auth/[...nextauth]/route.ts',
    method: 'POST',
    kind: 'auth',
    body: 'form',
    request: async (f) => {
      const c = new Client(f.base);
      return { path: '/api/auth/signin/email', client: c, form: { email: `${unique('nobody')}@candlewise.test`, csrfToken: await csrfOf(c), json: 'true' } };
    },
    expect: every(200),
  },
  {
    route: 'POST /api/auth/signout',
    file: 'app/api/auth/[...nextauth]/route.ts',
    method: 'POST',
    kind: 'auth',
    body: 'form',
    request: async (f, a) => {
      const c = await f.freshClient(a);
      return { path: '/api/auth/signout', client: c, form: { csrfToken: await csrfOf(c), json: 'true' } };
    },
    expect: every(200),
  },

  // Pages
  { route: 'GET /', file: 'app/page.tsx', method: 'GET', kind: 'page', body: 'none', request: () => ({ path: '/' }), expect: every(200) },
  {
    route: 'GET /sign-in',
    file: 'app/(auth)/sign-in/page.tsx',
    method: 'GET',
    kind: 'page',
    body: 'none',
    request: () => ({ path: '/sign-in' }),
    expect: every(200),
  },
  {
    route: 'GET /sign-up',
    file: 'app/(auth)/sign-up/page.tsx',
    method: 'GET',
    kind: 'page',
    body: 'none',
    request: () => ({ path: '/sign-up' }),
    expect: every(200),
  },
  {
    route: 'GET /sign-up/confirm',
    file: 'app/(auth)/sign-up/confirm/page.tsx',
    method: 'GET',
    kind: 'page',
    body: 'none',
    request: () => ({ path: '/sign-up/confirm?token=not-a-real-confirmation-token' }),
    expect: every(200),
  },
  {
    route: 'GET /verify',
    file: 'app/(auth)/verify/page.tsx',
    method: 'GET',
    kind: 'page',
    body: 'none',
    request: () => ({ path: '/verify' }),
    expect: every(200),
  },
  {
    route: 'GET /profile',
    file: 'app/(club)/profile/page.tsx',
    method: 'GET',
    kind: 'page',
    body: 'none',
    request: () => ({ path: '/profile' }),
    expect: pageSignedIn,
  },
  {
    route: 'GET /admin',
    file: 'app/(club)/admin/page.tsx',
    method: 'GET',
    kind: 'page',
    body: 'none',
    request: () => ({ path: '/admin' }),
    expect: pageAtLeast('admin'),
  },
  {
    route: 'GET /admin/outbox',
    file: 'app/(club)/admin/outbox/page.tsx',
    method: 'GET',
    kind: 'page',
    body: 'none',
    request: () => ({ path: '/admin/outbox' }),
    expect: pageAtLeast('admin'),
  },
  {
    route: 'GET /species',
    file: 'app/(club)/species/(browse)/page.tsx',
    method: 'GET',
    kind: 'page',
    body: 'none',
    request: () => ({ path: '/species' }),
    expect: every(200),
  },
  { route: 'GET /ask', file: 'app/(club)/ask/page.tsx', method: 'GET', kind: 'page', body: 'none', request: () => ({ path: '/ask' }), expect: every(200) },
  {
    route: 'GET /answers',
    file: 'app/(club)/answers/page.tsx',
    method: 'GET',
    kind: 'page',
    body: 'none',
    request: () => ({ path: '/answers' }),
    expect: pageSignedIn,
  },
  {
    route: 'GET /trees',
    file: 'app/(club)/trees/page.tsx',
    method: 'GET',
    kind: 'page',
    body: 'none',
    request: () => ({ path: '/trees' }),
    expect: pageSignedIn,
  },
  {
    route: 'GET /notes',
    file: 'app/(club)/notes/page.tsx',
    method: 'GET',
    kind: 'page',
    body: 'none',
    request: () => ({ path: '/notes' }),
    expect: pageSignedIn,
  },

  ...clubRows,
];
