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

/** "1st", "2nd", "3rd", "4th", "11th", "22nd". */
export function ordinal(n: number): string {
  const tens = n % 100;
  const suffix = tens >= 11 && tens <= 13 ? 'th' : (({ 1: 'st', 2: 'nd', 3: 'rd' } as Record<number, string>)[n % 10] ?? 'th');
  return `${n}${suffix}`;
}

/**
 * A device in a picker, named so it can be told from its twins: "B32 · row 1, 4th from left",
 * "Spare (B16) · row 2, 1st from left". Devices are kept in row order, left to right, so the place
 * counts every device before it on its row (main switch and blanks included, as they sit on the rail).
 */
export function devicePickerText(d: Device, devices: readonly Device[]): string {
  const place = devices.filter((other) => other.row === d.row).findIndex((other) => other.id === d.id) + 1;
  return `${deviceChoiceText(d)} · row ${d.row}${place > 0 ? `, ${ordinal(place)} from left` : ''}`;
}
