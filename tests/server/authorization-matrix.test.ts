/**
 * The authorization matrix: every API route the server declares × every kind of person, against
 * the status the roles rules say it must answer (Frameside's own policy: the roles issue and
 * shared/domain/access.ts; not a published table). The route list comes from createApp's own
 * route table, so a new route without a row here FAILS the suite.
 *
 * Each cell runs in a world of its own (a fresh apiary with an owner, a keeper, a sitter whose
 * window is around today, a viewer; and a person who belongs only to another apiary), so a write
 * in one cell cannot change another cell's answer. "Sitter after the window" moves the server
 * clock past the end of the window. Bodies are valid, so a role that may write gets the real 2xx.
 */
import { randomBytes } from 'node:crypto';
import request from 'supertest';
import { sealData } from 'iron-session';
import { apiaries, hives, invitations, memberships, passwordResets, photos, sessions, users } from '../../db/schema';
import { createApp } from '../../server/app';
import type { Db } from '../../db/client';
import type { SessionUser } from '../../server/context';
import { hashPassword } from '../../server/password';
import { SESSION_COOKIE } from '../../server/middleware/session';
import * as records from '../../server/services/records';
import { createTask } from '../../server/services/due';
import { newToken } from '../../server/tokens';
import { RECORD_KIND_PATHS, type RecordFormKind } from '../../shared/schemas/records';
import { startDemoServer, TEST_SESSION_PASSWORD, type DemoServer } from '../helpers/server';

jest.setTimeout(120_000);

const ACTORS = ['owner', 'keeper', 'sitter', 'sitterAfter', 'viewer', 'other', 'anon'] as const;
type Actor = (typeof ACTORS)[number];
type Row = Record<Actor, number>;

/** One row: owner, keeper, sitter in window, sitter after window, viewer, member of another apiary only, signed out. */
const row = (owner: number, keeper: number, sitter: number, sitterAfter: number, viewer: number, other: number, anon: number): Row => ({
  owner,
  keeper,
  sitter,
  sitterAfter,
  viewer,
  other,
  anon,
});

// Patterns the rules produce again and again.
/** Anything a member may read; the window closes it for the sitter; strangers learn nothing (404). */
const READ = (ok = 200) => row(ok, ok, ok, 403, ok, 404, 401);
/** Owner and keeper only (hives, treatments, harvests…). */
const KEEPERS = (ok: number) => row(ok, ok, 403, 403, 403, 404, 401);
/** The everyday care a sitter may do in her window. */
const CARE = (ok: number) => row(ok, ok, ok, 403, 403, 404, 401);
/** Owner only (members, deleting the apiary, the activity trail). */
const OWNER = (ok: number) => row(ok, 403, 403, 403, 403, 404, 401);
/** About the signed-in person, not an apiary: every account gets it. */
const PERSONAL = (ok: number) => row(ok, ok, ok, ok, ok, ok, 401);
/** Open to everyone, signed in or not. */
const PUBLIC = (ok: number) => row(ok, ok, ok, ok, ok, ok, ok);

/** Which record kinds a sitter may write (the roles issue: Quick checks, feedings, forage checks, photos). */
const SITTER_RECORDS: Record<RecordFormKind, boolean> = {
  inspection: true,
  feeding: true,
  treatment: false,
  'mite-count': false,
  harvest: false,
  'queen-event': false,
  'colony-event': false,
  'forage-check': true,
};

function recordRows(): Record<string, Row> {
  const out: Record<string, Row> = {};
  for (const [kind, seg] of Object.entries(RECORD_KIND_PATHS) as [RecordFormKind, string][]) {
    const base = kind === 'forage-check' ? `/api/apiaries/:apiaryId/${seg}` : `/api/hives/:hiveId/${seg}`;
    out[`POST ${base}`] = SITTER_RECORDS[kind] ? CARE(201) : KEEPERS(201);
    out[`GET ${base}`] = READ();
    out[`GET /api/${seg}/:recordId`] = READ();
    // The record was written by the owner: a sitter may not edit or delete others' records.
    out[`PATCH /api/${seg}/:recordId`] = KEEPERS(200);
    out[`DELETE /api/${seg}/:recordId`] = KEEPERS(204);
  }
  return out;
}

