/**
 * The circuit CSV (documented in DEVELOPERS.md, "Circuit CSV"): one row per circuit, one column
 * per circuit field. Pure: schedule → CSV text, and CSV text + current circuits → new circuits or
 * the list of `rows.<n>.<column>` at fault.
 */
import { circuitSchema, type Circuit } from '../../shared/schemas/schedule.js';
import { CsvSyntaxError, formatCsv, guardFormula, parseCsv, unguardFormula } from './csv.js';

type CellKind = 'text' | 'number' | 'boolean' | 'list' | 'choice';
interface Column {
  name: string;
  path: string[];
  kind: CellKind;
}

const col = (name: string, path: string, kind: CellKind): Column => ({ name, path: path.split('.'), kind });

/**
 * The columns, in the order the export writes them. Only `way` and `label` are required in a file, so files
 * written before a column existed (e.g. the installation conditions) still import and keep those values.
 */
export const CIRCUIT_CSV_COLUMNS: Column[] = [
  col('id', 'id', 'choice'),
  col('way', 'way', 'number'),
  col('phase', 'phase', 'choice'),
  col('device_id', 'deviceId', 'choice'),
  col('label', 'label', 'text'),
  col('description', 'description', 'text'),
  col('kind', 'kind', 'choice'),
  // Design current Ib (A), for Ib ≤ In ≤ Iz and the voltage drop; blank = not recorded (the device rating stands in).
  col('design_current', 'designCurrent', 'number'),
  col('socket_outlets', 'socketOutlets', 'boolean'),
  col('concealed_in_wall', 'concealedInWall', 'boolean'),
  col('cable_type', 'cable.type', 'choice'),
  col('live_csa', 'cable.liveCsa', 'number'),
  col('cpc_csa', 'cable.cpcCsa', 'number'),
  col('reference_method', 'cable.referenceMethod', 'choice'),
  col('length_m', 'cable.lengthM', 'number'),
  col('diameter_mm', 'cable.diameterMm', 'number'),
  col('ambient_c', 'cable.ambientC', 'number'),
  col('grouped_with', 'cable.groupedWith', 'number'),
  col('insulated_length_mm', 'cable.insulatedLengthMm', 'number'),
  col('points', 'points', 'number'),
  col('locations', 'locations', 'list'),
  col('previous_reference', 'previousReference', 'text'),
  col('measured_zs', 'measuredZs', 'number'),
  col('zs_at_ambient', 'zsAtAmbient', 'boolean'),
  col('legs', 'legs', 'number'),
  col('notes', 'notes', 'text'),
  col('notes_public', 'notesPublic', 'boolean'),
  col('feeds_board_id', 'feedsBoardId', 'number'),
  // Test readings on the new circuit (Zs stays in measured_zs): MΩ for insulation, Ω for the rest.
  col('ir_test_voltage', 'readings.insulation.testVoltage', 'number'),
  col('ir_line_line', 'readings.insulation.lineLine', 'number'),
  col('ir_line_earth', 'readings.insulation.lineEarth', 'number'),
  col('ir_neutral_earth', 'readings.insulation.neutralEarth', 'number'),
  col('r1_plus_r2', 'readings.r1PlusR2', 'number'),
  col('r2', 'readings.r2', 'number'),
  col('ring_r1', 'readings.ring.r1', 'number'),
  col('ring_rn', 'readings.ring.rn', 'number'),
  col('ring_r2', 'readings.ring.r2', 'number'),
  col('polarity', 'readings.polarity', 'choice'),
];
const READING_COLUMNS = CIRCUIT_CSV_COLUMNS.filter((c) => c.path[0] === 'readings');
const REQUIRED = ['way', 'label'];
const BY_NAME = new Map(CIRCUIT_CSV_COLUMNS.map((c) => [c.name, c]));
/** Separates the locations inside one cell: "Kitchen; Utility". */
export const LOCATION_SEPARATOR = ';';

/** A loose object being built from CSV cells, checked by the circuit schema once complete. */
type Loose = Record<string, unknown>;

