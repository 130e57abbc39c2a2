/**
 * The safety cautions on the board page. Our own wording of the usual trade cautions; the
 * page defers to BS 7671, the local code and licensed practice rather than replacing them.
 */
import type { BoardDetails } from '../schemas/schedule.js';

const ALTERNATIVE_SUPPLY_NAMES: Record<BoardDetails['alternativeSupply']['kinds'][number], string> = {
  pv: 'solar PV',
  battery: 'battery storage',
  generator: 'a generator',
  wind: 'a wind turbine',
  other: 'another source',
};

/** Who may open the board: said in the general cautions and again beside the picture that finds a switch. */
export const COVER_CAUTION = 'Only a competent person may remove the cover of this board or work inside it.';
/** The page may be out of date: said in the general cautions and again where the page points at one device. */
export const AS_RECORDED_CAUTION = 'This page shows the board as last recorded. Check it against the board itself before relying on it.';

/** Cautions that apply to every board, in the order a visitor should read them. */
export const GENERAL_CAUTIONS: readonly string[] = [
  'Before any work, switch off and isolate the supply, lock it off, then prove the circuit dead with a suitable tester.',
  COVER_CAUTION,
  'Follow BS 7671 and the wiring rules where you are. If in doubt, ask a qualified, licensed electrician.',
  AS_RECORDED_CAUTION,
];

/**
 * Beside the picture that shows a visitor which switch is their way's: switching that device off
 * or on at its front is as far as a householder goes; the cover and everything behind it are not theirs.
 */
export const SWITCH_ONLY_CAUTIONS: readonly string[] = [
  'Switching this device off or on, at its front, is as far as you should go. Do not touch anything inside the board.',
  `${COVER_CAUTION} For anything more than switching, call an electrician.`,
  AS_RECORDED_CAUTION,
];

/**
 * The caution of a three-phase board. BS 7671 514.10.1 asks for a warning where more than 230 V
 * to earth would not normally be expected; between the phases of a 230 V supply there are 400 V.
 */
export const THREE_PHASE_CAUTION =
  'Danger: 400 V. This is a three-phase board: 400 V is present between the phases, here and at the three-phase equipment it feeds. Isolate all three phases before any work.';

/** The general cautions plus those this board calls for (three phases, another source of supply, mixed wiring colours). */
export function boardCautions(board: Pick<BoardDetails, 'alternativeSupply' | 'mixedWiringColours' | 'phases'>): string[] {
  const out = [...GENERAL_CAUTIONS];
  const early: string[] = [];
  if (board.phases === 3) early.push(THREE_PHASE_CAUTION);
  if (board.alternativeSupply.present) {
    const kinds = board.alternativeSupply.kinds.map((k) => ALTERNATIVE_SUPPLY_NAMES[k]);
    const what = kinds.length ? ` (${kinds.join(', ')})` : '';
    // BS 7671 514.15.1: isolate both sources.
    early.push(`This installation has another source of supply${what}. Switching off this board alone may not make it dead: isolate every source.`);
  }
  // The dangers of this board come straight after "isolate and prove dead".
  out.splice(1, 0, ...early);
  if (board.mixedWiringColours) {
    // BS 7671 514.14.1: wiring to two versions of the colour code.
    out.push('Wiring in both the old and the new colour codes is present. Identify each conductor before you disconnect anything.');
  }
  return out;
}
