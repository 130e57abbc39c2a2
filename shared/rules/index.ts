/**
 * The rule sets Waymark knows, by id, and the calls the rest of the product makes: the API's
 * check route, the editor's live findings, the chart's max Zs column and the inspection notice.
 * Everything is pure; `today` comes in through the context.
 */
import type { BoardDetails, Circuit, Schedule } from '../schemas/schedule.js';
import type { CheckContext, Finding, RuleSet, Severity } from './types.js';
import { bs7671 } from './bs7671/index.js';

/** "way 4" / "ways 1, 2 and 3": how a message or panel lists the ways of a finding. */
export { waysText } from './bs7671/view.js';

export type { CheckContext, Finding, RuleSet, Severity } from './types.js';

/** The rule set used when a board names none. */
export const DEFAULT_RULE_SET_ID = 'bs7671-2018-a2';

/** Every rule set by id. A second region adds its RuleSet here (see README.md). */
export const ruleSets: ReadonlyMap<string, RuleSet> = new Map([[bs7671.id, bs7671]]);

/** The caution shown with findings wherever they appear. */
export const CHECKS_CAUTION =
  'These checks help and do not replace the judgement of the designer and the inspector. ' +
  'Confirm every value against the current edition of the wiring regulations and local codes; work on installations is for competent persons only.';

/** The rule set for an id; an unknown id is a programming mistake, so it throws. */
export function getRuleSet(id: string = DEFAULT_RULE_SET_ID): RuleSet {
  const set = ruleSets.get(id);
  if (!set) throw new Error(`Unknown rule set "${id}"; known: ${[...ruleSets.keys()].join(', ')}`);
  return set;
}

const SEVERITY_ORDER: Record<Severity, number> = { error: 0, warning: 1, info: 2 };

/** Checks a schedule; findings come most serious first, then by way, board-level ones first within a severity. */
export function checkSchedule(schedule: Schedule, context: CheckContext, ruleSetId: string = DEFAULT_RULE_SET_ID): Finding[] {
  const findings = getRuleSet(ruleSetId).check(schedule, context);
  return findings
    .map((f, i) => ({ f, i }))
    .sort((a, b) => SEVERITY_ORDER[a.f.severity] - SEVERITY_ORDER[b.f.severity] || (a.f.ways[0] ?? 0) - (b.f.ways[0] ?? 0) || a.i - b.i)
    .map(({ f }) => f);
}

/** Next periodic inspection date (YYYY-MM-DD), for the 514.12.1 notice and the board page; null when no date is known. */
export function nextInspectionDate(board: BoardDetails, ruleSetId: string = DEFAULT_RULE_SET_ID): string | null {
  return getRuleSet(ruleSetId).nextInspectionDate?.(board) ?? null;
}

/** Maximum Zs (Ω) for one circuit, shown on the chart even when nothing was measured; null when unknown. */
export function maxZsFor(schedule: Schedule, circuit: Circuit, ruleSetId: string = DEFAULT_RULE_SET_ID): number | null {
  const limits = getRuleSet(ruleSetId).maxZs?.(schedule);
  if (!limits) return null;
  // The circuit as found in the schedule; a copy (e.g. from a form) is matched by its id.
  const own = limits.has(circuit) ? circuit : schedule.circuits.find((c) => c.id === circuit.id);
  return own ? (limits.get(own) ?? null) : null;
}

/** Maximum Zs for every circuit by circuit id, the map the print engine's chart takes. */
export function maxZsByCircuit(schedule: Schedule, ruleSetId: string = DEFAULT_RULE_SET_ID): Record<string, number | null> {
  const limits = getRuleSet(ruleSetId).maxZs?.(schedule);
  const out: Record<string, number | null> = {};
  for (const c of schedule.circuits) if (!(c.id in out)) out[c.id] = limits?.get(c) ?? null;
  return out;
}
