/**
 * What each cell of the changeover schedule says about one old way: the way as found (reference,
 * how it was proved, what it feeds, device, cable, readings), the plan (action, new ways with their
 * planned devices and any junction box a leg goes through) and the verdict of its before-you-swap
 * findings. Pure text; the table in `index.ts` fits it.
 */
import { oldWayName } from '../../../../shared/rules/bs7671/changeover.js';
import type { Finding, Severity } from '../../../../shared/rules/types.js';
import type { Cable } from '../../../../shared/schemas/schedule.js';
import type { IdentificationMethod, OldDevice, PlanAction, PlannedDevice, Survey, SurveyWay } from '../../../../shared/schemas/survey.js';
import { BLACK, GREY, RED } from '../../model.js';
import { ohms, type Paragraph } from '../chart/columns.js';

/** One old way with everything its row needs, worked out once. */
export interface WayFacts {
  way: SurveyWay;
  index: number;
  survey: Survey;
  findings: Finding[];
  worst: Severity | null;
}

export interface ChangeoverColumn {
  header: string;
  weight: number;
  maxLines: number;
  /** The column's longest word set in bold, which it must hold unbroken on any page. */
  minWord: string;
  readings?: boolean;
  cell: (f: WayFacts) => Paragraph[];
}

/** Whole numbers stay whole, others keep up to two decimals: "30", "2.5", "0.4". */
const n = (v: number) => String(Math.round(v * 100) / 100);
const bold = (text: string, color?: Paragraph['color']): Paragraph => ({ text, face: 'bold', color });
const plain = (text: string, color?: Paragraph['color']): Paragraph => ({ text, face: 'regular', color });
const capital = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

const PROVED: Record<IdentificationMethod, string> = {
  'fuse-withdrawn': 'proved: fuse withdrawn',
  'breaker-off': 'proved: breaker off',
  traced: 'proved: traced',
  'as-labelled': 'as labelled, not proved',
  'not-found': 'not found',
};
const ACTIONS: Record<PlanAction, string> = { keep: 'Keep', split: 'Split', join: 'Join', retire: 'Retired', spare: 'Spare' };
const CABLES: Record<Cable['type'], string> = { 'twin-earth': 'T&E', swa: 'SWA', 'singles-conduit': 'singles in conduit', flex: 'flex', other: '' };

/** The survey findings of old way `index` (fields `survey.ways.<index>.…`), most serious first as the rules sort them. */
export function findingsOfWay(findings: Finding[], index: number): Finding[] {
  const at = `survey.ways.${index}`;
  return findings.filter((f) => f.field === at || f.field?.startsWith(`${at}.`));
}

const RANK: Record<Severity, number> = { error: 3, warning: 2, info: 1 };

export function worstOf(findings: Finding[]): Severity | null {
  return findings.reduce<Severity | null>((w, f) => (w == null || RANK[f.severity] > RANK[w] ? f.severity : w), null);
}

/** The verdict words: what the electrician must do about this way before the swap. */
export function verdictText(worst: Severity | null): string {
  return worst === 'error' ? 'Fix before changeover' : worst === 'warning' ? 'Check' : 'OK';
}

/** "30 A BS 3036", "MCB B32", "RCBO B16 30 mA", "No device". */
export function oldDeviceText(d: OldDevice): string {
  const rating = d.rating != null ? `${n(d.rating)}` : '';
  if (d.kind === 'none') return 'No device';
  if (d.kind === 'fuse') return capital([rating && `${rating} A`, d.fuseStandard ?? 'fuse'].filter(Boolean).join(' '));
  const breaker = `${d.curve ?? ''}${rating}`;
  return [d.kind === 'rcbo' ? 'RCBO' : 'MCB', breaker, d.kind === 'rcbo' && d.residualMa != null ? `${n(d.residualMa)} mA` : ''].filter(Boolean).join(' ');
}

/** "RCBO B32 30 mA", "MCB B6 on RCD 1": the device a new way is planned to get. */
export function plannedDeviceText(d: PlannedDevice): string {
  const breaker = d.rating != null ? `${d.curve ?? ''}${n(d.rating)}` : 'rating not set';
  if (d.kind === 'rcbo') return ['RCBO', breaker, d.residualMa != null ? `${n(d.residualMa)} mA` : ''].filter(Boolean).join(' ');
  return `MCB ${breaker}${d.rcdGroup ? ` on ${d.rcdGroup}` : ', no RCD'}`;
}

/** "2.5/1.5 mm² T&E". */
export function cableText(c: Cable): string {
  const size = c.liveCsa != null ? `${n(c.liveCsa)}${c.cpcCsa != null ? `/${n(c.cpcCsa)}` : ''} mm²` : 'Size not recorded';
  return [size, CABLES[c.type]].filter(Boolean).join(' ');
}

function deviceCell(f: WayFacts): Paragraph[] {
  const { device, cable, legs } = f.way;
  const detail = [cable.lengthM ? `${n(cable.lengthM)} m` : '', cable.referenceMethod ? `method ${cable.referenceMethod}` : '', legs > 1 ? `${legs} legs` : '']
    .filter(Boolean)
    .join(' · ');
  return [bold(oldDeviceText(device)), plain(cableText(cable)), ...(detail ? [plain(detail, GREY)] : [])];
}

/** Red when an error finding concerns this reading (its field path starts with `prefix`). */
function readingColour(f: WayFacts, prefix: string): Paragraph['color'] {
  const at = `survey.ways.${f.index}.${prefix}`;
  return f.findings.some((x) => x.severity === 'error' && (x.field === at || x.field?.startsWith(`${at}.`))) ? RED : BLACK;
}