/** The expected status of every route, keyed "METHOD /path" exactly as the route table writes it. */
const EXPECTED: Record<string, Row> = {
  'GET /api/health': PUBLIC(200),
  'POST /api/auth/sign-up': PUBLIC(201),
  'POST /api/auth/sign-in': PUBLIC(200),
  'POST /api/auth/sign-out': PUBLIC(204),
  'GET /api/me': PERSONAL(200),
  'GET /api/apiaries': PERSONAL(200),
  'POST /api/apiaries': PERSONAL(201),
  'GET /api/apiaries/:apiaryId': READ(),
  'PATCH /api/apiaries/:apiaryId': KEEPERS(200),
  'DELETE /api/apiaries/:apiaryId': OWNER(204),
  'GET /api/apiaries/:apiaryId/hives': READ(),
  'POST /api/apiaries/:apiaryId/hives': KEEPERS(201),
  'GET /api/hives/:hiveId': READ(),
  'PATCH /api/hives/:hiveId': KEEPERS(200),

  // People (this issue).
  'GET /api/apiaries/:apiaryId/members': KEEPERS(200),
  'PATCH /api/apiaries/:apiaryId/members/:userId': OWNER(200),
  'DELETE /api/apiaries/:apiaryId/members/:userId': OWNER(204),
  'POST /api/apiaries/:apiaryId/invitations': OWNER(201),
  'DELETE /api/apiaries/:apiaryId/invitations/:invitationId': OWNER(204),
  // Public by design: the link is the key (expiry and single use are tested in people.test.ts).
  'GET /api/invitations/:token': PUBLIC(200),
  // Signed in, it accepts for that account: members of the apiary already have access (409, the
  // ended sitter too: the owner changes her window instead); the person from another apiary joins;
  // signed out, the e-mail and password make a new account.
  'POST /api/invitations/:token/accept': row(409, 409, 409, 409, 409, 200, 200),
  'GET /api/apiaries/:apiaryId/activity': OWNER(200),
  'GET /api/apiaries/:apiaryId/handover': CARE(200),
  'POST /api/auth/password-reset': PUBLIC(202),
  // The link is the key, whoever opens it (single use and expiry: people.test.ts).
  'POST /api/auth/password-reset/:token': PUBLIC(204),

  // The Due list and tasks.
  'GET /api/due': READ(),
  'POST /api/tasks': KEEPERS(201),
  'POST /api/tasks/:taskId/done': CARE(200),
  'POST /api/tasks/:taskId/snooze': CARE(200),
  'POST /api/tasks/:taskId/dismiss': CARE(200),

  'GET /api/hives/:hiveId/story': READ(),
  ...recordRows(),

  // Photos: a sitter may add them; the owner's photo is not hers to delete.
  'POST /api/hives/:hiveId/photos': CARE(202),
  'GET /api/hives/:hiveId/photos': READ(),
  'GET /api/photos/:photoId': READ(),
  'DELETE /api/photos/:photoId': KEEPERS(204),

  'GET /api/hives/:hiveId/season': READ(),
  'GET /api/apiaries/:apiaryId/season': READ(),
  'POST /api/hives/:hiveId/sensor-imports': KEEPERS(201),
  'GET /api/hives/:hiveId/sensor-readings': READ(),
  'GET /api/apiaries/:apiaryId/treatments.csv': KEEPERS(200),
  'GET /api/apiaries/:apiaryId/records.csv': KEEPERS(200),
  // The account export covers what the person owns; the import only fills an account that owns nothing yet (409).
  'GET /api/export': PERSONAL(200),
  'POST /api/import': row(409, 201, 201, 201, 201, 409, 401),
};

// ---------------------------------------------------------------------------------- worlds

const PASSWORD = 'matrix-password-1';
let passwordHash = '';
let seq = 0;

interface World {
  apiaryId: string;
  otherApiaryId: string;
  hiveId: string;
  hive2Id: string;
  people: Record<Exclude<Actor, 'anon' | 'sitterAfter'>, SessionUser>;
}

const DAY = 86_400_000;

