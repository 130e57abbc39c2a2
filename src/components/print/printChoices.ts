/**
 * What the print page offers: each output with a plain description, and the media grouped as
 * the contractor thinks of them (tape, sheets, their own label sheets, a custom size).
 */
import { tapeWidths, type PrintOutput } from '../../../shared/schemas/print.js';
import type { SheetLayoutRecord } from '../../api/print.js';

export const outputChoices: Array<{ value: PrintOutput; label: string; description: string }> = [
  {
    value: 'chart',
    label: 'Circuit chart',
    description: 'The schedule for the board door: supply, RCDs and what each protects, every way with its device, cable and Zs.',
  },
  {
    value: 'flags',
    label: 'Cable flags',
    description: 'One flag per cable leg, wrapped round the cable near its terminal; it reads the same from both faces.',
  },
  { value: 'way-labels', label: 'Way labels', description: 'One strip per DIN row, each cell as wide as the device under it.' },
  { value: 'notices', label: 'Notices', description: 'Periodic inspection, RCD test, earthing and bonding, and the warnings this board calls for.' },
  { value: 'tag', label: 'Board tag', description: 'The QR code to the board page, the board code and its barcode, for the board front or door.' },
  {
    value: 'changeover',
    label: 'Changeover schedule',
    description:
      'For the job file when replacing an old board: each old way as surveyed, its readings, the new way it goes to and what to fix before the swap.',
  },
  { value: 'calibration', label: 'Calibration page', description: 'A 100 mm ruler and crosshairs to check your printer’s scale and alignment.' },
];

export interface MediumOption {
  value: string;
  label: string;
}
export interface MediumGroup {
  label: string;
  options: MediumOption[];
}

/** Outputs laid out on pages only: a chart on tape would not be readable. */
const pageOnly = new Set<PrintOutput>(['chart', 'changeover']);
/** Outputs made for A4 and A5 only (no custom size). */
const paperOnly = new Set<PrintOutput>(['changeover']);

export function mediumGroups(output: PrintOutput, layouts: SheetLayoutRecord[]): MediumGroup[] {
  const groups: MediumGroup[] = [];
  if (!pageOnly.has(output)) groups.push({ label: 'Label tape', options: tapeWidths.map((w) => ({ value: `tape-${w}`, label: `Tape ${w} mm` })) });
  groups.push({
    label: 'Paper',
    options: [
      { value: 'a4', label: 'A4 portrait (210 × 297 mm)' },
      { value: 'a4-landscape', label: 'A4 landscape (297 × 210 mm)' },
      { value: 'a5', label: 'A5 portrait (148 × 210 mm)' },
      { value: 'a5-landscape', label: 'A5 landscape (210 × 148 mm)' },
    ],
  });
  if (layouts.length && !pageOnly.has(output)) {
    groups.push({
      label: 'Your label sheets',
      options: layouts.map((l) => ({ value: `sheet-${l.id}`, label: `${l.name} (${l.columns} × ${l.rows} of ${l.labelWidthMm} × ${l.labelHeightMm} mm)` })),
    });
  }
  if (!paperOnly.has(output)) groups.push({ label: 'Other', options: [{ value: 'custom', label: 'Custom size…' }] });
  return groups;
}

/** `custom-250x180` → [250, 180]; anything else → null. */
export function customSize(media: string): [number, number] | null {
  const m = /^custom-(\d+)x(\d+)$/.exec(media);
  return m ? [Number(m[1]), Number(m[2])] : null;
}

/** A readable name for a medium id, for the history table. */
export function mediumName(media: string, layouts: SheetLayoutRecord[]): string {
  // Images for a tape printer's app are recorded as `tape-12@180dpi`.
  const image = /^(.+)@(\d+)dpi$/.exec(media);
  if (image) return `${mediumName(image[1], layouts)}, images at ${image[2]} dpi`;
  const tape = /^tape-(\d+)$/.exec(media);
  if (tape) return `Tape ${tape[1]} mm`;
  const custom = customSize(media);
  if (custom) return `${custom[0]} × ${custom[1]} mm`;
  const sheet = /^sheet-(\d+)$/.exec(media);
  if (sheet) return layouts.find((l) => l.id === Number(sheet[1]))?.name ?? `Label sheet ${sheet[1]}`;
  return media.toUpperCase().replace('-LANDSCAPE', ' landscape');
}

export const outputName = (output: string) => outputChoices.find((o) => o.value === output)?.label ?? output;
