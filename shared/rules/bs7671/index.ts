/**
 * The BS 7671:2018+A2:2022 rule set: every rule group run over one prepared view of the
 * schedule. The checks help and do not replace the designer's and inspector's judgement.
 */
import type { RuleSet } from '../types.js';
import { checkAdditionalProtection } from './additional-protection.js';
import { checkArcFault } from './arc-fault.js';
import { checkBreakingCapacity } from './breaking-capacity.js';
import { checkCapacity } from './capacity.js';
import { checkCircuitData } from './data-circuits.js';
import { checkDeviceData } from './data-devices.js';
import { checkEarthFaultLoop, checkElectrode, zsLimit } from './earth-fault-loop.js';
import { checkInspection, nextInspectionOn } from './inspection.js';
import { checkLightingSpread } from './lighting-spread.js';
import { checkRcdType } from './rcd-type.js';
import { viewOf } from './view.js';
import { checkReadings } from './readings-check.js';
import { checkChangeover } from './changeover.js';
import { checkVoltageDrop } from './voltage-drop.js';

export { maxZs, fuseMaxZs, zsLimit, disconnectionSeconds, type ZsLimit } from './earth-fault-loop.js';
export { checkChangeover, oldWayName } from './changeover.js';
export { twinEarthIz } from './capacity.js';
export { estimatedVoltageDrop } from './voltage-drop.js';
export { waysText } from './view.js';
export { nextInspectionOn, inspectionIntervalMonths } from './inspection.js';

/** The UK rule set, registered in `shared/rules/index.ts`; the checks run in the order findings are grouped on the panel. */
export const bs7671: RuleSet = {
  id: 'bs7671-2018-a2',
  name: 'BS 7671:2018+A2:2022 (UK)',
  check(schedule, context) {
    const view = viewOf(schedule);
    return [
      ...checkCircuitData(view),
      ...checkDeviceData(view),
      ...checkCapacity(view),
      ...checkBreakingCapacity(view),
      ...checkElectrode(view),
      ...checkEarthFaultLoop(view),
      ...checkAdditionalProtection(view),
      ...checkRcdType(view),
      ...checkArcFault(view),
      ...checkVoltageDrop(view),
      ...checkLightingSpread(view),
      ...checkInspection(schedule.board, context, nextInspectionOn(schedule.board)),
      ...checkReadings(view),
      ...checkChangeover(schedule),
    ];
  },
  nextInspectionDate: nextInspectionOn,
  maxZs(schedule) {
    const view = viewOf(schedule);
    return new Map(view.circuits.map((f) => [f.circuit, zsLimit(schedule, f)?.ohms ?? null]));
  },
};
