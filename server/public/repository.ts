/**
 * Data access for the board page and for the members' sharing screen. The public lookup
 * goes by token only and answers nothing for a board whose page is off or that is deleted;
 * the members' lookup always filters by organisation (another organisation's id → null → 404).
 */
import DataLoader from 'dataloader';
import { and, eq, inArray, isNull, sql } from 'drizzle-orm';
import type { Db } from '../db/client.js';
import { boardRevisions, boards, files, organisations } from '../db/schema.js';

export interface PublicBoardRow {
  id: number;
  organisationId: number;
  name: string;
  code: string;
  schedule: unknown;
  revision: number;
  revisionDate: Date | null;
  updatedAt: Date;
  organisation: { name: string; contactPhone: string; contactEmail: string };
  hasLogo: boolean;
}

/** A board page's live facts without its schedule: cheap enough to read on every request. */
export type PublicBoardHead = Omit<PublicBoardRow, 'schedule' | 'revisionDate'>;

/** The columns of a board page's head, shared by the single and the batched query. */
function headColumns() {
  return {
    id: boards.id,
    organisationId: boards.organisationId,
    boardName: boards.name,
    code: boards.code,
    publicToken: boards.publicToken,
    revision: boards.revision,
    updatedAt: boards.updatedAt,
    name: organisations.name,
    contactPhone: organisations.contactPhone,
    contactEmail: organisations.contactEmail,
    // Both queries below join organisations, so Drizzle qualifies these columns with their tables.
    hasLogo: sql<number>`exists(select 1 from ${files} where ${files.organisationId} = ${boards.organisationId} and ${files.kind} = 'logo')`,
  };
}
const livePage = and(eq(boards.publicEnabled, true), isNull(boards.deletedAt));

/**
 * The board page's per-request query: the board (only while its page is on and it is not deleted),
 * its organisation's public contact and whether a logo exists, without the schedule document.
 * Prepared once per database, since the busiest public route would otherwise spend much of its
 * time assembling the same SQL again.
 */
function buildHeadQuery(db: Db) {
  return db
    .select(headColumns())
    .from(boards)
    .innerJoin(organisations, eq(organisations.id, boards.organisationId))
    .where(and(eq(boards.publicToken, sql.placeholder('token')), livePage))
    .limit(1)
    .prepare();
}
type HeadRecord = Awaited<ReturnType<ReturnType<typeof buildHeadQuery>['execute']>>[number];

function toHead({ boardName, name, contactPhone, contactEmail, hasLogo, publicToken: _t, ...rest }: HeadRecord): PublicBoardHead {
  return { ...rest, name: boardName, organisation: { name, contactPhone, contactEmail }, hasLogo: Number(hasLogo) === 1 };
}

/** Heads for several tokens in one statement (the prepared one when there is a single token). */
async function findHeads(db: Db, query: ReturnType<typeof buildHeadQuery>, tokens: readonly string[]): Promise<(PublicBoardHead | null)[]> {
  const distinct = [...new Set(tokens)];
  const rows =
    distinct.length === 1
      ? await query.execute({ token: distinct[0]! })
      : await db
          .select(headColumns())
          .from(boards)
          .innerJoin(organisations, eq(organisations.id, boards.organisationId))
          .where(and(inArray(boards.publicToken, distinct), livePage));
  const byToken = new Map(rows.map((r) => [r.publicToken, toHead(r)]));
  return tokens.map((t) => byToken.get(t) ?? null);
}

/**
 * Board-page reads arriving while one is on the wire wait for it to finish and then go together
 * in a single statement (duplicates folded). Every answer still comes from a statement sent after
 * its request arrived, so a save, a rotated token or a switched-off page shows at once on every
 * process, as it would with one statement per request; a crowd reading the same page costs one
 * round trip per batch instead of one each.
 */
function buildHeadLoader(db: Db): DataLoader<string, PublicBoardHead | null> {
  const query = buildHeadQuery(db);
  let onWire: Promise<unknown> | null = null;
  return new DataLoader(
    (tokens) => {
      const read = findHeads(db, query, tokens);
      const settled = read.then(
        () => undefined,
        () => undefined,
      );
      onWire = settled;
      void settled.then(() => {
        if (onWire === settled) onWire = null;
      });
      return read;
    },
    {
      cache: false,
      maxBatchSize: 200,
      batchScheduleFn: (dispatch) => {
        if (onWire) void onWire.then(() => setImmediate(dispatch));
        else setImmediate(dispatch);
      },
    },
  );
}
const headLoaders = new WeakMap<Db, DataLoader<string, PublicBoardHead | null>>();

export async function findPublicBoardHead(db: Db, token: string): Promise<PublicBoardHead | null> {
  let loader = headLoaders.get(db);
  if (!loader) headLoaders.set(db, (loader = buildHeadLoader(db)));
  return loader.load(token);
}

/** The schedule document of a board and the date of its current revision. */
export async function findPublicBoardBody(db: Db, boardId: number): Promise<{ schedule: unknown; revisionDate: Date | null } | null> {
  const [row] = await db
    .select({ schedule: boards.schedule, revisionDate: boardRevisions.createdAt })
    .from(boards)
    .leftJoin(boardRevisions, and(eq(boardRevisions.boardId, boards.id), eq(boardRevisions.number, boards.revision)))
    .where(eq(boards.id, boardId))
    .limit(1);
  return row ?? null;
}

/** The whole board behind a token (head and schedule), or null. */
export async function findPublicBoard(db: Db, token: string): Promise<PublicBoardRow | null> {
  const head = await findPublicBoardHead(db, token);
  const body = head && (await findPublicBoardBody(db, head.id));
  return head && body ? { ...head, ...body } : null;
}
