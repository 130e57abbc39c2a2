/**
 * What the main thread sends a render worker and what comes back. Both sides import this file, so
 * the message shapes have one home. A LayoutError cannot cross a thread as its class (a thrown
 * error is cloned as a plain Error), so the worker answers it as data and the pool throws it again.
 */
import type { PrintOutput, PrintWarning } from '../../../shared/schemas/print.js';
import type { RenderRequest, RenderResult } from '../../pdf/types.js';

/**
 * A render request whose rule findings and maximum Zs the worker works out, so judging a big board
 * (tens of milliseconds at 2,000 ways) does not hold the event loop either. `checkedOn` is the day
 * the rules judge the board on; null gives none (the calibration page has no board to judge).
 */
export type PrintJobRequest = Omit<RenderRequest<PrintOutput>, 'findings' | 'maxZsByCircuit'> & { checkedOn: string | null };

export type RenderJob =
  /** The PDF of one output (`renderOutput`). */
  | { kind: 'pdf'; request: PrintJobRequest }
  /** The same output as PNG images at `dpi` (`rasterOutput`). */
  | { kind: 'images'; request: PrintJobRequest; dpi: number }
  /** Laid out only, for the warnings list (`layoutOutput`). */
  | { kind: 'check'; request: PrintJobRequest };

export interface CheckedLayout {
  warnings: PrintWarning[];
  pageCount: number;
}

/** A PNG as it arrives from a thread: a Node Buffer crosses as a plain Uint8Array. */
export interface DrawnImage {
  png: Uint8Array;
  widthPx: number;
  heightPx: number;
}

export interface DrawnImages {
  images: DrawnImage[];
  warnings: PrintWarning[];
}

/** The answer for each kind of job. */
export interface JobResults {
  pdf: RenderResult;
  images: DrawnImages;
  check: CheckedLayout;
}

export type JobAnswer<K extends RenderJob['kind']> = { ok: true; result: JobResults[K] } | { ok: false; layoutError: { message: string; field?: string } };
