import 'server-only';
import { sql } from 'drizzle-orm';
import bcrypt from 'bcryptjs';
import type { Db } from './open';
import { clubSettings, users, type Role } from './schema';
import { seedSpecies } from './seed-species';
import { seedRecord } from './seed-record';

// The demo club is invented: a riverside pine study group with invented members.
export const DEMO_PASSWORD = 'candlewise-demo';

// The demo member has the weekly reminders on: their Scots pine's candle work falls in May, so a
// reminder run for a week in May sends them one e-mail.
export const demoAccounts: { email: string; name: string; role: Role; digestOptIn: boolean; reminderOptIn?: boolean }[] = [
  { email: 'member@candlewise.test', name: 'Wren Alder', role: 'member', digestOptIn: true, reminderOptIn: true },
  { email: 'member2@candlewise.test', name: 'Tamsin Reed', role: 'member', digestOptIn: false },
  { email: 'editor@candlewise.test', name: 'Osric Fenwood', role: 'editor', digestOptIn: true },
  { email: 'librarian@candlewise.test', name: 'Marla Quayle', role: 'librarian', digestOptIn: true },
  { email: 'admin@candlewise.test', name: 'Bram Hollis', role: 'admin', digestOptIn: false },
];

export const demoClub = { clubName: 'Riverside Pine Study Group', hemisphere: 'north' as const, defaultLatitude: 45.5 };

export type Seeder = (db: Db) => Promise<void>;

export async function seedUsers(db: Db) {
  const passwordHash = await bcrypt.hash(DEMO_PASSWORD, 10);
  for (const a of demoAccounts) {
    await db
      .insert(users)
      .values({ ...a, passwordHash, emailVerified: new Date() })
      .onConflictDoNothing({ target: users.email });
  }
}

export async function seedSettings(db: Db) {
  await db
    .insert(clubSettings)
    .values({ id: 1, ...demoClub })
    .onConflictDoNothing({ target: clubSettings.id });
}

/** Further seeders (species, demo trees and answers, notes) register here in order. */
export const seeders: Seeder[] = [seedUsers, seedSettings, (db) => seedSpecies(db), seedRecord];

/** Idempotent: running it twice leaves the same rows. */
export async function seed(db: Db) {
  for (const s of seeders) await s(db);
  await db.execute(sql`select 1`);
}
