/**
 * `GET /b/:token`: the board page's first HTML with the board in it (server/public/page-html.ts).
 * Cached like the page's JSON, counted against the same per-address limit; a token that opens no
 * page falls through to the plain shell, whose script then says so.
 */
import { createHash } from 'node:crypto';
import { Router, type RequestHandler } from 'express';
import type { AppContext } from '../context.js';
import { AppError } from '../errors.js';
import { dynamicCompression } from '../http/compression.js';
import { BOARD_PAGE_CACHE_CONTROL, PRIVATE_CACHE_CONTROL } from './caching.js';
import { boardPageHtml } from './page-html.js';
import { publicReadLimit } from './routes.js';
import { publicBoardPage, type PublicBoardBody } from './service.js';

export function boardPageDocumentRoutes(ctx: AppContext, shellHtml: string): Router {
  const r = Router();
  // One HTML per cached projection: a scan of an unchanged board costs no rendering.
  const rendered = new WeakMap<PublicBoardBody, string>();
  // The HTML is the page and this release's shell: after a release the old tag must not revalidate, or a
  // cache (or a browser) keeps HTML naming scripts the new build no longer has for as long as the board is unchanged.
  const release = createHash('sha256').update(shellHtml).digest('base64url').slice(0, 12);
  // Uncached until the page itself is sent: a 429 or an error answer is never kept by a shared cache.
  const uncached: RequestHandler = (_req, res, next) => {
    res.set('Cache-Control', PRIVATE_CACHE_CONTROL);
    next();
  };
  r.get('/b/:token', uncached, publicReadLimit(ctx), dynamicCompression(), async (req, res, next) => {
    let body: PublicBoardBody;
    try {
      body = await publicBoardPage(ctx.db, String(req.params.token));
    } catch (err) {
      if (err instanceof AppError && err.status === 404) return next();
      throw err;
    }
    let html = rendered.get(body);
    if (html === undefined) {
      html = boardPageHtml(shellHtml, body.page, body.json.toString('utf8'));
      rendered.set(body, html);
    }
    // The page's tag, marked as the HTML's (a cache must not answer the JSON's request with it) and the release's.
    res.set({ ETag: `"page-${release}-${body.etag.slice(1)}`, 'Cache-Control': BOARD_PAGE_CACHE_CONTROL, 'X-Robots-Tag': 'noindex, nofollow' });
    res.type('html').send(html);
  });
  return r;
}
