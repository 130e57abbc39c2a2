/**
 * Words the survey screens show for the survey's coded values, and its option lists, in the
 * trade's terms. New survey items start from here with what is usual on an old domestic board.
 */
import {
  fuseStandards,
  identificationMethods,
  oldDeviceKinds,
  planActions,
  surveyWaySchema,
  type IdentificationMethod,
  type OldDeviceKind,
  type PlanAction,
  type PlannedWay,
  type SurveyWay,
} from '../../../../shared/schemas/survey.js';
import { newItemId } from '../../../stores/board.js';

export const identificationNames: Record<IdentificationMethod, string> = {
  'fuse-withdrawn': 'Fuse withdrawn, points dead',
  'breaker-off': 'Breaker off, points dead',
  traced: 'Cable traced',
  'as-labelled': 'As labelled (not proved)',
  'not-found': 'Not found',
};
export const oldDeviceNames: Record<OldDeviceKind, string> = { fuse: 'Fuse', mcb: 'MCB', rcbo: 'RCBO', none: 'None' };
export const actionNames: Record<PlanAction, string> = {
  keep: 'Keep: one new way',
  split: 'Split: several new ways',
  join: 'Join: shares a new way',
  retire: 'Retire',
  spare: 'Leave spare',
};

export const identificationOptions = identificationMethods.map((value) => ({ value, label: identificationNames[value] }));
export const oldDeviceOptions = oldDeviceKinds.map((value) => ({ value, label: oldDeviceNames[value] }));
export const fuseStandardOptions = fuseStandards.map((value) => ({ value, label: value === 'BS 3036' ? 'BS 3036 rewireable' : value }));
export const actionOptions = planActions.map((value) => ({ value, label: actionNames[value] }));

/** The next old way: its reference numbered on from the last, one leg, a rewireable fuse until told otherwise. */
export function newSurveyWay(count: number): SurveyWay {
  return surveyWaySchema.parse({ id: newItemId('old'), reference: `Fuse ${count + 1}`, device: { kind: 'fuse', fuseStandard: 'BS 3036' } });
}

/** A new way for an old one: next to the highest way planned so far, taking the old way's kind and every leg. */
export function newTarget(way: SurveyWay, nextWay: number): PlannedWay {
  const label = (way.feeds.split(/[,:;]/)[0] ?? '').trim().slice(0, 24) || `Way ${nextWay}`;
  return {
    circuitId: newItemId('c'),
    way: nextWay,
    phase: null,
    label,
    kind: way.kind,
    device: { kind: 'rcbo', rating: null, curve: 'B', residualMa: 30, rcdType: 'A', rcdGroup: null },
    legs: Array.from({ length: way.legs }, (_, i) => ({ leg: i + 1, junctionBoxId: null })),
  };
}
