/**
 * Upload routes: the organisation logo (`/api/organisation/logo`) and board photos
 * (`/api/boards/:id/photos`). Uploads are multipart with one file in the field `file`.
 */
import { Router } from 'express';
import { sendImage } from '../http/images.js';
import type { AppContext } from '../context.js';
import { canEdit, ownerOnly, requireUser } from '../auth/guard.js';
import { idParam, parse } from '../http/parse.js';
import { photoCaptionSchema } from '../../shared/schemas/photos.js';
import { LOGO_MAX_BYTES, PHOTO_MAX_BYTES, receiveOneFile, uploadedImage } from './receive.js';
import { fitUpload, LOGO_STORED_SIDE_PX, PHOTO_STORED_SIDE_PX } from './pixels.js';
import * as uploads from './service.js';

/** Mounted at `/organisation/logo`. */
export function logoRoutes(ctx: AppContext): Router {
  const r = Router();
  r.get('/', requireUser, async (req, res) => {
    sendImage(res, await uploads.organisationLogo(ctx.db, req.user!.organisationId), 'private, no-cache');
  });
  r.put('/', ownerOnly, receiveOneFile(LOGO_MAX_BYTES, 'logo'), async (req, res) => {
    const { mime, data } = await fitUpload(uploadedImage(req, 'logo'), 'logo', LOGO_STORED_SIDE_PX);
    const image = { mime, data };
    await uploads.saveLogo(ctx.db, req.user!.organisationId, image);
    res.status(201).json({ mime: image.mime, size: image.data.length });
  });
  r.delete('/', ownerOnly, async (req, res) => {
    await uploads.removeLogo(ctx.db, req.user!.organisationId);
    res.status(204).end();
  });
  return r;
}

/** Mounted at `/boards/:id/photos`: members only, never public. */
export function photoRoutes(ctx: AppContext): Router {
  const r = Router({ mergeParams: true });
  r.use(requireUser);
  r.get('/', async (req, res) => {
    res.json({ items: await uploads.boardPhotos(ctx.db, req.user!.organisationId, idParam(req.params)) });
  });
  r.post('/', canEdit, receiveOneFile(PHOTO_MAX_BYTES, 'photo'), async (req, res) => {
    const boardId = idParam(req.params);
    const { caption } = parse(photoCaptionSchema, { ...req.body });
    const { mime, data } = await fitUpload(uploadedImage(req, 'photo'), 'photo', PHOTO_STORED_SIDE_PX);
    const image = { mime, data };
    res.status(201).json(await uploads.addPhoto(ctx.db, req.user!.organisationId, boardId, { ...image, caption }));
  });
  r.get('/:photoId', async (req, res) => {
    const photo = await uploads.boardPhoto(ctx.db, req.user!.organisationId, idParam(req.params), idParam(req.params, 'photoId'));
    sendImage(res, photo, 'private, no-store');
  });
  r.patch('/:photoId', canEdit, async (req, res) => {
    const { caption } = parse(photoCaptionSchema, req.body);
    await uploads.captionPhoto(ctx.db, req.user!.organisationId, idParam(req.params), idParam(req.params, 'photoId'), caption);
    res.status(204).end();
  });
  r.delete('/:photoId', canEdit, async (req, res) => {
    await uploads.removePhoto(ctx.db, req.user!.organisationId, idParam(req.params), idParam(req.params, 'photoId'));
    res.status(204).end();
  });
  return r;
}
