/**
 * Typed calls to the print API: PDFs with their warnings, the pack, the print history, sheet
 * layouts and the printer offset. JSON responses are parsed with the shared schemas.
 */
import { z } from 'zod';
import { json, request, send } from './http.js';
import type { PrintOutput, PrintWarning, SheetLayout, SheetLayoutUpdate } from '../../shared/schemas/print.js';
import {
  printCheckSchema,
  printHistorySchema,
  printOffsetStateSchema,
  printWarningSchema,
  sheetLayoutListSchema,
  sheetLayoutRecordSchema,
  type PrintOffsetSave,
} from '../../shared/schemas/print-records.js';

export type { PrintRecord, SheetLayoutRecord, PrintOffset, PrintOffsetState } from '../../shared/schemas/print-records.js';

/** What the print page asks for: an output, a medium and the output's options as query values. */
export interface PrintSelection {
  output: PrintOutput;
  media: string;
  options: Record<string, string>;
}

/** The query string for a selection; empty option values are left out so the server's defaults apply. */
export function printQuery(selection: PrintSelection, record = false): string {
  const search = new URLSearchParams({ media: selection.media });
  for (const [k, v] of Object.entries(selection.options)) if (v !== '') search.set(k, v);
  if (record) search.set('record', '1');
  return search.toString();
}

export const pdfPath = (boardId: number, selection: PrintSelection, record = false) =>
  `/api/boards/${boardId}/pdf/${selection.output}?${printQuery(selection, record)}`;

export interface FetchedPdf {
  blob: Blob;
  warnings: PrintWarning[];
  pageCount: number;
  fileName: string;
}

function fileNameOf(res: Response, fallback: string): string {
  const m = /filename="([^"]+)"/.exec(res.headers.get('Content-Disposition') ?? '');
  return m ? m[1] : fallback;
}

/** The warnings header is URI-encoded JSON; a header that does not parse is reported, not hidden. */
export function warningsFromHeader(value: string | null): PrintWarning[] {
  if (!value) return [];
  try {
    return z.array(printWarningSchema).parse(JSON.parse(decodeURIComponent(value)));
  } catch {
    return [{ code: 'unreadable-warnings', message: 'The warnings for this print could not be read' }];
  }
}

/** The real PDF for the preview (record off) or for a download or print (record on). */
export async function fetchPdf(boardId: number, selection: PrintSelection, opts: { record?: boolean; signal?: AbortSignal } = {}): Promise<FetchedPdf> {
  // Recording writes, so it is a POST (with the CSRF token); the preview is a GET that records nothing.
  const res = await request(opts.record ? 'POST' : 'GET', pdfPath(boardId, selection), { signal: opts.signal });
  return {
    blob: await res.blob(),
    warnings: warningsFromHeader(res.headers.get('X-Waymark-Warnings')),
    pageCount: Number(res.headers.get('X-Waymark-Page-Count') ?? 0),
    fileName: fileNameOf(res, `${selection.output}-${selection.media}.pdf`),
  };
}

export const checkPrint = (boardId: number, selection: PrintSelection) =>
  json(printCheckSchema, 'GET', `/api/boards/${boardId}/pdf/${selection.output}/warnings?${printQuery(selection)}`);

/** Every output for the board in one ZIP; the POST records each file as a print. */
export async function fetchPack(boardId: number): Promise<{ blob: Blob; fileName: string }> {
  const res = await request('POST', `/api/boards/${boardId}/pack`);
  return { blob: await res.blob(), fileName: fileNameOf(res, `board-${boardId}-pack.zip`) };
}

export const listPrints = (boardId: number) => json(printHistorySchema, 'GET', `/api/boards/${boardId}/prints`);

export const listSheetLayouts = () => json(sheetLayoutListSchema, 'GET', '/api/sheet-layouts');
export const createSheetLayout = (layout: SheetLayout) => json(sheetLayoutRecordSchema, 'POST', '/api/sheet-layouts', { body: layout });
/** Saves against `layout.baseRevision`; a layout saved by someone else since answers 409 (`ApiError.code === 'stale'`). */
export const updateSheetLayout = (id: number, layout: SheetLayoutUpdate) => json(sheetLayoutRecordSchema, 'PUT', `/api/sheet-layouts/${id}`, { body: layout });
export const deleteSheetLayout = (id: number) => send('DELETE', `/api/sheet-layouts/${id}`);

/** The offset with the organisation's revision: the offset is saved against it, like the organisation's settings. */
export const getPrintOffset = () => json(printOffsetStateSchema, 'GET', '/api/print-settings/offset');
export const setPrintOffset = (offset: PrintOffsetSave) => json(printOffsetStateSchema, 'PUT', '/api/print-settings/offset', { body: offset });
