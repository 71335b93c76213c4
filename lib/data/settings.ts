import 'server-only';
import { getDb } from '@/db/client';
import { clubSettings } from '@/db/schema';
import { cachedRead } from './read-cache';
import { announceInvalidation } from './invalidation';
import type { SessionUser } from '@/lib/auth/session';
import type { SettingsInput } from '@/lib/validation/auth';
import { assertRole } from '@/lib/auth/roles';

export interface ClubSettingsDto {
  clubName: string;
  hemisphere: 'north' | 'south';
  defaultLatitude: number;
  decandleOffsetDays: number;
}

const DEFAULTS: ClubSettingsDto = { clubName: 'Our bonsai club', hemisphere: 'north', defaultLatitude: 45, decandleOffsetDays: 0 };

/** Club settings are readable by everyone (the wizard uses them, signed in or not). */
export async function getClubSettings(): Promise<ClubSettingsDto> {
  const db = await getDb();
  return cachedRead(db, 'settings', 'club', () => loadClubSettings(db));
}

async function loadClubSettings(db: Awaited<ReturnType<typeof getDb>>): Promise<ClubSettingsDto> {
  const [row] = await db
    .select({
      clubName: clubSettings.clubName,
      hemisphere: clubSettings.hemisphere,
      defaultLatitude: clubSettings.defaultLatitude,
      decandleOffsetDays: clubSettings.decandleOffsetDays,
    })
    .from(clubSettings)
    .limit(1);
  return row ?? DEFAULTS;
}

export async function updateClubSettings(actor: SessionUser, input: SettingsInput): Promise<ClubSettingsDto> {
  assertRole(actor, 'admin', 'settings', 'Only administrators change club settings.');
  const db = await getDb();
  const [row] = await db
    .insert(clubSettings)
    .values({ id: 1, ...input, updatedAt: new Date() })
    .onConflictDoUpdate({ target: clubSettings.id, set: { ...input, updatedAt: new Date() } })
    .returning({
      clubName: clubSettings.clubName,
      hemisphere: clubSettings.hemisphere,
      defaultLatitude: clubSettings.defaultLatitude,
      decandleOffsetDays: clubSettings.decandleOffsetDays,
    });
  await announceInvalidation({ kind: 'settings' });
  return row;
}
