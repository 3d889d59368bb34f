/**
 * Crash safety: the REAL server (server/index.ts, as `npm start` runs it, pg-boss jobs included)
 * as a child process on a fresh PostgreSQL database. 100 writes go in, four at a time — Quick
 * checks with Idempotency-Key headers, and every fifth a new hive with its queen — and the
 * process is killed with SIGKILL in the middle (no shutdown handler runs). After a restart:
 * - every write that was answered 2xx is present and whole (the stored fields are the ones sent);
 * - nothing is half-written: every Quick check and hive has its audit row, every hive sent with
 *   a queen has its queen, no record is stored twice;
 * - every acknowledged Idempotency-Key replays its answer after the restart, and the writes that
 *   never got an answer can be sent again with their keys without a duplicate or a 5xx.
 * Atomicity is PostgreSQL's: a transaction either commits whole or not at all after a crash
 * (PostgreSQL 15 manual, ch. 30 "Reliability and the Write-Ahead Log"). The test cluster runs
 * with fsync off, which is safe here because only the server process dies, not the machine.
 */
import { spawn, type ChildProcess } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { and, eq, inArray, like } from 'drizzle-orm';
import { auditLog, hives, idempotencyKeys, inspections, queens } from '../../db/schema';
import { DEMO_PASSWORD, DEMO_USERS, seedDemo, type DemoIds } from '../../db/seed';
import { createTestDb, type TestDb } from '../helpers/test-db';

jest.setTimeout(120_000);

const root = path.resolve(__dirname, '../..');
const TOTAL = 100;
const CONCURRENCY = 4;
const KILL_AFTER_ACKS = 45;
const MARK = `crash-${randomUUID().slice(0, 8)}`;

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const srv = net.createServer();
    srv.on('error', reject);
    srv.listen(0, '127.0.0.1', () => {
      const { port } = srv.address() as net.AddressInfo;
      srv.close(() => resolve(port));
    });
  });
}

interface Running {
  child: ChildProcess;
  output: () => string;
}

function startServer(env: NodeJS.ProcessEnv): Running {
  let out = '';
  // `node --import tsx` rather than the tsx CLI: the CLI runs the server in a child process of its
  // own, and a SIGKILL must hit the process that holds the connections.
  const child = spawn(process.execPath, ['--import', 'tsx', 'server/index.ts'], { cwd: root, env, stdio: ['ignore', 'pipe', 'pipe'] });
  child.stdout!.on('data', (d) => (out += String(d)));
  child.stderr!.on('data', (d) => (out += String(d)));
  return { child, output: () => out };
}

