/**
 * The e-mail a contractor gets when a visitor reports a discrepancy. Plain text only: the
 * visitor's words are untrusted and are quoted, never rendered as HTML.
 */

export interface ReportMailInput {
  boardName: string;
  boardCode: string;
  /** The way as the board writes it: "4", or "4 L2" on a three-phase board. */
  way: string | null;
  message: string;
  reporterName: string;
  reporterContact: string;
  /** The board's sharing screen in the app, where the report is accepted or dismissed. */
  reviewUrl: string;
}

const quote = (text: string) =>
  text
    .split(/\r?\n/)
    .map((line) => `> ${line}`)
    .join('\n');

export function reportMail(input: ReportMailInput): { subject: string; text: string } {
  // Everything the visitor typed sits below a label, each line behind "> ", so none of it can pass
  // for the app's own words (a fake "Review it in Waymark" link, say).
  const visitor = (label: string, value: string) => (value ? [`${label} (as the visitor wrote it):`, quote(value)] : []);
  const who = [...visitor('Name', input.reporterName), ...visitor('Contact', input.reporterContact)];
  const lines = [
    `Someone using the board page of "${input.boardName}" (${input.boardCode}) says the schedule does not match the board.`,
    '',
    input.way != null ? `Way: ${input.way}` : 'Way: not given',
    'Their words:',
    quote(input.message),
    '',
    ...(who.length ? who : ['They left no name or contact details.']),
    '',
    `Review it in Waymark: ${input.reviewUrl}`,
    'Check the board, correct the schedule if needed, then mark the report accepted or dismissed.',
    '',
    'This report came from the public board page and has not been verified.',
  ];
  return { subject: `Board page report: ${input.boardName} (${input.boardCode})`.slice(0, 200), text: lines.join('\n') };
}
