/** Boots createApp() on a fresh test database, with a movable clock and signed-in agents. */
import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import request from 'supertest';
import type { Express } from 'express';
import { createApp, type CreatedApp } from '../../server/app';
import { DEMO_PASSWORD, DEMO_USERS, seedDemo, type DemoIds } from '../../db/seed';
import type { Mailer } from '../../server/mail/mailer';
import { createLocalStorage } from '../../server/storage';
import { createTestDb, type TestDb } from './test-db';

export const TEST_SESSION_PASSWORD = 'test-session-password-that-is-long-enough-0123456789';

export interface TestServer extends CreatedApp {
  testDb: TestDb;
  clock: { now: Date; set(d: Date | string): void; advanceDays(n: number): void };
  /** A temporary folder the local storage driver writes photos under; removed on close. */
  uploadsDir: string;
  close(): Promise<void>;
}

export async function startTestServer(opts: { webDir?: string; signInLimit?: number; mailer?: Mailer } = {}): Promise<TestServer> {
  const testDb = await createTestDb();
  const uploadsDir = fs.mkdtempSync(path.join(os.tmpdir(), 'frameside-uploads-'));
  const clock = {
    now: new Date(),
    set(d: Date | string) {
      clock.now = new Date(d);
    },
    advanceDays(n: number) {
      clock.now = new Date(clock.now.getTime() + n * 86_400_000);
    },
  };
  const created = createApp({
    db: testDb.db,
    sessionPassword: TEST_SESSION_PASSWORD,
    now: () => clock.now,
    webDir: opts.webDir,
    signInLimit: opts.signInLimit ?? 1000,
    storage: createLocalStorage(uploadsDir),
    mailer: opts.mailer,
  });
  const close = async () => {
    await testDb.drop();
    fs.rmSync(uploadsDir, { recursive: true, force: true });
  };
  return { ...created, testDb, clock, uploadsDir, close };
}

/** A supertest agent that keeps cookies, signed in as the given e-mail. */
export async function signedInAgent(app: Express, email: string, password = DEMO_PASSWORD) {
  const agent = request.agent(app);
  const res = await agent.post('/api/auth/sign-in').send({ email, password });
  if (res.status !== 200) throw new Error(`sign-in as ${email} failed: ${res.status} ${JSON.stringify(res.body)}`);
  return agent;
}

export interface DemoServer extends TestServer {
  ids: DemoIds;
  as: Record<keyof typeof DEMO_USERS | 'stranger', Awaited<ReturnType<typeof signedInAgent>>>;
}

/** A test server with the demo scenario and an agent per demo person, plus a stranger with an apiary of their own. */
export async function startDemoServer(opts: { signInLimit?: number; mailer?: Mailer; webDir?: string } = {}): Promise<DemoServer> {
  const s = await startTestServer(opts);
  const ids = await seedDemo(s.testDb.db, { now: s.clock.now });
  const stranger = request.agent(s.app);
  const su = await stranger.post('/api/auth/sign-up').send({ email: 'stranger@example.test', password: 'stranger-password-1', name: 'Stranger' });
  if (su.status !== 201) throw new Error(`stranger sign-up failed: ${su.status}`);
  await stranger.post('/api/apiaries').send({ name: 'Elsewhere' });
  const as = {
    keeper: await signedInAgent(s.app, DEMO_USERS.keeper.email),
    cokeeper: await signedInAgent(s.app, DEMO_USERS.cokeeper.email),
    sitter: await signedInAgent(s.app, DEMO_USERS.sitter.email),
    mentor: await signedInAgent(s.app, DEMO_USERS.mentor.email),
    stranger,
  };
  return { ...s, ids, as };
}
