/**
 * Fuzzing every write route (property-based, fast-check): bad and odd payloads must be refused
 * with a 4xx and a JSON message a keeper can read, never a 5xx, and a refused request must leave
 * no row behind.
 *
 * The route list is the server's own route table (`createApp(...).routes`, every POST, PATCH,
 * PUT and DELETE), so a new write route is fuzzed without touching this file. Path parameters
 * are seeded with real ids of the demo scenario (the keeper's site, hive, records, a task, an
 * invitation, a reset link) so that the body reaches validation; a share of the cases gets a
 * malformed parameter instead.
 *
 * What is generated (OWASP Input Validation Cheat Sheet, "common practice" for API fuzzing):
 * wrong types, 100 kB strings, odd unicode (lone surrogates, RTL and zero-width marks, NUL),
 * nulls, extra fields (also `__proto__`/`constructor`), numbers at the edge of what JSON carries
 * (1e308, -0, 2^53+1, 1e400 in raw JSON), malformed dates, arrays where objects are expected,
 * deep nesting, wrong content types (text/plain, form-urlencoded, multipart, XML, unsupported
 * charsets) and malformed JSON.
 *
 * A generated payload may by chance be valid (an odd but legal name); such a 2xx is allowed and
 * counted. Routes that read no body at all (DELETE, sign-out) would act on any payload, so for
 * them every case is refused before the handler acts: a malformed path parameter, or malformed
 * JSON (refused by the body parser).
 *
 * Requests go over one keep-alive HTTP server, 8 at a time, signed in as the demo keeper (owner
 * of both sites). Rows: every table in the public schema is counted before and after each batch
 * of 8; when a batch holds an accepted (2xx) request, its refused requests are sent again one at
 * a time, each between two counts.
 */
import http from 'node:http';
import type { AddressInfo } from 'node:net';
import { randomUUID } from 'node:crypto';
import fc from 'fast-check';
import { createApp } from '../../server/app';
import type { Db } from '../../db/client';
import type { RouteDef } from '../../server/routes/route';
import { invitations, passwordResets } from '../../db/schema';
import { newToken } from '../../server/tokens';
import { RECORD_KIND_PATHS, type RecordFormKind } from '../../shared/schemas/records';
import { DEMO_PASSWORD, DEMO_USERS } from '../../db/seed';
import { startDemoServer, TEST_SESSION_PASSWORD, type DemoServer } from '../helpers/server';

jest.setTimeout(300_000);

/** At least this many cases in all (the issue asks for 10,000). */
const TOTAL_CASES = 10_000;
const BATCH = 8;

const WRITE_ROUTES: RouteDef[] = createApp({ db: {} as Db, sessionPassword: TEST_SESSION_PASSWORD }).routes.filter(
  (r) => r.method !== 'get',
);
/** Batches per route, so that every route gets the same share and the total reaches TOTAL_CASES. */
const RUNS_PER_ROUTE = Math.ceil(TOTAL_CASES / WRITE_ROUTES.length / BATCH);

/** Routes whose handler reads no body: any payload would be acted on, so only refusals are generated. */
const readsNoBody = (r: RouteDef) => r.method === 'delete' || r.path === '/api/auth/sign-out';

// ------------------------------------------------------------------------------ arbitraries

const HUGE = 100_000;
const oddStrings = [
  '',
  ' ',
  '\u0000',
  'Ash\u0000Bramble',
  '\ud800',
  'x\udfffy',
  '\udbff\udfff',
  '\u202eevil\u202c',
  '\u200f\u200e\u061c',
  '\u200b\u200d\ufeff',
  '\uffff\ufffe',
  'Z\u0337\u0322\u0347a\u0334l\u0335g\u0336o',
  '🐝🍯'.repeat(50),
  '<script>alert(1)</script>',
  "'; drop table hives; --",
  '../../etc/passwd',
  '%00%ff',
  '\r\n\t',
  'null',
  'undefined',
  'true',
  '1e308',
  'NaN',
] as const;

const oddString = fc.oneof(
  fc.constantFrom(...oddStrings),
  fc.string({ maxLength: 40 }),
  fc.string({ unit: 'binary', maxLength: 40 }),
  fc.string({ unit: 'grapheme', maxLength: 20 }),
  fc.constantFrom('x', '\u0000', '\ud800', 'é', '🐝').map((c) => c.repeat(Math.ceil(HUGE / c.length))),
);

