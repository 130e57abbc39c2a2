import { describe, expect, it } from 'vitest';
import { signupLinkMessage } from '../../../server/mail/messages.js';
import { handoverMail } from '../../../server/handover/messages.js';

describe('dates in e-mails read as in the app', () => {
  it('when a link expires, then the mail says the day as "2 Dec 2036" with the time in UTC, never 2036-12-02', () => {
    const { text } = signupLinkMessage({
      name: 'Tam',
      organisationName: 'Test Ltd',
      link: 'http://waymark.test/signup/x',
      expiresAt: new Date('2036-12-02T14:05:00Z'),
    });
    expect(text).toContain('2 Dec 2036, 14:05 UTC');
    expect(text).not.toMatch(/\d{4}-\d{2}-\d{2}/);
  });

  it('when the handover names the next inspection, then the day is written out', () => {
    const { text } = handoverMail({
      contractor: { name: 'Test Electrical', phone: '01632 960000', email: 'office@test.example' },
      boardName: 'Consumer unit',
      boardLocation: 'Hall',
      revision: 3,
      publicUrl: null,
      nextInspectionOn: '2036-12-02',
      personalMessage: '',
    });
    expect(text).toContain('recommended by 2 December 2036');
    expect(text).not.toMatch(/\d{4}-\d{2}-\d{2}/);
  });
});
