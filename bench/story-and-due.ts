/**
 * Benchmark: GET /api/hives/:hiveId/story and GET /api/due on the real app, beside a bare
 * node:http server that fetches the same rows with one raw SQL query each, at 50 connections.
 *
 *   npx tsx bench/story-and-due.ts            (1× and 10× data; ~2 minutes)
 *   BENCH_SECONDS=5 npx tsx bench/story-and-due.ts
 *
 * Data (invented, generated with generate_series in throwaway databases on the test cluster):
 * 300 hives in 10 apiaries, 5 seasons × 25 checks each, plus feedings, treatments, mite counts,
 * harvests, queen and colony events and forage checks. The 10× database holds ten times the
 * total data (3,000 hives: the benched keeper's 300 plus 2,700 of other keepers), so the same
 * requests show what the extra data costs. The clock is fixed at 20 Sept 2026 (late season: the
 * widest set of rules at work). The Due list keeps each hive's derived tasks while the hive's
 * trigger-set change stamp is unchanged, so the runs measure the warm list; the first request
 * (every hive derived) is timed and printed separately. Aims: story ≥ 50 % of the raw baseline's throughput; Due list
 * p95 ≤ 30 ms for 300 hives; 10× data ≤ 1.3× latency.
 */
import { randomBytes } from 'node:crypto';
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import autocannon from 'autocannon';
import { PgDialect } from 'drizzle-orm/pg-core';
import { Client, Pool } from 'pg';
import { createDb, type Db } from '../db/client';
import { createApp } from '../server/app';
import { hashPassword } from '../server/password';
import { storySql } from '../server/services/story';
import { DUE_CHECK_LOOKBACK_DAYS, DUE_LOOKBACK_DAYS } from '../server/services/due';
import { addDays } from '../shared/domain/dates';
import { adminUrl, ensureTemplate } from '../tests/helpers/test-db';

interface TestDb {
  url: string;
  db: Db;
  drop(): Promise<void>;
}

/** A throwaway database cloned from the migrated test template, named bench_… so no test clean-up takes it. */
async function createTestDb(): Promise<TestDb> {
  const name = `bench_${randomBytes(5).toString('hex')}`;
  await ensureTemplate(name);
  const u = new URL(adminUrl());
  u.pathname = `/${name}`;
  const db = createDb(u.toString(), { max: 5 });
  return {
    url: u.toString(),
    db,
    async drop() {
      await db.$client.end();
      const a = new Client({ connectionString: adminUrl() });
      await a.connect();
      await a.query(`drop database if exists ${name} with (force)`);
      await a.end();
    },
  };
}

const SECONDS = Number(process.env.BENCH_SECONDS ?? 10);
const CONNECTIONS = 50;
const NOW = new Date('2026-09-20T10:00:00Z');
const TODAY = '2026-09-20';
const PASSWORD = 'bench-password-1';
const HIVES_PER_KEEPER = 300;
const APIARIES_PER_KEEPER = 10;

interface Dataset {
  testDb: TestDb;
  keeperEmail: string;
  storyHiveId: string;
  storyApiaryId: string;
  keeperId: string;
  rows: Record<string, number>;
}