const oddNumber = fc.oneof(
  fc.constantFrom(1e308, -1e308, -0, 0, -1, 2 ** 53 + 1, -(2 ** 63), 2 ** 64, 1e-320, 0.1, 99_999_999_999, 1.5),
  fc.integer(),
  fc.double({ noNaN: true, noDefaultInfinity: true }),
);

const oddDate = fc.oneof(
  fc.constantFrom(
    '2026-02-30',
    '2026-13-01',
    '2026-00-10',
    '0000-00-00',
    '99999-01-01',
    '+275760-09-13T00:00:00.001Z',
    '-001000-01-01T00:00:00Z',
    '2026-06-01T25:61:00Z',
    '2026-06-01T12:00:00+99:00',
    '1969-12-31',
    '2026/06/01',
    'yesterday',
    'now',
    '2026-06-01T12:00:00',
    '2026-06-01 12:00',
  ),
  fc.date({ noInvalidDate: true }).map((d) => d.toISOString()),
  fc.integer().map((n) => n),
);

/** Field names the write routes use, so that odd values land on fields that are read. */
const FIELD_NAMES = [
  'name', 'note', 'email', 'password', 'version', 'occurredAt', 'kind', 'role', 'startsAt', 'endsAt', 'title',
  'dueDate', 'until', 'apiaryId', 'hiveId', 'otherHiveId', 'boxes', 'size', 'frames', 'framesBrood', 'framesBees',
  'honeyFrames', 'pollenFrames', 'queenStatus', 'eggsSeen', 'temperament', 'amountL', 'amountKg', 'ratio', 'basis',
  'activeIngredient', 'method', 'dose', 'batch', 'startDate', 'endDate', 'mites', 'beesSampled', 'supers', 'weightKg',
  'moisturePercent', 'judgement', 'climateNote', 'queenYear', 'photoIds', 'fileName', 'timeFormat', 'version',
  'apiaries', 'hives', 'records', 'format', 'token', '__proto__', 'constructor', 'prototype', 'toString',
] as const;

const { value: oddValue } = fc.letrec((tie) => ({
  value: fc.oneof(
    { depthSize: 'small', withCrossShrink: true },
    oddString,
    oddNumber,
    oddDate,
    fc.boolean(),
    fc.constant(null),
    fc.array(tie('value'), { maxLength: 4 }),
    fc.dictionary(fc.oneof(fc.constantFrom(...FIELD_NAMES), fc.string({ maxLength: 12 })), tie('value'), { maxKeys: 5 }),
  ),
}));

/** An object body: known field names with odd values, plus extra fields. */
const oddObject = fc.dictionary(fc.oneof(fc.constantFrom(...FIELD_NAMES), fc.string({ maxLength: 12 })), oddValue, {
  minKeys: 0,
  maxKeys: 8,
});

const deepNesting = fc
  .tuple(fc.integer({ min: 100, max: 20_000 }), fc.boolean())
  .map(([depth, arrays]) => (arrays ? '['.repeat(depth) + ']'.repeat(depth) : '{"note":'.repeat(depth) + '1' + '}'.repeat(depth)));

const MALFORMED_JSON = [
  '{',
  '}',
  '{"name":}',
  "{'name':'Ash'}",
  '{"name":"Ash",}',
  '[1,2',
  'undefined',
  'NaN',
  '{"framesBrood":NaN}',
  '{"framesBrood":Infinity}',
  '{"framesBrood":1e400}',
  '{"framesBrood":-1e400}',
  '{"version":123456789012345678901234567890}',
  '{"name":"\\ud800"}',
  '{"name":"\\u0000"}',
  '{"name":"\\x00"}',
  '\u0000',
  '\ufeff{"name":"Ash"}',
  '{"__proto__":{"isAdmin":true},"name":"Ash"}',
  '{"constructor":{"prototype":{"polluted":1}}}',
  '{"a":1}{"b":2}',
  '"just a string"',
  '123',
  'null',
  'true',
  '[]',
  '[{}]',
] as const;

type Body =
  | { kind: 'json'; value: unknown }
  | { kind: 'raw'; contentType: string | null; text: string };

