/**
 * The board page as its first HTML response: the built shell with the board already in it.
 * A visitor on a weak signal sees every way, its device and its RCD before any script arrives, and
 * still sees them if the script never does; the app then takes over the page from the same data,
 * which travels in a JSON script element instead of a second request. Pure: shell and page in, HTML out.
 */
import type { PublicBoard, PublicWay } from '../../shared/schemas/public-board.js';
import { SUB_MAIN_TEXT, wayProtectionText } from '../../shared/public/way-text.js';
import { BOARD_DATA_ELEMENT_ID } from '../../shared/public/inline-data.js';

const ENTITIES: Record<string, string> = { '&': '&amp;', '<': '&lt;', '>': '&gt;', '"': '&quot;', "'": '&#39;' };
/** Text as HTML: every board field is the electrician's or the visitor's free text. */
export const escapeHtml = (text: string) => text.replace(/[&<>"']/g, (c) => ENTITIES[c]);

/**
 * JSON safe inside a script element: no `<` (so no text can close the element or open a comment),
 * and the two line separators JavaScript once refused in strings spelled out.
 */
export const scriptSafeJson = (json: string) =>
  json
    .replace(/</g, '\\u003c')
    .replace(/\u2028/g, '\\u2028')
    .replace(/\u2029/g, '\\u2029');

// Enough style to read as a list on a phone without the app's stylesheet (the page's CSP allows inline styles).
const STYLE =
  '<style>.wm-first{font:16px/1.45 system-ui,sans-serif;color:#111;max-width:720px;margin:0 auto;padding:12px}' +
  '.wm-first ol{list-style:none;padding:0}.wm-first ol>li{border:2px solid #111;border-radius:6px;padding:8px 12px;margin:0 0 10px}' +
  '.wm-first dt{font-weight:700;float:left;clear:left;margin-right:6px}.wm-first dd{margin:0}' +
  '.wm-first .wm-caution{border-left:6px solid #b42318;padding-left:10px}</style>';

function wayItem(way: PublicWay): string {
  const facts: string[] = [];
  if (way.spare) facts.push('<dt>Not in use</dt><dd>the schedule records no circuit on this way.</dd>');
  if (way.locations.length) facts.push(`<dt>Serves</dt><dd>${escapeHtml(way.locations.join(', '))}</dd>`);
  if (way.device) facts.push(`<dt>Device</dt><dd>${escapeHtml(way.device)}</dd>`);
  if (way.feedsAnotherBoard) facts.push(`<dt>Feeds</dt><dd>${escapeHtml(SUB_MAIN_TEXT)}</dd>`);
  facts.push(`<dt>RCD</dt><dd>${escapeHtml(wayProtectionText(way))}</dd>`);
  if (way.notes) facts.push(`<dt>Note</dt><dd>${escapeHtml(way.notes)}</dd>`);
  const description = way.description ? `<p>${escapeHtml(way.description)}</p>` : '';
  return `<li><h3>Way ${escapeHtml(way.wayText)}: ${escapeHtml(way.label)}</h3>${description}<dl>${facts.join('')}</dl></li>`;
}

/** The board page's content as plain HTML, in the order the app shows it: the board, its cautions, its ways, who to call. */
export function boardPageFirstView(page: PublicBoard): string {
  const board = page.board;
  const place = board.location
    ? `<p>${escapeHtml(board.location)} · ${escapeHtml(page.supply.voltageText)}</p>`
    : `<p>${escapeHtml(page.supply.voltageText)}</p>`;
  const cautions = page.cautions.length
    ? `<div class="wm-caution" role="note"><h2>Before you touch this board</h2><ul>${page.cautions.map((c) => `<li>${escapeHtml(c)}</li>`).join('')}</ul></div>`
    : '';
  const contractor = page.contractor;
  const contact = [contractor.name, contractor.phone, contractor.email].filter(Boolean).map(escapeHtml).join(' · ');
  return (
    `${STYLE}<main class="wm-first"><h1>${escapeHtml(board.name)}</h1>${place}${cautions}` +
    `<h2>Ways</h2><ol>${page.ways.map(wayItem).join('')}</ol>` +
    (contact ? `<p>Installed and looked after by ${contact}</p>` : '') +
    '</main>'
  );
}

const APP_ELEMENT = /<div id="app">[\s\S]*?<\/div>/;

/**
 * The shell with the board in its app element and its data beside it. The shell is the built
 * index.html; a shell without the app element (a broken build) is returned as it is.
 */
export function boardPageHtml(shell: string, page: PublicBoard, json: string): string {
  if (!APP_ELEMENT.test(shell)) return shell;
  const data = `<script type="application/json" id="${BOARD_DATA_ELEMENT_ID}">${scriptSafeJson(json)}</script>`;
  return (
    shell
      // Replacers as functions: a `$&` or `$'` typed in a board name is text, not a replacement pattern.
      .replace(/<title>[^<]*<\/title>/, () => `<title>${escapeHtml(page.board.name)} · board page</title>`)
      .replace(APP_ELEMENT, () => `<div id="app">${boardPageFirstView(page)}</div>${data}`)
  );
}
