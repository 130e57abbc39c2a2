/**
 * The safety cautions on the board page. Our own wording of the usual trade cautions; the
 * page defers to BS 7671, the local code and licensed practice rather than replacing them.
 */
import type { BoardDetails } from '../schemas/schedule.js';

const ALTERNATIVE_SUPPLY_NAMES: Record<BoardDetails['alternativeSupply']['kinds'][number], string> = {
  pv: 'solar PV', battery: 'battery storage', generator: 'a generator', wind: 'a wind turbine', other: 'another source',
};

/** Cautions that apply to every board, in the order a visitor should read them. */
export const GENERAL_CAUTIONS: readonly string[] = [
  'Before any work, switch off and isolate the supply, lock it off, then prove the circuit dead with a suitable tester.',
  'Only a competent person may remove the cover of this board or work inside it.',
  'Follow BS 7671 and the wiring rules where you are. If in doubt, ask a qualified, licensed electrician.',
  'This page shows the board as last recorded. Check it against the board itself before relying on it.',
];

/** The general cautions plus those this board calls for (another source of supply, mixed wiring colours). */
export function boardCautions(board: Pick<BoardDetails, 'alternativeSupply' | 'mixedWiringColours'>): string[] {
  const out = [...GENERAL_CAUTIONS];
  if (board.alternativeSupply.present) {
    const kinds = board.alternativeSupply.kinds.map((k) => ALTERNATIVE_SUPPLY_NAMES[k]);
    const what = kinds.length ? ` (${kinds.join(', ')})` : '';
    // BS 7671 514.15.1: isolate both sources.
    out.splice(1, 0, `This installation has another source of supply${what}. Switching off this board alone may not make it dead: isolate every source.`);
  }
  if (board.mixedWiringColours) {
    // BS 7671 514.14.1: wiring to two versions of the colour code.
    out.push('Wiring in both the old and the new colour codes is present. Identify each conductor before you disconnect anything.');
  }
  return out;
}
