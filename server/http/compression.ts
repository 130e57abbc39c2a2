/**
 * Compression of dynamic responses (the JSON API, CSV, error bodies). Built client files are
 * compressed once at build time instead (see `static.ts`); this only covers what is made per request.
 */
import compression from 'compression';
import type { Request, RequestHandler, Response } from 'express';

/** Bodies smaller than this (bytes) go out as they are: below about one packet, encoding saves no round trip. */
export const COMPRESSION_THRESHOLD = 1024;

/** Types whose bytes are packed already (PDF streams, archives, raw files): encoding them again only costs time. */
const PACKED_TYPES = new Set(['application/pdf', 'application/zip', 'application/gzip', 'application/octet-stream']);
/** Top-level media types whose formats are packed already (pictures, fonts, sound, film); SVG is text and is compressed. */
const PACKED_MEDIA = /^(?:image|font|audio|video)\//;

function alreadyPacked(contentType: string): boolean {
  const type = contentType.split(';')[0]!.trim().toLowerCase();
  return PACKED_TYPES.has(type) || (type !== 'image/svg+xml' && PACKED_MEDIA.test(type));
}

function shouldCompress(req: Request, res: Response): boolean {
  if (alreadyPacked(String(res.getHeader('Content-Type') ?? ''))) return false;
  return compression.filter(req, res);
}

/**
 * Brotli (quality 4, the package's default for per-request work) to clients that accept it, else
 * gzip. Whole-buffer sends and streamed writes both pass through; `res.flush()` is there for a
 * response that must reach the client part by part.
 */
export function dynamicCompression(): RequestHandler {
  return compression({ threshold: COMPRESSION_THRESHOLD, filter: shouldCompress });
}

export type ContentCoding = 'br' | 'gzip' | 'identity';

/**
 * The coding to send a client, from its Accept-Encoding: brotli if it takes it, else gzip, else none.
 * The server's order wins over the client's (browsers list gzip first but all decode brotli, which is smaller);
 * a coding with `q=0` is refused, and `*` stands for any coding not named.
 */
export function preferredCoding(acceptEncoding: string | undefined): ContentCoding {
  if (!acceptEncoding) return 'identity';
  const q = new Map<string, number>();
  for (const part of acceptEncoding.split(',')) {
    const [name, ...params] = part.trim().toLowerCase().split(';');
    if (!name) continue;
    const qParam = params.map((p) => p.trim()).find((p) => p.startsWith('q='));
    const value = qParam ? Number(qParam.slice(2)) : 1;
    q.set(name, Number.isFinite(value) ? value : 0);
  }
  const accepts = (coding: string) => (q.get(coding) ?? q.get('*') ?? 0) > 0;
  if (accepts('br')) return 'br';
  if (accepts('gzip')) return 'gzip';
  return 'identity';
}
