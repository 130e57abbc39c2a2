import { describe, expect, it } from 'vitest';
import { nextInspectionDate } from '../../../shared/rules/index.js';
import { addMonths } from '../../../shared/rules/dates.js';
import { inspectionIntervalMonths } from '../../../shared/rules/bs7671/index.js';
import { installationTypes, scheduleSchema } from '../../../shared/schemas/schedule.js';
import { makeSchedule, withCode } from './fixtures.js';

const board = (b: Parameters<typeof makeSchedule>[0]['board']) => makeSchedule({ board: b });

describe('next periodic inspection date', () => {
  it('when a domestic installation was inspected on 2016-06-01, then the next is 10 years on, 2026-06-01', () => {
    expect(nextInspectionDate(board({ installationType: 'domestic', lastInspectionOn: '2016-06-01' }).board)).toBe('2026-06-01'); // IET Guidance Note 3 Table 3.2: domestic 10 years (found in secondary pages)
  });

  it.each([
    ['rented-domestic', '2027-03-31'], // IET Guidance Note 3 Table 3.2: rented domestic 5 years (found in secondary pages)
    ['hmo', '2027-03-31'], // IET Guidance Note 3 Table 3.2: residential accommodation 5 years (found in secondary pages)
    ['commercial', '2027-03-31'], // IET Guidance Note 3 Table 3.2: commercial 5 years (found in secondary pages)
    ['industrial', '2025-03-31'], // IET Guidance Note 3 Table 3.2: industrial 3 years (found in secondary pages)
    ['caravan', '2025-03-31'], // IET Guidance Note 3 Table 3.2: caravans 3 years (found in secondary pages)
    ['caravan-park', '2023-03-31'], // IET Guidance Note 3 Table 3.2: caravan parks 1 year (from memory)
    ['agricultural', '2025-03-31'], // IET Guidance Note 3 Table 3.2: agricultural and horticultural 3 years (from memory)
    ['swimming-pool', '2023-03-31'], // IET Guidance Note 3 Table 3.2: swimming pools 1 year (from memory)
    ['marina', '2023-03-31'], // IET Guidance Note 3 Table 3.2: marinas 1 year (from memory)
    ['petrol-station', '2023-03-31'], // IET Guidance Note 3 Table 3.2: petrol filling stations 1 year (from memory)
    ['leisure-complex', '2023-03-31'], // IET Guidance Note 3 Table 3.2: leisure complexes, not pools, 1 year (from memory)
    ['special-location', '2023-03-31'], // the old catch-all keeps its 1 year (common practice: the shortest special-location interval)
    ['construction-site', '2022-06-30'], // IET Guidance Note 3 Table 3.2: construction sites 3 months (found in secondary pages)
  ] as const)('when a %s installation was last inspected on 2022-03-31, then the next is %s', (installationType, next) => {
    expect(nextInspectionDate(board({ installationType, lastInspectionOn: '2022-03-31' }).board)).toBe(next);
  });

  it('when agricultural premises are overdue, then the finding names a 3-year interval, not the 1 year of other special locations', () => {
    // IET Guidance Note 3 Table 3.2: agricultural and horticultural 3 years (from memory); last 2023-01-10 → due 2026-01-10
    const [f] = withCode(board({ installationType: 'agricultural', lastInspectionOn: '2023-01-10' }), 'inspection-overdue');
    expect(f.message).toBe('Periodic inspection overdue: it was due on 10 January 2026 (3-year interval)');
    expect(withCode(board({ installationType: 'agricultural', lastInspectionOn: '2024-01-10' }), 'inspection-overdue')).toEqual([]);
  });

  it('when a board saved before the new types says special-location, then it still parses and keeps its 1-year interval', () => {
    const old = scheduleSchema.parse({
      board: { name: 'Pool plant room', installationType: 'special-location', lastInspectionOn: '2025-01-10', supply: { earthing: 'TN-S' } },
      devices: [],
      circuits: [],
    });
    expect(old.board.installationType).toBe('special-location');
    expect(nextInspectionDate(old.board)).toBe('2026-01-10'); // 1 year, as before
  });

  it('when every installation type is listed, then each has an interval of 3 months to 10 years', () => {
    for (const t of installationTypes) {
      expect(inspectionIntervalMonths({ installationType: t, inspectionIntervalMonths: null })).toBeGreaterThanOrEqual(3);
      expect(inspectionIntervalMonths({ installationType: t, inspectionIntervalMonths: null })).toBeLessThanOrEqual(120);
    }
  });

  it('when the board records its own 18-month interval, then that wins, with month ends clamped', () => {
    expect(nextInspectionDate(board({ lastInspectionOn: '2025-08-31', inspectionIntervalMonths: 18 }).board)).toBe('2027-02-28');
  });

  it('when months are added across a leap day, then the date clamps to the month end', () => {
    expect(addMonths('2024-02-29', 12)).toBe('2025-02-28');
    expect(addMonths('2024-01-31', 1)).toBe('2024-02-29');
    expect(addMonths('2024-11-15', 3)).toBe('2025-02-15');
  });

  it('when there is no last inspection but an installation date, then the next is counted from installation', () => {
    const s = board({ lastInspectionOn: null, installedOn: '2024-05-20', installationType: 'domestic' });
    expect(nextInspectionDate(s.board)).toBe('2034-05-20');
    expect(withCode(s, 'no-last-inspection')[0]).toMatchObject({ severity: 'info', field: 'board.lastInspectionOn' });
  });

  it('when neither date is recorded, then no next date and an info finding', () => {
    const s = board({ lastInspectionOn: null, installedOn: null });
    expect(nextInspectionDate(s.board)).toBeNull();
    expect(withCode(s, 'no-last-inspection')[0].message).toContain('cannot be given');
  });
});

describe('inspection findings (today 2026-06-15)', () => {
  it('when the next date has passed, then an overdue warning with the date and interval', () => {
    const [f] = withCode(board({ installationType: 'domestic', lastInspectionOn: '2016-06-01' }), 'inspection-overdue');
    expect(f).toMatchObject({ severity: 'warning', rule: 'IET Guidance Note 3 Table 3.2', field: 'board.lastInspectionOn' });
    expect(f.message).toBe('Periodic inspection overdue: it was due on 1 June 2026 (10-year interval)');
  });

  it('when the next date is within 90 days, then an info that it is due soon; further off, nothing', () => {
    expect(withCode(board({ installationType: 'industrial', lastInspectionOn: '2023-08-01' }), 'inspection-due-soon')).toHaveLength(1); // due 2026-08-01
    const far = board({ installationType: 'industrial', lastInspectionOn: '2024-08-01' });
    expect(withCode(far, 'inspection-due-soon')).toEqual([]);
    expect(withCode(far, 'inspection-overdue')).toEqual([]);
  });

  it('when the last inspection date is after today, then a data warning', () => {
    expect(withCode(board({ lastInspectionOn: '2026-07-01' }), 'last-inspection-in-future')).toHaveLength(1);
  });
});
