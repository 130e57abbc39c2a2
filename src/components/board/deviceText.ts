/**
 * How the editor names a device in a list or a status line. A device's own label (e.g. "Spare")
 * says what it is for, not what it is: the rating and curve are shown beside it, so a circuit
 * put on the spare way still reads as going onto a B16.
 */
import { deviceShortText } from '../../../shared/schedule/derive.js';
import type { Device } from '../../../shared/schemas/schedule.js';

/** The device as an electrician writes it: "B16", "RCBO B16 30 mA", "RCD 63 A 30 mA". */
export function deviceRatingText(d: Device): string {
  const short = deviceShortText(d);
  return d.kind === 'rcbo' && short && !short.startsWith('RCBO') ? `RCBO ${short}` : short;
}

/** "Spare (B16)", "Kitchen RCD (RCD 63 A 30 mA)", "B32" when it has no label; never the label alone when it hides the rating. */
export function deviceChoiceText(d: Device, kindName = d.kind.toUpperCase()): string {
  const rating = deviceRatingText(d);
  const label = d.label.trim();
  if (!label) return rating || kindName;
  if (!rating || label.toLowerCase().includes(rating.toLowerCase())) return label;
  return `${label} (${rating})`;
}
