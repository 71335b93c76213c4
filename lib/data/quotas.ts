import 'server-only';
import { count, eq } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { answers, photos } from '@/db/schema';
import { AppError } from '@/lib/errors';
import { env } from '@/lib/env';

// Per-member caps, so one account cannot fill the club's disk or database. The numbers are far
// above what a member of a club records in years (ANSWER_QUOTA and PHOTO_QUOTA raise them).

export async function assertAnswerQuota(userId: string) {
  const db = await getDb();
  const [{ n }] = await db.select({ n: count() }).from(answers).where(eq(answers.userId, userId));
  if (n >= env.ANSWER_QUOTA) {
    throw new AppError('forbidden:quota', `You have ${n} saved answers, the most one member may keep: delete some old ones first.`, {
      body: [`At most ${env.ANSWER_QUOTA} saved answers per member.`],
    });
  }
}

export async function assertPhotoQuota(userId: string) {
  const db = await getDb();
  const [{ n }] = await db.select({ n: count() }).from(photos).where(eq(photos.ownerId, userId));
  if (n >= env.PHOTO_QUOTA) {
    throw new AppError('forbidden:quota', `You have ${n} photos, the most one member may keep: remove some first.`, {
      file: [`At most ${env.PHOTO_QUOTA} photos per member.`],
    });
  }
}
