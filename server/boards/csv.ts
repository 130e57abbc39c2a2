/**
 * RFC 4180 CSV, small and strict enough for spreadsheets: commas, double-quoted fields with
 * doubled quotes inside, CRLF or LF line ends, line breaks inside quoted fields. Pure functions.
 */

/** A cell that cannot be read as CSV, with the spreadsheet row it is on (the first line is row 1). */
export class CsvSyntaxError extends Error {
  constructor(readonly row: number, message: string) {
    super(message);
  }
}

/** Splits CSV text into records of cells. A byte-order mark at the start is dropped. */
export function parseCsv(text: string): string[][] {
  const src = text.charCodeAt(0) === 0xfeff ? text.slice(1) : text;
  const records: string[][] = [];
  let record: string[] = [];
  const special = /[",\r\n]/g;
  let i = 0;
  let cell = '';
  while (i <= src.length) {
    special.lastIndex = i;
    const m = special.exec(src);
    const end = m ? m.index : src.length;
    cell += src.slice(i, end);
    if (!m) { if (cell !== '' || record.length) { record.push(cell); records.push(record); } break; }
    const ch = m[0];
    if (ch === '"') {
      if (cell !== '') throw new CsvSyntaxError(records.length + 1, 'A quote inside an unquoted cell: put the whole cell in quotes and double the quote');
      const closed = readQuoted(src, end + 1);
      if (!closed) throw new CsvSyntaxError(records.length + 1, 'A quoted cell is never closed');
      cell = closed.value;
      i = closed.next;
      if (i < src.length && !/[,\r\n]/.test(src[i])) throw new CsvSyntaxError(records.length + 1, 'Text after a closing quote: put the whole cell in quotes');
      continue;
    }
    record.push(cell);
    cell = '';
    if (ch === ',') { i = end + 1; continue; }
    records.push(record);
    record = [];
    i = ch === '\r' && src[end + 1] === '\n' ? end + 2 : end + 1;
    if (i >= src.length) break;
  }
  return records;
}

/** A quoted cell's text from just after its opening quote; null when it never closes. */
function readQuoted(src: string, from: number): { value: string; next: number } | null {
  let value = '';
  let i = from;
  for (;;) {
    const q = src.indexOf('"', i);
    if (q < 0) return null;
    value += src.slice(i, q);
    if (src[q + 1] === '"') { value += '"'; i = q + 2; continue; }
    return { value, next: q + 1 };
  }
}

/** Writes records as CSV with CRLF line ends, quoting only the cells that need it. */
export function formatCsv(records: string[][]): string {
  const quote = (cell: string) => (/[",\r\n]|^\s|\s$/.test(cell) ? `"${cell.replace(/"/g, '""')}"` : cell);
  return records.map((r) => r.map(quote).join(',')).join('\r\n') + '\r\n';
}

/**
 * Spreadsheets run a cell that starts with = + - @ as a formula. On export such text gets a
 * leading apostrophe (which spreadsheets show as plain text); on import the apostrophe is removed.
 */
export function guardFormula(text: string): string {
  return /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
}
export function unguardFormula(text: string): string {
  return /^'[=+\-@\t\r]/.test(text) ? text.slice(1) : text;
}
