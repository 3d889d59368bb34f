/**
 * The weekly due digest job, called directly (pg-boss only schedules it), delivered over SMTP to
 * the local fake server and parsed.
 */
import { sendDueDigests } from '../../server/jobs/digest';
import { createTask } from '../../server/services/due';
import { DEMO_USERS } from '../../db/seed';
import { startDemoServer, type DemoServer } from '../helpers/server';
import { startMailbox, type Mailbox } from '../helpers/mail';

jest.setTimeout(30_000);

let s: DemoServer;
let mail: Mailbox;
beforeAll(async () => {
  mail = await startMailbox();
  s = await startDemoServer({ mailer: mail.mailer });
});
afterAll(async () => {
  await s.close();
  await mail.close();
});

it('mails owners and keepers what is due in the coming week, and nobody else', async () => {
  const inThreeDays = new Date(s.clock.now.getTime() + 3 * 86_400_000).toISOString().slice(0, 10);
  const owner = { id: s.ids.users.keeper, email: DEMO_USERS.keeper.email, name: DEMO_USERS.keeper.name };
  await createTask(s.ctx, owner, { apiaryId: s.ids.quarryHill, hiveId: s.ids.hives.Granite!, title: 'Take the spare super up', dueDate: inThreeDays });

  const sent = await sendDueDigests(s.ctx);
  expect(sent).toBeGreaterThanOrEqual(2);
  for (const who of [DEMO_USERS.keeper.email, DEMO_USERS.cokeeper.email]) {
    const m = await mail.waitFor(who, /Due this week in Frameside/);
    expect(m.text).toContain('Quarry Hill:');
    expect(m.text).toContain(`${inThreeDays}: Take the spare super up — Granite`);
    expect(m.text).toMatch(/Open the Due list: http:\/\/\S+\//);
  }
  const all = await mail.messages();
  const to = all.flatMap((m) => (Array.isArray(m.to) ? m.to : [m.to!]).map((a) => a.text));
  // The sitter and the viewer get no digest.
  expect(to).not.toContain(DEMO_USERS.sitter.email);
  expect(to).not.toContain(DEMO_USERS.mentor.email);
});