/** The readings in short form, one per line; "Not taken" when there are none. */
export function readingLines(f: WayFacts): Paragraph[] {
  const r = f.way.readings;
  const ins = r.insulation;
  const ir = [
    ins.lineLine != null ? `L–L ${n(ins.lineLine)}` : '',
    ins.lineEarth != null ? `L–E ${n(ins.lineEarth)}` : '',
    ins.neutralEarth != null ? `N–E ${n(ins.neutralEarth)}` : '',
  ].filter(Boolean);
  const ring = [r.ring.r1, r.ring.rn, r.ring.r2];
  const trip = f.way.device.rcdTrip;
  const out: Paragraph[] = [];
  const add = (text: string, field: string) => out.push({ text, face: 'regular', color: readingColour(f, field) });
  if (ir.length) add(`IR ${ir.join(' / ')} MΩ${ins.testVoltage ? ` @ ${ins.testVoltage} V` : ''}`, 'readings.insulation');
  if (r.r1PlusR2 != null) add(`R1+R2 ${ohms(r.r1PlusR2)} Ω`, 'readings.r1PlusR2');
  if (ring.some((v) => v != null)) add(`r1/rn/r2 ${ring.map((v) => ohms(v) ?? '–').join('/')} Ω`, 'readings.ring');
  if (r.r2 != null) add(`R2 ${ohms(r.r2)} Ω`, 'readings.r2');
  if (r.zs != null) add(`Zs ${ohms(r.zs)} Ω`, 'readings.zs');
  if (r.polarity) add(`Polarity ${r.polarity}`, 'readings.polarity');
  if (trip.atRated != null || trip.atFiveTimes != null)
    add(`RCD trip ${[trip.atRated, trip.atFiveTimes].map((v) => (v == null ? '–' : n(v))).join(' / ')} ms (IΔn / 5 IΔn)`, 'device.rcdTrip');
  return out.length ? out : [plain('Not taken', GREY)];
}

/** Every new way the old way goes to, with its device, the legs through a junction box and any join. */
export function newWayLines(f: WayFacts): Paragraph[] {
  const { way, survey } = f;
  if (way.action === 'retire') return [bold('Retired'), plain('not connected to the new board', GREY)];
  if (!way.targets.length) return way.action === 'spare' ? [plain('Spare: no new way', GREY)] : [bold('No new way planned', RED)];
  return way.targets.flatMap((t): Paragraph[] => {
    const boxes = t.legs
      .filter((l) => l.junctionBoxId != null)
      .map((l) => {
        const jb = survey.junctionBoxes.find((b) => b.id === l.junctionBoxId);
        return plain(
          jb ? `leg ${l.leg} via ${jb.name}${jb.location ? ` ${jb.location}` : ''}` : `leg ${l.leg} via an unlisted junction box (${l.junctionBoxId})`,
        );
      });
    const joined = survey.ways.filter((o) => o !== way && o.targets.some((x) => x.circuitId === t.circuitId)).map((o) => o.reference);
    return [
      bold(`Way ${t.way}${t.phase ? ` ${t.phase}` : ''} ${t.label} · ${plannedDeviceText(t.device)}`),
      ...boxes,
      ...(joined.length ? [plain(`joined with old ${joined.join(', ')}`, GREY)] : []),
    ];
  });
}

function verdictCell(f: WayFacts): Paragraph[] {
  const text = verdictText(f.worst);
  const count = f.findings.filter((x) => x.severity !== 'info').length;
  return [bold(text, f.worst === 'error' ? RED : BLACK), ...(count ? [plain(`${count} finding${count === 1 ? '' : 's'} below`, GREY)] : [])];
}

/** Column order and relative widths. */
export const changeoverColumns: ChangeoverColumn[] = [
  {
    header: 'Old way',
    weight: 11,
    maxLines: 4,
    minWord: 'withdrawn',
    cell: (f) => [bold(f.way.reference), ...(f.way.identifiedBy ? [plain(PROVED[f.way.identifiedBy], GREY)] : [])],
  },
  { header: 'Feeds', weight: 16, maxLines: 6, minWord: 'kitchen-diner', cell: (f) => (f.way.feeds ? [plain(f.way.feeds)] : [plain('Not recorded', GREY)]) },
  { header: 'Old device · cable', weight: 13, maxLines: 5, minWord: '2.5/1.5 mm²', cell: deviceCell },
  { header: 'Readings as found', weight: 17, maxLines: 9, minWord: '0.74/0.75/1.24 Ω', readings: true, cell: readingLines },
  { header: 'Action', weight: 7, maxLines: 2, minWord: 'Retired', cell: (f) => [f.way.action ? bold(ACTIONS[f.way.action]) : bold('Not planned', RED)] },
  { header: 'New way(s) · planned device', weight: 23, maxLines: 14, minWord: 'kitchen-diner', cell: newWayLines },
  { header: 'Verdict', weight: 11, maxLines: 4, minWord: 'changeover', cell: verdictCell },
];

/** The detail under a row: the way's findings (each message without the "Old …:" opening the row already shows), then its notes. */
export function detailLines(f: WayFacts): Paragraph[] {
  const opening = `${oldWayName(f.way)}: `;
  const findings = f.findings.map((x): Paragraph => {
    const message = x.message.startsWith(opening) ? x.message.slice(opening.length) : x.message;
    const lead = x.severity === 'error' ? 'Fix' : x.severity === 'warning' ? 'Check' : 'Note';
    return {
      text: `${lead}: ${capital(message)}`,
      face: x.severity === 'error' ? 'bold' : 'regular',
      color: x.severity === 'error' ? RED : x.severity === 'info' ? GREY : BLACK,
    };
  });
  return [...findings, ...(f.way.notes ? [plain(`Notes: ${f.way.notes}`, GREY)] : [])];
}
