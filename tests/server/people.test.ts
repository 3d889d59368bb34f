/**
 * Invitations, password resets and the Handover brief, with e-mail really delivered over SMTP to
 * the local fake server, parsed, and its link followed. Expiry times are Frameside's own policy
 * (7-day invitations, 1-hour reset links: common practice for e-mailed links).
 */
import request from 'supertest';
import { eq } from 'drizzle-orm';
import { auditLog, invitations, passwordResets } from '../../db/schema';
import { hashToken } from '../../server/tokens';
import { startDemoServer, type DemoServer } from '../helpers/server';
import { linkIn, startMailbox, tokenOf, type Mailbox } from '../helpers/mail';

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

const day = (offset: number) => new Date(s.clock.now.getTime() + offset * 86_400_000).toISOString().slice(0, 10);

describe('invitations by e-mail', () => {
  it('invites a sitter; the mailed link shows the invitation, signs up and accepts once', async () => {
    const res = await s.as.keeper
      .post(`/api/apiaries/${s.ids.quarryHill}/invitations`)
      .send({ email: 'Neighbour@Example.test', role: 'sitter', startsAt: day(0), endsAt: day(13) });
    expect(res.status).toBe(201);
    const msg = await mail.waitFor('neighbour@example.test', /Invitation to Quarry Hill/);
    expect(msg.text).toContain('sitter');
    const link = linkIn(msg, '/invite/');
    const token = tokenOf(link);
    expect(token).toHaveLength(43);

    // Only the hash is stored.
    const rows = await s.testDb.db.select().from(invitations).where(eq(invitations.email, 'neighbour@example.test'));
    expect(rows).toHaveLength(1);
    expect(rows[0]!.tokenHash).toBe(hashToken(token));
    expect(JSON.stringify(rows[0])).not.toContain(token);

    const info = await request(s.app).get(`/api/invitations/${token}`);
    expect(info.status).toBe(200);
    expect(info.body.invitation).toMatchObject({ apiaryName: 'Quarry Hill', role: 'sitter', accountExists: false });

    const visitor = request.agent(s.app);
    const acc = await visitor.post(`/api/invitations/${token}/accept`).send({ email: 'neighbour@example.test', password: 'a-long-sitter-pass', name: 'Nell' });
    expect(acc.status).toBe(200);
    expect(acc.body).toMatchObject({ apiaryId: s.ids.quarryHill, role: 'sitter' });
    const list = await visitor.get('/api/apiaries');
    expect(list.body.apiaries.map((a: { name: string }) => a.name)).toEqual(['Quarry Hill']);

    // The handover brief follows by e-mail.
    const brief = await mail.waitFor('neighbour@example.test', /Handover brief: Quarry Hill/);
    expect(brief.text).toContain('Reach the owner');
    expect(brief.text).toContain('keeper@frameside.test');

    // Single use: the second click is refused with 410 and says so.
    const again = await request(s.app).post(`/api/invitations/${token}/accept`).send({ email: 'other@example.test', password: 'another-long-pass' });
    expect(again.status).toBe(410);
    expect(again.body.error.message).toMatch(/already been used/);
    expect((await request(s.app).get(`/api/invitations/${token}`)).status).toBe(410);
  });

  it('lets a signed-in person accept for their own account', async () => {
    await s.as.keeper.post(`/api/apiaries/${s.ids.quarryHill}/invitations`).send({ email: 'sitter@frameside.test', role: 'viewer' }).expect(201);
    const token = tokenOf(linkIn(await mail.waitFor('sitter@frameside.test', /Invitation to Quarry Hill/), '/invite/'));
    const res = await s.as.sitter.post(`/api/invitations/${token}/accept`).send({});
    expect(res.status).toBe(200);
    expect(res.body.role).toBe('viewer');
    const members = await s.as.keeper.get(`/api/apiaries/${s.ids.quarryHill}/members`);
    expect(members.body.members.find((m: { email: string }) => m.email === 'sitter@frameside.test')).toMatchObject({ role: 'viewer', endsAt: null });
  });

  it('signs an existing account in to accept while signed out (a wrong password is refused and uses nothing up)', async () => {
    await request(s.app).post('/api/auth/sign-up').send({ email: 'helper@example.test', password: 'a-long-helper-pass', name: 'Hal' }).expect(201);
    await s.as.keeper.post(`/api/apiaries/${s.ids.orchardRow}/invitations`).send({ email: 'helper@example.test', role: 'viewer' }).expect(201);
    const token = tokenOf(linkIn(await mail.waitFor('helper@example.test', /Invitation to Orchard Row/), '/invite/'));
    expect((await request(s.app).get(`/api/invitations/${token}`)).body.invitation.accountExists).toBe(true);
    const wrong = await request(s.app).post(`/api/invitations/${token}/accept`).send({ email: 'helper@example.test', password: 'not-the-password' });
    expect(wrong.status).toBe(401);
    const visitor = request.agent(s.app);
    const ok = await visitor.post(`/api/invitations/${token}/accept`).send({ email: 'helper@example.test', password: 'a-long-helper-pass' });
    expect(ok.status).toBe(200);
    expect(ok.body.user.name).toBe('Hal');
    expect((await visitor.get(`/api/apiaries/${s.ids.orchardRow}`)).body.apiary.myRole).toBe('viewer');
  });

  it('lets only one of two simultaneous clicks use a link', async () => {
    await s.as.keeper.post(`/api/apiaries/${s.ids.quarryHill}/invitations`).send({ email: 'twice@example.test', role: 'viewer' }).expect(201);
    const token = tokenOf(linkIn(await mail.waitFor('twice@example.test', /Invitation/), '/invite/'));
    const [a, b] = await Promise.all([
      request(s.app).post(`/api/invitations/${token}/accept`).send({ email: 'twice-a@example.test', password: 'a-long-password-a' }),
      request(s.app).post(`/api/invitations/${token}/accept`).send({ email: 'twice-b@example.test', password: 'a-long-password-b' }),
    ]);
    expect([a.status, b.status].sort()).toEqual([200, 410]);
    // The refused click left no account behind (one transaction).
    const loser = a.status === 410 ? { email: 'twice-a@example.test', password: 'a-long-password-a' } : { email: 'twice-b@example.test', password: 'a-long-password-b' };
    expect((await request(s.app).post('/api/auth/sign-in').send(loser)).status).toBe(401);
  });

  it('refuses an expired link (clock moved past 7 days) with 410, and an unknown one with 404', async () => {
    await s.as.keeper.post(`/api/apiaries/${s.ids.orchardRow}/invitations`).send({ email: 'late@example.test', role: 'keeper' }).expect(201);
    const token = tokenOf(linkIn(await mail.waitFor('late@example.test', /Invitation/), '/invite/'));
    s.clock.advanceDays(8);
    try {
      const res = await request(s.app).post(`/api/invitations/${token}/accept`).send({ email: 'late@example.test', password: 'a-long-late-pass' });
      expect(res.status).toBe(410);
      expect(res.body.error.message).toMatch(/expired/);
    } finally {
      s.clock.advanceDays(-8);
    }
    const unknown = await request(s.app).get(`/api/invitations/${'x'.repeat(43)}`);
    expect(unknown.status).toBe(404);
    expect(unknown.body.error.message).toMatch(/not known/);
  });

  it.each([
    [{ email: 'a@example.test', role: 'sitter' }, 'startsAt', /start date/],
    [{ email: 'a@example.test', role: 'sitter', startsAt: '2026-09-10', endsAt: '2026-09-01' }, 'endsAt', /after the start/],
    [{ email: 'a@example.test', role: 'keeper', startsAt: '2026-09-10', endsAt: '2026-09-20' }, 'startsAt', /Only a sitter/],
    [{ email: 'not-an-email', role: 'viewer' }, 'email', /e-mail/],
    [{ email: 'a@example.test', role: 'queen' }, 'role', /Choose a role/],
  ])('rejects a bad invitation %j (400 on %s)', async (input, field, msg) => {
    const res = await s.as.keeper.post(`/api/apiaries/${s.ids.orchardRow}/invitations`).send(input);
    expect(res.status).toBe(400);
    expect(res.body.error.fields[field]).toMatch(msg);
  });

  it('refuses inviting someone who already has access (409)', async () => {
    const res = await s.as.keeper.post(`/api/apiaries/${s.ids.orchardRow}/invitations`).send({ email: 'cokeeper@frameside.test', role: 'viewer' });
    expect(res.status).toBe(409);
  });
});