/** Writes `keepers` keepers with 300 hives each; the first keeper is the one benched. */
async function generate(keepers: number): Promise<Dataset> {
  const testDb = await createTestDb();
  const pool = testDb.db.$client;
  const hash = await hashPassword(PASSWORD);
  const q = (text: string, params: unknown[] = []) => pool.query(text, params);
  await q(
    `insert into users (email, name, password_hash)
     select 'keeper' || k || '@bench.test', 'Bench Keeper ' || k, $1 from generate_series(1, $2) k`,
    [hash, keepers],
  );
  await q(
    `insert into apiaries (name, hemisphere, winter_stores_target_kg)
     select 'Site ' || k || '-' || a, 'north', 20 from generate_series(1, $1) k, generate_series(1, $2) a`,
    [keepers, APIARIES_PER_KEEPER],
  );
  await q(
    `insert into memberships (apiary_id, user_id, role)
     select a.id, u.id, 'owner' from apiaries a join users u on u.email = 'keeper' || split_part(substr(a.name, 6), '-', 1) || '@bench.test'`,
  );
  await q(
    `insert into hives (apiary_id, name, boxes)
     select a.id, a.name || ' hive ' || n, '[{"size":"deep","frames":10},{"size":"deep","frames":10},{"size":"medium","frames":10}]'::jsonb
     from apiaries a, generate_series(1, $1) n`,
    [HIVES_PER_KEEPER / APIARIES_PER_KEEPER],
  );
  // Who wrote each hive's records: the apiary's owner.
  await q(`create temp table hive_owner as select h.id as hive_id, h.apiary_id, m.user_id from hives h join memberships m on m.apiary_id = h.apiary_id`);
  const seasons = 'generate_series(2022, 2026) y';
  // 25 weekly checks from 1 April to 16 September.
  await q(`
    insert into inspections (hive_id, occurred_at, created_by, frames_brood, frames_bees, honey_frames, pollen_frames, queen_status, eggs_seen, queen_cells, temperament)
    select o.hive_id, make_timestamptz(y, 4, 1, 10, 0, 0, 'UTC') + (k * 7) * interval '1 day', o.user_id,
      3 + (k % 6), 6 + (k % 5), 1 + (k % 7), 1, (case when k % 9 = 4 then 'queen-seen' else 'eggs-seen' end)::queen_status, k % 9 <> 4,
      case when k = 8 then '[{"kind":"swarm","count":2,"capped":true}]'::jsonb else '[]'::jsonb end, 1 + (k % 3)
    from hive_owner o, ${seasons}, generate_series(0, 24) k`);
  await q(`
    insert into feedings (hive_id, occurred_at, created_by, kind, ratio, basis, amount_l)
    select o.hive_id, make_timestamptz(y, 9, 1, 18, 0, 0, 'UTC') + (k * 3) * interval '1 day', o.user_id, 'syrup', '2:1', 'weight', 4
    from hive_owner o, ${seasons}, generate_series(0, 5) k`);
  await q(`
    insert into treatments (hive_id, occurred_at, created_by, active_ingredient, method, start_date, planned_end_date, actual_end_date, supers_off)
    select o.hive_id, make_timestamptz(y, m, 5, 9, 0, 0, 'UTC'), o.user_id,
      (case when m = 8 then 'formic-acid' else 'thymol' end)::active_ingredient, (case when m = 8 then 'strips' else 'gel' end)::treatment_method,
      make_date(y, m, 5), make_date(y, m, 5) + (case when m = 8 then 14 else 42 end),
      case when y < 2026 then make_date(y, m, 5) + (case when m = 8 then 14 else 42 end) end, m <> 8
    from hive_owner o, ${seasons}, (values (8), (9)) v(m)`);
  await q(`
    insert into mite_counts (hive_id, occurred_at, created_by, method, bees_sampled, mites)
    select o.hive_id, make_timestamptz(y, m, d, 11, 0, 0, 'UTC'), o.user_id, 'alcohol-wash', 300, (m * 3 + d) % 13
    from hive_owner o, ${seasons}, (values (6, 1), (7, 15), (8, 1), (9, 12)) v(m, d)`);
  await q(`
    insert into harvests (hive_id, occurred_at, created_by, supers, frames, weight_kg, moisture_percent)
    select o.hive_id, make_timestamptz(y, m, 20, 12, 0, 0, 'UTC'), o.user_id, 1, 10, 11.5, 17.4
    from hive_owner o, ${seasons}, (values (7), (8)) v(m)`);
  await q(`
    insert into queen_events (hive_id, occurred_at, created_by, kind)
    select o.hive_id, make_timestamptz(y, 5, 15, 12, 0, 0, 'UTC'), o.user_id, 'seen' from hive_owner o, ${seasons}`);
  await q(`
    insert into colony_events (hive_id, occurred_at, created_by, kind)
    select o.hive_id, make_timestamptz(y, 6, 1, 12, 0, 0, 'UTC'), o.user_id, 'moved' from hive_owner o, ${seasons} where ('x' || substr(o.hive_id::text, 1, 2))::bit(8)::int % 5 = 0`);
  await q(`
    insert into forage_checks (apiary_id, occurred_at, created_by, minutes_to_empty, judgement)
    select m.apiary_id, make_timestamptz(y, 5, 1, 12, 0, 0, 'UTC') + (k * 14) * interval '1 day', m.user_id, 15 + k * 5, (case when k > 6 then 'dearth' else 'some' end)::forage_judgement
    from memberships m, ${seasons}, generate_series(0, 9) k`);
  await q('analyze');

  const rows: Record<string, number> = {};
  for (const t of ['hives', 'inspections', 'feedings', 'treatments', 'mite_counts', 'harvests', 'queen_events', 'colony_events', 'forage_checks']) {
    rows[t] = Number((await q(`select count(*)::int as n from ${t}`)).rows[0].n);
  }
  const keeper = (await q(`select id from users where email = 'keeper1@bench.test'`)).rows[0];
  const hive = (
    await q(`select h.id, h.apiary_id from hives h join memberships m on m.apiary_id = h.apiary_id where m.user_id = $1 order by h.name limit 1`, [keeper.id])
  ).rows[0];
  return { testDb, keeperEmail: 'keeper1@bench.test', storyHiveId: hive.id, storyApiaryId: hive.apiary_id, keeperId: keeper.id, rows };
}

