/**
 * Load: the real server (server/index.ts, as `npm start` runs it, NODE_ENV=production) as a child
 * process on loopback, driven by autocannon from this process with 100 connections for 30 s of
 * mixed reads and writes by one signed-in keeper:
 *   - the Due list        GET  /api/due                      (40 connections)
 *   - the Hive story      GET  /api/hives/:hiveId/story       (40 connections, a random hive each time)
 *   - Quick check posts   POST /api/hives/:hiveId/inspections (20 connections, a unique Idempotency-Key each)
 * Prints throughput, p50, p99 and errors per kind and overall; latencies are every response's
 * own time (autocannon's `response` event). Aim on this machine (2 cores, the load generator on
 * the same machine): 0 errors, reads at p99 ≤ 100 ms.
 *
 *   npx tsx bench/load.ts
 *   BENCH_SECONDS=10 BENCH_CONNECTIONS=50 npx tsx bench/load.ts
 *
 * Data (invented), in a throwaway database on the project's test cluster: the demo, plus three
 * more sites of the demo keeper with 100 hives each (310 hives on one Due list), each with two
 * seasons of weekly Quick checks and a feeding, treatment and mite count per month in season.
 */
import { spawn, execFileSync, type ChildProcess } from 'node:child_process';
import { randomUUID } from 'node:crypto';
import fs from 'node:fs';
import net from 'node:net';
import os from 'node:os';
import path from 'node:path';
import { DEMO_PASSWORD, DEMO_USERS, seedDemo } from '../db/seed';
import { hashPassword } from '../server/password';
import { createTestDb, type TestDb } from '../tests/helpers/test-db';

// autocannon 8 ships no types; the few parts used here.
interface AcRequest {
  method?: string;
  path?: string;
  headers?: Record<string, string>;
  body?: string;
}
interface AcOptions {
  url: string;
  connections: number;
  duration: number;
  headers?: Record<string, string>;
  requests?: { method?: string; setupRequest?: (req: AcRequest) => AcRequest }[];
  timeout?: number;
}
interface AcResult {
  errors: number;
  timeouts: number;
  non2xx: number;
  requests: { total: number };
  duration: number;
}
interface AcInstance extends PromiseLike<AcResult> {
  on(event: 'response', cb: (client: unknown, statusCode: number, resBytes: number, responseTime: number) => void): void;
  on(event: 'reqError', cb: (err: Error) => void): void;
}
// eslint-disable-next-line @typescript-eslint/no-require-imports
const autocannon = require('autocannon') as (opts: AcOptions) => AcInstance;

const root = path.resolve(__dirname, '..');
const SECONDS = Number(process.env.BENCH_SECONDS ?? 30);
const CONNECTIONS = Number(process.env.BENCH_CONNECTIONS ?? 100);
const KEEPERS = Number(process.env.BENCH_KEEPERS ?? 10);
const HIVES_PER_KEEPER = Number(process.env.BENCH_HIVES_PER_KEEPER ?? 30);
const PASSWORD = 'load-bench-password-1';

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

interface Keeper {
  email: string;
  hives: string[];
  cookie?: string;
}

/**
 * The demo keeper (10 hives) plus KEEPERS generated keepers with a site of HIVES_PER_KEEPER hives
 * each; every generated hive has two seasons of records, written as the demo's records are
 * (weekly Quick checks April–September, a feeding and a mite count a month, an August treatment).
 */