describe('members', () => {
  it('changes a role, keeps the last owner, ends access, and writes the audit trail', async () => {
    const patch = await s.as.keeper.patch(`/api/apiaries/${s.ids.orchardRow}/members/${s.ids.users.mentor}`).send({ role: 'keeper' });
    expect(patch.status).toBe(200);
    expect(patch.body.member).toMatchObject({ role: 'keeper', startsAt: null });
    const last = await s.as.keeper.patch(`/api/apiaries/${s.ids.orchardRow}/members/${s.ids.users.keeper}`).send({ role: 'keeper' });
    expect(last.status).toBe(409);
    expect(last.body.error.message).toMatch(/at least one owner/);
    expect((await s.as.keeper.delete(`/api/apiaries/${s.ids.orchardRow}/members/${s.ids.users.keeper}`)).status).toBe(409);
    expect((await s.as.keeper.delete(`/api/apiaries/${s.ids.orchardRow}/members/${s.ids.users.mentor}`)).status).toBe(204);
    expect((await s.as.mentor.get(`/api/apiaries/${s.ids.orchardRow}`)).status).toBe(404);

    const activity = await s.as.keeper.get(`/api/apiaries/${s.ids.orchardRow}/activity`);
    expect(activity.status).toBe(200);
    const rows = activity.body.activity as { entity: string; action: string; who: { name: string } }[];
    // The test clock stands still, so rows of one instant come in any order.
    expect(rows).toEqual(expect.arrayContaining([expect.objectContaining({ entity: 'membership', action: 'delete', who: expect.objectContaining({ name: 'Rowan Hale' }) })]));
    expect(rows.some((r) => r.entity === 'membership' && r.action === 'update')).toBe(true);
    // Keepers do not read the trail.
    expect((await s.as.cokeeper.get(`/api/apiaries/${s.ids.orchardRow}/activity`)).status).toBe(403);
  });

  it("moves a sitter's window and the server holds it on the next request", async () => {
    const res = await s.as.keeper
      .patch(`/api/apiaries/${s.ids.orchardRow}/members/${s.ids.users.sitter}`)
      .send({ startsAt: day(-10), endsAt: day(-1) });
    expect(res.status).toBe(200);
    const refused = await s.as.sitter.get(`/api/apiaries/${s.ids.orchardRow}/hives`);
    expect(refused.status).toBe(403);
    expect(refused.body.error.message).toBe(`Your access to this apiary ended on ${day(-1)}.`);
    const after = (await s.as.sitter.get('/api/apiaries')).body.apiaries as { name: string }[];
    expect(after.map((a) => a.name)).not.toContain('Orchard Row');
    await s.as.keeper.patch(`/api/apiaries/${s.ids.orchardRow}/members/${s.ids.users.sitter}`).send({ startsAt: day(2), endsAt: day(9) }).expect(200);
    const early = await s.as.sitter.get(`/api/apiaries/${s.ids.orchardRow}/hives`);
    expect(early.status).toBe(403);
    expect(early.body.error.message).toBe(`Your access to this apiary begins on ${day(2)}.`);
    // The sitting to come is listed with its start, so the sitter knows when; an ended one is not.
    const upcoming = (await s.as.sitter.get('/api/apiaries')).body.apiaries;
    const orchard = upcoming.find((a: { name: string }) => a.name === 'Orchard Row') as { myStartsAt: string } | undefined;
    expect(orchard?.myStartsAt.slice(0, 10)).toBe(day(2));
    await s.as.keeper.patch(`/api/apiaries/${s.ids.orchardRow}/members/${s.ids.users.sitter}`).send({ startsAt: day(-3), endsAt: day(11) }).expect(200);
    expect((await s.as.sitter.get(`/api/apiaries/${s.ids.orchardRow}/hives`)).status).toBe(200);
  });
});

