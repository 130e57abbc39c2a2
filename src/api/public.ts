/**
 * The board page's calls. Deliberately free of zod at run time: the page is its own small
 * chunk for phones on a weak signal, so the response is checked by a small hand-written test
 * of its shape (the server builds it with the shared schema's types).
 */
import type { PublicBoard } from '../../shared/schemas/public-board.js';
import type { ReportSubmit } from '../../shared/schemas/reports.js';
import { ApiError, request } from './http.js';
import { BOARD_DATA_ELEMENT_ID } from '../../shared/public/inline-data.js';

const isObject = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v);
const isString = (v: unknown): v is string => typeof v === 'string';

function looksLikeWay(v: unknown): boolean {
  return (
    isObject(v) &&
    (typeof v.way === 'number' || v.way === null) &&
    typeof v.spare === 'boolean' &&
    isString(v.wayText) &&
    isString(v.label) &&
    isString(v.description) &&
    Array.isArray(v.locations) &&
    v.locations.every(isString) &&
    isString(v.device) &&
    isString(v.notes) &&
    typeof v.feedsAnotherBoard === 'boolean' &&
    (v.place === null || (isObject(v.place) && typeof v.place.row === 'number' && typeof v.place.index === 'number')) &&
    (v.rcd === null || (isObject(v.rcd) && (v.rcd.kind === 'rcd' || v.rcd.kind === 'rcbo')))
  );
}

/** True when a response has the board page's shape; anything else is treated as a failed load. */
export function isPublicBoard(v: unknown): v is PublicBoard {
  return (
    isObject(v) &&
    isObject(v.board) &&
    isString(v.board.name) &&
    isObject(v.contractor) &&
    isString(v.contractor.name) &&
    isObject(v.supply) &&
    isString(v.supply.voltageText) &&
    Array.isArray(v.ways) &&
    v.ways.every(looksLikeWay) &&
    isObject(v.dinRows) &&
    typeof v.dinRows.modulesPerRow === 'number' &&
    Array.isArray(v.dinRows.rows) &&
    Array.isArray(v.rcdGroups) &&
    isObject(v.inspection) &&
    isObject(v.revision) &&
    typeof v.revision.number === 'number' &&
    isString(v.publicNotes) &&
    Array.isArray(v.cautions) &&
    v.cautions.every(isString)
  );
}

export type PublicBoardResult = { status: 'ready'; board: PublicBoard } | { status: 'not-found' };

const boardPath = (token: string) => `/api/public/boards/${encodeURIComponent(token)}`;

/** The board the page's first HTML carried, once (server/public/page-html.ts); null when there is none or it is unreadable. */
function takeInlineBoard(): PublicBoard | null {
  const element = document.getElementById(BOARD_DATA_ELEMENT_ID);
  if (!element) return null;
  element.remove();
  try {
    const data: unknown = JSON.parse(element.textContent ?? '');
    return isPublicBoard(data) ? data : null;
  } catch {
    return null;
  }
}

/** The board behind a token; a 404 is an expected answer (rotated, switched off or mistyped), not an error. */
export async function fetchPublicBoard(token: string, signal?: AbortSignal): Promise<PublicBoardResult> {
  const inline = takeInlineBoard();
  if (inline) return { status: 'ready', board: inline };
  try {
    const res = await request('GET', boardPath(token), { signal });
    const body: unknown = await res.json();
    if (!isPublicBoard(body)) throw new ApiError(502, 'The board page answered in an unexpected shape');
    return { status: 'ready', board: body };
  } catch (err) {
    if (err instanceof ApiError && err.status === 404) return { status: 'not-found' };
    throw err;
  }
}

/** The contractor's logo for an `<img src>`. */
export const publicLogoUrl = (token: string) => `${boardPath(token)}/logo`;

/** Sends a discrepancy report; the server answers the same whether or not it was kept. */
export async function sendReport(token: string, report: ReportSubmit): Promise<void> {
  await request('POST', `${boardPath(token)}/reports`, { body: report });
}
