import type { Response } from 'express';

/** Sends stored image bytes with their sniffed type; `cache` says who may keep a copy. */
export function sendImage(res: Response, image: { mime: string; data: Buffer }, cache: string): void {
  res.set({ 'Content-Type': image.mime, 'Content-Length': String(image.data.length), 'Cache-Control': cache, 'Content-Disposition': 'inline' });
  res.end(image.data);
}
