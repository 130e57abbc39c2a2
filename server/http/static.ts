/**
 * Serves the built client from `dist/`: each text file as its precompressed twin (`.br` or `.gz`,
 * made by the build) when the client accepts one, hashed assets cached for a year, and the shell
 * page for every client route (history mode), such as the public board page `/b/:token`.
 */
import type { Express } from 'express';
import expressStaticGzip from 'express-static-gzip';
import { existsSync, readFileSync } from 'node:fs';
import { join, resolve } from 'node:path';
import { preferredCoding, type ContentCoding } from './compression.js';
import { BOARD_PAGE_CACHE_CONTROL } from '../public/caching.js';

/** The shell page in each coding its build made; identity is always there. */
function readShell(clientDir: string): Map<ContentCoding, Buffer> {
  const file = join(clientDir, 'index.html');
  const shell = new Map<ContentCoding, Buffer>([['identity', readFileSync(file)]]);
  for (const [coding, ext] of [
    ['br', '.br'],
    ['gzip', '.gz'],
  ] as const) {
    if (existsSync(file + ext)) shell.set(coding, readFileSync(file + ext));
  }
  return shell;
}

/** The built shell page as text, or null without a build: the board page's first HTML is made from it. */
export function clientShellHtml(dir: string | null): string | null {
  if (!dir || !existsSync(join(dir, 'index.html'))) return null;
  return readFileSync(join(resolve(dir), 'index.html'), 'utf8');
}

/** Mounts the client's files and the shell page fallback; does nothing without a build in `clientDir`. */
export function serveClient(app: Express, dir: string | null): void {
  if (!dir || !existsSync(join(dir, 'index.html'))) return;
  // express-static-gzip finds the twins by path under this root: give it no trailing separator.
  const clientDir = resolve(dir);
  const assetsDir = join(clientDir, 'assets');
  app.use(
    expressStaticGzip(clientDir, {
      enableBrotli: true,
      orderPreference: ['br', 'gzip'],
      index: false,
      serveStatic: {
        index: false,
        maxAge: '1h',
        setHeaders: (res, path) => {
          if (path.startsWith(assetsDir)) res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
        },
      },
    }),
  );
  // Every other path is a client route. The shell page is read once: it only changes with a new
  // build, and serving it from memory keeps the board page fast under load.
  const shell = readShell(clientDir);
  app.get('/{*splat}', (req, res) => {
    // A missing built file is a 404, never the shell: files under /assets/ go out without the page headers.
    if (req.path.startsWith('/assets/')) {
      res.status(404).type('text').set('Cache-Control', 'no-store').send('Not found');
      return;
    }
    const wanted = preferredCoding(req.headers['accept-encoding']);
    const coding = shell.has(wanted) ? wanted : 'identity';
    // The board page's shell is the same for every tag and visitor, so a shared cache may keep it as it keeps the
    // page's JSON; other screens' shell is revalidated each time (Express's entity tag makes that a 304).
    const cache = req.path.startsWith('/b/') ? BOARD_PAGE_CACHE_CONTROL : 'no-cache';
    res.type('html').set({ 'Cache-Control': cache, Vary: 'Accept-Encoding' });
    if (coding !== 'identity') res.set('Content-Encoding', coding);
    res.send(shell.get(coding));
  });
}