const jsonBody = fc.oneof(
  oddObject.map((value): Body => ({ kind: 'json', value })),
  oddValue.map((value): Body => ({ kind: 'json', value })),
  fc.array(oddObject, { maxLength: 3 }).map((value): Body => ({ kind: 'json', value })),
);

const rawBody = fc.oneof(
  fc.constantFrom(...MALFORMED_JSON).map((text): Body => ({ kind: 'raw', contentType: 'application/json', text })),
  deepNesting.map((text): Body => ({ kind: 'raw', contentType: 'application/json', text })),
  fc.string({ maxLength: 60 }).map((text): Body => ({ kind: 'raw', contentType: 'application/json', text: `{${text}` })),
);

const wrongContentType = fc
  .tuple(
    fc.constantFrom(
      'text/plain',
      'application/x-www-form-urlencoded',
      'multipart/form-data; boundary=XyZ',
      'application/xml',
      'application/json; charset=latin1',
      'application/json; charset=utf-16',
      'application/octet-stream',
      'text/csv',
      null,
    ),
    oddObject,
  )
  .map(([contentType, obj]): Body => {
    const fields = Object.entries(obj);
    let text: string;
    if (contentType?.startsWith('multipart')) {
      text = fields.map(([k, v]) => `--XyZ\r\nContent-Disposition: form-data; name="${k}"\r\n\r\n${flat(v)}\r\n`).join('') + '--XyZ--\r\n';
    } else if (contentType === 'application/x-www-form-urlencoded') {
      text = fields.map(([k, v]) => `${encodeUtf8(k)}=${encodeUtf8(flat(v))}`).join('&');
    } else if (contentType === 'application/xml') {
      text = `<hive>${fields.map(([k, v]) => `<${k}>${flat(v)}</${k}>`).join('')}</hive>`;
    } else {
      text = JSON.stringify(obj);
    }
    return { kind: 'raw', contentType, text };
  });

/** A value as form text (dictionaries from fast-check have no prototype, so no String()). */
const flat = (v: unknown): string => (v !== null && typeof v === 'object' ? JSON.stringify(v) : `${v as string}`);

/** Percent-encodes UTF-8 bytes; lone surrogates become U+FFFD (encodeURIComponent would throw). */
function encodeUtf8(s: string): string {
  return [...Buffer.from(s, 'utf8')].map((b) => (/[A-Za-z0-9\-_.~]/.test(String.fromCharCode(b)) ? String.fromCharCode(b) : `%${b.toString(16).padStart(2, '0').toUpperCase()}`)).join('');
}

/** A path parameter that cannot name anything: an unknown UUID, junk, malformed escapes, 2 kB. */
const badParam = fc.oneof(
  fc.uuid().map((u) => u),
  fc.constantFrom('0', '-1', 'null', 'undefined', '%', '%E0%A4%A', '%C0%80', '%00', '%FF%FE', '..', '%2e%2e', 'task:', 'rule:::', '%20').map((raw) => ({ raw })),
  oddString.map((s) => encodeUtf8(s.slice(0, 500))),
  fc.constant('a'.repeat(2_000)),
);

/** A query string, sometimes: odd values, repeated and bracketed keys. */
const oddQuery = fc.option(
  fc.array(
    fc.tuple(fc.oneof(fc.constantFrom('fileName', 'timeFormat', 'timeColumn', 'apiaryId', 'limit', 'a[b]', 'x[]'), fc.string({ maxLength: 8 })), oddString),
    { maxLength: 4 },
  ).map((pairs) => pairs.map(([k, v]) => `${encodeUtf8(k)}=${encodeUtf8(v.slice(0, 300))}`).join('&')),
  { freq: 3 },
);

/** The Idempotency-Key header: usually a fresh UUID, sometimes odd (only the bytes Node lets into a header). */
const idemKey = fc.option(
  fc.oneof(
    { weight: 4, arbitrary: fc.uuid() },
    { weight: 1, arbitrary: fc.constantFrom('', ' ', '""', '"', 'x'.repeat(300), '\u00e9\u00ff', 'a b', '\t') },
  ),
  { freq: 4 },
);

interface Case {
  params: Record<string, string | { raw: string } | null>; // null: the real id
  body: Body;
  query: string | null;
  key: string | null;
}