/** The Due list's rows in one raw query: the keeper's hives and the records the rules read. */
function dueBaselineSql(): string {
  const since = `${addDays(TODAY, -DUE_LOOKBACK_DAYS)}T00:00:00Z`;
  const checksSince = `${addDays(TODAY, -DUE_CHECK_LOOKBACK_DAYS)}T00:00:00Z`;
  const year = `${addDays(TODAY, -365)}`;
  return `
    with hv as (select h.id from hives h join memberships m on m.apiary_id = h.apiary_id where m.user_id = $1 and h.status = 'active')
    select 'inspection' as kind, r.hive_id, r.id, r.occurred_at, json_build_object('queenStatus', r.queen_status, 'eggsSeen', r.eggs_seen,
      'queenCells', r.queen_cells, 'honeyFrames', r.honey_frames, 'spaceActions', r.space_actions) as d
      from inspections r where r.hive_id in (select id from hv) and r.occurred_at >= '${checksSince}'
    union all select 'feeding', r.hive_id, r.id, r.occurred_at, json_build_object('kind', r.kind, 'ratio', r.ratio, 'basis', r.basis, 'amountL', r.amount_l)
      from feedings r where r.hive_id in (select id from hv) and r.occurred_at >= '${checksSince}'
    union all select 'treatment', r.hive_id, r.id, r.occurred_at, json_build_object('ai', r.active_ingredient, 'start', r.start_date, 'end', r.planned_end_date, 'supersOff', r.supers_off)
      from treatments r where r.hive_id in (select id from hv) and r.start_date >= '${year}'
    union all select 'mite-count', r.hive_id, r.id, r.occurred_at, json_build_object('method', r.method, 'mites', r.mites, 'bees', r.bees_sampled)
      from mite_counts r where r.hive_id in (select id from hv) and r.occurred_at >= '${year}T00:00:00Z'
    union all select 'queen-event', r.hive_id, r.id, r.occurred_at, json_build_object('kind', r.kind)
      from queen_events r where r.hive_id in (select id from hv) and r.occurred_at >= '${since}'`;
}

