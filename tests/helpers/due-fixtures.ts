/**
 * A demo server on a fixed clock, with hives of its own (no demo records) and helpers that write
 * records straight into the tables with drizzle, so the Due-list and story tests stand apart from
 * the record routes. Every record here is invented test data.
 */
import request from 'supertest';
import { DEMO_USERS, seedDemo, type DemoIds } from '../../db/seed';
import {
  colonyEvents,
  feedings,
  forageChecks,
  harvests,
  hives,
  inspections,
  miteCounts,
  queenEvents,
  treatments,
} from '../../db/schema';
import type { Box } from '../../shared/domain/hives';
import { signedInAgent, startTestServer, type TestServer } from './server';

export interface DueServer extends TestServer {
  ids: DemoIds;
  as: Record<keyof typeof DEMO_USERS | 'stranger', Awaited<ReturnType<typeof signedInAgent>>>;
}

/** The demo scenario seeded with the clock at `now`, so the sitter's window sits around it. */
export async function startDueServer(now: string): Promise<DueServer> {
  const s = await startTestServer();
  s.clock.set(now);
  const ids = await seedDemo(s.testDb.db, { now: s.clock.now });
  const stranger = request.agent(s.app);
  const su = await stranger.post('/api/auth/sign-up').send({ email: 'stranger@example.test', password: 'stranger-password-1', name: 'Stranger' });
  if (su.status !== 201) throw new Error(`stranger sign-up failed: ${su.status}`);
  const as = {
    keeper: await signedInAgent(s.app, DEMO_USERS.keeper.email),
    cokeeper: await signedInAgent(s.app, DEMO_USERS.cokeeper.email),
    sitter: await signedInAgent(s.app, DEMO_USERS.sitter.email),
    mentor: await signedInAgent(s.app, DEMO_USERS.mentor.email),
    stranger,
  };
  return { ...s, ids, as };
}

const deep10: Box = { size: 'deep', frames: 10 };

export async function addHive(s: DueServer, apiaryId: string, name: string, boxes: Box[] = [deep10, deep10]): Promise<string> {
  const [h] = await s.testDb.db.insert(hives).values({ apiaryId, name, boxes }).returning({ id: hives.id });
  return h!.id;
}

const at = (date: string) => new Date(`${date}T10:00:00Z`);

export function recordWriter(s: DueServer, by: string) {
  const db = s.testDb.db;
  const common = (date: string, note = '') => ({ occurredAt: at(date), createdBy: by, note });
  return {
    inspection: async (hiveId: string, date: string, v: Partial<typeof inspections.$inferInsert> = {}) =>
      (
        await db
          .insert(inspections)
          .values({ ...common(date), hiveId, framesBrood: 5, framesBees: 8, honeyFrames: 2, queenStatus: 'eggs-seen', eggsSeen: true, ...v })
          .returning({ id: inspections.id })
      )[0]!.id,
    feeding: async (hiveId: string, date: string, v: Partial<typeof feedings.$inferInsert> = {}) =>
      (await db.insert(feedings).values({ ...common(date), hiveId, kind: 'syrup', ratio: '1:1', basis: 'weight', amountL: 4, ...v }).returning({ id: feedings.id }))[0]!.id,
    treatment: async (hiveId: string, date: string, v: Partial<typeof treatments.$inferInsert> = {}) =>
      (
        await db
          .insert(treatments)
          .values({ ...common(date), hiveId, activeIngredient: 'formic-acid', method: 'strips', startDate: date, supersOff: false, ...v })
          .returning({ id: treatments.id })
      )[0]!.id,
    miteCount: async (hiveId: string, date: string, v: Partial<typeof miteCounts.$inferInsert> = {}) =>
      (await db.insert(miteCounts).values({ ...common(date), hiveId, method: 'alcohol-wash', beesSampled: 300, mites: 3, ...v }).returning({ id: miteCounts.id }))[0]!.id,
    harvest: async (hiveId: string, date: string, v: Partial<typeof harvests.$inferInsert> = {}) =>
      (await db.insert(harvests).values({ ...common(date), hiveId, supers: 1, frames: 10, weightKg: 12, ...v }).returning({ id: harvests.id }))[0]!.id,
    queenEvent: async (hiveId: string, date: string, kind: (typeof queenEvents.$inferInsert)['kind']) =>
      (await db.insert(queenEvents).values({ ...common(date), hiveId, kind }).returning({ id: queenEvents.id }))[0]!.id,
    colonyEvent: async (hiveId: string, date: string, kind: (typeof colonyEvents.$inferInsert)['kind']) =>
      (await db.insert(colonyEvents).values({ ...common(date), hiveId, kind }).returning({ id: colonyEvents.id }))[0]!.id,
    forageCheck: async (apiaryId: string, date: string, v: Partial<typeof forageChecks.$inferInsert> = {}) =>
      (await db.insert(forageChecks).values({ ...common(date), apiaryId, judgement: 'dearth', minutesToEmpty: 20, ...v }).returning({ id: forageChecks.id }))[0]!.id,
  };
}