async function seed(testDb: TestDb): Promise<{ keepers: Keeper[]; rows: Record<string, number> }> {
  const ids = await seedDemo(testDb.db, { now: new Date() });
  const q = (text: string, params: unknown[] = []) => testDb.db.$client.query(text, params);
  await q(
    `insert into users (email, name, password_hash) select 'keeper' || k || '@load.test', 'Load Keeper ' || k, $1 from generate_series(1, $2) k`,
    [await hashPassword(PASSWORD), KEEPERS],
  );
  await q(`insert into apiaries (name, hemisphere, winter_stores_target_kg) select 'Load site ' || k, 'north', 20 from generate_series(1, $1) k`, [KEEPERS]);
  await q(`insert into memberships (apiary_id, user_id, role)
           select a.id, u.id, 'owner' from apiaries a join users u on u.email = 'keeper' || substr(a.name, 11) || '@load.test'`);
  await q(
    `insert into hives (apiary_id, name, boxes)
     select a.id, a.name || ' hive ' || n, '[{"size":"deep","frames":10},{"size":"deep","frames":10},{"size":"medium","frames":10}]'::jsonb
     from apiaries a, generate_series(1, $1) n where a.name like 'Load site %'`,
    [HIVES_PER_KEEPER],
  );
  await q(`create temp table load_hives as
           select h.id, m.user_id from hives h join apiaries a on a.id = h.apiary_id join memberships m on m.apiary_id = a.id where a.name like 'Load site %'`);
  const years = `generate_series(extract(year from now())::int - 1, extract(year from now())::int) y`;
  await q(`
    insert into inspections (hive_id, occurred_at, created_by, frames_brood, frames_bees, honey_frames, pollen_frames, queen_status, eggs_seen, temperament)
    select h.id, make_timestamptz(y, 4, 1, 10, 0, 0, 'UTC') + (k * 7) * interval '1 day', h.user_id,
      3 + (k % 6), 6 + (k % 5), 1 + (k % 7), 1, 'eggs-seen', true, 1 + (k % 3)
    from load_hives h, ${years}, generate_series(0, 24) k
    where make_timestamptz(y, 4, 1, 10, 0, 0, 'UTC') + (k * 7) * interval '1 day' < now()`);
  await q(`
    insert into feedings (hive_id, occurred_at, created_by, kind, ratio, basis, amount_l)
    select h.id, make_timestamptz(y, m, 10, 18, 0, 0, 'UTC'), h.user_id, 'syrup', '1:1', 'weight', 2
    from load_hives h, ${years}, generate_series(4, 9) m where make_timestamptz(y, m, 10, 18, 0, 0, 'UTC') < now()`);
  await q(`
    insert into mite_counts (hive_id, occurred_at, created_by, method, bees_sampled, mites)
    select h.id, make_timestamptz(y, m, 1, 11, 0, 0, 'UTC'), h.user_id, 'alcohol-wash', 300, (m * 3) % 11
    from load_hives h, ${years}, generate_series(4, 9) m where make_timestamptz(y, m, 1, 11, 0, 0, 'UTC') < now()`);
  await q(`
    insert into treatments (hive_id, occurred_at, created_by, active_ingredient, method, start_date, planned_end_date, actual_end_date, supers_off)
    select h.id, make_timestamptz(y, 8, 20, 9, 0, 0, 'UTC'), h.user_id, 'thymol', 'gel', make_date(y, 8, 20), make_date(y, 8, 20) + 42, make_date(y, 8, 20) + 42, true
    from load_hives h, ${years} where make_date(y, 8, 20) + 42 < now()::date`);
  await q('analyze');
  const rows: Record<string, number> = {};
  for (const t of ['users', 'hives', 'inspections', 'feedings', 'treatments', 'mite_counts']) {
    rows[t] = Number((await q(`select count(*)::int as n from ${t}`)).rows[0].n);
  }
  const generated = (await q(`select u.email, array_agg(h.id::text) as hives from load_hives h join users u on u.id = h.user_id group by u.email order by u.email`)).rows as Keeper[];
  return { keepers: [{ email: DEMO_USERS.keeper.email, hives: Object.values(ids.hives) }, ...generated], rows };
}

function startServer(env: NodeJS.ProcessEnv): { child: ChildProcess; output: () => string } {
  let out = '';
  // BENCH_PROFILE=<folder>: the server writes a V8 CPU profile there when it stops.
  const prof = process.env.BENCH_PROFILE ? ['--cpu-prof', '--cpu-prof-dir', path.resolve(process.env.BENCH_PROFILE)] : [];
  const child = spawn(process.execPath, [...prof, '--import', 'tsx', 'server/index.ts'], { cwd: root, env, stdio: ['ignore', 'pipe', 'pipe'] });
  child.stdout!.on('data', (d) => (out += String(d)));
  child.stderr!.on('data', (d) => (out += String(d)));
  return { child, output: () => out };
}

async function waitHealthy(base: string, s: ReturnType<typeof startServer>) {
  const until = Date.now() + 60_000;
  for (;;) {
    if (s.child.exitCode !== null) throw new Error(`server exited:\n${s.output()}`);
    try {
      if ((await fetch(`${base}/api/health`)).status === 200) return;
    } catch {
      /* not yet */
    }
    if (Date.now() > until) throw new Error(`server not up:\n${s.output()}`);
    await new Promise((r) => setTimeout(r, 100));
  }
}

interface Kind {
  name: string;
  connections: number;
  read: boolean;
  requests: AcOptions['requests'];
}

interface Tally {
  times: number[];
  statuses: Map<number, number>;
  reqErrors: number;
  result?: AcResult;
}

