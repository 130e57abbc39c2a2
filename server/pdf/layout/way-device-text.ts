/**
 * The device text of a way-label strip ("B16 30 mA" beside the way number) is fitted once for the
 * whole strip, never cell by cell: a reader comparing two cells of one row must see the same size and
 * the same form. The steps, in order, each for every cell at once:
 *
 * 1. one line, shrunk to the largest size every cell fits, down to the output's legible minimum;
 * 2. two lines (split at the first space: "B16" over "30 mA"), again one size for all;
 * 3. the defined abbreviation (`abbreviateDeviceText`: units closed up, "Isolator" → "Isol."), one
 *    line then two;
 * 4. nothing left: the abbreviated text at the minimum, cut with an ellipsis where it must be.
 *
 * Pure: the caller passes each cell's room and the font metrics, and words the warning from the result.
 */
import { MM_PER_PT, type TypeMetrics } from '../model.js';
import { cutToWidth } from './fit.js';

/** One cell's device text and the room its top line offers, in the cell's own (possibly turned) frame. */
export interface DeviceCell {
  /** How the warning names the cell, e.g. "way 4 L1". */
  name: string;
  device: string;
  /** Width of the top line (mm), way number and device text together. */
  lineWidthMm: number;
  /** Width the way number keeps whatever happens (mm): its text at the smallest way-number size. */
  wayWidthMm: number;
  /** Height of the top line for one line of device text (mm). */
  oneLineHeightMm: number;
  /** Height the top line may grow to for two lines (mm). */
  twoLineHeightMm: number;
}

export type DeviceFitKind = 'one-line' | 'two-lines' | 'abbreviated' | 'cut';

/** The strip's one decision, and what each cell prints under it (same order as the cells given). */
export interface DeviceFit {
  kind: DeviceFitKind;
  /** One size for every cell's device text (pt). */
  sizePt: number;
  /** Whether the lines are the abbreviated text (also true for `cut`, which starts from it). */
  abbreviated: boolean;
  cells: Array<{ lines: string[]; cut: boolean }>;
  /** The cells that could not take the form before this one at the minimum size: why the strip went further. */
  forcedBy: string[];
}

export interface DeviceFitLimits {
  /** Preferred size (pt); never exceeded. */
  maxPt: number;
  /** Legible minimum for this output (pt); never gone below. */
  minPt: number;
  /** Space between the way number and the device text (mm). */
  gapMm: number;
  /** Baseline to baseline of two lines, in ems. */
  lineSpacing: number;
}

const STEP_PT = 0.25;
const floorStep = (pt: number) => Math.floor(pt / STEP_PT + 1e-9) * STEP_PT;

/**
 * The abbreviation used when the full text cannot be set: units closed up to their number ("30 mA" →
 * "30mA", "40 A" → "40A") and the long device words shortened. Every change keeps the rating, curve
 * and residual current readable. // common practice (ratings written without spaces on way labels)
 */
export function abbreviateDeviceText(text: string): string {
  return text
    .replace(/(\d) (mA|A)\b/g, '$1$2')
    .replace(/\bIsolator\b/g, 'Isol.')
    .replace(/\bMain switch\b/g, 'Main sw.');
}

/** The device text as lines: one, or split at its first space into two (a text without a space stays one). */
function linesOf(text: string, two: boolean): string[] {
  const at = text.indexOf(' ');
  return two && at > 0 ? [text.slice(0, at), text.slice(at + 1)] : [text];
}

/** Largest size (pt) at which `lines` fit the cell's room, before the strip's limits. */
function sizeFor(cell: DeviceCell, lines: string[], limits: DeviceFitLimits, tm: TypeMetrics): number {
  const widest = Math.max(...lines.map((l) => tm.measure(l, 'regular', 1)));
  const room = cell.lineWidthMm - cell.wayWidthMm - limits.gapMm;
  if (room <= 0 || widest <= 0) return 0;
  const extent = tm.ascent + tm.descent;
  const spacing = Math.max(limits.lineSpacing, extent);
  const heightPerPt = MM_PER_PT * (extent + (lines.length - 1) * spacing);
  const height = lines.length > 1 ? cell.twoLineHeightMm : cell.oneLineHeightMm;
  return Math.min(room / widest, height / heightPerPt);
}

/** The common size for all cells in one form (null when some cell cannot reach the minimum), and the cells that cannot. */
function commonSize(cells: DeviceCell[], texts: string[], two: boolean, limits: DeviceFitLimits, tm: TypeMetrics) {
  let size = limits.maxPt;
  const short: string[] = [];
  cells.forEach((c, i) => {
    if (!texts[i]) return;
    const own = floorStep(sizeFor(c, linesOf(texts[i], two), limits, tm));
    if (own < limits.minPt - 1e-9) short.push(c.name);
    size = Math.min(size, own);
  });
  return { sizePt: short.length ? null : floorStep(size), short };
}

