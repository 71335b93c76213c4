import 'server-only';
import path from 'node:path';
import { z } from 'zod';

// The one place that reads process.env; everything else imports `env`.
const schema = z.object({
  NODE_ENV: z.enum(['development', 'production', 'test']).default('development'),
  PGLITE_DIR: z.string().min(1).default('./data/pglite'),
  DATABASE_URL: z.string().url().optional(),
  NEXTAUTH_URL: z.string().url().default('http://127.0.0.1:3000'),
  NEXTAUTH_SECRET: z.string().min(16).optional(),
  /** Where a generated secret is kept when NEXTAUTH_SECRET is unset (default: beside the PGlite directory). */
  SECRET_FILE: z.string().min(1).optional(),
  SMTP_URL: z.string().optional(),
  SMTP_FAKE_PORT: z.coerce.number().int().min(1).max(65535).default(2525),
  MAIL_FAKE: z.enum(['0', '1']).default('0'),
  MAIL_FROM: z.string().default('Candlewise <no-reply@candlewise.test>'),
  UPLOADS_DIR: z.string().min(1).default('./data/uploads'),
  // Photos in an S3-compatible store instead of UPLOADS_DIR when both S3_URL and S3_BUCKET are set.
  S3_URL: z.string().url().optional(),
  S3_BUCKET: z
    .string()
    .min(3)
    .max(63)
    .regex(/^[a-z0-9][a-z0-9.-]+[a-z0-9]$/, { error: 'S3_BUCKET: 3 to 63 lower-case letters, digits, dots or hyphens.' })
    .optional(),
  S3_REGION: z.string().min(1).optional(),
  S3_ACCESS_KEY_ID: z.string().min(1).optional(),
  S3_SECRET_ACCESS_KEY: z.string().min(1).optional(),
  S3_PREFIX: z.string().max(200).optional(),
  // Caps per member and per client (see lib/data/quotas.ts); tests and big clubs may raise them.
  ANSWER_QUOTA: z.coerce.number().int().min(1).max(10_000_000).default(5000),
  PHOTO_QUOTA: z.coerce.number().int().min(1).max(10_000_000).default(1000),
  SIGNUPS_PER_CLIENT_PER_HOUR: z.coerce.number().int().min(1).max(10_000_000).default(10),
});

// An empty variable means unset (scripts pass DATABASE_URL='' to mean PGlite).
const parsed = schema.safeParse(Object.fromEntries(Object.entries(process.env).filter(([, v]) => v !== '')));
if (!parsed.success) {
  const fields = parsed.error.issues.map((i) => `${i.path.join('.')}: ${i.message}`).join('; ');
  throw new Error(`Invalid environment: ${fields}`);
}

const raw = parsed.data;

export const env = {
  ...raw,
  PGLITE_DIR: path.resolve(raw.PGLITE_DIR),
  UPLOADS_DIR: path.resolve(raw.UPLOADS_DIR),
  /** The generated secret's file (lib/auth/secret.ts): kept with the data, owner-readable only. */
  secretFile: path.resolve(raw.SECRET_FILE ?? path.join(path.dirname(path.resolve(raw.PGLITE_DIR)), 'candlewise-secret')),
  /** True while `next build` runs: nothing may be written or opened then. */
  building: process.env.NEXT_PHASE === 'phase-production-build',
  /** Mail goes to the local fake unless a real SMTP server is configured. */
  get smtpUrl() {
    return raw.SMTP_URL ?? `smtp://127.0.0.1:${raw.SMTP_FAKE_PORT}`;
  },
  get secureCookies() {
    return raw.NEXTAUTH_URL.startsWith('https://');
  },
};
