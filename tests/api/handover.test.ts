import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { simpleParser } from 'mailparser';
import { PDFParse } from 'pdf-parse';
import { handoverListSchema } from '../../shared/schemas/handover.js';
import { startTestApp, uniqueEmail, waitForMail, type TestApp } from '../helpers/app.js';
import { addMember } from '../helpers/accounts.js';
import { createBoard, signupMarkedOwner } from './public-fixture.js';

let t: TestApp;
beforeAll(async () => {
  t = await startTestApp();
});
afterAll(async () => {
  await t.close();
});

async function pdfText(data: Buffer): Promise<string> {
  const parser = new PDFParse({ data: new Uint8Array(data) });
  try {
    return (await parser.getText()).text;
  } finally {
    await parser.destroy();
  }
}

describe('handover e-mail', () => {
  it('when an electrician hands the board over, then the client gets the chart PDF and the board page link, and the send is recorded', async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner, undefined, false);
    const electrician = await addMember(t, owner, 'electrician', 'Nerys Albright');
    const to = uniqueEmail('client');
    const res = await electrician.post(`/api/boards/${board.id}/handover`, { to, message: 'Thanks for the tea.' }).expect(201);
    expect(res.body).toMatchObject({ toEmail: to, revision: board.revision, sentByName: 'Nerys Albright' });

    const mail = await simpleParser((await waitForMail(t.database, to)).raw);
    expect(mail.subject).toContain('Hallway consumer unit');
    expect(mail.text).toContain('Thanks for the tea.');
    expect(mail.text).toContain(`http://waymark.test/b/${board.token}`);
    expect(mail.text).toContain('Lanternfield Electrical');
    expect(mail.text).toMatch(/isolated and proved dead/);
    expect(mail.attachments).toHaveLength(1);
    const [pdf] = mail.attachments;
    expect(pdf.contentType).toBe('application/pdf');
    expect(pdf.filename).toBe(`${board.code}-circuit-chart.pdf`);
    expect(pdf.content.subarray(0, 5).toString()).toBe('%PDF-');
    const text = await pdfText(pdf.content);
    for (const label of ['Kitchen sockets', 'Lights downstairs', 'Garage sockets', 'Garden studio']) expect(text).toContain(label);

    const list = handoverListSchema.parse((await owner.get(`/api/boards/${board.id}/handovers`).expect(200)).body);
    expect(list.items.map((h) => [h.toEmail, h.revision, h.sentByName])).toEqual([[to, board.revision, 'Nerys Albright']]);
  });

  it('when the board page is switched off, then the e-mail carries no link to it', async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner, undefined, false);
    await owner.patch(`/api/boards/${board.id}/public`, { enabled: false }).expect(200);
    const to = uniqueEmail('client');
    await owner.post(`/api/boards/${board.id}/handover`, { to }).expect(201);
    const mail = await simpleParser((await waitForMail(t.database, to)).raw);
    expect(mail.text).not.toContain('/b/');
    expect(mail.attachments).toHaveLength(1);
  });

  it('when the address is bad or fields are unknown, then 400 with the field and nothing sent or recorded', async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner, undefined, false);
    expect((await owner.post(`/api/boards/${board.id}/handover`, { to: 'not-an-address' }).expect(400)).body.error.fields.to).toBeTruthy();
    expect((await owner.post(`/api/boards/${board.id}/handover`, { to: uniqueEmail(), cc: uniqueEmail() }).expect(400)).body.error.fields).toBeDefined();
    expect(
      (await owner.post(`/api/boards/${board.id}/handover`, { to: uniqueEmail(), message: 'x'.repeat(1001) }).expect(400)).body.error.fields.message,
    ).toBeTruthy();
    expect((await owner.get(`/api/boards/${board.id}/handovers`).expect(200)).body.items).toEqual([]);
  });

  it('when a viewer tries, then 403; another organisation gets 404 on send and list', async () => {
    const owner = await signupMarkedOwner(t.app);
    const board = await createBoard(owner, undefined, false);
    const viewer = await addMember(t, owner, 'viewer');
    await viewer.post(`/api/boards/${board.id}/handover`, { to: uniqueEmail() }).expect(403);
    await viewer.get(`/api/boards/${board.id}/handovers`).expect(200);
    const other = await signupMarkedOwner(t.app);
    await other.post(`/api/boards/${board.id}/handover`, { to: uniqueEmail() }).expect(404);
    await other.get(`/api/boards/${board.id}/handovers`).expect(404);
    expect((await owner.get(`/api/boards/${board.id}/handovers`).expect(200)).body.items).toEqual([]);
  });
});
