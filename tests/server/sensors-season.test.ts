/**
 * Sensor CSV import, sensor readings, and the Season review's series, against a real PostgreSQL
 * with the demo scenario (whose Ash hive carries an invented hive-scale log).
 */
import { startDemoServer, type DemoServer } from '../helpers/server';

// Booting a demo database takes a few seconds on a busy machine.
jest.setTimeout(60_000);

let s: DemoServer;
beforeAll(async () => {
  s = await startDemoServer();
});
afterAll(async () => {
  await s?.close();
});

const importUrl = (hiveId: string, q: Record<string, string>) =>
  `/api/hives/${hiveId}/sensor-imports?${new URLSearchParams({ fileName: 'logger.csv', timeFormat: 'iso', ...q }).toString()}`;

describe('POST /api/hives/:hiveId/sensor-imports', () => {
  const csv = '\uFEFFTimestamp;Brood °C;Scale kg\n2025-06-01 00:00;34,6;52,10\n2025-06-01 01:00;34,7;52,05\n2025-06-01 02:00;bad;52,00\n2025-06-01 03:00;34,9;\n';

  it('imports a semicolon file with decimal commas, reports the bad line, and a second import adds nothing ("N new, M already there")', async () => {
    const hive = s.ids.hives.Bramble;
    const url = importUrl(hive, { timeColumn: 'Timestamp', temperatureColumn: 'Brood °C', weightColumn: 'Scale kg', timeZone: 'Europe/London' });
    const first = await s.as.keeper.post(url).set('Content-Type', 'text/csv').send(csv);
    expect(first.status).toBe(201);
    expect(first.body.import).toMatchObject({ rows: 4, newReadings: 3, alreadyThere: 0, badCount: 1, sameFileBefore: false });
    expect(first.body.import.bad).toEqual([{ line: 4, reason: 'temperature "bad" is not a number' }]);
    expect(first.body.import.summary).toMatch(/^3 new, 0 already there, 1 bad row skipped \(line 4/);

    const again = await s.as.cokeeper.post(url).set('Content-Type', 'text/csv').send(csv);
    expect(again.status).toBe(201);
    expect(again.body.import).toMatchObject({ newReadings: 0, alreadyThere: 3, sameFileBefore: true });
    expect(again.body.import.summary).toMatch(/^0 new, 3 already there/);

    const series = await s.as.mentor.get(`/api/hives/${hive}/sensor-readings`);
    expect(series.status).toBe(200);
    expect(series.body.series.readings).toBe(3);
    // 00:00 BST is 23:00 UTC the day before (IANA tz database: BST = UTC+1 in June).
    expect(series.body.series.points[0]).toMatchObject({ t: '2025-05-31T23:00:00.000Z', temperatureC: 34.6, weightKg: 52.1 });
  });

  it('answers 400 naming the missing column, and 400 for a file with no readable row', async () => {
    const hive = s.ids.hives.Clover;
    const missing = await s.as.keeper
      .post(importUrl(hive, { timeColumn: 'Timestamp', temperatureColumn: 'Temperature' }))
      .set('Content-Type', 'text/csv')
      .send(csv);
    expect(missing.status).toBe(400);
    expect(missing.body.error.message).toMatch(/no column called "Temperature"/);
    const none = await s.as.keeper
      .post(importUrl(hive, { timeColumn: 'Timestamp', temperatureColumn: 'Brood °C', timeFormat: 'epoch-s' }))
      .set('Content-Type', 'text/csv')
      .send(csv);
    expect(none.status).toBe(400);
    expect(none.body.badCount).toBe(4);
    const badZone = await s.as.keeper
      .post(importUrl(hive, { timeColumn: 'Timestamp', temperatureColumn: 'Brood °C', timeZone: 'Mars/Olympus' }))
      .set('Content-Type', 'text/csv')
      .send(csv);
    expect(badZone.status).toBe(400);
    const json = await s.as.keeper.post(importUrl(hive, { timeColumn: 'Timestamp' })).send({ csv });
    expect(json.status).toBe(415);
  });

  it('is for keepers and owners only: a sitter and a viewer get 403, a stranger 404, signed out 401', async () => {
    const url = importUrl(s.ids.hives.Ash, { timeColumn: 'Timestamp', temperatureColumn: 'Brood °C' });
    expect((await s.as.sitter.post(url).set('Content-Type', 'text/csv').send(csv)).status).toBe(403);
    expect((await s.as.mentor.post(url).set('Content-Type', 'text/csv').send(csv)).status).toBe(403);
    expect((await s.as.stranger.post(url).set('Content-Type', 'text/csv').send(csv)).status).toBe(404);
    const request = (await import('supertest')).default;
    expect((await request(s.app).post(url).set('Content-Type', 'text/csv').send(csv)).status).toBe(401);
  });

  it('imports 100,000 rows within 20 s (measured and printed), and again adds none', async () => {
    const lines = ['time,temperature_c,weight_kg'];
    const start = Date.UTC(2024, 0, 1);
    for (let i = 0; i < 100_000; i++) {
      lines.push(`${new Date(start + i * 5 * 60_000).toISOString()},${(34 + (i % 20) / 10).toFixed(1)},${(45 + (i % 50) / 100).toFixed(2)}`);
    }
    const body = lines.join('\n');
    const url = importUrl(s.ids.hives.Damson, { timeColumn: 'time', temperatureColumn: 'temperature_c', weightColumn: 'weight_kg' });
    const t0 = performance.now();
    const res = await s.as.keeper.post(url).set('Content-Type', 'text/csv').send(body);
    const ms = performance.now() - t0;
    // eslint-disable-next-line no-console
    console.log(`sensor import: 100,000 rows (${(body.length / 1e6).toFixed(1)} MB) uploaded, parsed and stored in ${ms.toFixed(0)} ms`);
    expect(res.status).toBe(201);
    expect(res.body.import).toMatchObject({ rows: 100_000, newReadings: 100_000, alreadyThere: 0, badCount: 0 });
    expect(ms).toBeLessThan(20_000);

    const t1 = performance.now();
    const again = await s.as.keeper.post(url).set('Content-Type', 'text/csv').send(body);
    // eslint-disable-next-line no-console
    console.log(`sensor import: the same 100,000 rows again in ${(performance.now() - t1).toFixed(0)} ms`);
    expect(again.body.import).toMatchObject({ newReadings: 0, alreadyThere: 100_000 });

    const series = await s.as.keeper.get(`/api/hives/${s.ids.hives.Damson}/sensor-readings?points=500`);
    expect(series.body.series.readings).toBe(100_000);
    expect(series.body.series.points.length).toBeLessThanOrEqual(500);
    // 100,000 five-minute readings span 347 days: 500 points need buckets of at least 16.7 h, so 24 h.
    expect(series.body.series.bucketMinutes).toBe(1440);
  }, 60_000);

  it('rejects bad query values for readings with 400', async () => {
    const res = await s.as.keeper.get(`/api/hives/${s.ids.hives.Ash}/sensor-readings?from=yesterday`);
    expect(res.status).toBe(400);
  });
});

describe('GET season', () => {
  // The season of the demo's scale log (the demo records' season).
  const seasonYear = async () => {
    const series = await s.as.keeper.get(`/api/hives/${s.ids.hives.Ash}/sensor-readings?points=10`);
    return new Date(series.body.series.from).getUTCFullYear();
  };

  it("gives Ash's season with its sensor trace, the brood-nest band and mite threshold named with their sources", async () => {
    const res = await s.as.mentor.get(`/api/hives/${s.ids.hives.Ash}/season?season=${await seasonYear()}`);
    expect(res.status).toBe(200);
    const season = res.body.season;
    expect(season.scope).toBe('hive');
    expect(season.hives).toHaveLength(1);
    const ash = season.hives[0];
    expect(ash.name).toBe('Ash');
    expect(ash.sensors.readings).toBeGreaterThan(100);
    expect(ash.sensors.points.length).toBeLessThanOrEqual(1000);
    // The invented log gains in spring and loses in the summer dearth.
    const trends = new Set(ash.sensors.weightDays.map((d: { trend: string }) => d.trend));
    if (ash.sensors.points.at(-1).t.slice(5, 7) >= '09') {
      expect(trends.has('gaining')).toBe(true);
      expect(trends.has('losing')).toBe(true);
    }
    // TRADE-REFERENCES §8 (Kleinhenz et al. 2003) and §3 (USDA-ARS / UF).
    expect(season.references).toMatchObject({ broodNestLowC: 33, broodNestHighC: 36, miteThresholdPerHundred: 3, miteThresholdSource: 'USDA-ARS / UF' });
  });

  it('gives the apiary season with every hive, and refuses strangers (404) and a bad season (400)', async () => {
    const res = await s.as.keeper.get(`/api/apiaries/${s.ids.orchardRow}/season`);
    expect(res.status).toBe(200);
    expect(res.body.season.hives.map((h: { name: string }) => h.name)).toEqual(['Ash', 'Bramble', 'Clover', 'Damson', 'Elder', 'Fennel']);
    expect((await s.as.stranger.get(`/api/apiaries/${s.ids.orchardRow}/season`)).status).toBe(404);
    expect((await s.as.keeper.get(`/api/hives/${s.ids.hives.Ash}/season?season=soon`)).status).toBe(400);
    expect((await s.as.keeper.get(`/api/hives/${s.ids.hives.Ash}/season?season=2026&extra=1`)).status).toBe(400);
  });

  it('turns records into series and totals: stores from honey frames, sugar from syrup, treatments as spans, mite loads', async () => {
    const hive = s.ids.hives.Elder;
    const year = 2025;
    const db = s.testDb.db;
    const schema = await import('../../db/schema');
    const by = s.ids.users.keeper;
    await db.insert(schema.inspections).values([
      { hiveId: hive, occurredAt: new Date('2025-05-01T10:00:00Z'), framesBrood: 4, framesBees: 7, honeyFrames: 2, queenStatus: 'queen-seen', createdBy: by },
      { hiveId: hive, occurredAt: new Date('2025-06-01T10:00:00Z'), framesBrood: 7.5, framesBees: 10, honeyFrames: 3.5, queenStatus: 'eggs-seen', createdBy: by },
    ]);
    await db.insert(schema.feedings).values([
      { hiveId: hive, occurredAt: new Date('2025-09-10T18:00:00Z'), kind: 'syrup', ratio: '2:1', basis: 'weight', amountL: 1, createdBy: by },
      { hiveId: hive, occurredAt: new Date('2025-09-20T18:00:00Z'), kind: 'fondant', amountKg: 2, createdBy: by },
    ]);
    await db.insert(schema.treatments).values({
      hiveId: hive, occurredAt: new Date('2025-08-20T09:00:00Z'), activeIngredient: 'formic-acid', method: 'strips', startDate: '2025-08-20', plannedEndDate: '2025-09-03', createdBy: by,
    });
    await db.insert(schema.miteCounts).values({ hiveId: hive, occurredAt: new Date('2025-08-15T09:00:00Z'), method: 'alcohol-wash', beesSampled: 300, mites: 12, createdBy: by });
    await db.insert(schema.harvests).values({ hiveId: hive, occurredAt: new Date('2025-07-10T09:00:00Z'), supers: 1, frames: 10, weightKg: 12.5, createdBy: by });

    const res = await s.as.keeper.get(`/api/hives/${hive}/season?season=${year}`);
    expect(res.status).toBe(200);
    const h = res.body.season.hives[0];
    // Elder is one deep: honey frames counted as deep frames, 2.7–3.6 kg each (TRADE-REFERENCES §6, derived), midpoint 3.15.
    expect(h.honeyFrameSize).toBe('deep');
    expect(h.inspections.map((i: { storesKg: number }) => i.storesKg)).toEqual([expect.closeTo(6.3, 6), expect.closeTo(11.025, 6)]);
    // 1 L of 2:1 syrup holds 0.884 kg sugar (TRADE-REFERENCES §2b, derived from CRC density 1.3265).
    expect(h.feedings[0].sugarKg).toBeCloseTo(0.884, 2);
    expect(h.feedings[1].sugarKg).toBeNull();
    expect(h.treatments[0]).toMatchObject({ start: '2025-08-20T00:00:00.000Z', end: '2025-09-04T00:00:00.000Z', ended: false });
    // 12 mites in 300 bees = 4 per 100: above the 3 per 100 threshold (BEEBOOK formula; USDA-ARS / UF threshold, §3).
    expect(h.miteCounts[0]).toMatchObject({ perHundredBees: 4, level: 'act' });
    expect(res.body.season.totals).toMatchObject({ honeyHarvestedKg: 12.5, treatments: 1, inspections: 2, peakBrood: { frames: 7.5, hiveName: 'Elder' } });
    expect(res.body.season.totals.sugarFedKg).toBeCloseTo(0.9, 5);
    expect(res.body.season.records.map((r: { kind: string }) => r.kind)).toEqual(['inspection', 'inspection', 'harvest', 'mite-count', 'treatment', 'feeding', 'feeding']);
    expect(res.body.season.records[0]).toMatchObject({ hiveName: 'Elder', recordedBy: 'Rowan Hale' });
  });
});