async function buildWorld(s: DemoServer): Promise<World> {
  const n = ++seq;
  const tag = randomBytes(3).toString('hex');
  const db = s.testDb.db;
  const now = s.clock.now;
  const roles = ['owner', 'keeper', 'sitter', 'viewer', 'other'] as const;
  const us = await db
    .insert(users)
    .values(roles.map((r) => ({ email: `${r}-${n}-${tag}@matrix.test`, name: `${r} ${n}`, passwordHash })))
    .returning({ id: users.id, email: users.email, name: users.name });
  const people = Object.fromEntries(roles.map((r, i) => [r, us[i]!])) as World['people'];
  const [a, b] = await db
    .insert(apiaries)
    .values([{ name: `Matrix ${n}` }, { name: `Elsewhere ${n}` }])
    .returning({ id: apiaries.id });
  await db.insert(memberships).values([
    { apiaryId: a!.id, userId: people.owner.id, role: 'owner' },
    { apiaryId: a!.id, userId: people.keeper.id, role: 'keeper' },
    { apiaryId: a!.id, userId: people.sitter.id, role: 'sitter', startsAt: new Date(now.getTime() - 3 * DAY), endsAt: new Date(now.getTime() + 11 * DAY) },
    { apiaryId: a!.id, userId: people.viewer.id, role: 'viewer' },
    { apiaryId: b!.id, userId: people.other.id, role: 'owner' },
  ]);
  const boxes = [
    { size: 'deep' as const, frames: 10 },
    { size: 'deep' as const, frames: 10 },
  ];
  const [h1, h2] = await db
    .insert(hives)
    .values([
      { apiaryId: a!.id, name: 'Alder', boxes },
      { apiaryId: a!.id, name: 'Birch', boxes },
    ])
    .returning({ id: hives.id });
  return { apiaryId: a!.id, otherApiaryId: b!.id, hiveId: h1!.id, hive2Id: h2!.id, people };
}

async function cookieFor(s: DemoServer, user: SessionUser): Promise<string> {
  const [row] = await s.testDb.db.insert(sessions).values({ userId: user.id }).returning({ id: sessions.id });
  const sealed = await sealData({ sid: row!.id }, { password: TEST_SESSION_PASSWORD });
  return `${SESSION_COOKIE}=${sealed}`;
}

// ---------------------------------------------------------------------------------- requests

interface Req {
  path: string;
  body?: unknown;
  csv?: string;
  photo?: Buffer;
}
type Prep = (w: World, s: DemoServer) => Promise<Req>;

const today = (s: DemoServer) => s.clock.now.toISOString().slice(0, 10);
const plusDays = (s: DemoServer, d: number) => new Date(s.clock.now.getTime() + d * DAY).toISOString().slice(0, 10);

function createBodies(w: World, s: DemoServer): Record<RecordFormKind, Record<string, unknown>> {
  return {
    inspection: { framesBrood: 6, framesBees: 9.5, honeyFrames: 3, pollenFrames: 1.5, queenStatus: 'eggs-seen', eggsSeen: true, temperament: 2 },
    feeding: { kind: 'syrup', ratio: '1:1', basis: 'volume', amountL: 3 },
    treatment: { activeIngredient: 'oxalic-acid', method: 'dribble', dose: 'As on the label', batch: 'L123', startDate: today(s) },
    'mite-count': { method: 'alcohol-wash', mites: 9 },
    harvest: { supers: 2, weightKg: 21.5, moisturePercent: 17.4 },
    'queen-event': { kind: 'seen' },
    'colony-event': { kind: 'split-to', otherHiveId: w.hive2Id },
    'forage-check': { judgement: 'some' },
  };
}

/** A record of `kind` written by the owner, through the service (what the POST route calls). */
async function ownersRecord(w: World, s: DemoServer, kind: RecordFormKind): Promise<string> {
  const schemas = records.schemasOf(s.ctx);
  const input = schemas[kind].create.parse(createBodies(w, s)[kind]);
  const parent = kind === 'forage-check' ? w.apiaryId : w.hiveId;
  const dto = await records.createRecord(s.ctx, w.people.owner, kind, parent, input as never);
  return dto.id;
}

async function ownersTask(w: World, s: DemoServer): Promise<string> {
  const t = await createTask(s.ctx, w.people.owner, { apiaryId: w.apiaryId, hiveId: w.hiveId, title: 'Check the feeder', dueDate: plusDays(s, 2) });
  return encodeURIComponent(t.key);
}

