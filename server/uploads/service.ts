/**
 * Use-cases for the organisation logo (printed in the chart header, shown on the board page)
 * and board photos (members only, never public). A photo belongs to a board of the member's
 * organisation; any other id answers 404.
 */
import type { Db } from '../db/client.js';
import { notFound } from '../errors.js';
import type { Photo } from '../../shared/schemas/photos.js';
import { requireMemberBoard } from '../boards/member-board.js';
import type { ImageMime } from './sniff.js';
import * as files from './repository.js';

export async function saveLogo(db: Db, organisationId: number, image: { mime: ImageMime; data: Buffer }): Promise<void> {
  await files.replaceLogo(db, organisationId, image);
}

export async function organisationLogo(db: Db, organisationId: number): Promise<files.StoredImage> {
  const logo = await files.findLogo(db, organisationId);
  if (!logo) throw notFound('No logo has been uploaded');
  return logo;
}

export async function removeLogo(db: Db, organisationId: number): Promise<void> {
  await files.deleteLogo(db, organisationId);
}

async function requireBoard(db: Db, organisationId: number, boardId: number): Promise<void> {
  await requireMemberBoard(db, organisationId, boardId);
}

const toPhoto = (row: files.PhotoRow): Photo => ({ ...row, size: Number(row.size), createdAt: row.createdAt.toISOString() });

export async function addPhoto(db: Db, organisationId: number, boardId: number, photo: { mime: ImageMime; data: Buffer; caption: string }): Promise<Photo> {
  await requireBoard(db, organisationId, boardId);
  const id = await files.insertPhoto(db, organisationId, boardId, photo);
  return { id, caption: photo.caption, mime: photo.mime, size: photo.data.length, createdAt: new Date().toISOString() };
}

export async function boardPhotos(db: Db, organisationId: number, boardId: number): Promise<Photo[]> {
  await requireBoard(db, organisationId, boardId);
  return (await files.listPhotos(db, organisationId, boardId)).map(toPhoto);
}

export async function boardPhoto(db: Db, organisationId: number, boardId: number, photoId: number): Promise<files.StoredImage> {
  await requireBoard(db, organisationId, boardId);
  const photo = await files.findPhoto(db, organisationId, boardId, photoId);
  if (!photo) throw notFound('No such photo');
  return photo;
}

export async function captionPhoto(db: Db, organisationId: number, boardId: number, photoId: number, caption: string): Promise<void> {
  await requireBoard(db, organisationId, boardId);
  if (!(await files.updatePhotoCaption(db, organisationId, boardId, photoId, caption))) throw notFound('No such photo');
}

export async function removePhoto(db: Db, organisationId: number, boardId: number, photoId: number): Promise<void> {
  await requireBoard(db, organisationId, boardId);
  if (!(await files.deletePhoto(db, organisationId, boardId, photoId))) throw notFound('No such photo');
}
