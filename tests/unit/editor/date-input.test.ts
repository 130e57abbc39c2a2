import { describe, expect, it } from 'vitest';
import { parseDay } from '../../../src/components/app/format.js';

describe('reading a date typed the UK way', () => {
  it('when a day is typed day first with slashes, then it is that day, never month first', () => {
    expect(parseDay('02/12/2026')).toBe('2026-12-02'); // UK dates are day/month/year // common practice
    expect(parseDay('2/12/2026')).toBe('2026-12-02');
    expect(parseDay('12/2/2026')).toBe('2026-02-12');
    expect(parseDay(' 2.12.2026 ')).toBe('2026-12-02');
    expect(parseDay('2-12-2026')).toBe('2026-12-02');
    expect(parseDay('2/12/26')).toBe('2026-12-02');
  });

  it('when the month is written in words, then short, long and "Sept" forms are read, any case', () => {
    expect(parseDay('2 Dec 2026')).toBe('2026-12-02');
    expect(parseDay('2 december 2026')).toBe('2026-12-02');
    expect(parseDay('2nd Dec, 2026')).toBe('2026-12-02');
    expect(parseDay('14 Sept 2026')).toBe('2026-09-14');
    expect(parseDay('14 SEP 2026')).toBe('2026-09-14');
    expect(parseDay('1 Jun 27')).toBe('2027-06-01');
  });

  it('when an ISO date is typed, then it is kept as it is', () => {
    expect(parseDay('2026-12-02')).toBe('2026-12-02');
    expect(parseDay('2026-2-9')).toBe('2026-02-09');
  });

  it('when the day does not exist in that month, then it is refused, not moved to another day', () => {
    expect(parseDay('31/02/2026')).toBeNull();
    expect(parseDay('29/02/2026')).toBeNull(); // 2026 is not a leap year
    expect(parseDay('29/02/2028')).toBe('2028-02-29'); // 2028 is
    expect(parseDay('31/04/2026')).toBeNull();
    expect(parseDay('2026-13-01')).toBeNull();
    expect(parseDay('0/12/2026')).toBeNull();
    expect(parseDay('32 Dec 2026')).toBeNull();
  });

  it('when the text is not a date, then it is refused', () => {
    for (const text of ['', 'soon', '02/12', '2 Decimal 2026', '2 De 2026', '12/2026', '2/12/202', '02122026', '2 Dec 2026 10:00']) {
      expect(parseDay(text), text).toBeNull();
    }
  });
});