function getPath(obj: Loose, path: string[]): unknown {
  return path.reduce<unknown>((o, k) => (o == null ? undefined : (o as Loose)[k]), obj);
}
function setPath(obj: Loose, path: string[], value: unknown): void {
  let o = obj;
  for (const k of path.slice(0, -1)) o = (o[k] ??= {}) as Loose;
  o[path[path.length - 1]] = value;
}

function cellOf(c: Column, value: unknown): string {
  if (value == null) return '';
  if (c.kind === 'boolean') return value ? 'yes' : 'no';
  if (c.kind === 'list') return (value as string[]).map(guardFormula).join(`${LOCATION_SEPARATOR} `);
  if (c.kind === 'text') return guardFormula(String(value));
  return String(value);
}

/** `GET /api/boards/:id/circuits.csv`: every circuit, in the schedule's order, every column. */
export function circuitsToCsv(circuits: Circuit[]): string {
  const rows = circuits.map((circuit) => CIRCUIT_CSV_COLUMNS.map((c) => cellOf(c, getPath(circuit, c.path))));
  return formatCsv([CIRCUIT_CSV_COLUMNS.map((c) => c.name), ...rows]);
}

const TRUE = new Set(['yes', 'y', 'true', '1']);
const FALSE = new Set(['no', 'n', 'false', '0']);

/** A cell as the schema's input; an empty cell means "the default"; a cell that cannot convert goes through as text for the schema to refuse. */
function valueOf(c: Column, raw: string): unknown {
  const cell = raw.trim();
  if (cell === '') return c.kind === 'list' ? [] : undefined;
  switch (c.kind) {
    case 'number': {
      const n = cell.replace(/^(\d+),(\d+)$/, '$1.$2');
      return /^-?\d+(\.\d+)?$/.test(n) ? Number(n) : cell;
    }
    case 'boolean':
      return TRUE.has(cell.toLowerCase()) ? true : FALSE.has(cell.toLowerCase()) ? false : cell;
    case 'list':
      return cell
        .split(LOCATION_SEPARATOR)
        .map((s) => unguardFormula(s.trim()))
        .filter(Boolean);
    case 'text':
      return unguardFormula(cell);
    default:
      return cell;
  }
}

export type CsvResult = { ok: true; circuits: Circuit[]; rowOf: number[] } | { ok: false; fields: Record<string, string> };

function readHeader(header: string[]): { columns: Column[]; fields: Record<string, string> } {
  const fields: Record<string, string> = {};
  const seen = new Set<string>();
  const columns = header.map((h) => {
    const name = h.trim().toLowerCase();
    const c = BY_NAME.get(name);
    if (!c) fields[`header.${name || '(blank)'}`] = `Unknown column; the columns are ${CIRCUIT_CSV_COLUMNS.map((x) => x.name).join(', ')}`;
    else if (seen.has(name)) fields[`header.${name}`] = 'Column given twice';
    seen.add(name);
    return c!;
  });
  for (const r of REQUIRED) if (!seen.has(r)) fields[`header.${r}`] = 'Missing column';
  return { columns, fields };
}

/** An id for a new circuit: "w7", "w7-L2", with a suffix if that is taken. */
function newCircuitId(way: unknown, phase: unknown, isTaken: (id: string) => boolean): string {
  const base = `w${typeof way === 'number' ? way : 'x'}${typeof phase === 'string' && phase ? `-${phase}` : ''}`;
  let id = base;
  for (let n = 2; isTaken(id); n++) id = `${base}-${n}`;
  return id;
}

/** The current circuits, looked up by id and by way and phase, and the ids already given out. */
interface Matching {
  byId: Map<string, Circuit>;
  byWay: Map<string, Circuit>;
  taken: Set<string>;
}

