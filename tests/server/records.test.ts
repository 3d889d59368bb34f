/**
 * Hive and apiary records on PostgreSQL: validation (400, nothing stored), reading, editing with
 * versions (409), deleting, roles and the audit trail.
 */
import request from 'supertest';
import { and, count, eq } from 'drizzle-orm';
import { auditLog, feedings, inspections, miteCounts, treatments } from '../../db/schema';
import { RECORD_KIND_PATHS } from '../../shared/schemas/records';
import { startDemoServer, type DemoServer } from '../helpers/server';

// Booting a seeded demo server can pass 5 s on a loaded 2-core machine; the tests themselves are quick.
jest.setTimeout(30_000);

const DAY = 86_400_000;

describe('hive records', () => {
  let s: DemoServer;
  let ash: string; // deep 10 + deep 10 + medium 10 = 30 frames (demo seed)
  let elder: string; // one deep of 10 frames (demo seed)
  let orchard: string;

  beforeAll(async () => {
    s = await startDemoServer();
    ash = s.ids.hives.Ash!;
    elder = s.ids.hives.Elder!;
    orchard = s.ids.orchardRow;
  });
  afterAll(() => s.close());

  const quickCheck = (over: Record<string, unknown> = {}) => ({
    framesBrood: 6,
    framesBees: 9.5,
    honeyFrames: 3,
    pollenFrames: 1.5,
    queenStatus: 'eggs-seen',
    eggsSeen: true,
    temperament: 2,
    ...over,
  });
  const rows = async (table: typeof inspections | typeof feedings | typeof treatments | typeof miteCounts) =>
    (await s.testDb.db.select({ n: count() }).from(table))[0]!.n;

  describe('validation: 400 with a keeper message, nothing stored', () => {
    const cases: [string, string, Record<string, unknown>, string, RegExp][] = [
      ['a negative frame count', 'inspections', quickCheck({ framesBees: -1 }), 'framesBees', /cannot be below 0/],
      ['a frame count that is not a half step', 'inspections', quickCheck({ framesBrood: 3.3 }), 'framesBrood', /whole or half frames/],
      ['an unknown queen status', 'inspections', quickCheck({ queenStatus: 'happy' }), 'queenStatus', /Choose the queen status/],
      ['an unknown disease sign', 'inspections', quickCheck({ diseaseSigns: ['mystery'] }), 'diseaseSigns.0', /Choose/],
      ['temperament 6', 'inspections', quickCheck({ temperament: 6 }), 'temperament', /1 \(calm\) to 5 \(very defensive\)/],
      ['a note over 280 characters', 'inspections', quickCheck({ note: 'x'.repeat(281) }), 'note', /at most 280/],
      ['a missing field (queen status)', 'inspections', quickCheck({ queenStatus: undefined }), 'queenStatus', /Choose the queen status/],
      ['an extra field', 'inspections', quickCheck({ colour: 'blue' }), '_', /not expected here: colour/],
      ['no eggs or brood, yet eggs seen', 'inspections', quickCheck({ queenStatus: 'no-eggs-or-brood' }), 'queenStatus', /no eggs or young brood/],
      ['syrup without ratio, basis or amount', 'feedings', { kind: 'syrup' }, 'ratio', /ratio/],
      ['fondant in litres', 'feedings', { kind: 'fondant', amountL: 2 }, 'amountKg', /in kg/],
      ['a negative syrup amount', 'feedings', { kind: 'syrup', ratio: '1:1', basis: 'weight', amountL: -2 }, 'amountL', /more than 0/],
      ['more mites than bees sampled', 'mite-counts', { method: 'alcohol-wash', beesSampled: 300, mites: 301 }, 'mites', /more mites than bees/],
      ['a negative mite count', 'mite-counts', { method: 'sugar-roll', beesSampled: 300, mites: -1 }, 'mites', /cannot be below 0/],
      ['a sticky board without days', 'mite-counts', { method: 'sticky-board', mites: 40 }, 'days', /days it was in/],
      ['an unknown mite method', 'mite-counts', { method: 'guess', mites: 4 }, 'method', /Choose the method/],
      ['a harvest of nothing', 'harvests', { supers: 0, frames: 0 }, 'frames', /at least one super or one frame/],
      ['an unknown queen event', 'queen-events', { kind: 'crowned' }, 'kind', /Choose what happened to the queen/],
      ['a colony event naming itself', 'colony-events', { kind: 'swarmed', otherHiveId: '00000000-0000-4000-8000-000000000000' }, 'otherHiveId', /Only a split or a combine/],
    ];

    it.each(cases)('rejects %s', async (_name, seg, payload, field, message) => {
      const before = await s.testDb.db.select({ n: count() }).from(auditLog);
      const res = await s.as.keeper.post(`/api/hives/${ash}/${seg}`).send(payload);
      expect(res.status).toBe(400);
      expect(res.body.error.code).toBe('invalid');
      expect(res.body.error.fields[field]).toMatch(message);
      expect(res.body.error.message).not.toMatch(/Invalid input|expected (string|number|nonoptional)/);
      const after = await s.testDb.db.select({ n: count() }).from(auditLog);
      expect(after[0]!.n).toBe(before[0]!.n);
    });

    it('rejects more frames than the hive’s boxes hold (Elder: one 10-frame deep)', async () => {
      const n = await rows(inspections);
      const res = await s.as.keeper.post(`/api/hives/${elder}/inspections`).send(quickCheck({ framesBees: 10.5 }));
      expect(res.status).toBe(400);
      expect(res.body.error.fields.framesBees).toBe('Frames covered with bees (10.5) is more than this hive’s boxes hold (10 frames).');
      expect(await rows(inspections)).toBe(n);
      // Exactly full is allowed.
      expect((await s.as.keeper.post(`/api/hives/${elder}/inspections`).send(quickCheck({ framesBees: 10 }))).status).toBe(201);
    });

    it('rejects a visit more than a day in the future, by the server’s clock', async () => {
      const n = await rows(inspections);
      const tooLate = new Date(s.clock.now.getTime() + DAY + 60_000).toISOString();
      const res = await s.as.keeper.post(`/api/hives/${ash}/inspections`).send(quickCheck({ occurredAt: tooLate }));
      expect(res.status).toBe(400);
      expect(res.body.error.message).toBe('The visit time cannot be more than a day in the future.');
      expect(await rows(inspections)).toBe(n);
      const justInside = new Date(s.clock.now.getTime() + DAY - 60_000).toISOString();
      expect((await s.as.keeper.post(`/api/hives/${ash}/inspections`).send(quickCheck({ occurredAt: justInside }))).status).toBe(201);
    });

    it('rejects a treatment ending before it starts, and one without its batch number', async () => {
      const n = await rows(treatments);
      const base = { activeIngredient: 'oxalic-acid', method: 'dribble', dose: 'As on the label', batch: 'L123', startDate: '2026-11-20' };
      const ends = await s.as.keeper.post(`/api/hives/${ash}/treatments`).send({ ...base, actualEndDate: '2026-11-19' });
      expect(ends.status).toBe(400);
      expect(ends.body.error.fields.actualEndDate).toBe('The treatment cannot end before it starts.');
      const noBatch = await s.as.keeper.post(`/api/hives/${ash}/treatments`).send({ ...base, batch: '  ' });
      expect(noBatch.status).toBe(400);
      expect(noBatch.body.error.fields.batch).toMatch(/batch or lot number .* is required/);
      expect(await rows(treatments)).toBe(n);
    });

    it('rejects a body that is not JSON, and a season that is not a year', async () => {
      const bad = await s.as.keeper.post(`/api/hives/${ash}/inspections`).set('Content-Type', 'application/json').send('{"framesBrood":');
      expect(bad.status).toBe(400);
      const season = await s.as.keeper.get(`/api/hives/${ash}/inspections?season=last`);
      expect(season.status).toBe(400);
      expect(season.body.error.message).toBe('The season must be a year, like 2026.');
    });
  });

  describe('create, read, list', () => {
    it('stores a Quick check with who recorded it, its defaults and its cautions', async () => {
      const occurredAt = new Date(s.clock.now.getTime() - 2 * 3_600_000).toISOString();
      const res = await s.as.cokeeper
        .post(`/api/hives/${ash}/inspections`)
        .send(quickCheck({ occurredAt, diseaseSigns: ['suspected-foulbrood'], queenCells: [{ kind: 'swarm', count: 3, capped: true }] }));
      expect(res.status).toBe(201);
      const dto = res.body.inspection;
      expect(dto).toMatchObject({
        recordKind: 'inspection',
        hiveId: ash,
        apiaryId: orchard,
        occurredAt,
        framesBrood: 6,
        framesBees: 9.5,
        youngLarvaeSeen: false,
        spaceActions: [],
        weather: null,
        note: '',
        version: 1,
        createdBy: { name: 'Idris Penrose' },
        cautions: ['notifiable-disease'],
      });
      const got = await s.as.mentor.get(`/api/inspections/${dto.id}`);
      expect(got.status).toBe(200);
      expect(got.body.inspection).toEqual(dto);
    });

    it('derives the mite sample and the dish verdict the trade uses', async () => {
      // No bee count: the standard ½-cup sample of about 300 bees (Lee et al. 2010; Oliver 2020; TRADE-REFERENCES §3).
      const wash = await s.as.keeper.post(`/api/hives/${ash}/mite-counts`).send({ method: 'alcohol-wash', mites: 9 });
      expect(wash.status).toBe(201);
      expect(wash.body.miteCount).toMatchObject({ beesSampled: 300, mites: 9, days: null });
      // A dish emptied in 20 min is a dearth (common practice, ≤ 30 min; TRADE-REFERENCES §9).
      const dish = await s.as.keeper.post(`/api/apiaries/${orchard}/forage-checks`).send({ minutesToEmpty: 20 });
      expect(dish.status).toBe(201);
      expect(dish.body.forageCheck).toMatchObject({ hiveId: null, apiaryId: orchard, judgement: 'dearth', cautions: ['robbing'] });
    });

    it('returns the acid cautions on an oxalic vapour treatment (label governs, TRADE-REFERENCES §4)', async () => {
      const res = await s.as.keeper.post(`/api/hives/${ash}/treatments`).send({
        activeIngredient: 'oxalic-acid',
        method: 'vaporisation',
        dose: 'As on the label',
        batch: 'OX-2611',
        startDate: '2026-11-28',
        plannedEndDate: '2026-11-28',
      });
      expect(res.status).toBe(201);
      expect(res.body.treatment).toMatchObject({ supersOff: true, batch: 'OX-2611', cautions: ['acid-treatment', 'oxalic-vapour', 'treatment-supers'] });
    });

    it('lists newest first and filters by season (calendar year)', async () => {
      const at = (iso: string) => s.as.keeper.post(`/api/hives/${elder}/queen-events`).send({ kind: 'seen', occurredAt: iso });
      await at('2025-06-01T10:00:00Z');
      await at('2026-05-01T10:00:00Z');
      await at('2026-07-01T10:00:00Z');
      const all = await s.as.sitter.get(`/api/hives/${elder}/queen-events`);
      expect(all.status).toBe(200);
      const times = all.body.records.map((r: { occurredAt: string }) => r.occurredAt);
      expect(times).toEqual([...times].sort().reverse());
      const season = await s.as.keeper.get(`/api/hives/${elder}/queen-events?season=2025`);
      expect(season.body.records.map((r: { occurredAt: string }) => r.occurredAt)).toEqual(['2025-06-01T10:00:00.000Z']);
      const last = await s.as.keeper.get(`/api/hives/${elder}/queen-events?limit=1`);
      expect(last.body.records).toHaveLength(1);
      expect(last.body.records[0].occurredAt).toBe(times[0]);
      expect((await s.as.keeper.get(`/api/hives/${elder}/queen-events?limit=0`)).status).toBe(400);
    });

    it('writes an audit row for a create, an edit and a delete, in the record’s apiary', async () => {
      const created = await s.as.keeper.post(`/api/hives/${ash}/feedings`).send({ kind: 'syrup', ratio: '2:1', basis: 'weight', amountL: 4, feederType: 'top-feeder' });
      expect(created.status).toBe(201);
      const id = created.body.feeding.id;
      const edited = await s.as.keeper.patch(`/api/feedings/${id}`).send({ version: 1, amountL: 5 });
      expect(edited.status).toBe(200);
      expect((await s.as.keeper.delete(`/api/feedings/${id}`)).status).toBe(204);
      const trail = await s.testDb.db.select().from(auditLog).where(and(eq(auditLog.entity, 'feeding'), eq(auditLog.entityId, id)));
      expect(trail.map((r) => r.action).sort()).toEqual(['create', 'delete', 'update']);
      expect(trail.every((r) => r.apiaryId === orchard)).toBe(true);
      expect(trail.find((r) => r.action === 'update')!.changes).toEqual({ amountL: [4, 5] });
      expect((await s.as.keeper.get(`/api/feedings/${id}`)).status).toBe(404);
    });
  });

  describe('edits carry a version', () => {
    it('answers 409 with the current record on a stale edit, and never overwrites', async () => {
      const c = await s.as.keeper.post(`/api/hives/${ash}/harvests`).send({ supers: 2, weightKg: 21.5, moisturePercent: 17.4 });
      const id = c.body.harvest.id;
      const first = await s.as.cokeeper.patch(`/api/harvests/${id}`).send({ version: 1, weightKg: 22 });
      expect(first.status).toBe(200);
      expect(first.body.harvest).toMatchObject({ version: 2, weightKg: 22, updatedBy: { name: 'Idris Penrose' }, createdBy: { name: 'Rowan Hale' } });
      const stale = await s.as.keeper.patch(`/api/harvests/${id}`).send({ version: 1, weightKg: 30 });
      expect(stale.status).toBe(409);
      expect(stale.body.error.code).toBe('conflict');
      expect(stale.body.current).toMatchObject({ id, version: 2, weightKg: 22 });
      expect((await s.as.keeper.get(`/api/harvests/${id}`)).body.harvest.weightKg).toBe(22);
    });

    it('needs the version, re-checks the whole record, and clears a field with null', async () => {
      const c = await s.as.keeper.post(`/api/hives/${ash}/feedings`).send({ kind: 'syrup', ratio: '1:1', basis: 'volume', amountL: 3 });
      const id = c.body.feeding.id;
      const noVersion = await s.as.keeper.patch(`/api/feedings/${id}`).send({ amountL: 4 });
      expect(noVersion.status).toBe(400);
      expect(noVersion.body.error.fields.version).toBe('The edit needs the version of the record it was based on.');
      // Turning syrup into fondant without clearing the syrup fields would leave a record that could not be created.
      const half = await s.as.keeper.patch(`/api/feedings/${id}`).send({ version: 1, kind: 'fondant', amountKg: 1 });
      expect(half.status).toBe(400);
      const whole = await s.as.keeper.patch(`/api/feedings/${id}`).send({ version: 1, kind: 'fondant', amountKg: 1, ratio: null, basis: null, amountL: null });
      expect(whole.status).toBe(200);
      expect(whole.body.feeding).toMatchObject({ kind: 'fondant', amountKg: 1, ratio: null, amountL: null, version: 2 });
      const frames = await s.as.keeper.post(`/api/hives/${elder}/inspections`).send(quickCheck());
      const tooMany = await s.as.keeper.patch(`/api/inspections/${frames.body.inspection.id}`).send({ version: 1, framesBees: 11 });
      expect(tooMany.status).toBe(400);
      expect(tooMany.body.error.fields.framesBees).toMatch(/more than this hive’s boxes hold \(10 frames\)/);
    });
    it('judges a Forage check again when its dish reading is edited (≤ 30 min = dearth, common practice; TRADE-REFERENCES §9)', async () => {
      const c = await s.as.keeper.post(`/api/apiaries/${orchard}/forage-checks`).send({ minutesToEmpty: 20 });
      expect(c.body.forageCheck.judgement).toBe('dearth');
      const e = await s.as.keeper.patch(`/api/forage-checks/${c.body.forageCheck.id}`).send({ version: 1, minutesToEmpty: 50 });
      expect(e.status).toBe(200);
      expect(e.body.forageCheck).toMatchObject({ minutesToEmpty: 50, judgement: 'some' });
    });
  });

  describe('who may do what', () => {
    type Actor = 'keeper' | 'cokeeper' | 'sitter' | 'mentor' | 'stranger' | 'signedOut';
    const agent = (a: Actor) => (a === 'signedOut' ? request(s.app) : s.as[a]);
    const treatment = { activeIngredient: 'thymol', method: 'gel', dose: 'As on the label', batch: 'TH-1', startDate: '2026-11-01' };

    // [actor, POST Quick check, POST feeding, POST treatment, GET list] at Orchard Row
    const matrix: [Actor, number, number, number, number][] = [
      ['keeper', 201, 201, 201, 200],
      ['cokeeper', 201, 201, 201, 200],
      ['sitter', 201, 201, 403, 200],
      ['mentor', 403, 403, 403, 200],
      ['stranger', 404, 404, 404, 404],
      ['signedOut', 401, 401, 401, 401],
    ];
    it.each(matrix)('%s: Quick check %i, feeding %i, treatment %i, list %i', async (actor, check, feed, treat, list) => {
      expect((await agent(actor).post(`/api/hives/${ash}/inspections`).send(quickCheck())).status).toBe(check);
      expect((await agent(actor).post(`/api/hives/${ash}/feedings`).send({ kind: 'fondant', amountKg: 1 })).status).toBe(feed);
      expect((await agent(actor).post(`/api/hives/${ash}/treatments`).send(treatment)).status).toBe(treat);
      expect((await agent(actor).get(`/api/hives/${ash}/treatments`)).status).toBe(list);
    });

    it('lets a sitter record a Forage check, but not a mite count, harvest or queen event', async () => {
      expect((await s.as.sitter.post(`/api/apiaries/${orchard}/forage-checks`).send({ judgement: 'some' })).status).toBe(201);
      expect((await s.as.sitter.post(`/api/hives/${ash}/mite-counts`).send({ method: 'sugar-roll', mites: 2 })).status).toBe(403);
      expect((await s.as.sitter.post(`/api/hives/${ash}/harvests`).send({ frames: 2 })).status).toBe(403);
      expect((await s.as.sitter.post(`/api/hives/${ash}/queen-events`).send({ kind: 'seen' })).status).toBe(403);
      // Quarry Hill is not the sitter's site: not revealed.
      expect((await s.as.sitter.post(`/api/hives/${s.ids.hives.Granite}/inspections`).send(quickCheck())).status).toBe(404);
    });

    it('lets a sitter edit her own Quick check but not edit or delete the keeper’s', async () => {
      const keepers = (await s.as.keeper.post(`/api/hives/${ash}/inspections`).send(quickCheck())).body.inspection;
      expect((await s.as.sitter.patch(`/api/inspections/${keepers.id}`).send({ version: 1, temperament: 3 })).status).toBe(403);
      expect((await s.as.sitter.delete(`/api/inspections/${keepers.id}`)).status).toBe(403);
      const own = (await s.as.sitter.post(`/api/hives/${ash}/inspections`).send(quickCheck())).body.inspection;
      expect(own.createdBy.name).toBe('Maren Clough');
      expect((await s.as.sitter.patch(`/api/inspections/${own.id}`).send({ version: 1, temperament: 3 })).status).toBe(200);
      // The co-keeper may edit and delete the sitter's record (record:edit-others / record:delete-others).
      expect((await s.as.cokeeper.patch(`/api/inspections/${own.id}`).send({ version: 2, temperament: 4 })).status).toBe(200);
      expect((await s.as.cokeeper.delete(`/api/inspections/${own.id}`)).status).toBe(204);
    });

    it('keeps the viewer read-only and strangers out of single records', async () => {
      const rec = (await s.as.keeper.post(`/api/hives/${ash}/colony-events`).send({ kind: 'split-to', otherHiveId: elder })).body.colonyEvent;
      expect(rec.otherHiveId).toBe(elder);
      expect((await s.as.mentor.get(`/api/colony-events/${rec.id}`)).status).toBe(200);
      expect((await s.as.mentor.patch(`/api/colony-events/${rec.id}`).send({ version: 1, note: 'x' })).status).toBe(403);
      expect((await s.as.mentor.delete(`/api/colony-events/${rec.id}`)).status).toBe(403);
      for (const call of [
        s.as.stranger.get(`/api/colony-events/${rec.id}`),
        s.as.stranger.patch(`/api/colony-events/${rec.id}`).send({ version: 1, note: 'x' }),
        s.as.stranger.delete(`/api/colony-events/${rec.id}`),
      ]) {
        const res = await call;
        expect(res.status).toBe(404);
        expect(res.body.error.message).toBe('That record was not found.');
      }
      expect((await request(s.app).get(`/api/colony-events/${rec.id}`)).status).toBe(401);
      expect((await s.as.keeper.get('/api/colony-events/not-a-uuid')).status).toBe(404);
      // A record id of another kind is not found under this kind.
      expect((await s.as.keeper.get(`/api/feedings/${rec.id}`)).status).toBe(404);
    });

    it('does not let a split name a hive the person cannot see', async () => {
      const strangerHives = await s.as.stranger.get('/api/apiaries');
      const elsewhere = strangerHives.body.apiaries[0].id;
      const h = await s.as.stranger.post(`/api/apiaries/${elsewhere}/hives`).send({ name: 'Far', boxes: [{ size: 'deep', frames: 10 }] });
      const res = await s.as.keeper.post(`/api/hives/${ash}/colony-events`).send({ kind: 'split-to', otherHiveId: h.body.hive.id });
      expect(res.status).toBe(400);
      expect(res.body.error.fields.otherHiveId).toBe('The other hive was not found among your hives.');
    });
  });

  it('serves every record kind at the paths RECORD_KIND_PATHS names', async () => {
    for (const [kind, seg] of Object.entries(RECORD_KIND_PATHS)) {
      const path = kind === 'forage-check' ? `/api/apiaries/${orchard}/${seg}` : `/api/hives/${ash}/${seg}`;
      const res = await s.as.keeper.get(path);
      expect([kind, res.status]).toEqual([kind, 200]);
      expect(Array.isArray(res.body.records)).toBe(true);
    }
  });
});
