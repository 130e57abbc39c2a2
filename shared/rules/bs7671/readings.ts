/**
 * Test readings judged against published limits: insulation resistance (Table 64), ring end-to-end
 * readings, polarity, Zs against Ze + (R1+R2), and RCD operating times. The same judgements serve a
 * new board's circuits and the old board's survey: each issue names its field relative to the
 * readings, and the caller places it (`circuits.3.readings…` or `survey.ways.1.readings…`).
 */
import type { CircuitReadings, RcdTripTimes } from '../../schemas/survey.js';
import type { Severity } from '../types.js';
import { LOW_INSULATION_MEGOHMS, RCD_TRIP_LIMIT_MS, RING_END_TO_END, TABLE_64_MIN_MEGOHMS, ZS_CROSS_CHECK_OHMS } from './tables-fuses.js';
import { num, ohms } from './view.js';

export interface ReadingIssue {
  severity: Severity;
  code: string;
  rule: string;
  field: string;
  message: string;
}

export interface ReadingContext {
  ring: boolean;
  /** Ze of the supply, for the Zs cross-check. */
  ze: number | null;
  /** Measured Zs where it is kept outside the readings (a new circuit's `measuredZs`), with the field it is in. */
  zs?: { value: number | null; field: string };
  /** The circuit is, or will be, behind an RCD: low insulation then means nuisance trips. */
  behindRcd: boolean;
  /** Live and cpc csa of the cable, when known: the r2/r1 ratio is only expected for 2.5/1.5 mm². */
  liveCsa?: number | null;
  cpcCsa?: number | null;
}

const megohms = (v: number) => `${num(v)} MΩ`;
const INSULATION_PAIRS = [
  ['lineLine', 'L–L'],
  ['lineEarth', 'L–E'],
  ['neutralEarth', 'N–E'],
] as const;

function insulationIssues(r: CircuitReadings, ctx: ReadingContext): ReadingIssue[] {
  const { testVoltage } = r.insulation;
  const taken = INSULATION_PAIRS.filter(([k]) => r.insulation[k] != null);
  if (!taken.length) return [];
  if (testVoltage == null) {
    return [
      {
        severity: 'info',
        code: 'insulation-voltage-missing',
        rule: 'BS 7671 Table 64',
        field: 'insulation.testVoltage',
        message: 'record the test voltage of the insulation resistance readings: Table 64 sets the minimum by test voltage',
      },
    ];
  }
  const min = TABLE_64_MIN_MEGOHMS[testVoltage];
  const out: ReadingIssue[] = [];
  for (const [k, name] of taken) {
    const value = r.insulation[k]!;
    if (value < min) {
      out.push({
        severity: 'error',
        code: 'insulation-below-table-64',
        rule: 'BS 7671 Table 64',
        field: `insulation.${k}`,
        message: `${name} insulation resistance ${megohms(value)} at ${testVoltage} V is below the ${megohms(min)} minimum of Table 64: find and clear the fault before the circuit is put back in service`,
      });
    } else if (value < LOW_INSULATION_MEGOHMS && k !== 'lineLine') {
      out.push({
        severity: 'warning',
        code: 'insulation-low',
        rule: 'Common practice',
        field: `insulation.${k}`,
        message: `${name} insulation resistance ${megohms(value)} passes Table 64 but is low (a sound circuit reads hundreds of MΩ)${ctx.behindRcd ? '; behind an RCD it will likely trip it, so look for the cause before the changeover' : ''}`,
      });
    }
  }
  return out;
}

