/**
 * The changeover plan applied to the board: the pure step (`applyPlan`) on the saved schedule,
 * saved through the same path as every edit, so it makes one revision, answers 409 when the board
 * moved on, and a plan that is not whole is refused with the fields to fix.
 */
import type { Db } from '../db/client.js';
import { applyPlan } from '../../shared/schedule/apply-plan.js';
import { invalid } from '../errors.js';
import { requireBoardSchedule } from './member-board.js';
import { checkFeedsBoardIds, saveScheduleAt, type Actor, type SaveOutcome } from './writes.js';

export type ApplyOutcome = SaveOutcome & { created?: string[]; updated?: string[] };

/** `POST /api/boards/:id/changeover/apply` */
export async function applyChangeover(db: Db, actor: Actor, id: number, baseRevision: number): Promise<ApplyOutcome> {
  const row = await requireBoardSchedule(db, actor.organisationId, id);
  if (row.revision !== baseRevision) return { status: 'stale', revision: row.revision };
  const plan = applyPlan(row.schedule);
  if (!plan.ok) throw invalid('The plan is not complete; nothing was changed', plan.fields);
  await checkFeedsBoardIds(db, actor.organisationId, plan.schedule, id);
  const saved = await saveScheduleAt(db, actor, id, baseRevision, plan.schedule);
  return saved.status === 'stale' ? saved : { ...saved, created: plan.created, updated: plan.updated };
}
