import request from 'supertest';
import { startDemoServer, type DemoServer } from '../helpers/server';

type Actor = 'keeper' | 'cokeeper' | 'sitter' | 'mentor' | 'stranger' | 'signedOut';

describe('apiary and hive routes for each role', () => {
  let s: DemoServer;
  let orchardHive: string;
  let quarryHive: string;
  const agent = (a: Actor) => (a === 'signedOut' ? request(s.app) : s.as[a]);

  beforeAll(async () => {
    s = await startDemoServer();
    orchardHive = s.ids.hives.Ash!;
    quarryHive = s.ids.hives.Granite!;
  });
  afterAll(() => s.close());

  it('lists each person’s apiaries: the sitter only the site they sit', async () => {
    const names = async (a: Actor) => (await agent(a).get('/api/apiaries')).body.apiaries.map((x: { name: string }) => x.name);
    expect(await names('keeper')).toEqual(['Orchard Row', 'Quarry Hill']);
    expect(await names('cokeeper')).toEqual(['Orchard Row', 'Quarry Hill']);
    expect(await names('sitter')).toEqual(['Orchard Row']);
    expect(await names('mentor')).toEqual(['Orchard Row', 'Quarry Hill']);
    expect(await names('stranger')).toEqual(['Elsewhere']);
    expect((await agent('signedOut').get('/api/apiaries')).status).toBe(401);
  });

  it('counts the demo hives: six at Orchard Row, four at Quarry Hill', async () => {
    const res = await s.as.keeper.get('/api/apiaries');
    expect(res.body.apiaries.map((a: { hiveCount: number }) => a.hiveCount)).toEqual([6, 4]);
  });

  // [actor, GET apiary, PATCH apiary, GET hives, POST hive, GET hive, PATCH hive] on Orchard Row
  const orchardMatrix: [Actor, number, number, number, number, number, number][] = [
    ['keeper', 200, 200, 200, 201, 200, 200],
    ['cokeeper', 200, 200, 200, 201, 200, 200],
    ['sitter', 200, 403, 200, 403, 200, 403],
    ['mentor', 200, 403, 200, 403, 200, 403],
    ['stranger', 404, 404, 404, 404, 404, 404],
    ['signedOut', 401, 401, 401, 401, 401, 401],
  ];

  it.each(orchardMatrix)('%s on Orchard Row: %i %i %i %i %i %i', async (actor, getA, patchA, listH, postH, getH, patchH) => {
    const a = s.ids.orchardRow;
    expect((await agent(actor).get(`/api/apiaries/${a}`)).status).toBe(getA);
    expect((await agent(actor).patch(`/api/apiaries/${a}`).send({ climateNote: `edited by ${actor}` })).status).toBe(patchA);
    expect((await agent(actor).get(`/api/apiaries/${a}/hives`)).status).toBe(listH);
    const created = await agent(actor)
      .post(`/api/apiaries/${a}/hives`)
      .send({ name: `New by ${actor}`, boxes: [{ size: 'deep', frames: 10 }] });
    expect(created.status).toBe(postH);
    expect((await agent(actor).get(`/api/hives/${orchardHive}`)).status).toBe(getH);
    expect((await agent(actor).patch(`/api/hives/${orchardHive}`).send({ note: `by ${actor}` })).status).toBe(patchH);
  });

  it('hides the other site from the sitter (404), not just forbids it', async () => {
    expect((await s.as.sitter.get(`/api/apiaries/${s.ids.quarryHill}`)).status).toBe(404);
    expect((await s.as.sitter.get(`/api/hives/${quarryHive}`)).status).toBe(404);
  });

  it('answers 404 for unknown and malformed ids', async () => {
    expect((await s.as.keeper.get('/api/hives/00000000-0000-4000-8000-000000000000')).status).toBe(404);
    expect((await s.as.keeper.get('/api/hives/not-an-id')).status).toBe(404);
    expect((await s.as.keeper.get('/api/apiaries/123')).status).toBe(404);
    expect((await s.as.keeper.get('/api/no-such-route')).status).toBe(404);
  });

  it('creates a hive with its boxes and queen, and reads it back', async () => {
    const res = await s.as.keeper.post(`/api/apiaries/${s.ids.quarryHill}/hives`).send({
      name: 'Kestrel',
      boxes: [
        { size: 'deep', frames: 10 },
        { size: 'medium', frames: 9 },
      ],
      queen: { origin: 'bought-mated', year: 2026, markColour: 'white', clipped: true },
    });
    expect(res.status).toBe(201);
    const got = await s.as.keeper.get(`/api/hives/${res.body.hive.id}`);
    expect(got.body.hive).toMatchObject({
      name: 'Kestrel',
      apiaryName: 'Quarry Hill',
      status: 'active',
      boxes: [
        { size: 'deep', frames: 10 },
        { size: 'medium', frames: 9 },
      ],
      queen: { origin: 'bought-mated', year: 2026, markColour: 'white', clipped: true, status: 'present' },
      version: 1,
    });
  });

  it.each([
    ['no name', { boxes: [{ size: 'deep', frames: 10 }] }, 'name'],
    ['no boxes', { name: 'X', boxes: [] }, 'boxes'],
    ['a box of an unknown size', { name: 'X', boxes: [{ size: 'jumbo', frames: 10 }] }, 'boxes.0.size'],
    ['a box of 40 frames', { name: 'X', boxes: [{ size: 'deep', frames: 40 }] }, 'boxes.0.frames'],
    ['an unknown status', { name: 'X', boxes: [{ size: 'deep', frames: 10 }], status: 'lost' }, 'status'],
    ['an extra field', { name: 'X', boxes: [{ size: 'deep', frames: 10 }], colour: 'blue' }, '_'],
  ])('refuses a hive with %s (400, field message, nothing stored)', async (_label, payload, field) => {
    const before = (await s.as.keeper.get(`/api/apiaries/${s.ids.quarryHill}/hives`)).body.hives.length;
    const res = await s.as.keeper.post(`/api/apiaries/${s.ids.quarryHill}/hives`).send(payload);
    expect(res.status).toBe(400);
    expect(Object.keys(res.body.error.fields)).toContain(field);
    expect(res.body.error.message.length).toBeGreaterThan(5);
    const after = (await s.as.keeper.get(`/api/apiaries/${s.ids.quarryHill}/hives`)).body.hives.length;
    expect(after).toBe(before);
  });

  it('answers a stale hive edit with 409 and the current hive', async () => {
    const hiveId = s.ids.hives.Juniper!;
    const { version } = (await s.as.keeper.get(`/api/hives/${hiveId}`)).body.hive;
    const first = await s.as.keeper.patch(`/api/hives/${hiveId}`).send({ note: 'first', version });
    expect(first.status).toBe(200);
    expect(first.body.hive.version).toBe(version + 1);
    const stale = await s.as.cokeeper.patch(`/api/hives/${hiveId}`).send({ note: 'second', version });
    expect(stale.status).toBe(409);
    expect(stale.body.current.note).toBe('first');
  });

  it('updates an apiary’s winter target and refuses a negative one', async () => {
    const ok = await s.as.keeper.patch(`/api/apiaries/${s.ids.quarryHill}`).send({ winterStoresTargetKg: 25 });
    expect(ok.body.apiary.winterStoresTargetKg).toBe(25);
    const bad = await s.as.keeper.patch(`/api/apiaries/${s.ids.quarryHill}`).send({ winterStoresTargetKg: -1 });
    expect(bad.status).toBe(400);
    expect(bad.body.error.fields.winterStoresTargetKg).toMatch(/cannot be negative/);
  });
});
