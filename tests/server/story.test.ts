/**
 * The Hive story over HTTP on PostgreSQL: records written straight into the tables come back in
 * order, with what changed since the previous check and the dates that follow from them.
 * Derived dates name their source in TRADE-REFERENCES.md.
 */
import request from 'supertest';
import { eq } from 'drizzle-orm';
import { forageChecks, harvests } from '../../db/schema';
import type { StoryDto, StoryItemDto } from '../../shared/schemas/story';
import { addHive, recordWriter, startDueServer, type DueServer } from '../helpers/due-fixtures';

describe('GET /api/hives/:hiveId/story', () => {
  let s: DueServer;
  let hive = '';
  let quarryHive = '';
  const ids: Record<string, string> = {};
  const story = async (agent: request.Agent, q = ''): Promise<StoryDto> => {
    const res = await agent.get(`/api/hives/${hive}/story${q}`);
    expect(res.status).toBe(200);
    return res.body.story;
  };
  const item = (st: StoryDto, id: string): StoryItemDto => st.items.find((i) => i.id === id)!;

  beforeAll(async () => {
    s = await startDueServer('2026-08-20T09:00:00Z');
    hive = await addHive(s, s.ids.orchardRow, 'Story Rowan');
    quarryHive = await addHive(s, s.ids.quarryHill, 'Story Slate');
    const keeper = recordWriter(s, s.ids.users.keeper);
    const co = recordWriter(s, s.ids.users.cokeeper);
    // The season before: its last check and count are the baseline of the first deltas.
    ids.lastYearCheck = await keeper.inspection(hive, '2025-09-20', { framesBrood: 3 });
    ids.lastYearCount = await keeper.miteCount(hive, '2025-09-20', { mites: 13, beesSampled: 317 }); // 4.1 per 100
    ids.check1 = await keeper.inspection(hive, '2026-05-02', { framesBrood: 4, framesBees: 8, honeyFrames: 2 });
    ids.check2 = await co.inspection(hive, '2026-05-09', {
      framesBrood: 6,
      framesBees: 9,
      honeyFrames: 2,
      queenCells: [{ kind: 'swarm', count: 3, capped: true }],
      temperament: 2,
    });
    ids.feed = await keeper.feeding(hive, '2026-05-03', { ratio: '1:1', basis: 'weight', amountL: 3.785411784 });
    ids.queen = await keeper.queenEvent(hive, '2026-05-20', 'introduced-caged');
    ids.treatment = await keeper.treatment(hive, '2026-08-01', { activeIngredient: 'thymol', supersOff: true, plannedEndDate: '2026-09-12', productName: 'Example thymol gel' });
    ids.count = await keeper.miteCount(hive, '2026-07-15', { mites: 4, beesSampled: 333 }); // 1.2 per 100
    ids.harvest = await keeper.harvest(hive, '2026-07-20', { moisturePercent: 17.5 });
    ids.forage = await keeper.forageCheck(s.ids.orchardRow, '2026-07-25', { minutesToEmpty: 20, judgement: 'dearth' });
    ids.other = await keeper.forageCheck(s.ids.quarryHill, '2026-07-25');
    await keeper.inspection(quarryHive, '2026-05-02');
  });
  afterAll(() => s.close());

  it('lists every record of the season in order, who recorded it, and the apiary’s forage checks', async () => {
    const st = await story(s.as.keeper);
    expect(st).toMatchObject({ hiveName: 'Story Rowan', apiaryName: 'Orchard Row', season: 2026, from: '2026-01-01', to: '2027-01-01', seasons: [2026, 2025] });
    // The demo season adds Orchard Row's own Forage checks to every hive's story there; compare this test's records.
    const mine = st.items.filter((i) => Object.values(ids).includes(i.id));
    expect(mine.map((i) => i.id)).toEqual([ids.check1, ids.feed, ids.check2, ids.queen, ids.count, ids.harvest, ids.forage, ids.treatment]);
    expect(mine.map((i) => i.kind)).toEqual(['inspection', 'feeding', 'inspection', 'queen-event', 'mite-count', 'harvest', 'forage-check', 'treatment']);
    expect(st.items.filter((i) => !mine.includes(i)).every((i) => i.kind === 'forage-check')).toBe(true);
    expect(item(st, ids.check2).recordedBy).toEqual({ id: s.ids.users.cokeeper, name: 'Idris Penrose' });
    expect(item(st, ids.forage).scope).toBe('apiary');
    expect(st.items.every((i) => Array.isArray(i.photos))).toBe(true);
    const dates = st.items.map((i) => i.occurredAt);
    expect([...dates].sort()).toEqual(dates);
  });

  it('says what changed since the previous check, across the season boundary', async () => {
    const st = await story(s.as.keeper);
    expect(item(st, ids.check1).changes.map((c) => c.text)).toContain('Brood frames +1');
    const c2 = item(st, ids.check2).changes.map((c) => c.text);
    expect(c2).toEqual(expect.arrayContaining(['Brood frames +2', 'Frames of bees +1']));
    expect(c2.some((t) => t.startsWith('Honey frames'))).toBe(false);
    // BEEBOOK (Dietemann et al. 2013): mites ÷ bees × 100 → 13/317 = 4.1, 4/333 = 1.2.
    expect(item(st, ids.count).changes.map((c) => c.text)).toEqual(['Mites per 100 bees 4.1 → 1.2']);
  });

  it('gives the dates that follow: emergence from capped cells, the caged queen’s checks, the mite recount', async () => {
    const st = await story(s.as.keeper);
    const check2 = item(st, ids.check2).derivedDates;
    // TRADE-REFERENCES §1 (W. Shaw, Welsh BKA): a queen emerges 8 days after sealing → by 17 May.
    expect(check2).toEqual(expect.arrayContaining([expect.objectContaining({ label: 'A queen could emerge by', date: '2026-05-17' })]));
    // §1 (Britannica; BEE-L 1997): release check after 3–5 days → 23 May; eggs about a week after release.
    const q = item(st, ids.queen).derivedDates;
    expect(q[0]).toMatchObject({ label: 'Check she is released', date: '2026-05-23' });
    expect(q[1]).toMatchObject({ date: '2026-05-30' });
    // §3 (retailer instructions): mite recount 10–14 days after the planned end, 12 Sept → 22 Sept.
    const t = item(st, ids.treatment);
    expect(t.derivedDates).toEqual(expect.arrayContaining([expect.objectContaining({ label: 'Count mites again', date: '2026-09-22' })]));
    expect(t.cautions.join(' ')).toMatch(/label/);
    // §2b: one US gallon of 1:1 syrup holds 2.33 kg of sugar (derived from CRC ρ = 1.2295).
    expect(item(st, ids.feed).facts.join(' ')).toMatch(/2\.3 kg of sugar/);
    // §7: 17.5 % water is within the EU limit of 20 %.
    expect(item(st, ids.harvest).facts.join(' ')).toMatch(/within the EU limit of 20 %/);
  });

  it('reads another season with ?season=, and refuses a bad one', async () => {
    const last = await story(s.as.keeper, '?season=2025');
    expect(last.items.map((i) => i.id).sort()).toEqual([ids.lastYearCheck, ids.lastYearCount].sort());
    expect((await story(s.as.keeper, '?season=2019')).items).toEqual([]);
    expect((await s.as.keeper.get(`/api/hives/${hive}/story?season=last`)).status).toBe(400);
    expect((await s.as.keeper.get(`/api/hives/${hive}/story?season=2026&x=1`)).status).toBe(400);
  });

  it('shows a record written after the story was read (the cache follows trigger-set stamps, forage checks included)', async () => {
    const before = await story(s.as.keeper);
    const w = recordWriter(s, s.ids.users.keeper);
    const harvest = await w.harvest(hive, '2026-08-10', { weightKg: 9 });
    const forage = await w.forageCheck(s.ids.orchardRow, '2026-08-11', { judgement: 'flow', minutesToEmpty: null });
    const after = await story(s.as.keeper);
    expect(after.items.length).toBe(before.items.length + 2);
    expect(after.items.map((i) => i.id)).toEqual(expect.arrayContaining([harvest, forage]));
    await s.testDb.db.delete(harvests).where(eq(harvests.id, harvest));
    await s.testDb.db.delete(forageChecks).where(eq(forageChecks.id, forage));
    expect((await story(s.as.keeper)).items.map((i) => i.id)).toEqual(before.items.map((i) => i.id));
  });

  it('access: members read it; the sitter only on their site; strangers 404; signed out 401', async () => {
    for (const who of ['cokeeper', 'sitter', 'mentor'] as const) expect((await s.as[who].get(`/api/hives/${hive}/story`)).status).toBe(200);
    expect((await s.as.sitter.get(`/api/hives/${quarryHive}/story`)).status).toBe(404);
    expect((await s.as.stranger.get(`/api/hives/${hive}/story`)).status).toBe(404);
    expect((await s.as.keeper.get('/api/hives/00000000-0000-4000-8000-000000000000/story')).status).toBe(404);
    expect((await s.as.keeper.get('/api/hives/not-an-id/story')).status).toBe(404);
    expect((await request(s.app).get(`/api/hives/${hive}/story`)).status).toBe(401);
    s.clock.advanceDays(30);
    expect((await s.as.sitter.get(`/api/hives/${hive}/story`)).status).toBe(403);
    s.clock.set('2026-08-20T09:00:00Z');
  });
});
