import 'server-only';
import type { AuthOptions } from 'next-auth';
import type { Adapter } from 'next-auth/adapters';
import CredentialsProvider from 'next-auth/providers/credentials';
import EmailProvider from 'next-auth/providers/email';
import { DrizzleAdapter } from '@auth/drizzle-adapter';
import { getDb } from '@/db/client';
import { accounts, sessions, users, verificationTokens } from '@/db/schema';
import { env } from '@/lib/env';
import { sessionKey } from '@/lib/auth/secret';
import { announceInvalidation } from '@/lib/data/invalidation';
import { signInSchema } from '@/lib/validation/auth';
import { bumpTokenVersion, findSessionAccount, hasActiveAccount, isEmailAllowedToSignIn, verifyCredentials } from '@/lib/data/users';
import { clientIp, recordSignInFailure } from './rate-limit';
import { sendSignInLink } from '@/lib/mail/templates';
import { safeCallbackPath } from '@/lib/http/safe-redirect';

const adapterMethods = [
  'createUser',
  'getUser',
  'getUserByEmail',
  'getUserByAccount',
  'updateUser',
  'deleteUser',
  'linkAccount',
  'unlinkAccount',
  'createSession',
  'getSessionAndUser',
  'updateSession',
  'deleteSession',
  'createVerificationToken',
  'useVerificationToken',
] as const;

/** The database opens lazily (never during `next build`), so the adapter is built on first use. */
function lazyAdapter(): Adapter {
  let inner: Promise<Record<string, (...a: unknown[]) => unknown>> | undefined;
  const load = () =>
    (inner ??= getDb().then(
      (db) =>
        DrizzleAdapter(db, {
          usersTable: users,
          accountsTable: accounts,
          sessionsTable: sessions,
          verificationTokensTable: verificationTokens,
        } as never) as never,
    ));
  return Object.fromEntries(
    adapterMethods.map((m) => [
      m,
      async (...args: unknown[]) => {
        const result = await (await load())[m](...args);
        // The adapter writes accounts too (e-mail sign-in marks the address verified).
        if (m === 'updateUser' || m === 'deleteUser') await announceInvalidation({ kind: 'account' });
        return result;
      },
    ]),
  ) as unknown as Adapter;
}

/** Send a sign-in link after the response, if the address belongs to an enabled account. */
function queueSignInLink(identifier: string, url: string) {
  setImmediate(() => {
    hasActiveAccount(identifier)
      .then((active) => (active ? sendSignInLink(identifier, url) : undefined))
      .catch((e: unknown) => console.error('[candlewise] sign-in link not sent', e));
  });
}

const SESSION_MAX_AGE = 30 * 24 * 60 * 60;
export const EMAIL_LINK_MAX_AGE = 15 * 60;

export const authOptions: AuthOptions = {
  adapter: lazyAdapter(),
  // Read at request time, not at import (the build imports this module and must not create a secret).
  get secret() {
    return sessionKey();
  },
  session: { strategy: 'jwt', maxAge: SESSION_MAX_AGE },
  useSecureCookies: env.secureCookies,
  pages: { signIn: '/sign-in', verifyRequest: '/verify', error: '/sign-in' },
  providers: [
    CredentialsProvider({
      id: 'credentials',
      name: 'E-mail and password',
      credentials: { email: { label: 'E-mail', type: 'email' }, password: { label: 'Password', type: 'password' } },
      async authorize(credentials, req) {
        const parsed = signInSchema.safeParse(credentials);
        const ip = clientIp(req?.headers as Record<string, unknown> | undefined);
        if (!parsed.success) {
          await recordSignInFailure(String(credentials?.email ?? ''), ip);
          return null;
        }
        const user = await verifyCredentials(parsed.data.email, parsed.data.password);
        if (!user) {
          await recordSignInFailure(parsed.data.email, ip);
          return null;
        }
        return { id: user.id, email: user.email, name: user.name };
      },
    }),
    EmailProvider({
      maxAge: EMAIL_LINK_MAX_AGE,
      server: env.smtpUrl,
      from: env.MAIL_FROM,
      async sendVerificationRequest({ identifier, url }) {
        // Links go only to existing, enabled accounts (sign-up is the password form). The look-up
        // and the send are queued, not awaited: the answer comes back in the same time and with
        // the same words for a member and a stranger, so neither says who is a member.
        queueSignInLink(identifier, url);
      },
    }),
  ],
  callbacks: {
    // Only a path on our own origin, parsed against it: `/\evil.example`, `/%09/evil.example`,
    // `//evil.example` and the like all end on the home page.
    async redirect({ url, baseUrl }) {
      return `${baseUrl}${safeCallbackPath(url, baseUrl)}`;
    },
    async signIn({ user }) {
      return user.email ? isEmailAllowedToSignIn(user.email) : false;
    },
    async jwt({ token, user }) {
      // Check the account on every request: a role change, a disable or a sign-out elsewhere
      // takes effect now, not when the 30-day token runs out. The account comes from
      // lib/auth/token-cache.ts, which every write to it invalidates.
      const id = user?.id ?? (typeof token.uid === 'string' ? token.uid : undefined);
      if (!id) return token;
      const u = await findSessionAccount(id);
      const current = u && !u.disabled && (user ? true : u.tokenVersion === token.tv);
      if (!current) {
        delete token.uid;
        delete token.tv;
        delete token.role;
        return token;
      }
      token.uid = u.id;
      token.role = u.role;
      token.name = u.name ?? u.email.split('@')[0];
      token.email = u.email;
      if (user) token.tv = u.tokenVersion;
      return token;
    },
    async session({ session, token }) {
      if (typeof token.uid === 'string') {
        session.user = { ...session.user, id: token.uid, role: token.role as string, name: token.name, email: token.email };
      } else {
        delete (session as { user?: unknown }).user;
      }
      return session;
    },
  },
  events: {
    async signOut({ token }) {
      if (token && typeof token.uid === 'string') await bumpTokenVersion(token.uid);
    },
  },
};