function ringIssues(r: CircuitReadings, ctx: ReadingContext): ReadingIssue[] {
  if (!ctx.ring) return [];
  const { r1, rn, r2 } = r.ring;
  const out: ReadingIssue[] = [];
  if (r1 != null && rn != null && Math.abs(r1 - rn) > RING_END_TO_END.r1RnToleranceOhms + 1e-9) {
    out.push({
      severity: 'warning',
      code: 'ring-ends-differ',
      rule: 'Common practice',
      field: 'ring.rn',
      message: `ring end-to-end r1 ${ohms(r1)} and rn ${ohms(rn)} differ by more than ${ohms(RING_END_TO_END.r1RnToleranceOhms)}: the line and neutral loops should match; check for a break, an interconnection or a loose joint`,
    });
  }
  const usualCable = (ctx.liveCsa == null || ctx.liveCsa === 2.5) && (ctx.cpcCsa == null || ctx.cpcCsa === 1.5);
  if (usualCable && r1 != null && r2 != null && r1 > 0) {
    const ratio = r2 / r1;
    if (Math.abs(ratio - RING_END_TO_END.r2Ratio) > RING_END_TO_END.r2Ratio * RING_END_TO_END.r2RatioTolerance) {
      out.push({
        severity: 'warning',
        code: 'ring-r2-ratio',
        rule: 'Common practice',
        field: 'ring.r2',
        message: `ring end-to-end r2 ${ohms(r2)} is ${num(ratio)} × r1; for 2.5/1.5 mm² twin-and-earth it is about 1.67 × r1 (the ratio of the csa), so check the cpc loop`,
      });
    }
  }
  if (r1 != null && r2 != null && r.r1PlusR2 != null) {
    const expected = (r1 + r2) / 4;
    if (Math.abs(r.r1PlusR2 - expected) > RING_END_TO_END.r1RnToleranceOhms + 1e-9) {
      out.push({
        severity: 'warning',
        code: 'ring-r1r2-mismatch',
        rule: 'Common practice',
        field: 'r1PlusR2',
        message: `R1+R2 ${ohms(r.r1PlusR2)} should be about (r1 + r2) / 4 = ${ohms(expected)} on a ring cross-connected at the board; a difference means a spur, a break or a wrong reading`,
      });
    }
  }
  return out;
}

function zsIssues(r: CircuitReadings, ctx: ReadingContext): ReadingIssue[] {
  const zs = ctx.zs ? ctx.zs.value : r.zs;
  if (zs == null || ctx.ze == null || r.r1PlusR2 == null) return [];
  const expected = ctx.ze + r.r1PlusR2;
  if (Math.abs(zs - expected) <= ZS_CROSS_CHECK_OHMS) return [];
  return [
    {
      severity: 'warning',
      code: 'zs-cross-check',
      rule: 'Common practice',
      field: ctx.zs?.field ?? 'zs',
      message: `measured Zs ${ohms(zs)} differs from Ze + (R1+R2) = ${ohms(ctx.ze)} + ${ohms(r.r1PlusR2)} = ${ohms(expected)} by more than ${ohms(ZS_CROSS_CHECK_OHMS)}: one reading is wrong, or a parallel earth path is lowering Zs`,
    },
  ];
}

/** Everything the readings of one circuit say, most serious first within each kind. */
export function judgeReadings(r: CircuitReadings, ctx: ReadingContext): ReadingIssue[] {
  const out = [...insulationIssues(r, ctx), ...ringIssues(r, ctx), ...zsIssues(r, ctx)];
  if (r.polarity === 'incorrect') {
    out.unshift({
      severity: 'error',
      code: 'polarity-incorrect',
      rule: 'BS 7671 643.6',
      field: 'polarity',
      message: 'polarity recorded as incorrect: a single-pole device or switch is in the neutral; correct it before the circuit is energised',
    });
  }
  return out;
}

/** An RCD's operating times against the product standard's limits for a general (non-delay) RCD. */
export function judgeRcdTrip(t: RcdTripTimes, residualMa: number | null): ReadingIssue[] {
  const at = residualMa != null ? `${num(residualMa)} mA` : 'IΔn';
  const out: ReadingIssue[] = [];
  if (t.atRated != null && t.atRated > RCD_TRIP_LIMIT_MS.atRated) {
    out.push({
      severity: 'error',
      code: 'rcd-trip-slow',
      rule: 'BS EN 61008-1 / BS EN 61009-1',
      field: 'atRated',
      message: `trip time ${num(t.atRated)} ms at ${at} is over the ${RCD_TRIP_LIMIT_MS.atRated} ms limit for a general (non-delay) RCD: replace it, or find what slows it`,
    });
  }
  if (t.atFiveTimes != null && t.atFiveTimes > RCD_TRIP_LIMIT_MS.atFiveTimes) {
    out.push({
      severity: 'error',
      code: 'rcd-trip-slow-5x',
      rule: 'BS EN 61008-1 / BS EN 61009-1',
      field: 'atFiveTimes',
      message: `trip time ${num(t.atFiveTimes)} ms at 5 × ${at} is over the ${RCD_TRIP_LIMIT_MS.atFiveTimes} ms limit for a general (non-delay) RCD giving additional protection`,
    });
  }
  return out;
}
