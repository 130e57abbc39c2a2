/**
 * The print engine's contract. Routes build a `RenderRequest` from a stored board;
 * the engine returns the PDF bytes and any warnings. No I/O inside the engine.
 */
import type { Schedule } from '../../shared/schemas/schedule.js';
import type { Finding } from '../../shared/rules/types.js';
import type { PrintOptions, PrintOutput, PrintWarning, SheetLayout } from '../../shared/schemas/print.js';
import type { NoticeWordingSet } from '../../shared/schemas/notice-wording.js';

/** A medium resolved to sizes: continuous tape of a width, or a sheet page (optionally die-cut labels). */
export type Medium =
  | { kind: 'tape'; id: string; widthMm: number; printableMm: number; marginMm: number }
  | { kind: 'page'; id: string; widthMm: number; heightMm: number }
  | { kind: 'sheet'; id: string; layout: SheetLayout };

export interface BoardMeta {
  id: number;
  code: string;
  /** PUBLIC_BASE_URL + /b/ + token: what the QR code encodes. */
  publicUrl: string;
  /** Whether the board page is switched on (if not, the QR is left off). */
  publicEnabled: boolean;
  revision: number;
  /** YYYY-MM-DD of the revision. */
  revisionDate: string;
  /** Next inspection, computed by the rule set (YYYY-MM-DD or null). */
  nextInspectionOn: string | null;
}

export interface Contractor {
  name: string;
  phone: string;
  email: string;
  logo?: { bytes: Uint8Array; mime: 'image/png' | 'image/jpeg' };
  /** The organisation's own wording of the notices it may reword; one left out prints the prescribed words. */
  noticeWording?: NoticeWordingSet;
}

export interface RenderRequest<O extends PrintOutput = PrintOutput> {
  output: O;
  medium: Medium;
  options: PrintOptions[O];
  schedule: Schedule;
  board: BoardMeta;
  contractor: Contractor;
  findings: Finding[];
  /** Printer feed correction (mm), added to every drawn position. */
  offset: { xMm: number; yMm: number };
  /** Way numbers to print for flags and way labels ("changed since"); undefined = all. */
  onlyWays?: number[];
  /** Maximum Zs (Ω) per circuit id from the rule set, for the chart; missing or null prints "—". */
  maxZsByCircuit?: Record<string, number | null>;
  /** Today's date (YYYY-MM-DD), for warnings about dates already past; omitted, none are given. */
  today?: string;
}

export interface RenderResult {
  pdf: Uint8Array;
  warnings: PrintWarning[];
  pageCount: number;
}

/** Thrown when a request cannot be laid out (e.g. QR too small on this tape); the message says what would work. */
export class LayoutError extends Error {
  constructor(
    message: string,
    readonly field?: string,
  ) {
    super(message);
  }
}
