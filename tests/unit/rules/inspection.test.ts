import { describe, expect, it } from 'vitest';
import { nextInspectionDate } from '../../../shared/rules/index.js';
import { addMonths } from '../../../shared/rules/dates.js';
import { makeSchedule, withCode } from './fixtures.js';

const board = (b: Parameters<typeof makeSchedule>[0]['board']) => makeSchedule({ board: b });

describe('next periodic inspection date', () => {
  it('when a domestic installation was inspected on 2016-06-01, then the next is 10 years on, 2026-06-01', () => {
    expect(nextInspectionDate(board({ installationType: 'domestic', lastInspectionOn: '2016-06-01' }).board)).toBe('2026-06-01'); // IET Guidance Note 3: domestic 10 years
  });

  it.each([
    ['rented-domestic', '2027-03-31'], // IET Guidance Note 3: rented domestic 5 years
    ['hmo', '2027-03-31'], // IET Guidance Note 3: HMO 5 years
    ['commercial', '2027-03-31'], // IET Guidance Note 3: commercial 5 years
    ['industrial', '2025-03-31'], // IET Guidance Note 3: industrial 3 years
    ['caravan', '2025-03-31'], // IET Guidance Note 3: caravans 3 years
    ['special-location', '2023-03-31'], // IET Guidance Note 3: swimming pools, marinas… 1 year
    ['construction-site', '2022-06-30'], // IET Guidance Note 3: construction sites 3 months
  ] as const)('when a %s installation was last inspected on 2022-03-31, then the next is %s', (installationType, next) => {
    expect(nextInspectionDate(board({ installationType, lastInspectionOn: '2022-03-31' }).board)).toBe(next);
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
    expect(f).toMatchObject({ severity: 'warning', rule: 'IET Guidance Note 3', field: 'board.lastInspectionOn' });
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
