/** The warnings header stays under its length, even when one warning alone is longer (a list of hundreds of ways). */
import { describe, expect, it } from 'vitest';
import { warningsHeader } from '../../../server/print/routes.js';

describe('warnings header', () => {
  it('when one warning is 30 KB, then the header is under 6000 characters and says where the warnings are', () => {
    const ways = Array.from({ length: 2000 }, (_, i) => `way ${i + 1}`).join(', ');
    const header = warningsHeader([{ code: 'long', message: `These ways have no label: ${ways}` }]);
    expect(header.length).toBeLessThanOrEqual(6000);
    const decoded = JSON.parse(decodeURIComponent(header)) as Array<{ code: string; message: string }>;
    expect(decoded).toEqual([{ code: 'more-warnings', message: expect.stringContaining('see the warnings list') }]);
  });

  it('when the warnings are short, then all of them are in the header', () => {
    const warnings = [
      { code: 'a', message: 'First' },
      { code: 'b', message: 'Second' },
    ];
    expect(JSON.parse(decodeURIComponent(warningsHeader(warnings)))).toEqual(warnings);
  });
});
