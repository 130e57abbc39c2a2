/**
 * A copy of the built client as the next release would ship it when only one screen changed: that
 * screen's chunk gets a new name, and so does every file that names a renamed file, up to the shell
 * (the cascade content-hashed names make). Each changed text file gets fresh brotli and gzip twins.
 * The transfer bench serves it on the same origin to measure what a repeat visitor downloads.
 */
import { cpSync, existsSync, readdirSync, readFileSync, renameSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';
import { brotliCompressSync, constants, gzipSync } from 'node:zlib';

const TEXT = /\.(js|css|html)$/;

function writeTwins(file: string): void {
  const bytes = readFileSync(file);
  if (existsSync(file + '.br')) writeFileSync(file + '.br', brotliCompressSync(bytes, { params: { [constants.BROTLI_PARAM_QUALITY]: 11 } }));
  if (existsSync(file + '.gz')) writeFileSync(file + '.gz', gzipSync(bytes, { level: 9 }));
}

/** Copies `dist` to `out` with the chunk whose name starts with `screen` (e.g. "BoardEditorView-") released anew; returns the renamed files. */
export function releaseOneScreen(dist: string, out: string, screen: string): string[] {
  cpSync(dist, out, { recursive: true });
  const assets = join(out, 'assets');
  const names = readdirSync(assets).filter((n) => TEXT.test(n));
  const target = names.find((n) => n.startsWith(screen) && n.endsWith('.js'));
  if (!target) throw new Error(`no chunk ${screen}* in ${dist}`);
  const renamed: string[] = [];
  let changed = [target];
  // The screen's code changed: mark it, so its bytes (and name) differ as a real release's would.
  writeFileSync(join(assets, target), readFileSync(join(assets, target), 'utf8') + '\n// next release\n');
  while (changed.length) {
    const next: string[] = [];
    for (const old of changed) {
      const fresh = old.replace(/-([A-Za-z0-9_-]{8})\.(js|css)$/, '-r$1.$2');
      for (const ext of ['', '.br', '.gz']) if (existsSync(join(assets, old + ext))) renameSync(join(assets, old + ext), join(assets, fresh + ext));
      renamed.push(fresh);
      writeTwins(join(assets, fresh));
      for (const other of [
        ...readdirSync(assets)
          .filter((n) => TEXT.test(n))
          .map((n) => join(assets, n)),
        join(out, 'index.html'),
      ]) {
        const text = readFileSync(other, 'utf8');
        if (!text.includes(old)) continue;
        writeFileSync(other, text.split(old).join(fresh));
        writeTwins(other);
        const base = other.slice(other.lastIndexOf('/') + 1);
        if (base !== 'index.html' && !renamed.includes(base) && !next.includes(base)) next.push(base);
      }
    }
    changed = next;
  }
  return renamed;
}