const JPEG = Buffer.from(
  '/9j/4AAQSkZJRgABAQAAAQABAAD/2wCEAAEBAQEBAQEBAQEBAQEBAQEBAQEBAQEBAQEBAQEBAQEBAQEBAQEBAQEBAQEBAQEBAQEBAQEBAQEBAQEBAQEBAQEBAQEBAQEBAQEBAQEBAQEBAQEBAQEBAQEBAQEBAQEBAQEBAQEBAQEBAQEBAQEBAQEBAQEBAQEBAQEBAQEBAQEBAf/AABEIAAgACAMBEQACEQEDEQH/xAGiAAABBQEBAQEBAQAAAAAAAAAAAQIDBAUGBwgJCgsQAAIBAwMCBAMFBQQEAAABfQECAwAEEQUSITFBBhNRYQcicRQygZGhCCNCscEVUtHwJDNicoIJChYXGBkaJSYnKCkqNDU2Nzg5OkNERUZHSElKU1RVVldYWVpjZGVmZ2hpanN0dXZ3eHl6g4SFhoeIiYqSk5SVlpeYmZqio6Slpqeoqaqys7S1tre4ubrCw8TFxsfIycrS09TV1tfY2drh4uPk5ebn6Onq8fLz9PX29/j5+gEAAwEBAQEBAQEBAQAAAAAAAAECAwQFBgcICQoLEQACAQIEBAMEBwUEBAABAncAAQIDEQQFITEGEkFRB2FxEyIygQgUQpGhscEJIzNS8BVictEKFiQ04SXxFxgZGiYnKCkqNTY3ODk6Q0RFRkdISUpTVFVWV1hZWmNkZWZnaGlqc3R1dnd4eXqCg4SFhoeIiYqSk5SVlpeYmZqio6Slpqeoqaqys7S1tre4ubrCw8TFxsfIycrS09TV1tfY2dri4+Tl5ufo6ery8/T19vf4+fr/2gAMAwEAAhEDEQA/AP0Ir/Ec/uA//9k=',
  'base64',
);

/** A ready photo of the owner's, stored as the image worker would have left it. */
async function ownersPhoto(w: World, s: DemoServer): Promise<string> {
  const key = `photos/${randomBytes(16).toString('hex')}`;
  for (const size of ['original', 'display', 'thumb']) await s.ctx.storage.put(`${key}/${size}.jpg`, JPEG);
  const [p] = await s.testDb.db
    .insert(photos)
    .values({
      hiveId: w.hiveId,
      status: 'ready',
      originalKey: `${key}/original.jpg`,
      displayKey: `${key}/display.jpg`,
      thumbKey: `${key}/thumb.jpg`,
      width: 8,
      height: 8,
      bytes: JPEG.length,
      uploadBytes: JPEG.length,
      uploadedBy: w.people.owner.id,
    })
    .returning({ id: photos.id });
  return p!.id;
}

async function pendingInvitation(w: World, s: DemoServer): Promise<{ id: string; token: string }> {
  const { token, hash } = newToken();
  const [inv] = await s.testDb.db
    .insert(invitations)
    .values({
      apiaryId: w.apiaryId,
      email: `invited-${randomBytes(3).toString('hex')}@matrix.test`,
      role: 'viewer',
      tokenHash: hash,
      expiresAt: new Date(s.clock.now.getTime() + 7 * DAY),
      invitedBy: w.people.owner.id,
    })
    .returning({ id: invitations.id });
  return { id: inv!.id, token };
}

let exportBody: unknown;

function recordPreps(): Record<string, Prep> {
  const out: Record<string, Prep> = {};
  for (const [kind, seg] of Object.entries(RECORD_KIND_PATHS) as [RecordFormKind, string][]) {
    const parent = (w: World) => (kind === 'forage-check' ? `/api/apiaries/${w.apiaryId}` : `/api/hives/${w.hiveId}`);
    const base = kind === 'forage-check' ? `/api/apiaries/:apiaryId/${seg}` : `/api/hives/:hiveId/${seg}`;
    out[`POST ${base}`] = async (w, s) => ({ path: `${parent(w)}/${seg}`, body: createBodies(w, s)[kind] });
    out[`GET ${base}`] = async (w) => ({ path: `${parent(w)}/${seg}` });
    out[`GET /api/${seg}/:recordId`] = async (w, s) => ({ path: `/api/${seg}/${await ownersRecord(w, s, kind)}` });
    out[`PATCH /api/${seg}/:recordId`] = async (w, s) => ({
      path: `/api/${seg}/${await ownersRecord(w, s, kind)}`,
      body: { version: 1, note: 'Edited in the authorization matrix.' },
    });
    out[`DELETE /api/${seg}/:recordId`] = async (w, s) => ({ path: `/api/${seg}/${await ownersRecord(w, s, kind)}` });
  }
  return out;
}