function caseFor(route: RouteDef): fc.Arbitrary<Case> {
  const names = paramNames(route.path);
  const params = fc.record(
    Object.fromEntries(names.map((n) => [n, fc.option(badParam, { freq: 3 })])) as Record<string, fc.Arbitrary<string | { raw: string } | null>>,
  );
  const body = fc.oneof({ weight: 5, arbitrary: jsonBody }, { weight: 2, arbitrary: rawBody }, { weight: 2, arbitrary: wrongContentType });
  const c = fc.record({ params, body, query: oddQuery, key: idemKey });
  if (!readsNoBody(route)) return c;
  // Nothing generated for a body-less route may be acted on: a bad parameter or malformed JSON.
  return c.map((x) => {
    if (names.length > 0 && names.every((n) => x.params[n] === null)) x.params[names[0]!] = randomUUID();
    if (names.length === 0) x.body = { kind: 'raw', contentType: 'application/json', text: MALFORMED_JSON[x.body.kind === 'raw' ? x.body.text.length % 3 : 0]! };
    return x;
  });
}

const paramNames = (p: string) => [...p.matchAll(/:([A-Za-z]+)/g)].map((m) => m[1]!);

// ------------------------------------------------------------------------------ the server

let s: DemoServer;
let server: http.Server;
let port = 0;
const agent = new http.Agent({ keepAlive: true, maxSockets: BATCH });
let cookie = '';
const realIds: Record<string, string> = {};
const RECORD_TABLES: Record<RecordFormKind, string> = {
  inspection: 'inspections',
  feeding: 'feedings',
  treatment: 'treatments',
  'mite-count': 'mite_counts',
  harvest: 'harvests',
  'queen-event': 'queen_events',
  'colony-event': 'colony_events',
  'forage-check': 'forage_checks',
};

interface Answer {
  status: number;
  text: string;
  setCookie: string[];
}

function send(method: string, path: string, headers: Record<string, string>, payload?: Buffer): Promise<Answer> {
  return new Promise((resolve, reject) => {
    const req = http.request(
      { host: '127.0.0.1', port, method: method.toUpperCase(), path, agent, headers: { cookie, ...headers, ...(payload ? { 'content-length': String(payload.length) } : {}) } },
      (res) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => resolve({ status: res.statusCode ?? 0, text: Buffer.concat(chunks).toString('utf8'), setCookie: res.headers['set-cookie'] ?? [] }));
        res.on('error', reject);
      },
    );
    req.on('error', reject);
    req.end(payload);
  });
}

function realParam(route: RouteDef, name: string): string {
  if (name === 'recordId') {
    const seg = route.path.split('/')[2]!;
    return realIds[`record:${seg}`] ?? randomUUID();
  }
  if (name === 'token') return route.path.startsWith('/api/auth/password-reset') ? realIds.resetToken! : realIds.invitationToken!;
  return realIds[name] ?? randomUUID();
}

function requestOf(route: RouteDef, c: Case): { path: string; headers: Record<string, string>; payload: Buffer } {
  let path = route.path;
  for (const name of paramNames(route.path)) {
    const p = c.params[name];
    const value = p === null || p === undefined ? realParam(route, name) : typeof p === 'string' ? p : p.raw;
    path = path.replace(`:${name}`, value);
  }
  if (c.query !== null) path += `?${c.query}`;
  const headers: Record<string, string> = {};
  if (c.key !== null) headers['idempotency-key'] = c.key;
  let payload: Buffer;
  if (c.body.kind === 'json') {
    headers['content-type'] = 'application/json';
    payload = Buffer.from(JSON.stringify(c.body.value) ?? 'null', 'utf8');
  } else {
    if (c.body.contentType) headers['content-type'] = c.body.contentType;
    payload = Buffer.from(c.body.text, 'utf8');
  }
  return { path, headers, payload };
}

let countSql = '';
async function rowCounts(): Promise<Record<string, number>> {
  if (!countSql) {
    const tables = await s.testDb.db.$client.query<{ t: string }>(
      "select table_name as t from information_schema.tables where table_schema = 'public' and table_type = 'BASE TABLE' order by 1",
    );
    countSql = tables.rows.map((r) => `select '${r.t}' as t, count(*)::int as n from "${r.t}"`).join(' union all ');
  }
  const res = await s.testDb.db.$client.query<{ t: string; n: number }>(countSql);
  return Object.fromEntries(res.rows.map((r) => [r.t, r.n]));
}

