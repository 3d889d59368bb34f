/**
 * The Idempotency-Key header on record creates (IETF httpapi draft "The Idempotency-Key HTTP
 * Header Field"): one record per key, the same answer on a retry, 422 for a reused key with
 * another payload, 409 while the first copy is still in flight.
 */
import { randomUUID } from 'node:crypto';
import net from 'node:net';
import type { AddressInfo } from 'node:net';
import request from 'supertest';
import { count, eq } from 'drizzle-orm';
import { auditLog, idempotencyKeys, inspections } from '../../db/schema';
import { canonicalJson } from '../../server/middleware/idempotency';
import { DEMO_PASSWORD, DEMO_USERS } from '../../db/seed';
import { startDemoServer, type DemoServer } from '../helpers/server';

// Booting a seeded demo server can pass 5 s on a loaded 2-core machine; the tests themselves are quick.
jest.setTimeout(30_000);

describe('Idempotency-Key on record creates', () => {
  let s: DemoServer;
  let ash: string;
  const check = { framesBrood: 5, framesBees: 8, queenStatus: 'queen-seen', eggsSeen: true, temperament: 1 };
  const inspectionsOfAsh = async () => (await s.testDb.db.select({ n: count() }).from(inspections).where(eq(inspections.hiveId, ash)))[0]!.n;

  beforeAll(async () => {
    s = await startDemoServer();
    ash = s.ids.hives.Ash!;
  });
  afterAll(() => s.close());

  it('stores one record for the same draft sent twice and answers the same both times', async () => {
    const key = randomUUID();
    const n = await inspectionsOfAsh();
    const first = await s.as.keeper.post(`/api/hives/${ash}/inspections`).set('Idempotency-Key', key).send(check);
    const again = await s.as.keeper.post(`/api/hives/${ash}/inspections`).set('Idempotency-Key', key).send(check);
    expect(first.status).toBe(201);
    expect(again.status).toBe(201);
    expect(again.body).toEqual(first.body);
    expect(again.headers['idempotent-replayed']).toBe('true');
    expect(await inspectionsOfAsh()).toBe(n + 1);
    const audits = await s.testDb.db.select({ n: count() }).from(auditLog).where(eq(auditLog.entityId, first.body.inspection.id));
    expect(audits[0]!.n).toBe(1);
  });

  it('replays when the first answer was lost: the client just sends again (keys in another order are the same request)', async () => {
    const key = `"${randomUUID()}"`; // the draft writes the key as a structured-field string
    const n = await inspectionsOfAsh();
    // The first answer is "lost": the client never reads it, and sends the same draft again.
    void (await s.as.keeper.post(`/api/hives/${ash}/inspections`).set('Idempotency-Key', key).send(check));
    const reordered = Object.fromEntries(Object.entries(check).reverse());
    const retry = await s.as.keeper.post(`/api/hives/${ash}/inspections`).set('Idempotency-Key', key).send(reordered);
    expect(retry.status).toBe(201);
    expect(await inspectionsOfAsh()).toBe(n + 1);
  });

  it('replays after a real lost answer: the client hung up before the server answered', async () => {
    const signIn = await request(s.app).post('/api/auth/sign-in').send({ email: DEMO_USERS.keeper.email, password: DEMO_PASSWORD });
    const cookie = String(signIn.headers['set-cookie']![0]).split(';')[0];
    const server = s.app.listen(0, '127.0.0.1');
    try {
      await new Promise((r) => server.once('listening', r));
      const { port } = server.address() as AddressInfo;
      const key = randomUUID();
      const body = JSON.stringify(check);
      const n = await inspectionsOfAsh();
      // Send the whole request, then drop the connection without reading a byte of the answer.
      await new Promise<void>((resolve, reject) => {
        const sock = net.connect(port, '127.0.0.1', () => {
          sock.write(
            `POST /api/hives/${ash}/inspections HTTP/1.1\r\nHost: 127.0.0.1\r\nContent-Type: application/json\r\n` +
              `Content-Length: ${Buffer.byteLength(body)}\r\nCookie: ${cookie}\r\nIdempotency-Key: ${key}\r\n\r\n${body}`,
            () => {
              sock.destroy();
              resolve();
            },
          );
        });
        sock.on('error', reject);
      });
      // The server still finishes the write and stores its answer.
      for (let i = 0; i < 100; i++) {
        const [row] = await s.testDb.db.select({ status: idempotencyKeys.status }).from(idempotencyKeys).where(eq(idempotencyKeys.key, key));
        if (row?.status) break;
        await new Promise((r) => setTimeout(r, 20));
      }
      const retry = await s.as.keeper.post(`/api/hives/${ash}/inspections`).set('Idempotency-Key', key).send(check);
      expect(retry.status).toBe(201);
      expect(retry.headers['idempotent-replayed']).toBe('true');
      expect(await inspectionsOfAsh()).toBe(n + 1);
    } finally {
      await new Promise((r) => server.close(r));
    }
  });

  it('answers 422 for the same key with a different payload, and stores nothing more', async () => {
    const key = randomUUID();
    const n = await inspectionsOfAsh();
    expect((await s.as.keeper.post(`/api/hives/${ash}/inspections`).set('Idempotency-Key', key).send(check)).status).toBe(201);
    const other = await s.as.keeper.post(`/api/hives/${ash}/inspections`).set('Idempotency-Key', key).send({ ...check, framesBrood: 6 });
    expect(other.status).toBe(422);
    expect(other.body.error.message).toBe('This Idempotency-Key was already used for a different request. Send a new key for new details.');
    const elsewhere = await s.as.keeper.post(`/api/hives/${s.ids.hives.Bramble}/inspections`).set('Idempotency-Key', key).send(check);
    expect(elsewhere.status).toBe(422);
    expect(await inspectionsOfAsh()).toBe(n + 1);
  });

  it('keeps each person’s keys apart', async () => {
    const key = randomUUID();
    expect((await s.as.keeper.post(`/api/hives/${ash}/inspections`).set('Idempotency-Key', key).send(check)).status).toBe(201);
    const cokeeper = await s.as.cokeeper.post(`/api/hives/${ash}/inspections`).set('Idempotency-Key', key).send(check);
    expect(cokeeper.status).toBe(201);
    expect(cokeeper.headers['idempotent-replayed']).toBeUndefined();
  });

  it('stores one record when five copies race (insert-first claim)', async () => {
    const raceKey = randomUUID();
    const n = await inspectionsOfAsh();
    const results = await Promise.all(
      Array.from({ length: 5 }, () => s.as.keeper.post(`/api/hives/${ash}/inspections`).set('Idempotency-Key', raceKey).send(check)),
    );
    const statuses = results.map((r) => r.status);
    expect(statuses.every((st) => st === 201 || st === 409)).toBe(true);
    expect(statuses).toContain(201);
    for (const r of results.filter((x) => x.status === 409)) expect(r.body.error.message).toBe('This request is already being processed. Try again in a moment.');
    expect(await inspectionsOfAsh()).toBe(n + 1);
  });

  it('answers 409 "already being processed" for an in-flight copy of the same request', async () => {
    const key = randomUUID();
    const path = `/api/hives/${ash}/inspections`;
    const first = await s.as.keeper.post(path).set('Idempotency-Key', key).send(check);
    // Turn the finished claim back into an in-flight one, as if the first copy were still running.
    await s.testDb.db.update(idempotencyKeys).set({ status: null, responseBody: null, createdAt: s.clock.now }).where(eq(idempotencyKeys.key, key));
    const busy = await s.as.keeper.post(path).set('Idempotency-Key', key).send(check);
    expect(first.status).toBe(201);
    expect(busy.status).toBe(409);
    expect(busy.body.error.code).toBe('idempotency_busy');
  });

  it('frees the key after a 400 so the fixed draft can be sent with it', async () => {
    const key = randomUUID();
    const bad = await s.as.keeper.post(`/api/hives/${ash}/inspections`).set('Idempotency-Key', key).send({ ...check, framesBees: -2 });
    expect(bad.status).toBe(400);
    const fixed = await s.as.keeper.post(`/api/hives/${ash}/inspections`).set('Idempotency-Key', key).send(check);
    expect(fixed.status).toBe(201);
  });

  it('rejects a malformed key (400) and purges keys older than 24 hours', async () => {
    const bad = await s.as.keeper.post(`/api/hives/${ash}/inspections`).set('Idempotency-Key', 'has spaces in it').send(check);
    expect(bad.status).toBe(400);
    expect(bad.body.error.message).toMatch(/Idempotency-Key header must be 1 to 255 visible characters/);

    const key = randomUUID();
    const n = await inspectionsOfAsh();
    await s.as.keeper.post(`/api/hives/${ash}/inspections`).set('Idempotency-Key', key).send(check);
    s.clock.advanceDays(1.01);
    try {
      // After 24 h the key is forgotten: the same key makes a new record.
      const later = await s.as.keeper.post(`/api/hives/${ash}/inspections`).set('Idempotency-Key', key).send(check);
      expect(later.status).toBe(201);
      expect(later.headers['idempotent-replayed']).toBeUndefined();
      expect(await inspectionsOfAsh()).toBe(n + 2);
    } finally {
      s.clock.advanceDays(-1.01);
    }
  });

  it('fingerprints JSON by content, not key order', () => {
    expect(canonicalJson({ b: 1, a: [{ d: 2, c: null }] })).toBe(canonicalJson({ a: [{ c: null, d: 2 }], b: 1 }));
    expect(canonicalJson({ a: 1 })).not.toBe(canonicalJson({ a: 2 }));
  });
});
