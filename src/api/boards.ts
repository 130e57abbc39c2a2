/**
 * Typed calls to the boards API. Every response is parsed with its shared schema, so a contract
 * drift between client and server fails loudly here rather than deep inside a component.
 */
import { z } from 'zod';
import { json, request } from './http.js';
import { scheduleResponseSchema, type Schedule } from '../../shared/schemas/schedule.js';
import {
  boardListResponseSchema,
  boardSummarySchema,
  createdSchema,
  saveResultSchema,
  revisionListResponseSchema,
  revisionSnapshotSchema,
  diffResponseSchema,
  changeoverApplyResponseSchema,
  type BoardCreate,
} from '../../shared/schemas/boards.js';

export type { BoardListItem, BoardSummary, RevisionListItem, DiffResponse } from '../../shared/schemas/boards.js';

const findingsResponseSchema = z.object({
  findings: z.array(
    z.object({
      severity: z.enum(['error', 'warning', 'info']),
      rule: z.string(),
      ways: z.array(z.number()),
      message: z.string(),
      code: z.string(),
      field: z.string().optional(),
    }),
  ),
});

export interface BoardListFilter {
  q?: string;
  page?: number;
  pageSize?: number;
  siteId?: number | null;
  deleted?: boolean;
}

function query(params: Record<string, string | number | boolean | null | undefined>): string {
  const search = new URLSearchParams();
  for (const [k, v] of Object.entries(params)) if (v !== undefined && v !== null && v !== '' && v !== false) search.set(k, String(v));
  const s = search.toString();
  return s ? `?${s}` : '';
}

export const listBoards = (filter: BoardListFilter = {}) => json(boardListResponseSchema, 'GET', `/api/boards${query({ ...filter })}`);
export const createBoard = (body: BoardCreate) => json(createdSchema, 'POST', '/api/boards', { body });
export const getBoard = (id: number) => json(boardSummarySchema, 'GET', `/api/boards/${id}`);
export const getSchedule = (id: number) => json(scheduleResponseSchema, 'GET', `/api/boards/${id}/schedule`);

/** Saves the whole schedule against the revision it was edited from; a stale base answers 409 (`ApiError.code === 'stale'`). */
export const saveSchedule = (id: number, schedule: Schedule, baseRevision: number) =>
  json(saveResultSchema, 'PUT', `/api/boards/${id}/schedule`, { body: { ...schedule, baseRevision } });

/** Makes the new board's circuits and devices from the saved survey's plan; 400 names the plan's gaps, 409 when stale. */
export const applyChangeover = (id: number, baseRevision: number) =>
  json(changeoverApplyResponseSchema, 'POST', `/api/boards/${id}/changeover/apply`, { body: { baseRevision } });

export const checkBoard = (id: number) => json(findingsResponseSchema, 'GET', `/api/boards/${id}/check`);
export const deleteBoard = (id: number) => request('DELETE', `/api/boards/${id}`).then(() => undefined);
export const restoreBoard = (id: number) => request('POST', `/api/boards/${id}/restore`).then(() => undefined);
export const duplicateBoard = (id: number) => json(createdSchema, 'POST', `/api/boards/${id}/duplicate`);
export const setBoardSite = (id: number, siteId: number | null) => request('PATCH', `/api/boards/${id}`, { body: { siteId } }).then(() => undefined);

export const listRevisions = (id: number) => json(revisionListResponseSchema, 'GET', `/api/boards/${id}/revisions`);
export const getRevision = (id: number, number: number) => json(revisionSnapshotSchema, 'GET', `/api/boards/${id}/revisions/${number}`);
export const diffRevisions = (id: number, from: number, to: number) => json(diffResponseSchema, 'GET', `/api/boards/${id}/diff${query({ from, to })}`);

/** The board file as text, with the file name the server suggests. */
export async function exportBoard(id: number): Promise<{ text: string; fileName: string }> {
  const res = await request('GET', `/api/boards/${id}/export`);
  return { text: await res.text(), fileName: fileNameOf(res, `board-${id}.json`) };
}

/** Sends a board file as read from disk; the server validates it whole with the board file schema. */
export const importBoard = (file: unknown, siteId?: number | null) =>
  json(createdSchema, 'POST', '/api/boards/import', { body: siteId ? { file, siteId } : file });

export async function exportCircuitsCsv(id: number): Promise<{ text: string; fileName: string }> {
  const res = await request('GET', `/api/boards/${id}/circuits.csv`);
  return { text: await res.text(), fileName: fileNameOf(res, `circuits-${id}.csv`) };
}

/** The old board's survey as CSV (export only); 400 when the board has none. */
export async function exportSurveyCsv(id: number): Promise<{ text: string; fileName: string }> {
  const res = await request('GET', `/api/boards/${id}/survey.csv`);
  return { text: await res.text(), fileName: fileNameOf(res, `survey-${id}.csv`) };
}

export const importCircuitsCsv = (id: number, csv: string, baseRevision: number) =>
  json(saveResultSchema, 'POST', `/api/boards/${id}/circuits/import-csv`, { body: { csv, baseRevision } });

function fileNameOf(res: Response, fallback: string): string {
  const header = res.headers.get('Content-Disposition') ?? '';
  const match = /filename\*?=(?:UTF-8'')?"?([^";]+)"?/i.exec(header);
  return match ? decodeURIComponent(match[1]) : fallback;
}
