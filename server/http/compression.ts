/**
 * Compression of dynamic responses (the JSON API, CSV, error bodies). Built client files are
 * compressed once at build time instead (see `static.ts`); this only covers what is made per request.
 */
import compression from 'compression';
import type { Request, RequestHandler, Response } from 'express';

/** Bodies smaller than this (bytes) go out as they are: below about one packet, encoding saves no round trip. */
export const COMPRESSION_THRESHOLD = 1024;

/**
 * Which types to encode is the `compression` package's own filter, which asks mime-db (through
 * `compressible`) whether a type is worth it: PDFs, archives, pictures other than SVG, fonts, sound
 * and film are not. One exception: mime-db marks raw bytes (`application/octet-stream`) compressible,
 * but our raw downloads are already packed files, so encoding them again only costs time.
 */
function shouldCompress(req: Request, res: Response): boolean {
  const type = String(res.getHeader('Content-Type') ?? '')
    .split(';')[0]!
    .trim()
    .toLowerCase();
  if (type === 'application/octet-stream') return false;
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
