/**
 * The sitter's fortnight, end to end in Chromium against the exported web build, with e-mail
 * really delivered to the local fake SMTP server: the owner invites a sitter for the next two
 * weeks; the sitter opens the link from the mailbox, signs up, sees only that apiary and its
 * Handover brief, records a feeding, cannot delete it or see the other site; after the window
 * (the server clock moved) access is refused with the date it ended. Screenshots of the members,
 * invitation and Handover screens at 390 × 844 and 1440 × 900 for a person to judge, and the
 * brief printed to PDF (one or two pages, the figure).
 */
import fs from 'node:fs';
import path from 'node:path';
import { byTestId, newPage, PHONE, SHOTS_DIR, shot, signIn, startE2e, WIDE, type E2e } from './harness';
import { linkIn, startMailbox, type Mailbox } from '../helpers/mail';

jest.setTimeout(240_000);

const OWNER = 'keeper@frameside.test';
const SITTER = 'fortnight-sitter@example.test';

let e: E2e;
let mail: Mailbox;
beforeAll(async () => {
  mail = await startMailbox();
  e = await startE2e({ mailer: mail.mailer });
});
afterAll(async () => {
  await e?.close();
  await mail?.close();
});

const pdfPages = (pdf: Buffer) => (pdf.toString('latin1').match(/\/Type\s*\/Page[^s]/g) ?? []).length;

