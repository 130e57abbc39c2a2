/**
 * What a rule check says about a schedule. Findings never block saving: they are shown
 * beside the field they concern, in the findings panel and on the chart.
 */
import type { BoardDetails, Circuit, Schedule } from '../schemas/schedule.js';

export type Severity = 'error' | 'warning' | 'info';

export interface Finding {
  severity: Severity;
  /** Where the rule comes from, e.g. "BS 7671 433.1.1" or "Common practice". */
  rule: string;
  /** Way numbers the finding concerns (empty for board-level findings). */
  ways: number[];
  /** A plain sentence an electrician reads. */
  message: string;
  /** Stable machine code of the check, e.g. "zs-over-max". */
  code: string;
  /** Path of the field it concerns in the schedule, e.g. "circuits.3.measuredZs" or "board.lastInspectionOn". */
  field?: string;
}

/** A before-you-swap finding about the old board's survey, not the board itself (its field starts `survey.`). */
export const isSurveyFinding = (f: Pick<Finding, 'field'>): boolean => f.field?.startsWith('survey.') ?? false;

export interface CheckContext {
  /** Today's date as YYYY-MM-DD: passed in, never read from a clock inside shared/. */
  today: string;
}

/** A region's wiring rules. BS 7671 is the first; another region adds its own RuleSet. */
export interface RuleSet {
  id: string;
  name: string;
  check(schedule: Schedule, context: CheckContext): Finding[];
  /** Next periodic inspection (YYYY-MM-DD) by this region's usual intervals; omitted where the region sets none. */
  nextInspectionDate?(board: BoardDetails): string | null;
  /** Maximum earth fault loop impedance (Ω) of every circuit, keyed by the circuit object; omitted where the region tabulates none. */
  maxZs?(schedule: Schedule): Map<Circuit, number | null>;
}
