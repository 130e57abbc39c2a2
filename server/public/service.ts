/**
 * Use-cases of the board page: the public projection by token, the organisation's logo by
 * token, and the sharing state members see. A token that is unknown, rotated away or whose
 * page is switched off gives the same plain 404 as one that never existed.
 */
import { createHash } from 'node:crypto';
import { LRUCache } from 'lru-cache';
import type { Db } from '../db/client.js';
import type { ServerConfig } from '../config.js';
import { notFound } from '../errors.js';
import { readStoredSchedule } from '../boards/stored.js';
import { boardPageUrl, toPublicBoard } from '../../shared/public/board-page.js';
import type { PublicBoard } from '../../shared/schemas/public-board.js';
import type { Sharing } from '../../shared/schemas/sharing.js';
import { nextInspectionDate } from '../../shared/rules/index.js';
import { isoDay } from '../../shared/rules/dates.js';
import { findLogo, type StoredImage } from '../uploads/repository.js';
import { countOpenReports } from '../reports/repository.js';
import { findPublicBoard, findPublicBoardBody, findPublicBoardHead } from './repository.js';
import { requireMemberBoard } from '../boards/member-board.js';

/** Tokens are base64url; anything else cannot be one, so it is not looked up. */
const TOKEN_SHAPE = /^[A-Za-z0-9_-]{16,64}$/;

/** The page's live head, or null; a token that cannot be one is not looked up at all. */
const headFor = (db: Db, token: string) => (TOKEN_SHAPE.test(token) ? findPublicBoardHead(db, token) : Promise.resolve(null));

/** The same answer for every token that does not open a page: it reveals nothing. */
export const pageNotFound = () => notFound('Not found');

/** The live board behind a token, or a plain 404. */
export async function boardForToken(db: Db, token: string) {
  const row = TOKEN_SHAPE.test(token) ? await findPublicBoard(db, token) : null;
  if (!row) throw pageNotFound();
  return row;
}

/**
 * Projections already built, keyed by everything that feeds one. The board's live facts are read
 * on every request (so a rotated token, a switched-off page or a save shows at once, on every
 * process); only fetching, parsing and projecting the schedule document is saved.
 */
/** A board page serialised once per projection, with its entity tag. */
export interface PublicBoardBody {
  page: PublicBoard;
  json: Buffer;
  etag: string;
}

/**
 * Bytes the projections may hold together. Bounded by size, not by count: one tenant's 2,000-way
 * board is megabytes an entry, so a count bound would let a few such boards take the memory.
 */
export const PROJECTION_CACHE_BYTES = 64 * 1024 * 1024;

/**
 * A least-recently-used cache of projections bounded by their estimated size: the serialised JSON
 * plus the parsed page object, which takes about twice the JSON's length in memory. An entry
 * larger than the whole bound is simply not kept.
 */
export function createProjectionCache(maxBytes = PROJECTION_CACHE_BYTES): LRUCache<string, PublicBoardBody> {
  return new LRUCache<string, PublicBoardBody>({ maxSize: maxBytes, sizeCalculation: (b) => Math.max(1, b.json.length * 3) });
}

const projections = createProjectionCache();

/** `GET /api/public/boards/:token`. */
export async function publicBoardPage(db: Db, token: string): Promise<PublicBoardBody> {
  const head = await headFor(db, token);
  if (!head) throw pageNotFound();
  const key = JSON.stringify([head.id, head.revision, head.updatedAt.getTime(), head.organisation, head.hasLogo]);
  const known = projections.get(key);
  if (known) return known;
  const body = await findPublicBoardBody(db, head.id);
  if (!body) throw pageNotFound();
  const schedule = readStoredSchedule(body.schedule);
  const page = toPublicBoard(schedule, {
    organisation: head.organisation,
    hasLogo: head.hasLogo,
    revision: head.revision,
    revisionDate: isoDay(body.revisionDate ?? head.updatedAt),
    nextInspectionOn: nextInspectionDate(schedule.board),
  });
  const json = Buffer.from(JSON.stringify(page));
  const built = { page, json, etag: `"${createHash('sha1').update(json).digest('base64url')}"` };
  projections.set(key, built);
  return built;
}

/** `GET /api/public/boards/:token/logo`: the contractor's logo, only while the page is on. */
export async function publicLogo(db: Db, token: string): Promise<StoredImage> {
  // The head says whether a logo exists; the schedule is not needed for it.
  const head = await headFor(db, token);
  if (!head?.hasLogo) throw pageNotFound();
  const logo = await findLogo(db, head.organisationId);
  if (!logo) throw pageNotFound();
  return logo;
}

/** The board page's link as printed in the QR code. */
export function publicUrlFor(config: Pick<ServerConfig, 'publicBaseUrl'>, token: string): string {
  return boardPageUrl(config.publicBaseUrl, token);
}

/** `GET /api/boards/:id/sharing`. */
export async function sharingState(db: Db, config: ServerConfig, organisationId: number, boardId: number): Promise<Sharing> {
  const board = await requireMemberBoard(db, organisationId, boardId);
  return {
    boardId: board.id,
    name: board.name,
    code: board.code,
    publicEnabled: board.publicEnabled,
    publicUrl: publicUrlFor(config, board.publicToken),
    revision: board.revision,
    openReports: await countOpenReports(db, board.id),
  };
}