const PREP: Record<string, Prep> = {
  'GET /api/health': async () => ({ path: '/api/health' }),
  'POST /api/auth/sign-up': async () => ({
    path: '/api/auth/sign-up',
    body: { email: `new-${randomBytes(4).toString('hex')}@matrix.test`, password: PASSWORD, name: 'New' },
  }),
  'POST /api/auth/sign-in': async (w) => ({ path: '/api/auth/sign-in', body: { email: w.people.viewer.email, password: PASSWORD } }),
  'POST /api/auth/sign-out': async () => ({ path: '/api/auth/sign-out' }),
  'GET /api/me': async () => ({ path: '/api/me' }),
  'GET /api/apiaries': async () => ({ path: '/api/apiaries' }),
  'POST /api/apiaries': async () => ({ path: '/api/apiaries', body: { name: 'New site' } }),
  'GET /api/apiaries/:apiaryId': async (w) => ({ path: `/api/apiaries/${w.apiaryId}` }),
  'PATCH /api/apiaries/:apiaryId': async (w) => ({ path: `/api/apiaries/${w.apiaryId}`, body: { climateNote: 'Sheltered by the hedge.' } }),
  'DELETE /api/apiaries/:apiaryId': async (w) => ({ path: `/api/apiaries/${w.apiaryId}` }),
  'GET /api/apiaries/:apiaryId/hives': async (w) => ({ path: `/api/apiaries/${w.apiaryId}/hives` }),
  'POST /api/apiaries/:apiaryId/hives': async (w) => ({
    path: `/api/apiaries/${w.apiaryId}/hives`,
    body: { name: 'Cedar', boxes: [{ size: 'deep', frames: 10 }] },
  }),
  'GET /api/hives/:hiveId': async (w) => ({ path: `/api/hives/${w.hiveId}` }),
  'PATCH /api/hives/:hiveId': async (w) => ({ path: `/api/hives/${w.hiveId}`, body: { note: 'Moved to the back row.' } }),

  'GET /api/apiaries/:apiaryId/members': async (w) => ({ path: `/api/apiaries/${w.apiaryId}/members` }),
  'PATCH /api/apiaries/:apiaryId/members/:userId': async (w) => ({
    path: `/api/apiaries/${w.apiaryId}/members/${w.people.viewer.id}`,
    body: { role: 'keeper' },
  }),
  'DELETE /api/apiaries/:apiaryId/members/:userId': async (w) => ({ path: `/api/apiaries/${w.apiaryId}/members/${w.people.viewer.id}` }),
  'POST /api/apiaries/:apiaryId/invitations': async (w, s) => ({
    path: `/api/apiaries/${w.apiaryId}/invitations`,
    body: { email: `sitter-${randomBytes(3).toString('hex')}@matrix.test`, role: 'sitter', startsAt: today(s), endsAt: plusDays(s, 13) },
  }),
  'DELETE /api/apiaries/:apiaryId/invitations/:invitationId': async (w, s) => ({
    path: `/api/apiaries/${w.apiaryId}/invitations/${(await pendingInvitation(w, s)).id}`,
  }),
  'GET /api/invitations/:token': async (w, s) => ({ path: `/api/invitations/${(await pendingInvitation(w, s)).token}` }),
  'POST /api/invitations/:token/accept': async (w, s) => ({
    path: `/api/invitations/${(await pendingInvitation(w, s)).token}/accept`,
    body: { email: `joiner-${randomBytes(3).toString('hex')}@matrix.test`, password: PASSWORD, name: 'Joiner' },
  }),
  'GET /api/apiaries/:apiaryId/activity': async (w) => ({ path: `/api/apiaries/${w.apiaryId}/activity` }),
  'GET /api/apiaries/:apiaryId/handover': async (w) => ({ path: `/api/apiaries/${w.apiaryId}/handover` }),
  'POST /api/auth/password-reset': async (w) => ({ path: '/api/auth/password-reset', body: { email: w.people.viewer.email } }),
  'POST /api/auth/password-reset/:token': async (w, s) => {
    const { token, hash } = newToken();
    await s.testDb.db.insert(passwordResets).values({ userId: w.people.viewer.id, tokenHash: hash, expiresAt: new Date(s.clock.now.getTime() + 3_600_000) });
    return { path: `/api/auth/password-reset/${token}`, body: { password: 'a-new-matrix-password' } };
  },

  'GET /api/due': async (w) => ({ path: `/api/due?apiaryId=${w.apiaryId}` }),
  'POST /api/tasks': async (w, s) => ({ path: '/api/tasks', body: { apiaryId: w.apiaryId, hiveId: w.hiveId, title: 'Bring a spare brood box', dueDate: plusDays(s, 3) } }),
  'POST /api/tasks/:taskId/done': async (w, s) => ({ path: `/api/tasks/${await ownersTask(w, s)}/done`, body: {} }),
  'POST /api/tasks/:taskId/snooze': async (w, s) => ({ path: `/api/tasks/${await ownersTask(w, s)}/snooze`, body: { until: plusDays(s, 5) } }),
  'POST /api/tasks/:taskId/dismiss': async (w, s) => ({ path: `/api/tasks/${await ownersTask(w, s)}/dismiss`, body: {} }),

  'GET /api/hives/:hiveId/story': async (w) => ({ path: `/api/hives/${w.hiveId}/story` }),
  ...recordPreps(),

  'POST /api/hives/:hiveId/photos': async (w) => ({ path: `/api/hives/${w.hiveId}/photos`, photo: JPEG }),
  'GET /api/hives/:hiveId/photos': async (w) => ({ path: `/api/hives/${w.hiveId}/photos` }),
  'GET /api/photos/:photoId': async (w, s) => ({ path: `/api/photos/${await ownersPhoto(w, s)}` }),
  'DELETE /api/photos/:photoId': async (w, s) => ({ path: `/api/photos/${await ownersPhoto(w, s)}` }),

  'GET /api/hives/:hiveId/season': async (w) => ({ path: `/api/hives/${w.hiveId}/season` }),
  'GET /api/apiaries/:apiaryId/season': async (w) => ({ path: `/api/apiaries/${w.apiaryId}/season` }),
  'POST /api/hives/:hiveId/sensor-imports': async (w) => ({
    path: `/api/hives/${w.hiveId}/sensor-imports?${new URLSearchParams({ fileName: 'logger.csv', timeFormat: 'iso', timeColumn: 'time', temperatureColumn: 'temp' })}`,
    csv: 'time,temp\n2026-06-01T00:00:00Z,34.5\n2026-06-01T01:00:00Z,34.6\n',
  }),
  'GET /api/hives/:hiveId/sensor-readings': async (w) => ({ path: `/api/hives/${w.hiveId}/sensor-readings` }),
  'GET /api/apiaries/:apiaryId/treatments.csv': async (w) => ({ path: `/api/apiaries/${w.apiaryId}/treatments.csv` }),
  'GET /api/apiaries/:apiaryId/records.csv': async (w) => ({ path: `/api/apiaries/${w.apiaryId}/records.csv` }),
  'GET /api/export': async () => ({ path: '/api/export' }),
  'POST /api/import': async () => ({ path: '/api/import', body: exportBody }),
};

