/**
 * The two writes every way of making or changing a schedule goes through: a new board at
 * revision 1, and a save against a base revision. Create, duplicate, import, the CSV import and
 * the demo seed all use these, so the revision rules hold everywhere.
 */
import { inTransaction } from '../db/client.js';
import { mayRetryTransaction } from '../db/cluster.js';
import { isDeadlock, isDuplicateKey } from '../db/errors.js';
import type { Db } from '../db/client.js';
import type { Schedule } from '../../shared/schemas/schedule.js';
import { diffSchedules } from '../../shared/schedule/diff.js';
import { invalid } from '../errors.js';
import { newBoardCode, newPublicToken } from './codes.js';
import { existingBoardIds, insertBoard, siteExists, updateScheduleIfAt } from './repository.js';
import { requireBoardSchedule, requireLiveBoardState } from './member-board.js';
import { insertRevision } from './revision-repository.js';
import { sameSchedule, searchTextOf } from './stored.js';

/** Who is writing: the signed-in member (or the demo owner when seeding). */
export interface Actor {
  id: number;
  name: string;
  organisationId: number;
}

/** A site id given in a request body must be one of the organisation's sites: else 400 on that field. */
export async function checkSiteField(db: Db, organisationId: number, siteId: number | null | undefined, field = 'siteId'): Promise<void> {
  if (siteId != null && !(await siteExists(db, organisationId, siteId))) throw invalid('No such site', { [field]: 'No such site in your organisation' });
}

/**
 * A sub-main's `feedsBoardId` must name a board of the same organisation, and not the board
 * itself: else 400 on `circuits.<i>.feedsBoardId`. Other cross-references are findings, not errors.
 */
export async function checkFeedsBoardIds(
  db: Db,
  organisationId: number,
  schedule: Schedule,
  selfId: number | null,
  fieldFor: (index: number) => string = (i) => `circuits.${i}.feedsBoardId`,
): Promise<void> {
  const wanted = [...new Set(schedule.circuits.map((c) => c.feedsBoardId).filter((v): v is number => v != null))];
  if (!wanted.length) return;
  const known = await existingBoardIds(db, organisationId, wanted);
  const fields: Record<string, string> = {};
  schedule.circuits.forEach((c, i) => {
    if (c.feedsBoardId == null) return;
    if (c.feedsBoardId === selfId) fields[fieldFor(i)] = 'A board cannot feed itself';
    else if (!known.has(c.feedsBoardId)) fields[fieldFor(i)] = 'No such board in your organisation';
  });
  if (Object.keys(fields).length) throw invalid('A sub-main names a board that is not one of yours', fields);
}

/**
 * Inserts a board and its revision 1, in one transaction; retries on the rare clash of a random code.
 * A new board's page is off until the electrician switches it on (the schedule is not public by
 * accident); only the demo seed starts with it on, so its printed tags open something.
 */
export async function createBoardRecord(
  db: Db,
  actor: Actor,
  schedule: Schedule,
  siteId: number | null,
  summary: string,
  { publicEnabled = false }: { publicEnabled?: boolean } = {},
): Promise<number> {
  for (let attempt = 1; ; attempt++) {
    const code = newBoardCode();
    try {
      return await inTransaction(db, async (tx) => {
        const id = await insertBoard(tx, {
          organisationId: actor.organisationId,
          siteId,
          code,
          publicToken: newPublicToken(),
          publicEnabled,
          schedule,
          searchText: searchTextOf(schedule, code),
        });
        await insertRevision(tx, { boardId: id, number: 1, authorId: actor.id, authorName: actor.name, summary, snapshot: schedule });
        return id;
      });
    } catch (err) {
      if (!isDuplicateKey(err) || attempt >= 5) throw err;
    }
  }
}

export type SaveOutcome =
  | { status: 'saved'; revision: number; summary: string; changed: true }
  | { status: 'unchanged'; revision: number; summary: string; changed: false }
  | { status: 'stale'; revision: number };

/**
 * Saves a whole schedule made from `baseRevision`. A save that changes nothing makes no revision;
 * a save from an older revision is refused as stale (the caller answers 409), so nobody's work is
 * overwritten silently. The revision row and the board row change in one transaction.
 */
export async function saveScheduleAt(db: Db, actor: Actor, boardId: number, baseRevision: number, schedule: Schedule): Promise<SaveOutcome> {
  for (let attempt = 1; ; attempt++) {
    try {
      return await saveOnce(db, actor, boardId, baseRevision, schedule);
    } catch (err) {
      // On a Galera cluster two nodes may both pass the revision check, and one loses at commit (a deadlock error):
      // run the whole save again, which reads the winner's revision and answers stale. A node gone mid-save is the
      // same: the guarded update cannot apply twice. After the last try a lost conflict is still a stale save (409).
      if (!mayRetryTransaction(err)) throw err;
      if (attempt >= SAVE_ATTEMPTS) {
        if (!isDeadlock(err)) throw err;
        return { status: 'stale', revision: (await requireLiveBoardState(db, actor.organisationId, boardId)).revision };
      }
      await new Promise((r) => setTimeout(r, 50 * attempt));
    }
  }
}

const SAVE_ATTEMPTS = 4;

async function saveOnce(db: Db, actor: Actor, boardId: number, baseRevision: number, schedule: Schedule): Promise<SaveOutcome> {
  const current = await requireBoardSchedule(db, actor.organisationId, boardId);
  if (current.revision !== baseRevision) return { status: 'stale', revision: current.revision };
  await checkFeedsBoardIds(db, actor.organisationId, schedule, boardId);
  if (sameSchedule(current.schedule, schedule)) return { status: 'unchanged', revision: current.revision, summary: 'No changes', changed: false };
  const summary = diffSchedules(current.schedule, schedule).summary || 'Changed';
  const won = await inTransaction(db, async (tx) => {
    if (!(await updateScheduleIfAt(tx, actor.organisationId, boardId, baseRevision, schedule, searchTextOf(schedule, current.code)))) return false;
    await insertRevision(tx, { boardId, number: baseRevision + 1, authorId: actor.id, authorName: actor.name, summary, snapshot: schedule });
    return true;
  });
  if (won) return { status: 'saved', revision: baseRevision + 1, summary, changed: true };
  const now = await requireLiveBoardState(db, actor.organisationId, boardId);
  return { status: 'stale', revision: now.revision };
}
