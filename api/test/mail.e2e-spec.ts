import { afterAll, beforeAll, describe, expect, it } from '@jest/globals';
import nodemailer from 'nodemailer';
import { readMailConfig } from '../src/config/mail.config';
import { createTestApp, DEMO, type TestApp } from './support/test-app';

// The test profile's API is configured for the local mail catcher that `npm test` started.
describe('mail through the local SMTP catcher', () => {
  let t: TestApp;
  const config = readMailConfig();
  beforeAll(async () => {
    t = await createTestApp();
  });
  afterAll(() => t.close());

  it('stores a message sent over SMTP and shows it to admins only', async () => {
    const transport = nodemailer.createTransport(config.transport);
    const stamp = Date.now();
    const to = `outbox-check-${stamp}@halvorsen.example`;
    const info = await transport.sendMail({
      from: config.from, to, subject: `Outbox check ${stamp}`, text: 'plain body', html: '<p>html <b>body</b></p>',
    });
    transport.close();
    expect(info.accepted).toEqual([to]);

    const admin = await t.signIn(DEMO.admin);
    const list = await admin.get('/api/admin/outbox').query({ to });
    expect(list.status).toBe(200);
    expect(list.body.total).toBe(1);
    expect(list.body.items[0]).toMatchObject({ to: [to], subject: `Outbox check ${stamp}` });
    const message = await admin.get(`/api/admin/outbox/${list.body.items[0].id}`);
    expect(message.body).toMatchObject({ text: 'plain body', html: '<p>html <b>body</b></p>' });

    const member = await t.signIn(DEMO.plateauMember);
    expect((await member.get('/api/admin/outbox')).status).toBe(403);
  });

  it('answers 404 for ids that are not message file names, so no path leaves the folder', async () => {
    const admin = await t.signIn(DEMO.admin);
    for (const id of ['..%2F..%2Fsession-secret', 'abc', '1796000000000-000000']) {
      expect((await admin.get(`/api/admin/outbox/${id}`)).status).toBe(404);
    }
  });
});
