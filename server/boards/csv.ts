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
  let cell = '';
  let quoted = false;
  let i = 0;
  const endCell = () => { record.push(cell); cell = ''; };
  const endRecord = () => { endCell(); records.push(record); record = []; };
  while (i < src.length) {
    const ch = src[i];
    if (quoted) {
      if (ch === '"' && src[i + 1] === '"') { cell += '"'; i += 2; continue; }
      if (ch === '"') { quoted = false; i++; continue; }
      cell += ch; i++; continue;
    }
    if (ch === '"') {
      if (cell !== '') throw new CsvSyntaxError(records.length + 1, 'A quote inside an unquoted cell: put the whole cell in quotes and double the quote');
      quoted = true; i++; continue;
    }
    if (ch === ',') { endCell(); i++; continue; }
    if (ch === '\r' && src[i + 1] === '\n') { endRecord(); i += 2; continue; }
    if (ch === '\n' || ch === '\r') { endRecord(); i++; continue; }
    cell += ch; i++;
  }
  if (quoted) throw new CsvSyntaxError(records.length + 1, 'A quoted cell is never closed');
  if (cell !== '' || record.length) endRecord();
  return records;
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
