import { describe, expect, it } from 'vitest';
import { wayNamedIn } from '../../../shared/schemas/reports.js';

describe('the way a stored report names', () => {
  it("when the message leads with a way, in the server's words or the visitor's, then that way is read back; otherwise none", () => {
    expect(wayNamedIn('Way 3: feeds the shed')).toBe('3');
    expect(wayNamedIn('way 4 l2 is the compressor')).toBe('4 L2');
    expect(wayNamedIn('  WAY 07 is the hob')).toBe('7');
    expect(wayNamedIn('The porch light is on no way I can find')).toBeNull();
    expect(wayNamedIn('Wayside lights are wrong')).toBeNull();
  });
});