describe('handover brief', () => {
  it('gives the sitter the hives, the due list of the window, cautions and the owner', async () => {
    const res = await s.as.sitter.get(`/api/apiaries/${s.ids.orchardRow}/handover`);
    expect(res.status).toBe(200);
    const h = res.body.handover;
    expect(h.apiary.name).toBe('Orchard Row');
    expect(h.hives.map((x: { name: string }) => x.name)).toEqual(['Ash', 'Bramble', 'Clover', 'Damson', 'Elder', 'Fennel']);
    expect(h.owners).toEqual([{ name: 'Rowan Hale', email: 'keeper@frameside.test' }]);
    expect(h.window.to).toBe(day(11));
    expect(h.cautions.map((c: { id: string }) => c.id)).toEqual(expect.arrayContaining(['stings', 'robbing']));
    for (const t of h.due) expect(t.dueDate <= h.window.to).toBe(true);
    // A viewer has no handover; a stranger does not learn the apiary exists.
    expect((await s.as.mentor.get(`/api/apiaries/${s.ids.quarryHill}/handover`)).status).toBe(403);
    expect((await s.as.stranger.get(`/api/apiaries/${s.ids.orchardRow}/handover`)).status).toBe(404);
  });
});

describe('password reset by e-mail', () => {
  it('always answers 202, mails a single-use link, changes the password and ends other sessions', async () => {
    const unknown = await request(s.app).post('/api/auth/password-reset').send({ email: 'nobody@example.test' });
    expect(unknown.status).toBe(202);
    const res = await request(s.app).post('/api/auth/password-reset').send({ email: 'cokeeper@frameside.test' });
    expect(res.status).toBe(202);
    expect(res.body).toEqual(unknown.body);
    const link = linkIn(await mail.waitFor('cokeeper@frameside.test', /Reset your Frameside password/), '/reset-password/');
    expect(link).toContain('/reset-password/');
    const token = tokenOf(link);
    const [row] = await s.testDb.db.select().from(passwordResets).where(eq(passwordResets.tokenHash, hashToken(token)));
    expect(row).toBeDefined();

    expect((await s.as.cokeeper.get('/api/me')).status).toBe(200);
    const short = await request(s.app).post(`/api/auth/password-reset/${token}`).send({ password: 'short' });
    expect(short.status).toBe(400);
    const done = await request(s.app).post(`/api/auth/password-reset/${token}`).send({ password: 'a-brand-new-password' });
    expect(done.status).toBe(204);
    // The old session is revoked; the old password no longer works; the new one does.
    expect((await s.as.cokeeper.get('/api/me')).status).toBe(401);
    expect((await request(s.app).post('/api/auth/sign-in').send({ email: 'cokeeper@frameside.test', password: 'frameside-demo' })).status).toBe(401);
    expect((await request(s.app).post('/api/auth/sign-in').send({ email: 'cokeeper@frameside.test', password: 'a-brand-new-password' })).status).toBe(200);
    const again = await request(s.app).post(`/api/auth/password-reset/${token}`).send({ password: 'yet-another-password' });
    expect(again.status).toBe(410);
    expect(again.body.error.message).toMatch(/already been used/);
    const audit = await s.testDb.db.select().from(auditLog).where(eq(auditLog.entity, 'user'));
    expect(audit.length).toBeGreaterThan(0);
  });

  it('refuses a link after its hour (clock moved)', async () => {
    await request(s.app).post('/api/auth/password-reset').send({ email: 'mentor@frameside.test' }).expect(202);
    const token = tokenOf(linkIn(await mail.waitFor('mentor@frameside.test', /Reset your Frameside password/), '/reset-password/'));
    s.clock.set(new Date(s.clock.now.getTime() + 61 * 60_000));
    const res = await request(s.app).post(`/api/auth/password-reset/${token}`).send({ password: 'a-brand-new-password' });
    expect(res.status).toBe(410);
    expect(res.body.error.message).toMatch(/expired/);
  });
});
