import { describe, expect, it } from 'vitest';
import { deviceChoiceText, devicePickerText, deviceRatingText, ordinal } from '../../../src/components/board/deviceText.js';
import { deviceSchema } from '../../../shared/schemas/schedule.js';

const device = (extra: Record<string, unknown>) => deviceSchema.parse({ id: 'd1', row: 1, kind: 'mcb', modules: 1, ...extra });

describe('how the editor names a device', () => {
  it('when a device labelled "Spare" is a B16, then its name still says B16', () => {
    // B16: curve letter then rated current, as written on the device // BS EN 60898-1 marking, common practice
    expect(deviceChoiceText(device({ label: 'Spare', curve: 'B', rating: 16 }))).toBe('Spare (B16)');
  });

  it('when a labelled RCBO is named, then kind, curve, rating and residual current are all shown', () => {
    expect(deviceRatingText(device({ kind: 'rcbo', curve: 'B', rating: 16, residualMa: 30 }))).toBe('RCBO B16 30 mA'); // 30 mA: BS 7671:2018+A2 411.3.3
    expect(deviceChoiceText(device({ kind: 'rcbo', label: 'Spare', curve: 'B', rating: 16, residualMa: 30 }))).toBe('Spare (RCBO B16 30 mA)');
  });

  it('when a device has no label, then its rating alone names it', () => {
    expect(deviceChoiceText(device({ curve: 'C', rating: 32 }))).toBe('C32'); // common practice
  });

  it('when the label already carries the rating, then it is not repeated', () => {
    expect(deviceChoiceText(device({ label: 'B32 cooker', curve: 'B', rating: 32 }))).toBe('B32 cooker');
  });

  it('when a device has neither label nor rating, then the kind names it', () => {
    expect(deviceChoiceText(device({ kind: 'blank' }), 'Blank')).toBe('Blank');
  });
});

describe('naming a device in the circuit table’s picker', () => {
  const row = [
    device({ id: 'main', kind: 'main-switch', modules: 2, rating: 100 }),
    device({ id: 'a', curve: 'B', rating: 32 }),
    device({ id: 'b', curve: 'B', rating: 32 }),
    device({ id: 'c', curve: 'B', rating: 32, label: 'Garage' }),
    device({ id: 'r2', row: 2, curve: 'B', rating: 32 }),
  ];

  it('when three B32s sit on one row, then each is named by its place from the left, the main switch counted', () => {
    const names = row.map((d) => devicePickerText(d, row));
    expect(names.slice(1)).toEqual([
      'B32 · row 1, 2nd from left',
      'B32 · row 1, 3rd from left',
      'Garage (B32) · row 1, 4th from left',
      'B32 · row 2, 1st from left',
    ]);
    expect(new Set(names).size).toBe(names.length);
  });

  it('when places are counted, then English ordinals are used', () => {
    expect([1, 2, 3, 4, 11, 12, 13, 21, 22, 23, 101, 111].map(ordinal)).toEqual([
      '1st',
      '2nd',
      '3rd',
      '4th',
      '11th',
      '12th',
      '13th',
      '21st',
      '22nd',
      '23rd',
      '101st',
      '111th',
    ]);
  });
});
