/** The demo season of records (db/seed-records.ts): modest, varied, and within the API's own rules. */
import { count, eq } from 'drizzle-orm';
import { colonyEvents, feedings, forageChecks, harvests, inspections, miteCounts, queenEvents, treatments } from '../../db/schema';
import { startDemoServer, type DemoServer } from '../helpers/server';

// Booting a seeded demo server can pass 5 s on a loaded 2-core machine; the tests themselves are quick.
jest.setTimeout(30_000);

describe('demo season of records', () => {
  let s: DemoServer;
  beforeAll(async () => {
    s = await startDemoServer();
  });
  afterAll(() => s.close());

  it('stays modest in size (a few hundred rows)', async () => {
    const db = s.testDb.db;
    type Table = typeof inspections | typeof feedings | typeof treatments | typeof miteCounts | typeof harvests | typeof queenEvents | typeof colonyEvents | typeof forageChecks;
    const n = async (t: Table) => (await db.select({ n: count() }).from(t))[0]!.n;
    const sizes = {
      inspections: await n(inspections),
      feedings: await n(feedings),
      treatments: await n(treatments),
      miteCounts: await n(miteCounts),
      harvests: await n(harvests),
      queenEvents: await n(queenEvents),
      colonyEvents: await n(colonyEvents),
      forageChecks: await n(forageChecks),
    };
    const total = Object.values(sizes).reduce((a, b) => a + b, 0);
    // Measured at the time of writing: 190 Quick checks, 270 records in all.
    expect(total).toBeGreaterThan(150);
    expect(total).toBeLessThan(500);
    for (const v of Object.values(sizes)) expect(v).toBeGreaterThan(0);
  });

  it('tells the swarm-cell episode at Clover and the split to Elder through the API', async () => {
    const clover = await s.as.keeper.get(`/api/hives/${s.ids.hives.Clover}/inspections?season=2026`);
    const capped = clover.body.records.find((r: { queenCells: { kind: string; capped: boolean }[] }) => r.queenCells.some((c) => c.kind === 'swarm' && c.capped));
    expect(capped.occurredAt.slice(0, 10)).toBe('2026-06-01');
    const events = await s.as.keeper.get(`/api/hives/${s.ids.hives.Clover}/colony-events`);
    expect(events.body.records[0]).toMatchObject({ kind: 'split-to', otherHiveId: s.ids.hives.Elder });
  });

  it('shows who recorded it: both the keeper and the co-keeper', async () => {
    const granite = await s.as.mentor.get(`/api/hives/${s.ids.hives.Granite}/inspections`);
    const names = new Set(granite.body.records.map((r: { createdBy: { name: string } }) => r.createdBy.name));
    expect(names).toEqual(new Set(['Rowan Hale', 'Idris Penrose']));
  });

  it('reads the July dearth from the dish (emptied within 30 min, common practice; TRADE-REFERENCES §9)', async () => {
    const res = await s.as.keeper.get(`/api/apiaries/${s.ids.orchardRow}/forage-checks?season=2026`);
    const july = res.body.records.find((r: { occurredAt: string }) => r.occurredAt.startsWith('2026-07-22'));
    expect(july).toMatchObject({ minutesToEmpty: 20, judgement: 'dearth', cautions: ['robbing'] });
    const treated = await s.testDb.db.select().from(treatments).where(eq(treatments.hiveId, s.ids.hives.Ash!));
    expect(treated[0]).toMatchObject({ activeIngredient: 'thymol', supersOff: true, batch: 'TG-2604-118' });
  });
});