// ---------------------------------------------------------------------------------- the suite

/** The route table, read synchronously so that Jest can name one test per route. */
const ROUTES = createApp({ db: {} as Db, sessionPassword: TEST_SESSION_PASSWORD }).routes.map((r) => `${r.method.toUpperCase()} ${r.path}`);

let s: DemoServer;
beforeAll(async () => {
  s = await startDemoServer();
  passwordHash = await hashPassword(PASSWORD);
  // A real account export for the import route: a small account with one apiary and one hive.
  const exporter = request.agent(s.app);
  await exporter.post('/api/auth/sign-up').send({ email: 'exporter@matrix.test', password: PASSWORD, name: 'Exporter' }).expect(201);
  const site = (await exporter.post('/api/apiaries').send({ name: 'Exported site' }).expect(201)).body.apiary;
  await exporter.post(`/api/apiaries/${site.id}/hives`).send({ name: 'Yew', boxes: [{ size: 'deep', frames: 10 }] }).expect(201);
  exportBody = (await exporter.get('/api/export').expect(200)).body;
});
afterAll(() => s?.close());

/**
 * Writes that leave no audit row, with the reason. Everything else that answers 2xx to a POST,
 * PATCH or DELETE must add at least one row to audit_log (the roles issue: every create, edit
 * and delete records who, when and what).
 */
