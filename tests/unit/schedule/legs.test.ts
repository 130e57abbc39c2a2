import { describe, expect, it } from 'vitest';
import { defaultLegs, legsAfterKindChange } from '../../../shared/schedule/legs.js';

describe('cable legs following the circuit kind', () => {
  it('when a ring final is made a radial, then its two legs become one, so one flag prints', () => {
    // A ring final circuit has both ends of its cable at the board // common practice
    expect(defaultLegs('ring')).toBe(2);
    expect(legsAfterKindChange('ring', 'radial', 2)).toBe(1);
    expect(legsAfterKindChange('ring', 'lighting', 2)).toBe(1);
  });

  it('when a radial is made a ring, then it gets two legs', () => {
    expect(legsAfterKindChange('radial', 'ring', 1)).toBe(2);
    expect(legsAfterKindChange('other', 'ring', 1)).toBe(2);
  });

  it('when the legs were set by hand, then a change of kind keeps them', () => {
    expect(legsAfterKindChange('ring', 'radial', 3)).toBe(3);
    expect(legsAfterKindChange('radial', 'ring', 2)).toBe(2);
    expect(legsAfterKindChange('lighting', 'radial', 2)).toBe(2);
  });

  it('when the kind changes between two one-leg kinds, then one leg stays', () => {
    expect(legsAfterKindChange('radial', 'cooker', 1)).toBe(1);
  });
});
