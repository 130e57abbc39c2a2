import { describe, expect, it } from 'vitest';
import { formatDateTime, formatDay, formatDaysInText } from '../../../src/components/app/format.js';

describe('dates in the signed-in app', () => {
  it('when a calendar day is shown, then it reads day, short month, year, like the date-and-time format', () => {
    expect(formatDay('2027-06-01')).toBe('1 Jun 2027'); // en-GB medium date style // common practice
    expect(formatDay('2025-12-31')).toBe('31 Dec 2025');
    // The same words as the app's date-and-time format, which comes from the browser's own en-GB rules.
    expect(formatDateTime('2027-06-01T12:00:00Z')).toContain('Jun 2027');
  });

  it('when a value is not a calendar day, then it is shown as it came', () => {
    expect(formatDay('2027-13-01')).toBe('2027-13-01');
    expect(formatDay('soon')).toBe('soon');
  });

  it('when a revision diff names days, then each is written as the rest of the app writes it', () => {
    expect(formatDaysInText('last inspection 2025-06-01 → 2027-06-01; way 7 renamed Garage')).toBe(
      'last inspection 1 Jun 2025 → 1 Jun 2027; way 7 renamed Garage',
    );
  });

  it('when text holds something date-like inside a longer word, then it is left alone', () => {
    expect(formatDaysInText('board WM-2027-06-01X and 12027-06-01')).toBe('board WM-2027-06-01X and 12027-06-01');
  });
});
