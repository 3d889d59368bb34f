/**
 * The Due list over HTTP on PostgreSQL: tasks derived from records written straight into the
 * tables, their order, done / snooze / dismiss with who and when, person-added tasks, filters
 * and access for each role. The clock is fixed in swarm season (10 June, north).
 * Expected intervals name their source in TRADE-REFERENCES.md.
 */
import request from 'supertest';
import { and, eq } from 'drizzle-orm';
import { auditLog, hives, inspections, miteCounts, tasks } from '../../db/schema';
import { dueForApiary } from '../../server/services/due';
import type { DueTaskDto } from '../../shared/schemas/tasks';
import { addHive, recordWriter, startDueServer, type DueServer } from '../helpers/due-fixtures';

const NOW = '2026-06-10T09:00:00Z';

describe('GET /api/due and /api/tasks', () => {
  let s: DueServer;
  let w: ReturnType<typeof recordWriter>;
  const h = { alder: '', birch: '', cedar: '', deal: '' };
  const rec: Record<string, string> = {};
  const due = async (agent: request.Agent | ReturnType<typeof request>, q = ''): Promise<DueTaskDto[]> => {
    const res = await agent.get(`/api/due${q}`);
    expect(res.status).toBe(200);
    return res.body.tasks;
  };
  const mine = (list: DueTaskDto[]) => list.filter((t) => Object.values(h).includes(t.hiveId ?? ''));
  const enc = encodeURIComponent;

  beforeAll(async () => {
    s = await startDueServer(NOW);
    w = recordWriter(s, s.ids.users.keeper);
    h.alder = await addHive(s, s.ids.orchardRow, 'Test Alder');
    h.birch = await addHive(s, s.ids.orchardRow, 'Test Birch');
    h.cedar = await addHive(s, s.ids.orchardRow, 'Test Cedar');
    h.deal = await addHive(s, s.ids.quarryHill, 'Test Deal');
    rec.alderCheck = await w.inspection(h.alder, '2026-06-01');
    rec.birchCheck = await w.inspection(h.birch, '2026-06-08', { queenCells: [{ kind: 'swarm', count: 2, capped: true }] });
    rec.cedarCheck = await w.inspection(h.cedar, '2026-06-02');
    rec.cedarTreatment = await w.treatment(h.cedar, '2026-05-20', { activeIngredient: 'formic-acid' });
    rec.cedarFeed = await w.feeding(h.cedar, '2026-06-09');
    rec.cedarMites = await w.miteCount(h.cedar, '2026-06-05', { mites: 12, beesSampled: 300 });
    rec.dealCheck = await w.inspection(h.deal, '2026-06-05');
  });
  afterAll(() => s.close());

  it('derives each rule’s task from the records, with its reason, date and source', async () => {
    const list = mine(await due(s.as.keeper, '?days=60'));
    const byKey = new Map(list.map((t) => [t.key, t]));
    // TRADE-REFERENCES §9 (Trunch BKA): weekly checks in swarm season → 1 June + 7 d.
    const alder = byKey.get(`next-inspection:${h.alder}:${rec.alderCheck}`)!;
    expect(alder).toMatchObject({ rule: 'next-inspection', dueDate: '2026-06-08', overdue: true, hiveName: 'Test Alder', apiaryName: 'Orchard Row', status: 'open' });
    expect(alder.source).toMatch(/§9/);
    expect(alder.reason).toMatch(/7 days/);
    // §9: 5-day visits when swarm risk is high; §1 (W. Shaw): a queen emerges 8 d after sealing,
    // and lays within 14–21 d of emerging (BBKA via Trunch BKA) → 8 June + 8 + 21 = 7 July.
    expect(byKey.get(`queen-cells-visit:${h.birch}:${rec.birchCheck}`)).toMatchObject({ dueDate: '2026-06-13', overdue: false });
    expect(byKey.get(`new-queen-laying-check:${h.birch}:${rec.birchCheck}`)).toMatchObject({ dueDate: '2026-07-07' });
    // The queen-cell visit replaces the routine check (it is the visit).
    expect(list.some((t) => t.hiveId === h.birch && t.rule === 'next-inspection')).toBe(false);
    // Formic acid with no end date: the 14-day default (from memory, TREATMENT_DEFAULTS) → 3 June; check the label.
    const end = byKey.get(`treatment-end:${h.cedar}:${rec.cedarTreatment}`)!;
    expect(end).toMatchObject({ dueDate: '2026-06-03', overdue: true });
    expect(end.reason).toMatch(/label/i);
    // §3 (USDA-ARS Tucson, University of Florida): 12 mites in 300 bees = 4 per 100 ≥ 3 → treat.
    expect(byKey.get(`treat-varroa:${h.cedar}:${rec.cedarMites}`)).toMatchObject({ dueDate: '2026-06-05', overdue: true });
    // Common practice: check a syrup feeder 3 days after feeding → 12 June.
    expect(byKey.get(`feeder-refill:${h.cedar}:${rec.cedarFeed}`)).toMatchObject({ dueDate: '2026-06-12', overdue: false });
    expect(list.every((t) => t.reason.length > 10 && t.source.length > 5)).toBe(true);
  });

  it('puts overdue tasks first, then the rest by due date', async () => {
    const list = await due(s.as.keeper);
    const firstNotOverdue = list.findIndex((t) => !t.overdue);
    expect(list.slice(firstNotOverdue).every((t) => !t.overdue)).toBe(true);
    expect(list.slice(0, firstNotOverdue).length).toBeGreaterThan(0);
    const cedar = list.filter((t) => t.hiveId === h.cedar).map((t) => [t.rule, t.dueDate]);
    expect(cedar).toEqual([
      ['treatment-end', '2026-06-03'],
      ['treat-varroa', '2026-06-05'],
      ['next-inspection', '2026-06-09'],
      ['feeder-refill', '2026-06-12'],
    ]);
  });

  it('filters by apiary and by hive', async () => {
    const quarry = await due(s.as.keeper, `?apiaryId=${s.ids.quarryHill}`);
    expect(quarry.length).toBeGreaterThan(0);
    expect(quarry.every((t) => t.apiaryId === s.ids.quarryHill)).toBe(true);
    expect(quarry.some((t) => t.hiveId === h.deal)).toBe(true);
    const one = await due(s.as.keeper, `?hiveId=${h.birch}&days=60`);
    expect(one.map((t) => t.rule).sort()).toEqual(['new-queen-laying-check', 'queen-cells-visit']);
    // By default the list looks 14 days ahead: the laying check on 7 July is not due soon yet.
    expect((await due(s.as.keeper, `?hiveId=${h.birch}`)).map((t) => t.rule)).toEqual(['queen-cells-visit']);
    expect((await s.as.keeper.get('/api/due?days=0')).status).toBe(400);
    expect((await s.as.keeper.get('/api/due?days=soon')).status).toBe(400);
    expect((await s.as.keeper.get('/api/due?apiaryId=nope')).status).toBe(400);
    expect((await s.as.keeper.get('/api/due?colour=red')).status).toBe(400);
  });

  it('marks a derived task done with who and when; it stays done, and the rule moves on to the next check', async () => {
    const key = `next-inspection:${h.alder}:${rec.alderCheck}`;
    const res = await s.as.sitter.post(`/api/tasks/${enc(key)}/done`).send({});
    expect(res.status).toBe(200);
    expect(res.body.task).toMatchObject({ key, kind: 'derived', status: 'done', resolvedAt: new Date(NOW).toISOString() });
    expect(res.body.task.resolvedBy).toEqual({ id: s.ids.users.sitter, name: 'Maren Clough' });
    const [row] = await s.testDb.db.select().from(tasks).where(eq(tasks.derivedKey, key));
    expect(row).toMatchObject({ status: 'done', resolvedBy: s.ids.users.sitter, rule: 'next-inspection', hiveId: h.alder });
    const audit = await s.testDb.db.select().from(auditLog).where(and(eq(auditLog.entity, 'task'), eq(auditLog.entityId, row!.id)));
    expect(audit).toHaveLength(1);
    expect(audit[0]!.userId).toBe(s.ids.users.sitter);

    expect((await due(s.as.keeper)).some((t) => t.key === key)).toBe(false);
    s.clock.advanceDays(1);
    expect((await due(s.as.keeper)).some((t) => t.key === key)).toBe(false);
    // A new check: the rule derives the next visit from it, under a new key (TRADE-REFERENCES §9, 7 d).
    const next = await w.inspection(h.alder, '2026-06-11');
    const alder = (await due(s.as.keeper, `?hiveId=${h.alder}`)).filter((t) => t.rule === 'next-inspection');
    expect(alder).toEqual([expect.objectContaining({ key: `next-inspection:${h.alder}:${next}`, dueDate: '2026-06-18' })]);
    s.clock.set(NOW);
  });

  it('snoozes a task to a later day (it moves there) and refuses a day that is not after today', async () => {
    const key = `treat-varroa:${h.cedar}:${rec.cedarMites}`;
    expect((await s.as.keeper.post(`/api/tasks/${enc(key)}/snooze`).send({ until: '2026-06-10' })).status).toBe(400);
    expect((await s.as.keeper.post(`/api/tasks/${enc(key)}/snooze`).send({ until: '2026-02-30' })).status).toBe(400);
    expect((await s.as.keeper.post(`/api/tasks/${enc(key)}/snooze`).send({})).status).toBe(400);
    expect((await s.as.keeper.post(`/api/tasks/${enc(key)}/snooze`).send({ until: '2028-01-01' })).status).toBe(400);
    const res = await s.as.cokeeper.post(`/api/tasks/${enc(key)}/snooze`).send({ until: '2026-06-14' });
    expect(res.status).toBe(200);
    expect(res.body.task).toMatchObject({ status: 'snoozed', snoozedUntil: '2026-06-14', resolvedBy: { id: s.ids.users.cokeeper, name: 'Idris Penrose' } });
    const t = (await due(s.as.keeper, `?hiveId=${h.cedar}`)).find((x) => x.key === key)!;
    expect(t).toMatchObject({ status: 'snoozed', dueDate: '2026-06-14', overdue: false, snoozedUntil: '2026-06-14', by: { id: s.ids.users.cokeeper, name: 'Idris Penrose' } });
  });

  it('dismisses a task', async () => {
    const key = `feeder-refill:${h.cedar}:${rec.cedarFeed}`;
    const res = await s.as.keeper.post(`/api/tasks/${enc(key)}/dismiss`).send({});
    expect(res.body.task).toMatchObject({ status: 'dismissed', resolvedBy: { id: s.ids.users.keeper } });
    expect((await due(s.as.keeper)).some((t) => t.key === key)).toBe(false);
  });

  it('answers 404 for a task that does not exist or is no longer derived', async () => {
    expect((await s.as.keeper.post(`/api/tasks/${enc('nonsense')}/done`).send({})).status).toBe(404);
    expect((await s.as.keeper.post(`/api/tasks/${enc(`next-inspection:${h.cedar}:00000000-0000-4000-8000-000000000000`)}/done`).send({})).status).toBe(404);
    expect((await s.as.keeper.post('/api/tasks/00000000-0000-4000-8000-000000000000/done').send({})).status).toBe(404);
    expect((await s.as.keeper.post(`/api/tasks/${enc('treat-varroa:not-a-uuid:x')}/done`).send({})).status).toBe(404);
  });

  it('adds a task a person writes; a sitter or viewer may not add one; bad input answers 400', async () => {
    const body = { apiaryId: s.ids.orchardRow, hiveId: h.alder, title: 'Bring a spare super', dueDate: '2026-06-12', note: 'The one in the shed.' };
    const res = await s.as.keeper.post('/api/tasks').send(body);
    expect(res.status).toBe(201);
    expect(res.body.task).toMatchObject({ rule: 'added', title: 'Bring a spare super', dueDate: '2026-06-12', hiveName: 'Test Alder', reason: 'The one in the shed.', by: { id: s.ids.users.keeper, name: 'Rowan Hale' } });
    const key = res.body.task.key as string;
    expect(key).toMatch(/^task:/);
    expect((await due(s.as.sitter)).some((t) => t.key === key)).toBe(true);

    expect((await s.as.sitter.post('/api/tasks').send(body)).status).toBe(403);
    expect((await s.as.mentor.post('/api/tasks').send(body)).status).toBe(403);
    expect((await s.as.stranger.post('/api/tasks').send(body)).status).toBe(404);
    expect((await request(s.app).post('/api/tasks').send(body)).status).toBe(401);
    const bad = await s.as.keeper.post('/api/tasks').send({ ...body, title: '', dueDate: 'tomorrow' });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields).toHaveProperty('title');
    expect(bad.body.error.fields).toHaveProperty('dueDate');
    expect((await s.as.keeper.post('/api/tasks').send({ ...body, hiveId: h.deal })).status).toBe(400);

    // The sitter may mark it done.
    const done = await s.as.sitter.post(`/api/tasks/${enc(key)}/done`).send({});
    expect(done.status).toBe(200);
    expect(done.body.task).toMatchObject({ status: 'done', kind: 'added', resolvedBy: { id: s.ids.users.sitter } });
    expect((await due(s.as.keeper)).some((t) => t.key === key)).toBe(false);
  });

  it('access: the sitter sees only the site they sit, inside their window; others by role', async () => {
    const sitter = await due(s.as.sitter);
    expect(sitter.length).toBeGreaterThan(0);
    expect(sitter.every((t) => t.apiaryId === s.ids.orchardRow)).toBe(true);
    expect((await s.as.sitter.get(`/api/due?apiaryId=${s.ids.quarryHill}`)).status).toBe(404);
    expect((await s.as.sitter.get(`/api/due?hiveId=${h.deal}`)).status).toBe(404);
    const mentor = await due(s.as.mentor);
    expect(new Set(mentor.map((t) => t.apiaryId))).toEqual(new Set([s.ids.orchardRow, s.ids.quarryHill]));
    expect(await due(s.as.stranger)).toEqual([]);
    expect((await s.as.stranger.get(`/api/due?hiveId=${h.alder}`)).status).toBe(404);
    expect((await request(s.app).get('/api/due')).status).toBe(401);

    const key = `queen-cells-visit:${h.birch}:${rec.birchCheck}`;
    expect((await s.as.mentor.post(`/api/tasks/${enc(key)}/done`).send({})).status).toBe(403);
    expect((await s.as.stranger.post(`/api/tasks/${enc(key)}/done`).send({})).status).toBe(404);
    expect((await request(s.app).post(`/api/tasks/${enc(key)}/done`).send({})).status).toBe(401);

    // After the sitter's window (it ends 11 days after the seed day) the site drops out.
    s.clock.advanceDays(20);
    expect(await due(s.as.sitter)).toEqual([]);
    expect((await s.as.sitter.get(`/api/due?apiaryId=${s.ids.orchardRow}`)).status).toBe(403);
    expect((await s.as.sitter.post(`/api/tasks/${enc(key)}/done`).send({})).status).toBe(403);
    s.clock.set(NOW);
  });

  it('follows edits, deletes and renames made straight in the database (the cache is keyed by trigger-set stamps)', async () => {
    const db = s.testDb.db;
    const extra = await addHive(s, s.ids.orchardRow, 'Test Elm');
    const count = await w.miteCount(extra, '2026-06-06', { mites: 15, beesSampled: 300 });
    const rules = async () => (await due(s.as.keeper, `?hiveId=${extra}&days=60`)).map((t) => t.rule).sort();
    expect(await rules()).toEqual(['next-inspection', 'treat-varroa']);
    await db.update(miteCounts).set({ mites: 1 }).where(eq(miteCounts.id, count)); // 1 in 300: low (§3)
    expect(await rules()).toEqual(['next-inspection']);
    const check = await w.inspection(extra, '2026-06-07', { queenCells: [{ kind: 'swarm', count: 1, capped: true }] });
    expect(await rules()).toEqual(['new-queen-laying-check', 'queen-cells-visit']);
    await db.delete(inspections).where(eq(inspections.id, check));
    expect(await rules()).toEqual(['next-inspection']);
    await db.update(hives).set({ name: 'Test Elm II' }).where(eq(hives.id, extra));
    expect((await due(s.as.keeper, `?hiveId=${extra}`))[0]!.title).toMatch(/Test Elm II/);
  });

  it('dueForApiary returns what falls due in a window, for the Handover brief', async () => {
    const list = await dueForApiary(s.ctx, s.ids.orchardRow, { from: '2026-06-11', to: '2026-06-20' });
    expect(list.length).toBeGreaterThan(0);
    expect(list.every((t) => t.apiaryId === s.ids.orchardRow && t.dueDate >= '2026-06-11' && t.dueDate <= '2026-06-20')).toBe(true);
    expect(list.some((t) => t.key === `queen-cells-visit:${h.birch}:${rec.birchCheck}`)).toBe(true);
    const withOverdue = await dueForApiary(s.ctx, s.ids.orchardRow, { from: '2026-06-11', to: '2026-06-20', includeOverdue: true });
    expect(withOverdue.some((t) => t.key === `treatment-end:${h.cedar}:${rec.cedarTreatment}`)).toBe(true);
  });
});
