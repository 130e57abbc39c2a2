/**
 * The handover e-mail to the client, in our own wording: what the attachment is, where the
 * board page is, and the few cautions a householder needs. Pure: built from plain values.
 */
import { longDate } from '../../shared/rules/dates.js';

export interface HandoverMailInput {
  contractor: { name: string; phone: string; email: string };
  boardName: string;
  boardLocation: string;
  revision: number;
  /** The board page link, or null when the page is switched off. */
  publicUrl: string | null;
  nextInspectionOn: string | null;
  /** The electrician's own words, if any. */
  personalMessage: string;
}

function contactLines(c: HandoverMailInput['contractor']): string[] {
  const ways = [c.phone && `phone ${c.phone}`, c.email && `e-mail ${c.email}`].filter(Boolean);
  return ways.length ? [`Questions about the work: ${ways.join(' or ')}.`] : [];
}

export function handoverMail(input: HandoverMailInput): { subject: string; text: string } {
  const where = input.boardLocation ? ` (${input.boardLocation})` : '';
  const lines: string[] = ['Hello,', ''];
  if (input.personalMessage) lines.push(input.personalMessage, '');
  lines.push(
    `${input.contractor.name} has recorded the circuits of your electrical board "${input.boardName}"${where}.`,
    `Attached is its circuit chart as a PDF (schedule revision ${input.revision}). Keep it with the property's papers; the copy at the board is the one to go by.`,
    '',
  );
  if (input.publicUrl) {
    lines.push(
      'Every way, what it serves and what goes off when an RCD trips are also on the board page,',
      'which the QR code on the board opens:',
      input.publicUrl,
      '',
    );
  }
  lines.push(
    'Please remember:',
    '- Test each RCD with its own test button as the notice beside it says. If one does not trip, call an electrician.',
    '- Do not open the board or work inside it unless you are competent to. Before any work the supply must be isolated and proved dead.',
  );
  if (input.nextInspectionOn) lines.push(`- The next periodic inspection is recommended by ${longDate(input.nextInspectionOn)}.`);
  lines.push('', ...contactLines(input.contractor), '', input.contractor.name);
  return { subject: `Circuit chart for your board "${input.boardName}"`.slice(0, 200), text: lines.join('\n') };
}