/**
 * Chooses the strip's form and size for its device texts (cells without one are passed through empty).
 * `cut` lines are the abbreviated text cut with an ellipsis to the cell's room at the minimum size.
 */
export function chooseDeviceFit(cells: DeviceCell[], limits: DeviceFitLimits, tm: TypeMetrics): DeviceFit {
  const full = cells.map((c) => c.device);
  const short = full.map(abbreviateDeviceText);
  const tries: Array<{ kind: DeviceFitKind; texts: string[]; two: boolean }> = [
    { kind: 'one-line', texts: full, two: false },
    { kind: 'two-lines', texts: full, two: true },
    { kind: 'abbreviated', texts: short, two: false },
    { kind: 'abbreviated', texts: short, two: true },
  ];
  let forcedBy: string[] = [];
  for (const t of tries) {
    const { sizePt, short: tooSmall } = commonSize(cells, t.texts, t.two, limits, tm);
    if (sizePt == null) {
      forcedBy = tooSmall;
      continue;
    }
    const lines = t.texts.map((text) => ({ lines: text ? linesOf(text, t.two) : [], cut: false }));
    return { kind: t.kind, sizePt, abbreviated: t.texts === short, cells: lines, forcedBy };
  }
  // Even the abbreviation does not fit some cell at the minimum: those cells are cut, the rest set whole.
  const sizePt = limits.minPt;
  return {
    kind: 'cut',
    sizePt,
    abbreviated: true,
    forcedBy,
    cells: cells.map((c, i) => {
      const text = short[i];
      if (!text) return { lines: [], cut: false };
      if (sizeFor(c, [text], limits, tm) >= sizePt - 1e-9) return { lines: [text], cut: false };
      const room = Math.max(0, c.lineWidthMm - c.wayWidthMm - limits.gapMm);
      const cut = cutToWidth(text, room, 'regular', sizePt, tm);
      return { lines: cut ? [cut] : [], cut: true };
    }),
  };
}

const quoted = (texts: string[]) => texts.map((t) => `"${t}"`).join(', ');
/** "way 1, way 2 and way 3"; past six names, the first five and how many more. */
export function cellList(names: string[]): string {
  if (names.length > 6) return `${names.slice(0, 5).join(', ')} and ${names.length - 5} more`;
  return names.length > 1 ? `${names.slice(0, -1).join(', ')} and ${names[names.length - 1]}` : (names[0] ?? '');
}

/**
 * What the strip's fit did, in words for the print warnings: nothing to say when every device text
 * is set whole on one line; else which cells forced the change and what each text became.
 */
export function deviceFitWarnings(strip: string, cells: DeviceCell[], fit: DeviceFit): Array<{ code: string; label: string; message: string }> {
  if (fit.kind === 'one-line') return [];
  const changed = cells
    .map((c, i) => ({ name: c.name, from: c.device, to: fit.cells[i].lines.join(' / '), cut: fit.cells[i].cut }))
    .filter((c) => c.from && c.to !== c.from);
  const forced = cellList(fit.forcedBy);
  if (fit.kind === 'two-lines') {
    const example = changed[0];
    return [
      {
        code: 'device-text-wrapped',
        label: strip,
        message: `${strip}: the device text did not fit one line on ${forced} at ${fit.sizePt} pt or more, so every cell sets it on two lines at ${fit.sizePt} pt${example ? ` (e.g. "${example.from}" as "${example.to}")` : ''}`,
      },
    ];
  }
  const pairs = [...new Map(changed.filter((c) => !c.cut).map((c) => [`${c.from}→${c.to}`, `"${c.from}" → "${c.to}"`])).values()];
  const form = fit.cells.some((c) => c.lines.length > 1) ? ' on two lines' : '';
  const out = [];
  if (pairs.length)
    out.push({
      code: 'device-text-abbreviated',
      label: strip,
      message: `${strip}: the device text did not fit ${forced} even on two lines, so every cell prints it abbreviated${form} at ${fit.sizePt} pt: ${pairs.join(', ')}`,
    });
  const cut = changed.filter((c) => c.cut);
  if (cut.length)
    out.push({
      code: 'text-cut',
      label: strip,
      message: `${strip}: even abbreviated, the device text did not fit ${cellList(cut.map((c) => c.name))} at ${fit.sizePt} pt and was cut short: ${cut
        .map((c) => `${c.name} ${quoted([c.from])} → ${c.to ? quoted([c.to]) : 'left off'}`)
        .join(', ')}; choose a wider pitch, taller strip or wider tape`,
    });
  return out;
}
