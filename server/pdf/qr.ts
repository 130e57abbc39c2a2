/**
 * QR codes as vector modules: qrcode's module matrix (error correction M) drawn as rectangles,
 * with the 4-module quiet zone of ISO/IEC 18004. A code too small for a phone is refused with a
 * message that says what would work, never drawn blurry.
 */
import { LRUCache } from 'lru-cache';
import QRCode from 'qrcode';
import { WHITE, BLACK, type Box, type Item } from './model.js';
import { LayoutError } from './types.js';

/** Quiet zone on every side, in modules. // ISO/IEC 18004 */
export const QR_QUIET_MODULES = 4;
/** Smallest printed module a phone reads at hand distance (mm). // common practice (printing guidance for phone cameras) */
export const QR_MIN_MODULE_MM = 0.4;

export interface QrMatrix {
  size: number;
  dark: Uint8Array;
}

/** A board's URL is encoded again and again; the most recent few hundred are kept. */
const cache = new LRUCache<string, QrMatrix>({ max: 200 });

/** Module matrix for `text` at error correction M (cached: a board's URL is encoded again and again). */
export function qrMatrix(text: string): QrMatrix {
  let m = cache.get(text);
  if (!m) {
    const code = QRCode.create(text, { errorCorrectionLevel: 'M' });
    m = { size: code.modules.size, dark: Uint8Array.from(code.modules.data) };
    cache.set(text, m);
  }
  return m;
}

/** Smallest side (mm) the code for `text` may be printed at, quiet zone included. */
export function qrMinSideMm(text: string): number {
  return (qrMatrix(text).size + 2 * QR_QUIET_MODULES) * QR_MIN_MODULE_MM;
}

/**
 * The code as a white square (quiet zone included) and its dark modules, filling the largest square
 * that fits `box`, centred. `fixHint` finishes the refusal message, e.g. "use tape-24 or wider".
 */
export function qrItems(text: string, box: Box, fixHint: string): Item[] {
  const m = qrMatrix(text);
  const side = Math.min(box.w, box.h);
  const modules = m.size + 2 * QR_QUIET_MODULES;
  const moduleMm = side / modules;
  if (moduleMm < QR_MIN_MODULE_MM - 1e-9) {
    throw new LayoutError(
      `The QR code needs at least ${qrMinSideMm(text).toFixed(1)} mm square (${m.size} modules plus the quiet zone, at ${QR_MIN_MODULE_MM} mm each) but only ${side.toFixed(1)} mm fits here: ${fixHint}`,
      'media',
    );
  }
  const area: Box = { x: box.x + (box.w - side) / 2, y: box.y + (box.h - side) / 2, w: side, h: side };
  const boxes: Box[] = [];
  for (let r = 0; r < m.size; r++) {
    let c = 0;
    while (c < m.size) {
      if (!m.dark[r * m.size + c]) {
        c++;
        continue;
      }
      const start = c;
      while (c < m.size && m.dark[r * m.size + c]) c++;
      boxes.push({ x: area.x + (start + QR_QUIET_MODULES) * moduleMm, y: area.y + (r + QR_QUIET_MODULES) * moduleMm, w: (c - start) * moduleMm, h: moduleMm });
    }
  }
  return [
    { kind: 'rect', box: area, fill: WHITE },
    { kind: 'modules', purpose: 'qr', area, boxes, color: BLACK },
  ];
}