it('runs a sitter’s fortnight: invitation by e-mail, sign-up, Handover, a feeding, and the window closing', async () => {
  const orchard = e.ids.orchardRow;
  const quarry = e.ids.quarryHill;
  const ash = e.ids.hives.Ash!;

  // 1. The owner invites a sitter for the next two weeks (start today, 14 days).
  const owner = await newPage(e, WIDE);
  await signIn(owner.page, OWNER);
  await byTestId(owner.page, 'due-screen').or(byTestId(owner.page, 'apiaries-screen')).first().waitFor().catch(() => undefined);
  await owner.page.goto(`/apiaries/${orchard}/members`);
  await byTestId(owner.page, 'members-list').waitFor();
  // The phone layout mounts the screen anew (bottom bar instead of side rail): fill it at each size.
  for (const size of [PHONE, WIDE]) {
    await owner.page.setViewportSize(size);
    await owner.page.goto(`/apiaries/${orchard}/members`);
    await byTestId(owner.page, 'members-list').waitFor();
    await shot(owner.page, 'members');
    await byTestId(owner.page, 'invite-email').fill(SITTER);
    await byTestId(owner.page, 'chips-invite-role-sitter').click();
    await expect(byTestId(owner.page, 'stepper-invite-start-value').textContent()).resolves.toBe('Today');
    await expect(byTestId(owner.page, 'stepper-invite-days-value').textContent()).resolves.toContain('14');
    await shot(owner.page, 'members-invite');
  }
  const [invited] = await Promise.all([
    owner.page.waitForResponse((r) => r.url().includes('/invitations') && r.request().method() === 'POST'),
    byTestId(owner.page, 'invite-submit').click(),
  ]);
  expect({ status: invited.status(), body: invited.status() === 201 ? 'ok' : await invited.text() }).toEqual({ status: 201, body: 'ok' });
  await byTestId(owner.page, 'invite-sent').waitFor();
  await byTestId(owner.page, 'invitations-list').waitFor();

  // 2. The link arrives in the local mailbox.
  const msg = await mail.waitFor(SITTER, /Invitation to Orchard Row/);
  const invitePath = new URL(linkIn(msg, '/invite/')).pathname;

  // The invitation page at both sizes (read only: the link is single use).
  const look = await newPage(e, WIDE);
  await look.page.goto(invitePath);
  await byTestId(look.page, 'invite-summary').waitFor();
  await shot(look.page, 'invite');
  await look.context.close();

  // 3. The sitter opens it on a phone and signs up.
  const sitter = await newPage(e, PHONE);
  const p = sitter.page;
  await p.goto(invitePath);
  await byTestId(p, 'invite-summary').waitFor();
  await expect(byTestId(p, 'invite-window').textContent()).resolves.toMatch(/ to /);
  await shot(p, 'invite');
  await byTestId(p, 'invite-name').fill('Noor Ashby');
  await expect(byTestId(p, 'invite-email').inputValue()).resolves.toBe(SITTER);
  await byTestId(p, 'invite-password').fill('a-long-sitter-password');
  const [accepted] = await Promise.all([
    p.waitForResponse((r) => r.url().includes('/accept') && r.request().method() === 'POST'),
    byTestId(p, 'invite-accept').click(),
  ]);
  expect({ status: accepted.status(), body: accepted.status() === 200 ? 'ok' : await accepted.text() }).toEqual({ status: 200, body: 'ok' });
  await p.waitForURL(/\/handover$/).catch(async () => {
    await shot(p, 'debug-after-accept');
    throw new Error(`after accepting the page is at ${p.url()}`);
  });

  // 4. She lands on the Handover brief.
  await byTestId(p, 'handover-title').waitFor();
  await expect(byTestId(p, 'handover-title').textContent()).resolves.toContain('Orchard Row');
  await byTestId(p, 'handover-hive-Ash').waitFor();
  await byTestId(p, 'handover-owner').getByText(OWNER).waitFor();
  await byTestId(p, 'handover-caution-stings').waitFor();
  await shot(p, 'handover');
  // Crossing the wide breakpoint remounts the app shell, so the page is opened again at that size.
  const handoverUrl = p.url();
  await p.setViewportSize(WIDE);
  await p.goto(handoverUrl);
  await byTestId(p, 'handover-hive-Ash').waitFor();
  await shot(p, 'handover');
  // Printable on one or two pages (A4, the print stylesheet drops navigation and buttons).
  await p.emulateMedia({ media: 'print' });
  const pdf = await p.pdf({ format: 'A4', printBackground: true });
  fs.mkdirSync(SHOTS_DIR, { recursive: true });
  fs.writeFileSync(path.join(SHOTS_DIR, 'handover-print.pdf'), pdf);
  const pages = pdfPages(pdf);
  console.log(`handover brief prints on ${pages} page(s)`);
  // What the printer gets, as one long image, for a person to judge.
  await p.screenshot({ path: path.join(SHOTS_DIR, 'handover-print-1440.png'), fullPage: true });
  expect(pages).toBeGreaterThanOrEqual(1);
  expect(pages).toBeLessThanOrEqual(2);
  await p.emulateMedia({ media: 'screen' });
  await p.setViewportSize(PHONE);

  // The brief also came by e-mail.
  const brief = await mail.waitFor(SITTER, /Handover brief: Orchard Row/);
  expect(brief.text).toContain('Reach the owner');

  // 5. Only that apiary, with the days left.
  await p.goto('/apiaries');
  await p.getByText('Orchard Row').first().waitFor();
  await p.getByText(/days? left/).first().waitFor();
  expect(await p.getByText('Quarry Hill').count()).toBe(0);
  // The other site is not there for her.
  await p.goto(`/apiaries/${quarry}`);
  await p.getByText('That apiary was not found.').first().waitFor();

  // 6. She records a feeding on Ash with the form.
  await p.goto(`/hives/${ash}/feeding`);
  await byTestId(p, 'feeding-save').waitFor();
  const [saved] = await Promise.all([
    p.waitForResponse((r) => r.url().includes(`/api/hives/${ash}/feedings`) && r.request().method() === 'POST'),
    byTestId(p, 'feeding-save').click(),
  ]);
  expect(saved.status()).toBe(201);
  const feedingId = ((await saved.json()) as { feeding: { id: string; createdBy: { name: string } } }).feeding.id;
  expect(((await saved.json()) as { feeding: { createdBy: { name: string } } }).feeding.createdBy.name).toBe('Noor Ashby');

  // 7. She cannot delete it (the server refuses; the page offers no delete for her).
  const del = await p.evaluate(async (id) => {
    const r = await fetch(`/api/feedings/${id}`, { method: 'DELETE', credentials: 'include' });
    return { status: r.status, body: (await r.json()) as { error: { message: string } } };
  }, feedingId);
  expect(del.status).toBe(403);
  expect(del.body.error.message).toMatch(/sitter/);

  // 8. After the window (14 days, the clock moved 15): refused, saying when it ended.
  e.server.clock.advanceDays(15);
  try {
    await p.goto(`/apiaries/${orchard}`);
    await p.getByText(/Your access to this apiary ended on \d{4}-\d{2}-\d{2}\./).first().waitFor();
    await p.goto(`/apiaries/${orchard}/handover`);
    await byTestId(p, 'handover-error').waitFor();
    await expect(byTestId(p, 'handover-error').textContent()).resolves.toMatch(/ended on/);
    await shot(p, 'handover-after-window');
  } finally {
    e.server.clock.advanceDays(-15);
  }
  await owner.context.close();
  await sitter.context.close();
});