/** The process's user + system CPU time in ms (Linux /proc), or null elsewhere. */
function cpuMs(pid: number | undefined): number | null {
  try {
    const f = fs.readFileSync(`/proc/${pid}/stat`, 'utf8').split(') ')[1]!.split(' ');
    return ((Number(f[11]) + Number(f[12])) * 1000) / 100; // clock ticks, USER_HZ = 100 on Linux
  } catch {
    return null;
  }
}

const pct = (sorted: number[], p: number) => (sorted.length ? sorted[Math.min(sorted.length - 1, Math.ceil((p / 100) * sorted.length) - 1)]! : NaN);
const ms = (v: number) => (Number.isFinite(v) ? `${v.toFixed(1)} ms` : '—');

async function main() {
  execFileSync(process.execPath, [path.join(root, 'scripts/pg.mjs'), 'start', '--test'], { stdio: 'ignore' });
  console.log(`seeding (the demo + ${KEEPERS} keepers × ${HIVES_PER_KEEPER} hives)…`);
  const testDb = await createTestDb();
  let server: ReturnType<typeof startServer> | undefined;
  try {
    const data = await seed(testDb);
    console.log('rows:', JSON.stringify(data.rows));
    const port = await freePort();
    const base = `http://127.0.0.1:${port}`;
    server = startServer({
      PATH: process.env.PATH,
      HOME: process.env.HOME,
      NODE_ENV: 'production',
      LOG_LEVEL: 'silent',
      DATABASE_URL: testDb.url,
      HOST: '127.0.0.1',
      PORT: String(port),
      PUBLIC_URL: base,
      SESSION_PASSWORD: 'load-bench-session-password-long-enough-0123456789',
      MAIL_FAKE: 'false',
      JOBS: 'false',
      UPLOADS_DIR: path.join(root, '.bench-uploads'),
      WEB_DIR: path.join(root, 'dist'),
    });
    await waitHealthy(base, server);
    for (const k of data.keepers) {
      const signIn = await fetch(`${base}/api/auth/sign-in`, {
        method: 'POST',
        headers: { 'Content-Type': 'application/json' },
        body: JSON.stringify({ email: k.email, password: k.email === DEMO_USERS.keeper.email ? DEMO_PASSWORD : PASSWORD }),
      });
      if (signIn.status !== 200) throw new Error(`sign-in as ${k.email} failed: ${signIn.status}`);
      k.cookie = signIn.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ');
    }
    const probe = data.keepers[1] ?? data.keepers[0]!;
    const dueProbe = (await (await fetch(`${base}/api/due`, { headers: { Cookie: probe.cookie! } })).json()) as { tasks: unknown[] };
    console.log(`${data.keepers.length} keepers signed in; one generated keeper's Due list: ${dueProbe.tasks.length} tasks, ${JSON.stringify(dueProbe).length} bytes`);

    const pick = <T>(xs: T[]) => xs[Math.floor(Math.random() * xs.length)]!;
    /** Each request as one of the keepers, on one of their own hives. */
    const as = (r: AcRequest, k: Keeper, extra: Record<string, string> = {}) => ({ ...r.headers, Cookie: k.cookie!, ...extra });
    const readShare = Math.round(CONNECTIONS * 0.4);
    const kinds: Kind[] = [
      { name: 'Due list', connections: readShare, read: true, requests: [{ method: 'GET', setupRequest: (r) => ({ ...r, path: '/api/due', headers: as(r, pick(data.keepers)) }) }] },
      {
        name: 'Hive story',
        connections: readShare,
        read: true,
        requests: [
          {
            method: 'GET',
            setupRequest: (r) => {
              const k = pick(data.keepers);
              return { ...r, path: `/api/hives/${pick(k.hives)}/story`, headers: as(r, k) };
            },
          },
        ],
      },
      {
        name: 'Quick check',
        connections: CONNECTIONS - 2 * readShare,
        read: false,
        requests: [
          {
            method: 'POST',
            setupRequest: (r) => {
              const k = pick(data.keepers);
              return {
              ...r,
              path: `/api/hives/${pick(k.hives)}/inspections`,
              headers: as(r, k, { 'Content-Type': 'application/json', 'Idempotency-Key': randomUUID() }),
              body: JSON.stringify({
                occurredAt: new Date().toISOString(),
                framesBrood: 5,
                framesBees: 9,
                honeyFrames: 2,
                queenStatus: 'eggs-seen',
                eggsSeen: true,
                temperament: 2,
                note: 'load bench',
              }),
              };
            },
          },
        ],
      },
    ];

    const run = async (seconds: number, record: boolean) => {
      const tallies = new Map<string, Tally>();
      await Promise.all(
        kinds.map(async (k) => {
          const t: Tally = { times: [], statuses: new Map(), reqErrors: 0 };
          tallies.set(k.name, t);
          const inst = autocannon({ url: base, connections: k.connections, duration: seconds, requests: k.requests, timeout: 10 });
          inst.on('response', (_c, status, _bytes, time) => {
            t.times.push(time);
            t.statuses.set(status, (t.statuses.get(status) ?? 0) + 1);
          });
          inst.on('reqError', () => t.reqErrors++);
          t.result = await inst;
        }),
      );
      return record ? tallies : undefined;
    };

    console.log('warming up (3 s)…');
    await run(3, false);
    console.log(`driving ${CONNECTIONS} connections for ${SECONDS} s…`);
    const cpu0 = cpuMs(server.child.pid);
    const started = Date.now();
    const tallies = (await run(SECONDS, true))!;
    const elapsed = (Date.now() - started) / 1000;
    const cpu1 = cpuMs(server.child.pid);

    const lines: string[][] = [['kind', 'conns', 'requests', 'req/s', 'p50', 'p99', 'max', 'errors', 'statuses']];
    const all: number[] = [];
    let allReq = 0;
    let allErr = 0;
    const readP99: number[] = [];
    for (const k of kinds) {
      const t = tallies.get(k.name)!;
      const sorted = [...t.times].sort((a, b) => a - b);
      all.push(...t.times);
      const okCount = [...t.statuses].filter(([s]) => s >= 200 && s < 300).reduce((n, [, c]) => n + c, 0);
      const errors = t.times.length - okCount + t.reqErrors + (t.result?.timeouts ?? 0);
      allReq += t.times.length;
      allErr += errors;
      if (k.read) readP99.push(pct(sorted, 99));
      lines.push([
        k.name,
        String(k.connections),
        String(t.times.length),
        (t.times.length / elapsed).toFixed(0),
        ms(pct(sorted, 50)),
        ms(pct(sorted, 99)),
        ms(sorted[sorted.length - 1] ?? NaN),
        String(errors),
        [...t.statuses].map(([s, c]) => `${s}×${c}`).join(' '),
      ]);
    }
    const sortedAll = all.sort((a, b) => a - b);
    lines.push(['overall', String(CONNECTIONS), String(allReq), (allReq / elapsed).toFixed(0), ms(pct(sortedAll, 50)), ms(pct(sortedAll, 99)), ms(sortedAll[sortedAll.length - 1] ?? NaN), String(allErr), '']);
    const widths = lines[0]!.map((_, i) => Math.max(...lines.map((l) => l[i]!.length)));
    console.log('');
    for (const l of lines) console.log(l.map((c, i) => (i === 0 || i === 8 ? c.padEnd(widths[i]!) : c.padStart(widths[i]!))).join('  '));

    // The posts really stored one Quick check each (no doubles, none lost).
    const posted = tallies.get('Quick check')!;
    const created = [...posted.statuses].filter(([s]) => s === 201).reduce((n, [, c]) => n + c, 0);
    const stored = Number((await testDb.db.$client.query(`select count(*)::int as n from inspections where note = 'load bench'`)).rows[0].n);
    console.log(`\nQuick checks answered 201 (measured run + warm-up): stored ${stored}; 201s in the measured run ${created}`);
    if (cpu0 !== null && cpu1 !== null) {
      const used = cpu1 - cpu0;
      // How loaded the machine was: compare the server's CPU share with one full core.
      console.log(
        `server process CPU: ${(used / 1000).toFixed(1)} s in ${elapsed.toFixed(1)} s (${((100 * used) / (elapsed * 1000)).toFixed(0)} % of one core), ` +
          `${(used / allReq).toFixed(2)} ms CPU per request; load average now ${os.loadavg().map((l) => l.toFixed(1)).join(' ')} on ${os.cpus().length} cores`,
      );
    }
    const worstRead = Math.max(...readP99);
    console.log(`aim: 0 errors → ${allErr === 0 ? 'met' : `NOT met (${allErr})`}; reads p99 ≤ 100 ms → ${worstRead <= 100 ? 'met' : 'NOT met'} (${ms(worstRead)})`);
  } finally {
    if (server && server.child.exitCode === null) {
      server.child.kill('SIGTERM');
      await new Promise((r) => server!.child.once('exit', r));
    }
    await testDb.drop();
  }
}

main().catch((err) => {
  console.error(err);
  process.exit(1);
});