const changed = (a: Record<string, number>, b: Record<string, number>) =>
  Object.keys({ ...a, ...b })
    .filter((t) => a[t] !== b[t])
    .map((t) => `${t}: ${a[t]} → ${b[t]}`);

/** Checks one answer; returns 'refused' or 'accepted', or throws with the route and payload. */
function judge(route: RouteDef, c: Case, sent: { path: string }, a: Answer): 'refused' | 'accepted' {
  const where = () => `${route.method.toUpperCase()} ${route.path} as ${sent.path.slice(0, 200)} body ${summary(c.body)} → ${a.status} ${a.text.slice(0, 300)}`;
  if (a.status >= 500) throw new Error(`server error: ${where()}`);
  if (a.status >= 200 && a.status < 300) return 'accepted';
  if (a.status < 400) throw new Error(`neither accepted nor refused: ${where()}`);
  let parsed: { error?: { message?: unknown } };
  try {
    parsed = JSON.parse(a.text);
  } catch {
    throw new Error(`refusal is not JSON: ${where()}`);
  }
  if (typeof parsed.error?.message !== 'string' || parsed.error.message.trim() === '') throw new Error(`refusal without a message: ${where()}`);
  if (route.auth && a.status === 401) throw new Error(`the keeper's session was lost: ${where()}`);
  return 'refused';
}

const summary = (b: Body) => (b.kind === 'json' ? JSON.stringify(b.value)?.slice(0, 300) : `${b.contentType}: ${b.text.slice(0, 300)}`);

let casesRun = 0;
let accepted = 0;
const statusTally: Record<number, number> = {};

beforeAll(async () => {
  s = await startDemoServer();
  server = http.createServer(s.app);
  await new Promise<void>((r) => server.listen(0, '127.0.0.1', r));
  port = (server.address() as AddressInfo).port;

  const signIn = await send('post', '/api/auth/sign-in', { 'content-type': 'application/json' }, Buffer.from(JSON.stringify({ email: DEMO_USERS.keeper.email, password: DEMO_PASSWORD })));
  if (signIn.status !== 200) throw new Error(`sign-in failed: ${signIn.status}`);
  cookie = signIn.setCookie.map((c) => c.split(';')[0]).join('; ');

  const db = s.testDb.db;
  const now = s.clock.now;
  realIds.apiaryId = s.ids.orchardRow;
  realIds.hiveId = s.ids.hives.Ash!;
  realIds.userId = s.ids.users.mentor;
  for (const [kind, seg] of Object.entries(RECORD_KIND_PATHS) as [RecordFormKind, string][]) {
    const r = await db.$client.query<{ id: string }>(`select id from ${RECORD_TABLES[kind]} limit 1`);
    if (r.rows[0]) realIds[`record:${seg}`] = r.rows[0].id;
  }
  const task = await s.as.keeper
    .post('/api/tasks')
    .send({ apiaryId: s.ids.orchardRow, hiveId: s.ids.hives.Ash, title: 'Fuzz: bring a spare super', dueDate: new Date(now.getTime() + 3 * 86_400_000).toISOString().slice(0, 10) })
    .expect(201);
  realIds.taskId = encodeURIComponent(task.body.task.key);
  const inv = newToken();
  const [invitation] = await db
    .insert(invitations)
    .values({ apiaryId: s.ids.orchardRow, email: 'fuzz-invitee@example.test', role: 'viewer', tokenHash: inv.hash, expiresAt: new Date(now.getTime() + 7 * 86_400_000), invitedBy: s.ids.users.keeper })
    .returning({ id: invitations.id });
  realIds.invitationId = invitation!.id;
  realIds.invitationToken = inv.token;
  const reset = newToken();
  await db.insert(passwordResets).values({ userId: s.ids.users.mentor, tokenHash: reset.hash, expiresAt: new Date(now.getTime() + 3_600_000) });
  realIds.resetToken = reset.token;
  const photo = await db.$client.query<{ id: string }>('select id from photos limit 1');
  realIds.photoId = photo.rows[0]?.id ?? randomUUID();
});

