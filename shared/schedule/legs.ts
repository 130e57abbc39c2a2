/**
 * How many cable legs a circuit of a kind has unless the electrician says otherwise: a ring final
 * has two ends at the board, every other circuit one. The legs decide how many cable flags print,
 * so a ring changed to a radial must not keep its second flag.
 */
import type { Circuit } from '../schemas/schedule.js';
import type { PlannedWay, SurveyWay } from '../schemas/survey.js';

/** The legs a circuit of this kind has by default. */
export function defaultLegs(kind: Circuit['kind']): number {
  return kind === 'ring' ? 2 : 1;
}

/**
 * The legs after the kind changes from `before` to `after`: the new kind's default when the legs were
 * still the old kind's default; a count set by hand (e.g. a radial with two cables) is kept.
 */
export function legsAfterKindChange(before: Circuit['kind'], after: Circuit['kind'], legs: number): number {
  return legs === defaultLegs(before) ? defaultLegs(after) : legs;
}

/** The old legs a target takes: the ones it names, or all of them when it is the old way's only target and names none. */
export function legsOf(w: SurveyWay, t: PlannedWay): number[] {
  if (t.legs.length) return t.legs.map((l) => l.leg);
  return w.targets.length === 1 ? Array.from({ length: w.legs }, (_, i) => i + 1) : [];
}
