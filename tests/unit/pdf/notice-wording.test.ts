import { describe, expect, it } from 'vitest';
import { renderOutput } from '../../../server/pdf/index.js';
import { noticeContent } from '../../../server/pdf/layout/notice-content.js';
import { prescribedNotices } from '../../../shared/notices/prescribed-wording.js';
import { board, request, tenCircuitBoard } from './fixtures.js';
import { pdfText } from './helpers.js';

const squash = (t: string) => t.replace(/\s+/g, ' ');

describe('notice wording', () => {
  it('when an organisation has no wording of its own, then the notices print the prescribed words and their regulation', async () => {
    const req = request('notices', 'a4', { kinds: 'inspection,rcd-test,mixed-colours' });
    const text = squash(await pdfText((await renderOutput(req)).pdf));
    // BS 7671:2018+A2 Regulation 514.12.1 (from memory; docs/sources.md)
    expect(text).toContain('This installation should be periodically inspected and tested and a report on its condition obtained');
    expect(text).toContain('BS 7671 514.12.1');
    // BS 7671:2018+A2 Regulation 514.12.2 (from memory; docs/sources.md)
    expect(text).toContain('Test six-monthly by pressing the relevant test button(s)');
    expect(text).toContain('BS 7671 514.12.2');
    // BS 7671:2018+A2 Regulation 514.14.1 (from memory; docs/sources.md)
    expect(text).toContain('This installation has wiring colours to two versions of BS 7671');
    expect(text).toContain('BS 7671 514.14.1');
  });

  it('when the organisation words a notice its own way, then that notice prints its words, the regulation still, and the others stay prescribed', async () => {
    const own = { 'rcd-test': { title: 'Monthly RCD check', body: 'Press T on each RCD on the first of the month.\nCall Brightwell if one does not trip.' } };
    const req = request('notices', 'a4', { kinds: 'inspection,rcd-test' });
    req.contractor = { ...req.contractor, noticeWording: own };
    const text = squash(await pdfText((await renderOutput(req)).pdf));
    expect(text).toContain('Monthly RCD check');
    expect(text).toContain('Press T on each RCD on the first of the month. Call Brightwell'); // a typed line break prints as a space
    expect(text).not.toContain('Test six-monthly');
    expect(text).toContain('BS 7671 514.12.2');
    expect(text).toContain(prescribedNotices.inspection.wording.body.slice(0, 40));
    expect(noticeContent('rcd-test', tenCircuitBoard(), board, own).name).toBe('RCD test notice');
  });
});
