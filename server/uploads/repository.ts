/**
 * Uploaded images, kept in the `files` table (so every app process sees the same ones and no
 * path ever comes from a request). Every read filters by organisation; photos also by board.
 */
import { and, desc, eq } from 'drizzle-orm';
import type { Db } from '../db/client.js';
import { files } from '../db/schema.js';
import type { ImageMime } from './sniff.js';

export interface StoredImage {
  mime: string;
  data: Buffer;
  size: number;
}
export interface PhotoRow {
  id: number;
  caption: string;
  mime: string;
  size: number;
  createdAt: Date;
}

export async function findLogo(db: Db, organisationId: number): Promise<StoredImage | null> {
  const [row] = await db
    .select({ mime: files.mime, data: files.data, size: files.size })
    .from(files)
    .where(and(eq(files.organisationId, organisationId), eq(files.kind, 'logo')))
    .orderBy(desc(files.id))
    .limit(1);
  return row ?? null;
}

/** One logo per organisation: the new one replaces any old one in the same transaction. */
export async function replaceLogo(db: Db, organisationId: number, image: { mime: ImageMime; data: Buffer }): Promise<void> {
  await db.transaction(async (tx) => {
    await tx.delete(files).where(and(eq(files.organisationId, organisationId), eq(files.kind, 'logo')));
    await tx.insert(files).values({ organisationId, kind: 'logo', mime: image.mime, size: image.data.length, data: image.data });
  });
}

export async function deleteLogo(db: Db, organisationId: number): Promise<void> {
  await db.delete(files).where(and(eq(files.organisationId, organisationId), eq(files.kind, 'logo')));
}

export async function insertPhoto(db: Db, organisationId: number, boardId: number, photo: { mime: ImageMime; data: Buffer; caption: string }): Promise<number> {
  const [result] = await db.insert(files).values({
    organisationId,
    boardId,
    kind: 'photo',
    mime: photo.mime,
    size: photo.data.length,
    caption: photo.caption,
    data: photo.data,
  });
  return result.insertId;
}

const photoOf = (organisationId: number, boardId: number) => and(eq(files.organisationId, organisationId), eq(files.boardId, boardId), eq(files.kind, 'photo'));

export async function listPhotos(db: Db, organisationId: number, boardId: number): Promise<PhotoRow[]> {
  return db
    .select({ id: files.id, caption: files.caption, mime: files.mime, size: files.size, createdAt: files.createdAt })
    .from(files)
    .where(photoOf(organisationId, boardId))
    .orderBy(files.id);
}

export async function findPhoto(db: Db, organisationId: number, boardId: number, photoId: number): Promise<StoredImage | null> {
  const [row] = await db
    .select({ mime: files.mime, data: files.data, size: files.size })
    .from(files)
    .where(and(photoOf(organisationId, boardId), eq(files.id, photoId)))
    .limit(1);
  return row ?? null;
}

/** True when a row was changed (false: no such photo on this board of this organisation). */
export async function updatePhotoCaption(db: Db, organisationId: number, boardId: number, photoId: number, caption: string): Promise<boolean> {
  const [result] = await db
    .update(files)
    .set({ caption })
    .where(and(photoOf(organisationId, boardId), eq(files.id, photoId)));
  return result.affectedRows > 0;
}

export async function deletePhoto(db: Db, organisationId: number, boardId: number, photoId: number): Promise<boolean> {
  const [result] = await db.delete(files).where(and(photoOf(organisationId, boardId), eq(files.id, photoId)));
  return result.affectedRows > 0;
}