/** A bare node:http server: one raw SQL query per request, rows out as JSON. */
async function startBaseline(url: string, ds: Dataset) {
  const pool = new Pool({ connectionString: url, max: 10 });
  const story = new PgDialect().sqlToQuery(storySql(ds.storyHiveId, ds.storyApiaryId, '2025-01-01', '2026-01-01'));
  const due = dueBaselineSql();
  const server = http.createServer(async (req, res) => {
    try {
      // Named (prepared) statements, as the app's story uses: the comparison is of what lies around the query.
      const r = req.url?.startsWith('/story')
        ? await pool.query({ name: 'story', text: story.sql, values: story.params as unknown[] })
        : await pool.query({ name: 'due', text: due, values: [ds.keeperId] });
      res.writeHead(200, { 'content-type': 'application/json' });
      res.end(JSON.stringify({ rows: r.rows }));
    } catch (err) {
      res.writeHead(500);
      res.end(String(err));
    }
  });
  await new Promise<void>((resolve) => server.listen(0, '127.0.0.1', resolve));
  return { port: (server.address() as AddressInfo).port, close: async () => (server.close(), pool.end()) };
}

async function startRealApp(ds: Dataset) {
  // The same pool size as the baseline's (the test helper's pool holds 5).
  const db = createDb(ds.testDb.url, { max: 10 });
  const { app } = createApp({ db, sessionPassword: 'bench-session-password-that-is-long-enough-0123456789', now: () => NOW, signInLimit: 1000 });
  const server = app.listen(0, '127.0.0.1');
  await new Promise<void>((resolve) => server.once('listening', resolve));
  const port = (server.address() as AddressInfo).port;
  const res = await fetch(`http://127.0.0.1:${port}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json' },
    body: JSON.stringify({ email: ds.keeperEmail, password: PASSWORD }),
  });
  if (res.status !== 200) throw new Error(`sign-in failed: ${res.status}`);
  const cookie = (res.headers.get('set-cookie') ?? '').split(';')[0]!;
  return { port, cookie, close: () => new Promise<void>((resolve) => server.close(() => resolve())).then(() => db.$client.end()) };
}

interface Measure {
  rps: number;
  p50: number;
  p95: number;
  p99: number;
  bytes: number;
  errors: number;
}

/** autocannon at `connections` for SECONDS; p95 from every response time (autocannon's own table has no p95). */
async function measure(url: string, headers: Record<string, string>, connections = CONNECTIONS, seconds = SECONDS): Promise<Measure> {
  // Let the last run's queued requests finish, then warm up (plans prepared, pool connections open).
  await new Promise((r) => setTimeout(r, 1000));
  await fetch(url, { headers });
  await autocannon({ url, headers, connections: 10, duration: 1 });
  await fetch(url, { headers });
  const times: number[] = [];
  const instance = autocannon({ url, headers, connections, duration: seconds });
  instance.on('response', (_client: unknown, _status: number, _bytes: number, responseTime: number) => times.push(responseTime));
  const result = await instance;
  times.sort((a, b) => a - b);
  const pct = (p: number) => times[Math.min(times.length - 1, Math.floor((p / 100) * times.length))] ?? NaN;
  return {
    rps: result.requests.average,
    p50: pct(50),
    p95: pct(95),
    p99: pct(99),
    bytes: result.throughput.average,
    errors: result.non2xx + result.errors + result.timeouts,
  };
}

const f1 = (x: number) => (Number.isFinite(x) ? x.toFixed(1) : '—');

async function benchSize(label: string, keepers: number) {
  const t0 = Date.now();
  const ds = await generate(keepers);
  console.log(`\n[${label}] generated in ${((Date.now() - t0) / 1000).toFixed(1)} s:`, JSON.stringify(ds.rows));
  if (process.env.BENCH_KEEP) {
    // For EXPLAIN by hand: leave the database and stop here.
    console.log(`[${label}] kept ${ds.testDb.url} (keeper ${ds.keeperId}, hive ${ds.storyHiveId}); drop it when done`);
    process.exit(0);
  }
  const app = await startRealApp(ds);
  const base = await startBaseline(ds.testDb.url, ds);
  const h = { cookie: app.cookie };
  const storyUrl = `http://127.0.0.1:${app.port}/api/hives/${ds.storyHiveId}/story?season=2025`;
  const dueUrl = `http://127.0.0.1:${app.port}/api/due`;
  const check = await (await fetch(storyUrl, { headers: h })).json();
  const tCold = performance.now();
  const dueCheck = await (await fetch(dueUrl, { headers: h })).json();
  const coldMs = performance.now() - tCold;
  console.log(
    `[${label}] story items: ${check.story.items.length}; due tasks for ${HIVES_PER_KEEPER} hives: ${dueCheck.tasks.length}; ` +
      `first Due request (nothing cached, every hive derived): ${f1(coldMs)} ms`,
  );

  const out = {
    // The floor every signed-in route stands on (session cookie, session row, Express middleware).
    meApp: await measure(`http://127.0.0.1:${app.port}/api/me`, h),
    storyApp: await measure(storyUrl, h),
    storyRaw: await measure(`http://127.0.0.1:${base.port}/story`, {}),
    dueApp: await measure(dueUrl, h),
    dueRaw: await measure(`http://127.0.0.1:${base.port}/due`, {}),
    dueApp1: await measure(dueUrl, h, 1, Math.max(3, Math.round(SECONDS / 2))),
  };
  await app.close();
  await base.close();
  await ds.testDb.drop();
  return out;
}

function report(label: string, r: Awaited<ReturnType<typeof benchSize>>) {
  console.log(`\n== ${label} ==  (${CONNECTIONS} connections, ${SECONDS} s each)`);
  console.log('endpoint                      req/s     p50 ms   p95 ms   p99 ms   errors');
  const row = (name: string, m: Measure) =>
    console.log(`${name.padEnd(28)} ${f1(m.rps).padStart(7)} ${f1(m.p50).padStart(9)} ${f1(m.p95).padStart(8)} ${f1(m.p99).padStart(8)} ${String(m.errors).padStart(8)}`);
  row('GET /api/me (app floor)', r.meApp);
  row('story  (app)', r.storyApp);
  row('story  (raw SQL baseline)', r.storyRaw);
  row('due    (app)', r.dueApp);
  row('due    (raw SQL baseline)', r.dueRaw);
  row('due    (app, 1 connection)', r.dueApp1);
  console.log(`story throughput: ${f1((100 * r.storyApp.rps) / r.storyRaw.rps)} % of the raw baseline (aim ≥ 50 %); /api/me alone: ${f1((100 * r.meApp.rps) / r.storyRaw.rps)} %`);
  console.log(`due throughput:   ${f1((100 * r.dueApp.rps) / r.dueRaw.rps)} % of the raw baseline`);
  console.log(`due p95 for ${HIVES_PER_KEEPER} hives: ${f1(r.dueApp.p95)} ms at ${CONNECTIONS} connections, ${f1(r.dueApp1.p95)} ms at 1 (aim ≤ 30 ms)`);
}

async function main() {
  const small = await benchSize('1× data', 1);
  report('1× data: 300 hives', small);
  if (process.env.BENCH_ONLY_SMALL) return;
  const large = await benchSize('10× data', 10);
  report('10× data: 3,000 hives (the keeper still sees 300)', large);
  console.log('\n== scaling, 10× data vs 1× (aim ≤ 1.3×) ==');
  console.log(`story p95 ${f1(large.storyApp.p95 / small.storyApp.p95)}×, p50 ${f1(large.storyApp.p50 / small.storyApp.p50)}×`);
  console.log(`due   p95 ${f1(large.dueApp.p95 / small.dueApp.p95)}×, p50 ${f1(large.dueApp.p50 / small.dueApp.p50)}×; 1 connection p95 ${f1(large.dueApp1.p95 / small.dueApp1.p95)}×`);
}

main().then(
  () => process.exit(0),
  (err) => {
    console.error(err);
    process.exit(1);
  },
);
