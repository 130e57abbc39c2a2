/**
 * The survey CSV (documented in DEVELOPERS.md, "Survey CSV"): the old board's ways as found, their
 * readings, the plan and the before-you-swap verdict, one row per old way, for a spreadsheet or the
 * job file. Export only: the survey is edited in Waymark and travels whole in the board file.
 * Pure: schedule and findings in, CSV text out.
 */
import type { Finding } from '../../shared/rules/types.js';
import type { Schedule } from '../../shared/schemas/schedule.js';
import type { Survey, SurveyWay } from '../../shared/schemas/survey.js';
import { formatCsv, guardFormula } from './csv.js';

type Cell = string | number | boolean | null | undefined;
const cell = (v: Cell): string => (v == null ? '' : typeof v === 'boolean' ? (v ? 'yes' : 'no') : typeof v === 'string' ? guardFormula(v) : String(v));

/** "3 Sockets front (RCBO B32 30 mA; leg 2 via JB1)": one new way as the plan names it. */
function newWays(w: SurveyWay, survey: Survey): string {
  const box = new Map(survey.junctionBoxes.map((b) => [b.id, b.name]));
  return w.targets
    .map((t) => {
      const d = t.device;
      const device =
        d.kind === 'rcbo'
          ? `RCBO ${d.curve ?? ''}${d.rating ?? '?'}${d.residualMa ? ` ${d.residualMa} mA` : ''}`
          : `MCB ${d.curve ?? ''}${d.rating ?? '?'}${d.rcdGroup ? ` behind ${d.rcdGroup}` : ''}`;
      const via = t.legs.filter((l) => l.junctionBoxId).map((l) => `leg ${l.leg} via ${box.get(l.junctionBoxId!) ?? '?'}`);
      return `${t.way}${t.phase ? ` ${t.phase}` : ''} ${t.label} (${[device, ...via].join('; ')})`;
    })
    .join(' | ');
}

function verdict(list: Finding[]): string {
  if (list.some((f) => f.severity === 'error')) return 'fix before changeover';
  if (list.some((f) => f.severity === 'warning')) return 'check';
  return 'ok';
}

const COLUMNS: Array<[string, (w: SurveyWay, s: Survey, f: Finding[]) => Cell]> = [
  ['old_way_id', (w) => w.id],
  ['reference', (w) => w.reference],
  ['feeds', (w) => w.feeds],
  ['identified_by', (w) => w.identifiedBy],
  ['kind', (w) => w.kind],
  ['socket_outlets', (w) => w.socketOutlets],
  ['device', (w) => w.device.kind],
  ['fuse_standard', (w) => w.device.fuseStandard],
  ['rating_a', (w) => w.device.rating],
  ['curve', (w) => w.device.curve],
  ['residual_ma', (w) => w.device.residualMa],
  ['cable_type', (w) => w.cable.type],
  ['live_csa', (w) => w.cable.liveCsa],
  ['cpc_csa', (w) => w.cable.cpcCsa],
  ['length_m', (w) => w.cable.lengthM],
  ['reference_method', (w) => w.cable.referenceMethod],
  ['legs', (w) => w.legs],
  ['ir_test_voltage', (w) => w.readings.insulation.testVoltage],
  ['ir_line_line', (w) => w.readings.insulation.lineLine],
  ['ir_line_earth', (w) => w.readings.insulation.lineEarth],
  ['ir_neutral_earth', (w) => w.readings.insulation.neutralEarth],
  ['r1_plus_r2', (w) => w.readings.r1PlusR2],
  ['r2', (w) => w.readings.r2],
  ['ring_r1', (w) => w.readings.ring.r1],
  ['ring_rn', (w) => w.readings.ring.rn],
  ['ring_r2', (w) => w.readings.ring.r2],
  ['polarity', (w) => w.readings.polarity],
  ['zs', (w) => w.readings.zs],
  ['rcd_trip_ms', (w) => w.device.rcdTrip.atRated],
  ['rcd_trip_5x_ms', (w) => w.device.rcdTrip.atFiveTimes],
  ['action', (w) => w.action],
  ['new_ways', (w, s) => newWays(w, s)],
  ['verdict', (_w, _s, f) => verdict(f)],
  ['findings', (_w, _s, f) => f.map((x) => `${x.severity}: ${x.message} (${x.rule})`).join(' | ')],
  ['notes', (w) => w.notes],
];
export const SURVEY_CSV_COLUMNS = COLUMNS.map(([name]) => name);

/** `GET /api/boards/:id/survey.csv`; null when the board has no survey. */
export function surveyToCsv(schedule: Schedule, findings: Finding[]): string | null {
  const survey = schedule.survey;
  if (!survey) return null;
  const rows = survey.ways.map((w, i) => {
    const mine = findings.filter((f) => f.field?.startsWith(`survey.ways.${i}.`));
    return COLUMNS.map(([, get]) => cell(get(w, survey, mine)));
  });
  return formatCsv([SURVEY_CSV_COLUMNS, ...rows]);
}