async function waitHealthy(base: string, running: Running, timeoutMs = 60_000) {
  const until = Date.now() + timeoutMs;
  for (;;) {
    if (running.child.exitCode !== null) throw new Error(`server exited (${running.child.exitCode}):\n${running.output()}`);
    try {
      const res = await fetch(`${base}/api/health`);
      if (res.status === 200) return;
    } catch {
      /* not listening yet */
    }
    if (Date.now() > until) throw new Error(`server not healthy after ${timeoutMs} ms:\n${running.output()}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

const killed = (child: ChildProcess) =>
  new Promise<void>((resolve) => {
    if (child.exitCode !== null || child.signalCode !== null) return resolve();
    child.once('exit', () => resolve());
  });

type Write =
  | { kind: 'check'; i: number; hiveId: string; key: string; body: Record<string, unknown> }
  | { kind: 'hive'; i: number; apiaryId: string; body: { name: string; boxes: { size: string; frames: number }[]; note: string; queen: Record<string, unknown> } };

interface Outcome {
  write: Write;
  status: number | 'no answer';
  body?: Record<string, any>;
}

describe('crash safety: SIGKILL in the middle of 100 writes', () => {
  let testDb: TestDb;
  let ids: DemoIds;
  let running: Running | undefined;
  let base: string;
  let env: NodeJS.ProcessEnv;
  let uploads: string;

  beforeAll(async () => {
    testDb = await createTestDb();
    ids = await seedDemo(testDb.db, { now: new Date() });
    const port = await freePort();
    base = `http://127.0.0.1:${port}`;
    uploads = fs.mkdtempSync(path.join(os.tmpdir(), 'frameside-crash-'));
    env = {
      PATH: process.env.PATH,
      HOME: process.env.HOME,
      NODE_ENV: 'test',
      LOG_LEVEL: 'silent',
      DATABASE_URL: testDb.url,
      HOST: '127.0.0.1',
      PORT: String(port),
      PUBLIC_URL: base,
      SESSION_PASSWORD: 'crash-test-session-password-long-enough-0123456789',
      // No local fake SMTP (its fixed port may be taken by a running Frameside); these writes send no mail.
      MAIL_FAKE: 'false',
      SMTP_PORT: String(await freePort()),
      UPLOADS_DIR: path.join(uploads, 'photos'),
      WEB_DIR: path.join(uploads, 'no-web-build'),
      // The real start: pg-boss's scheduled jobs run too, in the same database.
      JOBS: 'true',
    };
  });
  afterAll(async () => {
    if (running && running.child.exitCode === null) {
      running.child.kill('SIGKILL');
      await killed(running.child);
    }
    await testDb.drop();
    fs.rmSync(uploads, { recursive: true, force: true });
  });

  async function signIn(): Promise<string> {
    const res = await fetch(`${base}/api/auth/sign-in`, {
      method: 'POST',
      headers: { 'Content-Type': 'application/json' },
      body: JSON.stringify({ email: DEMO_USERS.keeper.email, password: DEMO_PASSWORD }),
    });
    expect(res.status).toBe(200);
    return res.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
  }

  async function send(w: Write, cookie: string): Promise<Outcome> {
    const url = w.kind === 'check' ? `${base}/api/hives/${w.hiveId}/inspections` : `${base}/api/apiaries/${w.apiaryId}/hives`;
    const headers: Record<string, string> = { 'Content-Type': 'application/json', Cookie: cookie };
    if (w.kind === 'check') headers['Idempotency-Key'] = w.key;
    try {
      const res = await fetch(url, { method: 'POST', headers, body: JSON.stringify(w.body) });
      return { write: w, status: res.status, body: (await res.json()) as Record<string, any> };
    } catch {
      return { write: w, status: 'no answer' };
    }
  }

  function makeWrites(): Write[] {
    const orchard = ['Ash', 'Bramble', 'Clover', 'Damson', 'Elder', 'Fennel'].map((n) => ids.hives[n]!);
    const t0 = Date.now() - 3 * 86_400_000;
    return Array.from({ length: TOTAL }, (_, i): Write => {
      if (i % 5 === 4) {
        return {
          kind: 'hive',
          i,
          apiaryId: ids.orchardRow,
          body: {
            name: `${MARK} hive ${i}`,
            boxes: [{ size: 'deep', frames: 10 }, ...(i % 2 ? [{ size: 'medium', frames: 10 }] : [])],
            note: `${MARK} note ${i}`,
            queen: { origin: 'own-rearing', year: 2026, markColour: 'green', clipped: i % 3 === 0, status: 'present' },
          },
        };
      }
      return {
        kind: 'check',
        i,
        hiveId: orchard[i % orchard.length]!,
        key: randomUUID(),
        body: {
          occurredAt: new Date(t0 + i * 60_000).toISOString(),
          note: `${MARK} check ${i}`,
          framesBrood: 1 + (i % 5),
          framesBees: 3 + (i % 6),
          honeyFrames: i % 3,
          queenStatus: 'eggs-seen',
          eggsSeen: true,
          temperament: 1 + (i % 5),
        },
      };
    });
  }

  it('keeps every acknowledged write whole and leaves nothing half-written', async () => {
    running = startServer(env);
    await waitHealthy(base, running);
    const cookie = await signIn();
    const writes = makeWrites();
    const outcomes: Outcome[] = [];
    let acks = 0;
    let killedAt = -1;
    let next = 0;

    const worker = async () => {
      while (next < writes.length) {
        const w = writes[next++]!;
        const o = await send(w, cookie);
        outcomes.push(o);
        if (typeof o.status === 'number' && o.status >= 200 && o.status < 300) acks++;
        if (acks >= KILL_AFTER_ACKS && killedAt < 0) {
          killedAt = next;
          running!.child.kill('SIGKILL');
        }
      }
    };
    await Promise.all(Array.from({ length: CONCURRENCY }, worker));
    await killed(running.child);
    expect(running.child.signalCode).toBe('SIGKILL');

    const acked = outcomes.filter((o) => typeof o.status === 'number' && o.status >= 200 && o.status < 300);
    const refused = outcomes.filter((o) => typeof o.status === 'number' && (o.status < 200 || o.status >= 300));
    // Nothing was refused for a reason of its own: only the kill stopped writes.
    expect(refused.map((o) => [o.write.i, o.status, o.body])).toEqual([]);
    expect(acked.length).toBeGreaterThanOrEqual(KILL_AFTER_ACKS);
    expect(acked.length).toBeLessThan(TOTAL);

    // Start again on the same database.
    running = startServer(env);
    await waitHealthy(base, running);

    const db = testDb.db;
    const storedChecks = await db.select().from(inspections).where(like(inspections.note, `${MARK} %`));
    const storedHives = await db.select().from(hives).where(like(hives.note, `${MARK} %`));
    const byNote = new Map(storedChecks.map((r) => [r.note, r]));
    const hiveByNote = new Map(storedHives.map((r) => [r.note, r]));

    let present = 0;
    for (const o of acked) {
      const w = o.write;
      if (w.kind === 'check') {
        const row = byNote.get(w.body.note as string);
        expect([w.i, row?.id]).toEqual([w.i, o.body!.inspection.id]);
        expect({
          hiveId: row!.hiveId,
          occurredAt: row!.occurredAt.toISOString(),
          framesBrood: row!.framesBrood,
          framesBees: row!.framesBees,
          honeyFrames: row!.honeyFrames,
          queenStatus: row!.queenStatus,
          eggsSeen: row!.eggsSeen,
          temperament: row!.temperament,
          createdBy: row!.createdBy,
        }).toEqual({
          hiveId: w.hiveId,
          occurredAt: w.body.occurredAt,
          framesBrood: w.body.framesBrood,
          framesBees: w.body.framesBees,
          honeyFrames: w.body.honeyFrames,
          queenStatus: w.body.queenStatus,
          eggsSeen: w.body.eggsSeen,
          temperament: w.body.temperament,
          createdBy: ids.users.keeper,
        });
      } else {
        const row = hiveByNote.get(w.body.note);
        expect([w.i, row?.id]).toEqual([w.i, o.body!.hive.id]);
        expect({ name: row!.name, apiaryId: row!.apiaryId, boxes: row!.boxes }).toEqual({ name: w.body.name, apiaryId: w.apiaryId, boxes: w.body.boxes });
      }
      present++;
    }

    // Nothing half-written, acknowledged or not: no doubles, every row has its audit row, every hive its queen.
    expect(storedChecks.length).toBe(byNote.size);
    expect(storedHives.length).toBe(hiveByNote.size);
    const entityIds = [...storedChecks.map((r) => r.id), ...storedHives.map((r) => r.id)];
    const audits = entityIds.length ? await db.select().from(auditLog).where(and(inArray(auditLog.entityId, entityIds), eq(auditLog.action, 'create'))) : [];
    const auditsPer = new Map<string, number>();
    for (const a of audits) auditsPer.set(a.entityId, (auditsPer.get(a.entityId) ?? 0) + 1);
    expect(entityIds.filter((id) => auditsPer.get(id) !== 1)).toEqual([]);
    const hiveIds = storedHives.map((h) => h.id);
    const qs = hiveIds.length ? await db.select().from(queens).where(inArray(queens.hiveId, hiveIds)) : [];
    expect(hiveIds.filter((id) => qs.filter((q) => q.hiveId === id).length !== 1)).toEqual([]);
    for (const q of qs) expect({ origin: q.origin, year: q.year, markColour: q.markColour, status: q.status }).toEqual({ origin: 'own-rearing', year: 2026, markColour: 'green', status: 'present' });

    // A Quick check that committed in the instant between its transaction and the stored answer
    // has a key still "in flight": the window in which a retry after the claim expires (60 s)
    // could store it a second time. Counted and printed; the retries below stay inside the window.
    const checkKeys = writes.filter((w): w is Extract<Write, { kind: 'check' }> => w.kind === 'check').map((w) => w.key);
    const keyRows = await db.select().from(idempotencyKeys).where(inArray(idempotencyKeys.key, checkKeys));
    const keyOf = new Map(keyRows.map((k) => [k.key, k]));
    const ackedKeys = acked.flatMap((o) => (o.write.kind === 'check' ? [o.write.key] : []));
    expect(ackedKeys.filter((k) => keyOf.get(k)?.status !== 201)).toEqual([]);
    const unackedStored = writes.filter((w): w is Extract<Write, { kind: 'check' }> => w.kind === 'check' && !ackedKeys.includes(w.key) && byNote.has(w.body.note as string));
    const unackedWithRow = unackedStored.filter((w) => keyOf.get(w.key)?.status == null).length;

    // After the restart: every acknowledged key replays the same answer; unanswered ones may be sent again.
    const cookie2 = await signIn();
    for (const o of acked.filter((x) => x.write.kind === 'check')) {
      const r = await fetch(`${base}/api/hives/${(o.write as Extract<Write, { kind: 'check' }>).hiveId}/inspections`, {
        method: 'POST',
        headers: { 'Content-Type': 'application/json', Cookie: cookie2, 'Idempotency-Key': (o.write as Extract<Write, { kind: 'check' }>).key },
        body: JSON.stringify(o.write.body),
      });
      expect(r.status).toBe(201);
      expect(r.headers.get('idempotent-replayed')).toBe('true');
      expect(((await r.json()) as { inspection: { id: string } }).inspection.id).toBe(o.body!.inspection.id);
    }
    const unanswered = writes.filter((w) => w.kind === 'check' && !ackedKeys.includes(w.key));
    const retryStatuses: Record<string, number> = {};
    for (const w of unanswered) {
      const o = await send(w, cookie2);
      retryStatuses[String(o.status)] = (retryStatuses[String(o.status)] ?? 0) + 1;
      // 201 (stored now, or replayed) or 409 (its first copy's claim is still fresh): never a 5xx or a double.
      expect([201, 409]).toContain(o.status);
    }
    const after = await db.select({ note: inspections.note }).from(inspections).where(like(inspections.note, `${MARK} %`));
    expect(after.length).toBe(new Set(after.map((r) => r.note)).size);

    running.child.kill('SIGTERM');
    await killed(running.child);

    // eslint-disable-next-line no-console
    console.log(
      [
        `crash safety: ${TOTAL} writes (${writes.filter((w) => w.kind === 'check').length} Quick checks, ${writes.filter((w) => w.kind === 'hive').length} hives with queens), ${CONCURRENCY} at a time, SIGKILL after write #${killedAt}`,
        `  acknowledged (2xx) before the kill: ${acked.length}; present and whole after restart: ${present}`,
        `  answered nothing (cut off by the kill or refused connection): ${outcomes.length - acked.length - refused.length}`,
        `  stored but unacknowledged (committed as the process died): ${storedChecks.length + storedHives.length - acked.length}, of which Quick checks with an unsettled key: ${unackedWithRow}`,
        `  half-written rows: 0; retries of unanswered Quick checks after restart: ${JSON.stringify(retryStatuses)}`,
      ].join('\n'),
    );
  });
});
