import 'server-only';
import { and, asc, count, eq } from 'drizzle-orm';
import { getDb } from '@/db/client';
import { answers, photos, trees } from '@/db/schema';
import { AppError } from '@/lib/errors';
import { newPublicId } from '@/lib/ids';
import { newStorageKey, storage } from '@/lib/storage';
import { MAX_PHOTOS_PER_ITEM, type ProcessedPhoto } from '@/lib/uploads/image';
import type { SessionUser } from '@/lib/auth/session';
import { getAnswer } from '@/lib/data/answers';
import { assertPhotoQuota } from '@/lib/data/quotas';

// Shoot photos belong to an answer or a tree. Who may see a photo is who may see its item:
// a tree's photos only its owner; an answer's photos its asker, and every signed-in member once
// the answer is shared with the club. Only the photo's owner adds or removes photos.

export type PhotoTarget = { treeId: string } | { answerId: string };

export interface PhotoDto {
  id: string;
  url: string;
  thumbUrl: string;
  mime: string;
  width: number;
  height: number;
  bytes: number;
  createdAt: string;
  mine: boolean;
}

type Access = 'owner' | 'viewer' | null;

async function treeAccess(viewer: SessionUser, treeId: string): Promise<Access> {
  const db = await getDb();
  const [t] = await db.select({ ownerId: trees.ownerId }).from(trees).where(eq(trees.id, treeId)).limit(1);
  return t && t.ownerId === viewer.id ? 'owner' : null;
}

async function answerAccess(viewer: SessionUser, answerId: string): Promise<Access> {
  // The answer log decides who may see an answer (its asker, or everyone once shared).
  const a = await getAnswer(answerId, viewer);
  if (!a) return null;
  return a.isOwner ? 'owner' : 'viewer';
}

function accessTo(viewer: SessionUser, target: PhotoTarget): Promise<Access> {
  return 'treeId' in target ? treeAccess(viewer, target.treeId) : answerAccess(viewer, target.answerId);
}

const notFound = () => new AppError('not_found:photo', 'No such photo.');
const itemNotFound = (target: PhotoTarget) =>
  'treeId' in target ? new AppError('not_found:tree', 'No such tree.') : new AppError('not_found:answer', 'No such answer.');

const dtoColumns = {
  id: photos.id,
  ownerId: photos.ownerId,
  mime: photos.mime,
  width: photos.width,
  height: photos.height,
  bytes: photos.bytes,
  createdAt: photos.createdAt,
};

function toDto(viewer: SessionUser, r: { id: string; ownerId: string; mime: string; width: number; height: number; bytes: number; createdAt: Date }): PhotoDto {
  return {
    id: r.id,
    url: `/api/uploads/${r.id}`,
    thumbUrl: `/api/uploads/${r.id}?size=thumb`,
    mime: r.mime,
    width: r.width,
    height: r.height,
    bytes: r.bytes,
    createdAt: r.createdAt.toISOString(),
    mine: r.ownerId === viewer.id,
  };
}

const targetWhere = (target: PhotoTarget) => ('treeId' in target ? eq(photos.treeId, target.treeId) : eq(photos.answerId, target.answerId));

export async function listPhotos(viewer: SessionUser, target: PhotoTarget): Promise<PhotoDto[]> {
  if (!(await accessTo(viewer, target))) throw itemNotFound(target);
  const db = await getDb();
  const rows = await db.select(dtoColumns).from(photos).where(targetWhere(target)).orderBy(asc(photos.createdAt), asc(photos.id));
  return rows.map((r) => toDto(viewer, r));
}

/** May the actor add a photo here at all? Checked before the image is processed. */
export async function assertCanAddPhoto(actor: SessionUser, target: PhotoTarget): Promise<void> {
  const access = await accessTo(actor, target);
  if (!access) throw itemNotFound(target);
  if (access !== 'owner') throw new AppError('forbidden:photo', 'Only the member who asked can add photos to this answer.');
  const db = await getDb();
  const [{ n }] = await db.select({ n: count() }).from(photos).where(targetWhere(target));
  if (n >= MAX_PHOTOS_PER_ITEM) throw limitReached();
  await assertPhotoQuota(actor.id);
}

const limitReached = () =>
  new AppError('conflict:photo_limit', `Up to ${MAX_PHOTOS_PER_ITEM} photos per tree or answer: remove one first.`, {
    file: [`Already ${MAX_PHOTOS_PER_ITEM} photos here.`],
  });

