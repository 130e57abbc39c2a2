import { describe, expect, it } from 'vitest';
import { CsvSyntaxError, formatCsv, guardFormula, parseCsv, unguardFormula } from '../../server/boards/csv.js';
import { circuitsFromCsv, circuitsToCsv } from '../../server/boards/circuit-csv.js';
import { makeSchedule } from '../helpers/boards.js';

describe('CSV reading and writing (RFC 4180)', () => {
  it.each([
    [
      'CRLF line ends',
      'a,b\r\nc,d\r\n',
      [
        ['a', 'b'],
        ['c', 'd'],
      ],
    ], // RFC 4180 §2.1
    [
      'no line end after the last record',
      'a,b\nc,d',
      [
        ['a', 'b'],
        ['c', 'd'],
      ],
    ], // RFC 4180 §2.2
    ['empty cells', 'a,,\n', [['a', '', '']]],
    ['commas and doubled quotes inside quotes', '"x, y","he said ""hi""",z\n', [['x, y', 'he said "hi"', 'z']]], // RFC 4180 §2.6, §2.7
    ['a line break inside quotes', '"line1\nline2",b\n', [['line1\nline2', 'b']]], // RFC 4180 §2.6
    [
      'a byte-order mark',
      '\ufeffway,label\n1,A',
      [
        ['way', 'label'],
        ['1', 'A'],
      ],
    ],
    ['an empty quoted cell', 'a,""\n', [['a', '']]],
    ['old Mac line ends', 'a\rb\r', [['a'], ['b']]],
  ])('when the text has %s, then the cells come out right', (_name, text, records) => {
    expect(parseCsv(text)).toEqual(records);
  });

  it.each([
    ['a"b\n', /quote inside an unquoted cell/],
    ['a,b\n"open\n', /never closed/],
    ['"a"b,c\n', /after a closing quote/],
  ])('when the text is %j, then a syntax error names the row', (text, message) => {
    expect(() => parseCsv(text)).toThrow(message);
    try {
      parseCsv(text);
    } catch (err) {
      expect((err as CsvSyntaxError).row).toBe(text.startsWith('a,b') ? 2 : 1);
    }
  });

  it('when awkward cells are written and read back, then they are unchanged', () => {
    const records = [['plain', ' leading space', 'q"q', 'x,y', 'two\nlines', '', 'Ω ² é']];
    expect(parseCsv(formatCsv(records))).toEqual(records);
  });

  it('when text looks like a formula, then export guards it and import removes the guard', () => {
    for (const text of ['=1+1', '+44 1632', '-x', '@SUM(A1)']) {
      expect(guardFormula(text)).toBe(`'${text}`);
      expect(unguardFormula(guardFormula(text))).toBe(text);
    }
    expect(guardFormula('Kitchen')).toBe('Kitchen');
    expect(unguardFormula("'quoted")).toBe("'quoted");
  });
});

describe('circuits as CSV', () => {
  it('when 1000 circuits go out and back in, then they are identical', () => {
    const { circuits } = makeSchedule(1000);
    const result = circuitsFromCsv(circuitsToCsv(circuits), circuits);
    expect(result.ok && result.circuits).toEqual(circuits);
  });

  it("when a TT circuit's Zs is in the thousands of ohms, then it goes out and back in; over the 2000 Ω cap the row is refused", () => {
    const { circuits } = makeSchedule(2);
    circuits[0].measuredZs = 1650.5; // a TT reading within 1667 Ω, BS 7671:2018+A2 Table 41.5 for 30 mA (from memory)
    const csv = circuitsToCsv(circuits);
    expect(csv).toContain(',1650.5,');
    const back = circuitsFromCsv(csv, circuits);
    expect(back.ok && back.circuits[0].measuredZs).toBe(1650.5);
    expect(circuitsFromCsv('way,label,measured_zs\n1,A,1999\n2,B,2500\n', circuits)).toEqual({
      ok: false,
      fields: { 'rows.3.measured_zs': 'Zs is at most 2000 Ω: check the decimal point' },
    });
  });

  it('when a file holds a circuit twice by id, an unknown column or a missing required one, then each is listed', () => {
    const { circuits } = makeSchedule(2);
    expect(circuitsFromCsv('id,way,label\nc1,1,A\nc1,2,B\n', circuits)).toEqual({ ok: false, fields: { 'rows.3.id': 'The same circuit as row 2' } });
    const header = circuitsFromCsv('way,colour\n1,red\n', circuits);
    expect(header.ok).toBe(false);
    expect(Object.keys(header.ok ? {} : header.fields).sort()).toEqual(['header.colour', 'header.label']);
    expect(circuitsFromCsv('', circuits)).toEqual({ ok: false, fields: { header: 'The file is empty' } });
  });
});
