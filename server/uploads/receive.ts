/**
 * Receives one image upload with multer into memory (never to a path, let alone one taken from
 * the request), turns multer's limit errors into clear 400/413 answers, and checks the bytes
 * are really a PNG or JPEG. Nothing is stored unless every check passes.
 */
import multer from 'multer';
import type { Request, RequestHandler } from 'express';
import { AppError, invalid } from '../errors.js';
import { sniffImage, type ImageMime } from './sniff.js';

export const LOGO_MAX_BYTES = 2 * 1024 * 1024;
export const PHOTO_MAX_BYTES = 10 * 1024 * 1024;

const megabytes = (bytes: number) => `${Math.round(bytes / (1024 * 1024))} MB`;

function uploadError(err: unknown, maxBytes: number, what: string): unknown {
  if (!(err instanceof multer.MulterError)) {
    // busboy's complaints about a malformed multipart body are the client's fault.
    return err instanceof Error ? invalid(`The upload could not be read: ${err.message}`, { file: 'Not a valid upload' }) : err;
  }
  if (err.code === 'LIMIT_FILE_SIZE') {
    return new AppError(413, 'too_large', `The ${what} is larger than ${megabytes(maxBytes)}; choose a smaller file`, {
      file: `At most ${megabytes(maxBytes)}`,
    });
  }
  if (err.code === 'LIMIT_UNEXPECTED_FILE' || err.code === 'LIMIT_FILE_COUNT') {
    return invalid('Send one file, in the form field "file"', { file: 'Exactly one file in the field "file"' });
  }
  return invalid(`The upload was refused: ${err.message}`, { [err.field ?? 'file']: err.message });
}

/** Multer middleware for one file in the field `file` plus a few short text fields. */
export function receiveOneFile(maxBytes: number, what: string): RequestHandler {
  const handle = multer({
    storage: multer.memoryStorage(),
    limits: { fileSize: maxBytes, files: 1, fields: 4, fieldSize: 2000, parts: 6 },
  }).single('file');
  return (req, res, next) => handle(req, res, (err?: unknown) => next(err ? uploadError(err, maxBytes, what) : undefined));
}

/** The uploaded image's bytes and sniffed type, or a 400 saying what is wrong with it. */
export function uploadedImage(req: Request, what: string): { mime: ImageMime; data: Buffer } {
  const file = req.file;
  if (!file) throw invalid(`Choose a ${what} to upload (multipart form field "file")`, { file: 'Required' });
  if (!file.buffer.length) throw invalid(`The ${what} is empty`, { file: 'The file is empty' });
  const mime = sniffImage(file.buffer);
  if (!mime) throw invalid(`The ${what} must be a PNG or JPEG image; this file is neither`, { file: 'Only PNG or JPEG images' });
  return { mime, data: file.buffer };
}