afterAll(async () => {
  // eslint-disable-next-line no-console
  console.log(`fuzz: ${casesRun} cases run across ${WRITE_ROUTES.length} write routes; ${accepted} accepted (2xx), statuses ${JSON.stringify(statusTally)}`);
  agent.destroy();
  await new Promise((r) => server?.close(r));
  await s?.close();
});

describe('regressions found by fuzzing', () => {
  it('refuses a NUL character in text with a 400 and a message, and keeps no row (it was a 500: PostgreSQL cannot store U+0000)', async () => {
    const before = await rowCounts();
    const a = await send('post', '/api/apiaries', { 'content-type': 'application/json' }, Buffer.from(JSON.stringify({ name: 'Orchard\u0000Row' })));
    expect(a.status).toBe(400);
    expect(JSON.parse(a.text).error.message).toMatch(/NUL/);
    const note = await send('post', `/api/hives/${realIds.hiveId}/feedings`, { 'content-type': 'application/json', 'idempotency-key': randomUUID() }, Buffer.from(JSON.stringify({ kind: 'syrup', ratio: '1:1', basis: 'volume', amountL: 2, note: 'a\u0000' })));
    expect(note.status).toBe(400);
    expect(changed(before, await rowCounts())).toEqual([]);
  });

  it('refuses a body nested 20,000 levels deep with a 400 (it was a 500: the idempotency fingerprint overflowed the stack)', async () => {
    const deep = '{"note":'.repeat(20_000) + '1' + '}'.repeat(20_000);
    const a = await send('post', `/api/hives/${realIds.hiveId}/inspections`, { 'content-type': 'application/json', 'idempotency-key': randomUUID() }, Buffer.from(deep));
    expect(a.status).toBe(400);
    expect(JSON.parse(a.text).error.message).toMatch(/nested too deeply/);
  });

  it('still takes a normal record with an Idempotency-Key', async () => {
    const a = await send('post', `/api/hives/${realIds.hiveId}/feedings`, { 'content-type': 'application/json', 'idempotency-key': randomUUID() }, Buffer.from(JSON.stringify({ kind: 'syrup', ratio: '1:1', basis: 'volume', amountL: 2, note: 'Fed before the fuzz \u202e run' })));
    expect(a.status).toBe(201);
  });
});

describe('every write route refuses bad or odd payloads with a 4xx and a message, and leaves no row behind', () => {
  it('has write routes to fuzz', () => {
    expect(WRITE_ROUTES.length).toBeGreaterThan(10);
    expect(WRITE_ROUTES.length * RUNS_PER_ROUTE * BATCH).toBeGreaterThanOrEqual(TOTAL_CASES);
  });

  it.each(WRITE_ROUTES.map((r) => [`${r.method.toUpperCase()} ${r.path}`, r] as const))('%s', async (_name, route) => {
    await fc.assert(
      fc.asyncProperty(fc.array(caseFor(route), { minLength: BATCH, maxLength: BATCH }), async (batch) => {
        const before = await rowCounts();
        const sent = batch.map((c) => requestOf(route, c));
        const answers = await Promise.all(sent.map((r) => send(route.method, r.path, r.headers, r.payload)));
        const verdicts = answers.map((a, i) => judge(route, batch[i]!, sent[i]!, a));
        casesRun += batch.length;
        for (const a of answers) statusTally[a.status] = (statusTally[a.status] ?? 0) + 1;
        const after = await rowCounts();
        if (!verdicts.includes('accepted')) {
          expect(changed(before, after)).toEqual([]);
          return;
        }
        // An accepted case changed rows on purpose: check each refused one on its own.
        accepted += verdicts.filter((v) => v === 'accepted').length;
        for (let i = 0; i < batch.length; i++) {
          if (verdicts[i] !== 'refused') continue;
          const b = await rowCounts();
          const again = await send(route.method, sent[i]!.path, sent[i]!.headers, sent[i]!.payload);
          if (judge(route, batch[i]!, sent[i]!, again) !== 'refused') continue;
          expect(changed(b, await rowCounts())).toEqual([]);
        }
      }),
      { numRuns: RUNS_PER_ROUTE, endOnFailure: true },
    );
  });

  it("leaves the keeper signed in (no case lost the session, so every case ran as the keeper)", async () => {
    const me = await send('get', '/api/me', {});
    expect(me.status).toBe(200);
  });
});