/** Stores a checked, re-encoded photo and its thumbnail; the row and the files appear together or not at all. */
export async function addPhoto(actor: SessionUser, target: PhotoTarget, photo: ProcessedPhoto): Promise<PhotoDto> {
  await assertCanAddPhoto(actor, target);
  const db = await getDb();
  const store = storage();
  const id = newPublicId();
  const storageKey = newStorageKey('photos', photo.ext);
  const thumbKey = newStorageKey('thumbs', 'webp');
  let written = false;
  try {
    const row = await db.transaction(async (tx) => {
      // Lock the item so two uploads at once cannot both take the sixth place.
      if ('treeId' in target) {
        await tx
          .select({ id: trees.id })
          .from(trees)
          .where(and(eq(trees.id, target.treeId), eq(trees.ownerId, actor.id)))
          .for('update');
      } else {
        await tx
          .select({ id: answers.id })
          .from(answers)
          .where(and(eq(answers.id, target.answerId), eq(answers.userId, actor.id)))
          .for('update');
      }
      const [{ n }] = await tx.select({ n: count() }).from(photos).where(targetWhere(target));
      if (n >= MAX_PHOTOS_PER_ITEM) throw limitReached();
      const [inserted] = await tx
        .insert(photos)
        .values({
          id,
          ownerId: actor.id,
          treeId: 'treeId' in target ? target.treeId : null,
          answerId: 'answerId' in target ? target.answerId : null,
          storageKey,
          thumbKey,
          mime: photo.mime,
          width: photo.width,
          height: photo.height,
          bytes: photo.data.length,
        })
        .returning(dtoColumns);
      written = true;
      await store.put(storageKey, photo.data);
      await store.put(thumbKey, photo.thumb);
      return inserted;
    });
    return toDto(actor, row);
  } catch (e) {
    if (written) await Promise.allSettled([store.delete(storageKey), store.delete(thumbKey)]);
    throw e;
  }
}

/** The stored bytes of a photo for a viewer allowed to see it; 404 for everyone else. */
export async function readPhoto(viewer: SessionUser, id: string, size: 'full' | 'thumb'): Promise<{ mime: string; data: Buffer }> {
  const db = await getDb();
  const [p] = await db
    .select({ treeId: photos.treeId, answerId: photos.answerId, storageKey: photos.storageKey, thumbKey: photos.thumbKey, mime: photos.mime })
    .from(photos)
    .where(eq(photos.id, id))
    .limit(1);
  if (!p) throw notFound();
  const target: PhotoTarget | null = p.treeId ? { treeId: p.treeId } : p.answerId ? { answerId: p.answerId } : null;
  if (!target || !(await accessTo(viewer, target))) throw notFound();
  const data = await storage().get(size === 'thumb' ? p.thumbKey : p.storageKey);
  if (!data) throw notFound();
  return { mime: size === 'thumb' ? 'image/webp' : p.mime, data };
}

export async function deletePhoto(actor: SessionUser, id: string): Promise<void> {
  const db = await getDb();
  const [p] = await db.select({ ownerId: photos.ownerId, treeId: photos.treeId, answerId: photos.answerId }).from(photos).where(eq(photos.id, id)).limit(1);
  if (!p) throw notFound();
  const target: PhotoTarget | null = p.treeId ? { treeId: p.treeId } : p.answerId ? { answerId: p.answerId } : null;
  if (!target || !(await accessTo(actor, target))) throw notFound();
  if (p.ownerId !== actor.id) throw new AppError('forbidden:photo', 'Only the member who added a photo can remove it.');
  const [gone] = await db
    .delete(photos)
    .where(and(eq(photos.id, id), eq(photos.ownerId, actor.id)))
    .returning({ storageKey: photos.storageKey, thumbKey: photos.thumbKey });
  if (gone) await Promise.allSettled([storage().delete(gone.storageKey), storage().delete(gone.thumbKey)]);
}

/** The stored files of a tree's photos (read before the tree and, by cascade, its photo rows go). */
export async function photoFilesOfTree(actor: SessionUser, treeId: string): Promise<string[]> {
  const db = await getDb();
  const rows = await db
    .select({ storageKey: photos.storageKey, thumbKey: photos.thumbKey })
    .from(photos)
    .where(and(eq(photos.treeId, treeId), eq(photos.ownerId, actor.id)));
  return rows.flatMap((r) => [r.storageKey, r.thumbKey]);
}

export async function removeStoredFiles(keys: string[]): Promise<void> {
  await Promise.allSettled(keys.map((k) => storage().delete(k)));
}

/** The stored files of an answer's photos: read before deleting the answer, remove after (removeStoredFiles). */
export async function photoFilesOfAnswer(actor: Pick<SessionUser, 'id'>, answerId: string): Promise<string[]> {
  const db = await getDb();
  const rows = await db
    .select({ storageKey: photos.storageKey, thumbKey: photos.thumbKey })
    .from(photos)
    .where(and(eq(photos.answerId, answerId), eq(photos.ownerId, actor.id)));
  return rows.flatMap((r) => [r.storageKey, r.thumbKey]);
}
