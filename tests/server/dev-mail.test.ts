/** The development mailbox page: lists what the local fake SMTP server kept, and exists only when it is in use. */
import request from 'supertest';
import { createApp } from '../../server/app';
import { passwordResetMail } from '../../server/mail/templates';
import { startMailbox, type Mailbox } from '../helpers/mail';
import { createTestDb, type TestDb } from '../helpers/test-db';
import { TEST_SESSION_PASSWORD } from '../helpers/server';

jest.setTimeout(30_000);

let mail: Mailbox;
let db: TestDb;
beforeAll(async () => {
  mail = await startMailbox();
  db = await createTestDb();
});
afterAll(async () => {
  await db.drop();
  await mail.close();
});

it('lists the kept messages with their links at /dev/mail when the fake is in use', async () => {
  await mail.mailer.send(passwordResetMail({ to: 'keeper@example.test', link: 'http://127.0.0.1:8080/reset-password/abc', expiresAt: new Date() }));
  await mail.waitFor('keeper@example.test', /Reset/);
  const { app } = createApp({ db: db.db, sessionPassword: TEST_SESSION_PASSWORD, devMailDir: mail.dir });
  const list = await request(app).get('/dev/mail');
  expect(list.status).toBe(200);
  expect(list.text).toContain('Reset your Frameside password');
  const href = /href="(\/dev\/mail\/[^"]+\.eml)"/.exec(list.text)![1]!;
  const one = await request(app).get(href);
  expect(one.status).toBe(200);
  expect(one.text).toContain('<a href="http://127.0.0.1:8080/reset-password/abc">');
  // Not a way to read other files.
  expect((await request(app).get('/dev/mail/..%2F..%2Fpackage.json')).status).toBe(404);
});

it('has no /dev/mail without the fake (production)', async () => {
  const { app } = createApp({ db: db.db, sessionPassword: TEST_SESSION_PASSWORD });
  const res = await request(app).get('/dev/mail');
  expect(res.text).not.toContain('Local mailbox');
  expect(res.status).toBe(404);
});