const NOT_AUDITED: Record<string, string> = {
  'POST /api/auth/sign-up': 'an account, not apiary data; the session row is its own trail',
  'POST /api/auth/sign-in': 'a session, not a change to records',
  'POST /api/auth/sign-out': 'a session, not a change to records',
  'POST /api/auth/password-reset': 'only issues a link; using it is audited',
};

let audited = 0;
async function auditCount(): Promise<number> {
  const r = await s.testDb.db.$client.query<{ n: number }>('select count(*)::int as n from audit_log');
  return r.rows[0]!.n;
}

async function run(key: string, actor: Actor): Promise<number> {
  const w = await buildWorld(s);
  const person = actor === 'anon' ? null : actor === 'sitterAfter' ? w.people.sitter : w.people[actor];
  const cookie = person ? await cookieFor(s, person) : null;
  const [method] = key.split(' ') as [string];
  // The window was set at the real "now"; 12 days on it has ended (it ran to now + 11 days).
  if (actor === 'sitterAfter') s.clock.advanceDays(12);
  try {
    // Bodies and fixtures are made at the moved clock, so a date in a body is never stale.
    const req = await PREP[key]!(w, s);
    let r = request(s.app)[method.toLowerCase() as 'get' | 'post' | 'patch' | 'delete'](req.path);
    if (cookie) r = r.set('Cookie', cookie);
    if (req.csv !== undefined) r = r.set('Content-Type', 'text/csv').send(req.csv);
    else if (req.photo) r = r.attach('photos', req.photo, { filename: 'frame.jpg', contentType: 'image/jpeg' });
    else if (req.body !== undefined) r = r.send(req.body as object);
    const before = await auditCount();
    const res = await r;
    // Photos and imports finish their rows in the background; the request itself must already audit.
    audited = (await auditCount()) - before;
    if (process.env.MATRIX_DEBUG && key.includes(process.env.MATRIX_DEBUG)) console.log(key, actor, res.status, JSON.stringify(res.body).slice(0, 300));
    if (res.status >= 500) throw new Error(`${key} as ${actor}: ${res.status} ${JSON.stringify(res.body)}`);
    return res.status;
  } finally {
    if (actor === 'sitterAfter') s.clock.advanceDays(-12);
  }
}

describe('authorization matrix', () => {
  it('has an expected row and a request for every route the server declares, and no stale rows', () => {
    const missing = ROUTES.filter((k) => !EXPECTED[k]);
    const noPrep = ROUTES.filter((k) => !PREP[k]);
    const stale = Object.keys(EXPECTED).filter((k) => !ROUTES.includes(k));
    expect({ missing, noPrep, stale }).toEqual({ missing: [], noPrep: [], stale: [] });
  });

  it('reads the same route table from the running server', () => {
    expect(s.routes.map((r) => `${r.method.toUpperCase()} ${r.path}`)).toEqual(ROUTES);
  });

  it.each(ROUTES)('%s', async (key) => {
    if (!EXPECTED[key] || !PREP[key]) throw new Error(`No expected row for ${key}: add it to EXPECTED and PREP.`);
    const actual = {} as Row;
    const unaudited: Actor[] = [];
    for (const actor of ACTORS) {
      actual[actor] = await run(key, actor);
      const write = !key.startsWith('GET ');
      if (write && actual[actor] >= 200 && actual[actor] < 300 && audited === 0 && !NOT_AUDITED[key]) unaudited.push(actor);
    }
    expect(actual).toEqual(EXPECTED[key]);
    // A successful write leaves an audit row (who, when, what).
    expect({ key, unaudited }).toEqual({ key, unaudited: [] });
  });

  it('counts the matrix', () => {
    // Printed for the closing note: routes × actors.
    console.log(`authorization matrix: ${ROUTES.length} routes × ${ACTORS.length} actors = ${ROUTES.length * ACTORS.length} cells`);
  });
});
