/**
 * The board page's first HTML: the shell's app element holds the board, the data travels beside it
 * in a script element no typed text can close. HTML escaping per the WHATWG HTML standard
 * (§13.1.2.6 restrictions on script contents; character references for & < > " ').
 */
import { describe, expect, it } from 'vitest';
import { boardPageHtml, escapeHtml, scriptSafeJson } from '../../../server/public/page-html.js';
import { toPublicBoard } from '../../../shared/public/board-page.js';
import { scheduleSchema } from '../../../shared/schemas/schedule.js';
import { BOARD_DATA_ELEMENT_ID } from '../../../shared/public/inline-data.js';

const SHELL =
  '<!doctype html><html><head><title>Waymark</title></head><body><div id="app"><p>Loading Waymark…</p></div><script type="module" src="/assets/index.js"></script></body></html>';
const schedule = scheduleSchema.parse({
  board: { name: 'Hall <cupboard> & "store"', supply: { earthing: 'TN-C-S' } },
  devices: [{ id: 'b6', row: 1, kind: 'mcb', rating: 6, curve: 'B' }],
  circuits: [{ id: 'c1', way: 1, deviceId: 'b6', label: 'Lights', description: '</script><script>alert(1)</script>\u2028' }],
});
const page = toPublicBoard(schedule, {
  organisation: { name: 'Example Electrical', contactPhone: '01632 960 111', contactEmail: 'office@example.test' },
  hasLogo: false,
  revision: 2,
  revisionDate: '2026-12-01',
  nextInspectionOn: null,
});

describe('board page first HTML', () => {
  it('when the board has markup in its text, then it is escaped in the view and cannot close the data element', () => {
    const html = boardPageHtml(SHELL, page, JSON.stringify(page));
    expect(html).toContain('<title>Hall &lt;cupboard&gt; &amp; &quot;store&quot; · board page</title>');
    expect(html).toContain('&lt;/script&gt;&lt;script&gt;alert(1)&lt;/script&gt;');
    // Exactly the shell's one module script and the data element: no script tag came from the text.
    expect(html.match(/<script/g)).toHaveLength(2);
    const data = html.slice(html.indexOf(`<script type="application/json" id="${BOARD_DATA_ELEMENT_ID}">`));
    const inner = data.slice(data.indexOf('>') + 1, data.indexOf('</script>'));
    expect(JSON.parse(inner)).toEqual(page);
    expect(html).not.toContain('Loading Waymark');
  });

  it('when each way is listed, then its number, label, device and RCD text are in the view, after the cautions', () => {
    const html = boardPageHtml(SHELL, page, JSON.stringify(page));
    expect(html).toContain('<h3>Way 1: Lights</h3>');
    expect(html).toContain('<dt>Device</dt><dd>MCB B6</dd>');
    expect(html).toContain('<dt>RCD</dt><dd>No RCD protection recorded</dd>');
    expect(html.indexOf('Before you touch this board')).toBeLessThan(html.indexOf('Way 1:'));
  });

  it("when a board name holds a replacement pattern ($' $& $`), then the title shows it as typed and the shell appears once", () => {
    // ECMA-262 GetSubstitution: in a replacement string `$'`, `$&` and `$\`` stand for parts of the subject.
    const named = toPublicBoard(scheduleSchema.parse({ ...schedule, board: { ...schedule.board, name: "Shop $' $& $` DB" } }), {
      organisation: { name: 'Example Electrical', contactPhone: '', contactEmail: '' },
      hasLogo: false,
      revision: 1,
      revisionDate: '2026-12-01',
      nextInspectionOn: null,
    });
    const html = boardPageHtml(SHELL, named, JSON.stringify(named));
    expect(html).toContain('<title>Shop $&#39; $&amp; $` DB · board page</title>');
    expect(html.match(/<div id="app">/g)).toHaveLength(1);
    expect(html.match(/<title>/g)).toHaveLength(1);
    // The first view and the data sit in the one app element, after the title, not inside it.
    expect(html.indexOf(`id="${BOARD_DATA_ELEMENT_ID}"`)).toBeGreaterThan(html.indexOf('</title>'));
  });

  it('when the shell has no app element, then it is returned unchanged', () => {
    expect(boardPageHtml('<html></html>', page, '{}')).toBe('<html></html>');
  });

  it('escapes the five characters HTML reserves, and JSON keeps its meaning once made script-safe', () => {
    expect(escapeHtml(`&<>"'`)).toBe('&amp;&lt;&gt;&quot;&#39;');
    const json = JSON.stringify({ a: '</script><!--\u2028\u2029' });
    expect(scriptSafeJson(json)).not.toMatch(/[<\u2028\u2029]/);
    expect(JSON.parse(scriptSafeJson(json))).toEqual(JSON.parse(json));
  });
});