/** One data row as a checked circuit, or its faults keyed by column name. */
function readRow(columns: Column[], cells: string[], m: Matching): { circuit: Circuit } | { faults: Record<string, string> } {
  const input: Loose = {};
  columns.forEach((c, i) => setPath(input, c.path, valueOf(c, cells[i])));
  const match = (typeof input.id === 'string' ? m.byId.get(input.id) : undefined) ?? m.byWay.get(`${input.way}/${input.phase ?? ''}`);
  const merged: Loose = match ? (structuredClone(match) as unknown as Loose) : {};
  for (const c of columns) if (!(c.name === 'id' && input.id === undefined && match)) setPath(merged, c.path, getPath(input, c.path));
  // A circuit with no reading in the file or before keeps no readings record, as the editor leaves it.
  if (READING_COLUMNS.every((c) => getPath(merged, c.path) == null) && match?.readings == null) delete merged.readings;
  // Ib is optional: a blank cell clears it, and a circuit that never had one stays as it was (absent or null), so a re-import changes nothing.
  if (merged.designCurrent == null) {
    if (match?.designCurrent === null) merged.designCurrent = null;
    else delete merged.designCurrent;
  }
  // A second row on a matched way (without an id of its own) is a new circuit, not the same one twice.
  if (merged.id === undefined || (!input.id && m.taken.has(String(merged.id)))) {
    merged.id = newCircuitId(merged.way as number, merged.phase as Circuit['phase'], (id) => m.taken.has(id) || m.byId.has(id));
  }
  const parsed = circuitSchema.safeParse(merged);
  if (parsed.success) return { circuit: parsed.data };
  const faults: Record<string, string> = {};
  for (const issue of parsed.error.issues) {
    const column = CIRCUIT_CSV_COLUMNS.find((c) => c.path.every((k, i) => issue.path[i] === k))?.name ?? String(issue.path[0] ?? 'row');
    faults[column] ??= issue.message;
  }
  return { faults };
}

/**
 * Reads a circuit CSV against the board's current circuits. The file is the board's whole circuit
 * list: a row matches an existing circuit by `id`, else by way and phase, and keeps that circuit's
 * values for columns the file leaves out; circuits not in the file are removed. Any bad cell fails
 * the whole file, every fault listed as `rows.<n>.<column>` (n = the spreadsheet row, header = 1).
 */
export function circuitsFromCsv(text: string, current: Circuit[]): CsvResult {
  let records: string[][];
  try {
    records = parseCsv(text);
  } catch (err) {
    if (err instanceof CsvSyntaxError) return { ok: false, fields: { [`rows.${err.row}`]: err.message } };
    throw err;
  }
  if (!records.length) return { ok: false, fields: { header: 'The file is empty' } };
  const { columns, fields } = readHeader(records[0]);
  if (Object.keys(fields).length) return { ok: false, fields };
  const m: Matching = { byId: new Map(current.map((c) => [c.id, c])), byWay: new Map(current.map((c) => [`${c.way}/${c.phase ?? ''}`, c])), taken: new Set() };
  const firstRowOfId = new Map<string, number>();
  const circuits: Circuit[] = [];
  const rowOf: number[] = [];
  records.forEach((cells, index) => {
    const row = index + 1;
    if (index === 0 || cells.every((c) => c.trim() === '')) return;
    if (cells.length !== columns.length) {
      fields[`rows.${row}`] = `Has ${cells.length} cells; the header has ${columns.length}`;
      return;
    }
    const result = readRow(columns, cells, m);
    if ('faults' in result) {
      for (const [column, message] of Object.entries(result.faults)) fields[`rows.${row}.${column}`] = message;
      return;
    }
    const seenAt = firstRowOfId.get(result.circuit.id);
    if (seenAt) {
      fields[`rows.${row}.id`] = `The same circuit as row ${seenAt}`;
      return;
    }
    firstRowOfId.set(result.circuit.id, row);
    m.taken.add(result.circuit.id);
    circuits.push(result.circuit);
    rowOf.push(row);
  });
  if (circuits.length > 2000) fields.rows = 'At most 2000 circuits';
  return Object.keys(fields).length ? { ok: false, fields } : { ok: true, circuits, rowOf };
}
