/**
 * RFC 4180 CSV through csv-parse and csv-stringify: commas, double-quoted fields with doubled
 * quotes inside, CRLF or LF line ends, line breaks inside quoted fields. Pure functions; what is
 * ours is the error wording (by spreadsheet row) and the formula guard.
 */
import { parse } from 'csv-parse/sync';
import { stringify } from 'csv-stringify/sync';

/** A cell that cannot be read as CSV, with the spreadsheet row it is on (the first line is row 1). */
export class CsvSyntaxError extends Error {
  constructor(
    readonly row: number,
    message: string,
  ) {
    super(message);
  }
}

/** What each of the reader's errors means to someone holding a spreadsheet. */
const MESSAGES: Record<string, string> = {
  INVALID_OPENING_QUOTE: 'A quote inside an unquoted cell: put the whole cell in quotes and double the quote',
  CSV_INVALID_OPENING_QUOTE: 'A quote inside an unquoted cell: put the whole cell in quotes and double the quote',
  CSV_QUOTE_NOT_CLOSED: 'A quoted cell is never closed',
  CSV_INVALID_CLOSING_QUOTE: 'Text after a closing quote: put the whole cell in quotes',
};

/**
 * Splits CSV text into records of cells (csv-parse, RFC 4180). A byte-order mark at the start is
 * dropped; rows may have fewer or more cells than the header, for the caller to judge by column.
 */
export function parseCsv(text: string): string[][] {
  try {
    return parse(text, { bom: true, relax_column_count: true }) as string[][];
  } catch (err) {
    const e = err as { code?: string; records?: number; message?: string };
    if (e.code && typeof e.records === 'number') throw new CsvSyntaxError(e.records + 1, MESSAGES[e.code] ?? `Not readable as CSV: ${e.message ?? e.code}`);
    throw err;
  }
}

/**
 * Writes records as CSV with CRLF line ends (csv-stringify), quoting the cells that need it and
 * those with a line break or leading or trailing space, so a spreadsheet keeps them as written.
 */
export function formatCsv(records: string[][]): string {
  return stringify(records, { record_delimiter: 'windows', quoted_match: /^\s|\s$|[\r\n]/ });
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
