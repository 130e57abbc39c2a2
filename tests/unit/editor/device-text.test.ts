import { describe, expect, it } from 'vitest';
import { deviceChoiceText, deviceRatingText } from '../../../src/components/board/deviceText.js';
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
