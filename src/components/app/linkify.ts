/** A piece of plain text, either words or a web address to show as a link. */
export interface TextPart {
  text: string;
  href?: string;
}

const WEB_ADDRESS = /https?:\/\/[^\s<>"')]+/g;

/**
 * Splits text into words and http(s) addresses, so a mail's links can be followed without
 * ever rendering its text as HTML (only http and https become links).
 */
export function linkify(text: string): TextPart[] {
  const parts: TextPart[] = [];
  let last = 0;
  for (const match of text.matchAll(WEB_ADDRESS)) {
    const start = match.index ?? 0;
    const address = match[0].replace(/[.,;:!?]+$/, '');
    if (start > last) parts.push({ text: text.slice(last, start) });
    parts.push({ text: address, href: address });
    last = start + address.length;
  }
  if (last < text.length) parts.push({ text: text.slice(last) });
  return parts;
}
