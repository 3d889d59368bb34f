/**
 * The hive and apiary records (Quick check, feeding, treatment, mite count, harvest, queen and
 * colony events, Forage check) through one service, parameterised by a small table of kinds:
 * each kind differs only in its table, what it hangs off (a hive or an apiary) and its fields,
 * which the shared zod schemas describe. The story of every use case is the same:
 * check access → load → apply the rules → save with its audit row in one transaction.
 */
import { and, desc, eq, gte, lt, type SQL } from 'drizzle-orm';
import { alias, type PgColumn, type PgTable } from 'drizzle-orm/pg-core';
import type { Action } from '../../shared/domain/access';
import { cautionsFor, type CautionInput } from '../../shared/domain/cautions';
import { frameCapacity } from '../../shared/domain/hives';
import {
  recordSchemas,
  type RecordDto,
  type RecordFieldsByKind,
  type RecordFormKind,
  type RecordListQuery,
  type RecordSchemas,
} from '../../shared/schemas/records';
import { colonyEvents, feedings, forageChecks, harvests, hives, inspections, miteCounts, queenEvents, treatments, users } from '../../db/schema';
import type { Ctx, SessionUser } from '../context';
import { AppError, conflict, fromZod, notFound } from '../errors';
import { assertAllowed, findMembership, requireApiary, requireHive, type Membership } from './access';
import { recordAudit } from './audit';

type Tx = Parameters<Parameters<Ctx['db']['transaction']>[0]>[0];
type Conn = Ctx['db'] | Tx;

/** The columns every record table has (record-columns.ts) plus its parent. */
interface RecordTable {
  table: PgTable;
  id: PgColumn;
  occurredAt: PgColumn;
  createdAt: PgColumn;
  createdBy: PgColumn;
  updatedBy: PgColumn;
  /** hive_id for hive records, apiary_id for a Forage check. */
  parent: PgColumn;
}

interface KindDef {
  scope: 'hive' | 'apiary';
  t: RecordTable;
}

const tableOf = <T extends PgTable & { id: PgColumn; occurredAt: PgColumn; createdAt: PgColumn; createdBy: PgColumn; updatedBy: PgColumn }>(
  table: T,
  parent: PgColumn,
): RecordTable => ({ table, id: table.id, occurredAt: table.occurredAt, createdAt: table.createdAt, createdBy: table.createdBy, updatedBy: table.updatedBy, parent });

/** The table of kinds. The audit entity name is the kind itself. */
export const RECORD_KINDS_TABLE: Readonly<Record<RecordFormKind, KindDef>> = {
  inspection: { scope: 'hive', t: tableOf(inspections, inspections.hiveId) },
  feeding: { scope: 'hive', t: tableOf(feedings, feedings.hiveId) },
  treatment: { scope: 'hive', t: tableOf(treatments, treatments.hiveId) },
  'mite-count': { scope: 'hive', t: tableOf(miteCounts, miteCounts.hiveId) },
  harvest: { scope: 'hive', t: tableOf(harvests, harvests.hiveId) },
  'queen-event': { scope: 'hive', t: tableOf(queenEvents, queenEvents.hiveId) },
  'colony-event': { scope: 'hive', t: tableOf(colonyEvents, colonyEvents.hiveId) },
  'forage-check': { scope: 'apiary', t: tableOf(forageChecks, forageChecks.apiaryId) },
};

/** The frame counts of a Quick check, each bounded by what the hive's boxes hold. */
const FRAME_FIELDS = [
  ['framesBrood', 'Frames of brood'],
  ['framesBees', 'Frames covered with bees'],
  ['honeyFrames', 'Honey frames'],
  ['pollenFrames', 'Pollen frames'],
] as const;

const DISH_FIELDS = ['minutesToEmpty', 'watchedMinutes', 'untouched'];

/** Columns that are bookkeeping rather than the record's own fields. */
const META_COLUMNS = new Set(['id', 'hiveId', 'apiaryId', 'occurredAt', 'note', 'createdBy', 'updatedBy', 'version', 'createdAt', 'updatedAt']);

type Row = Record<string, unknown> & {
  id: string;
  occurredAt: Date;
  note: string;
  version: number;
  createdBy: string;
  createdAt: Date;
  updatedAt: Date;
};

const schemaCache = new WeakMap<Ctx, RecordSchemas>();
/** The record schemas read the "not in the future" rule from the app's clock (tests move it). */
export function schemasOf(ctx: Ctx): RecordSchemas {
  let s = schemaCache.get(ctx);
  if (!s) {
    s = recordSchemas(ctx.now);
    schemaCache.set(ctx, s);
  }
  return s;
}

const invalid = (field: string, message: string) => new AppError('invalid', message, 400, { fields: { [field]: message } });

const creator = alias(users, 'record_creator');
const updater = alias(users, 'record_updater');

/** Loads records with their authors' names and their apiary, newest first. */
async function loadRows(db: Conn, kind: RecordFormKind, where: SQL | undefined, limit = 500) {
  const { t, scope } = RECORD_KINDS_TABLE[kind];
  const apiaryCol = scope === 'hive' ? hives.apiaryId : t.parent;
  let q = db
    .select({
      r: t.table,
      apiaryId: apiaryCol,
      creatorName: creator.name,
      updaterId: updater.id,
      updaterName: updater.name,
    })
    .from(t.table)
    .innerJoin(creator, eq(creator.id, t.createdBy))
    .leftJoin(updater, eq(updater.id, t.updatedBy))
    .$dynamic();
  if (scope === 'hive') q = q.innerJoin(hives, eq(hives.id, t.parent));
  const rows = await q.where(where).orderBy(desc(t.occurredAt), desc(t.createdAt)).limit(limit);
  return rows.map((x) => {
    return toDto(kind, x.r as Row, x.apiaryId as string, x.creatorName, x.updaterId && x.updaterName ? { id: x.updaterId, name: x.updaterName } : null);
  });
}

/** Each kind's own fields, from its shared schema: a column added for bookkeeping never leaks into a DTO. */
const FIELD_KEYS: Readonly<Record<RecordFormKind, readonly string[]>> = (() => {
  const shapes = recordSchemas();
  return Object.fromEntries(
    (Object.keys(RECORD_KINDS_TABLE) as RecordFormKind[]).map((k) => [k, Object.keys(shapes[k].update.shape).filter((f) => !META_COLUMNS.has(f))]),
  ) as Record<RecordFormKind, string[]>;
})();

function fieldsOf(kind: RecordFormKind, row: Row): Record<string, unknown> {
  return Object.fromEntries(FIELD_KEYS[kind].map((k) => [k, row[k]]));
}

function toDto<K extends RecordFormKind>(kind: K, row: Row, apiaryId: string, creatorName: string, updatedBy: { id: string; name: string } | null): RecordDto<K> {
  const fields = fieldsOf(kind, row);
  const dto = {
    id: row.id,
    recordKind: kind,
    hiveId: RECORD_KINDS_TABLE[kind].scope === 'hive' ? (row.hiveId as string) : null,
    apiaryId,
    occurredAt: row.occurredAt.toISOString(),
    note: row.note,
    ...fields,
    createdBy: { id: row.createdBy, name: creatorName },
    updatedBy,
    version: row.version,
    createdAt: row.createdAt.toISOString(),
    updatedAt: row.updatedAt.toISOString(),
    cautions: cautionsFor(kind, fields as CautionInput),
  };
  return dto as unknown as RecordDto<K>;
}

async function loadOne<K extends RecordFormKind>(db: Conn, kind: K, recordId: string): Promise<RecordDto<K> | null> {
  const [dto] = await loadRows(db, kind, eq(RECORD_KINDS_TABLE[kind].t.id, recordId));
  return (dto as RecordDto<K> | undefined) ?? null;
}

/** The parent's apiary and, for a hive, its boxes; checks the person may do `action` there. */
async function requireParent(ctx: Ctx, user: SessionUser, kind: RecordFormKind, parentId: string, action: Action) {
  if (RECORD_KINDS_TABLE[kind].scope === 'apiary') {
    const m = await requireApiary(ctx, user, parentId, action);
    return { apiaryId: m.apiaryId, capacity: null as number | null, membership: m };
  }
  const m = await requireHive(ctx, user, parentId, action);
  const [h] = await ctx.db.select({ boxes: hives.boxes }).from(hives).where(eq(hives.id, parentId)).limit(1);
  return { apiaryId: m.apiaryId, capacity: h ? frameCapacity(h.boxes) : null, membership: m };
}

/** Rules that need the database: frames within the hive's boxes; a colony event's other hive. */
async function checkAgainstHive(ctx: Ctx, user: SessionUser, kind: RecordFormKind, hiveId: string | null, fields: Record<string, unknown>, capacity: number | null) {
  if (kind === 'inspection' && capacity !== null) {
    for (const [field, label] of FRAME_FIELDS) {
      const n = fields[field] as number;
      if (n > capacity) throw invalid(field, `${label} (${n}) is more than this hive’s boxes hold (${capacity} frames).`);
    }
  }
  if (kind === 'colony-event' && fields.otherHiveId) {
    const other = fields.otherHiveId as string;
    if (other === hiveId) throw invalid('otherHiveId', 'The other hive must be a different hive.');
    const [h] = await ctx.db.select({ apiaryId: hives.apiaryId }).from(hives).where(eq(hives.id, other)).limit(1);
    const m = h ? await findMembership(ctx, user.id, h.apiaryId) : null;
    if (!m) throw invalid('otherHiveId', 'The other hive was not found among your hives.');
  }
}

const parentColumnName = (kind: RecordFormKind) => (RECORD_KINDS_TABLE[kind].scope === 'hive' ? 'hiveId' : 'apiaryId');

/** Creates a record of `kind` on a hive (or an apiary, for a Forage check); `input` is the parsed create body. */
export async function createRecord<K extends RecordFormKind>(
  ctx: Ctx,
  user: SessionUser,
  kind: K,
  parentId: string,
  input: RecordFieldsByKind[K],
): Promise<RecordDto<K>> {
  const { apiaryId, capacity } = await requireParent(ctx, user, kind, parentId, `record:create:${kind}`);
  const { occurredAt, note, ...fields } = input as RecordFieldsByKind[K] & { occurredAt: string; note: string };
  await checkAgainstHive(ctx, user, kind, RECORD_KINDS_TABLE[kind].scope === 'hive' ? parentId : null, fields, capacity);
  const { t } = RECORD_KINDS_TABLE[kind];
  return ctx.db.transaction(async (tx) => {
    const now = ctx.now();
    const [row] = (await tx
      .insert(t.table)
      .values({
        ...fields,
        [parentColumnName(kind)]: parentId,
        occurredAt: new Date(occurredAt),
        note,
        createdBy: user.id,
        updatedBy: user.id,
        createdAt: now,
        updatedAt: now,
      } as never)
      .returning({ id: t.id })) as { id: string }[];
    const dto = (await loadOne(tx, kind, row!.id))!;
    await recordAudit(tx, ctx, { apiaryId, userId: user.id, entity: kind, entityId: dto.id, action: 'create', after: { ...dto } });
    return dto;
  });
}

/** A hive's (or apiary's) records of one kind, newest first; `season` keeps one calendar year (UTC), `limit` the newest N (at most 500). */
export async function listRecords<K extends RecordFormKind>(ctx: Ctx, user: SessionUser, kind: K, parentId: string, q: RecordListQuery): Promise<RecordDto<K>[]> {
  await requireParent(ctx, user, kind, parentId, 'hive:read');
  const { t } = RECORD_KINDS_TABLE[kind];
  const conds: SQL[] = [eq(t.parent, parentId)];
  if (q.season !== undefined) {
    conds.push(gte(t.occurredAt, new Date(Date.UTC(q.season, 0, 1))), lt(t.occurredAt, new Date(Date.UTC(q.season + 1, 0, 1))));
  }
  return (await loadRows(ctx.db, kind, and(...conds), q.limit)) as RecordDto<K>[];
}

/**
 * Finds a record and checks the person may `action` in its apiary. A stranger gets the same
 * 404 as for an id that does not exist.
 */
async function requireRecord<K extends RecordFormKind>(ctx: Ctx, db: Conn, user: SessionUser, kind: K, recordId: string) {
  const dto = await loadOne(db, kind, recordId);
  if (!dto) throw notFound('That record');
  const m = await findMembership(ctx, user.id, dto.apiaryId);
  if (!m) throw notFound('That record');
  assertAllowed(ctx, m, 'hive:read');
  return { dto, membership: m };
}

export async function getRecord<K extends RecordFormKind>(ctx: Ctx, user: SessionUser, kind: K, recordId: string): Promise<RecordDto<K>> {
  return (await requireRecord(ctx, ctx.db, user, kind, recordId)).dto;
}

/** Editing or deleting your own record needs the right to record that kind; someone else's needs `others`. */
function assertMayChange(ctx: Ctx, m: Membership, user: SessionUser, dto: RecordDto, others: Action) {
  assertAllowed(ctx, m, dto.createdBy.id === user.id ? (`record:create:${dto.recordKind}` as Action) : others);
}

/**
 * Edits a record. `patch.version` must be the version the edit was based on; a stale one answers
 * 409 with the current record. The patch is merged into the record and the whole is checked again
 * with the create schema, so no edit can leave a record that could not have been created.
 */
export async function updateRecord<K extends RecordFormKind>(
  ctx: Ctx,
  user: SessionUser,
  kind: K,
  recordId: string,
  patch: { version: number } & Record<string, unknown>,
): Promise<RecordDto<K>> {
  const first = await requireRecord(ctx, ctx.db, user, kind, recordId);
  assertMayChange(ctx, first.membership, user, first.dto, 'record:edit-others');
  const { t } = RECORD_KINDS_TABLE[kind];
  const schemas = schemasOf(ctx);
  return ctx.db.transaction(async (tx) => {
    await tx.select({ id: t.id }).from(t.table).where(eq(t.id, recordId)).for('update');
    const before = await loadOne(tx, kind, recordId);
    if (!before) throw notFound('That record');
    const { version, ...changes } = patch;
    if (version !== before.version) {
      throw conflict('Someone else changed this record since you opened it. Here is the current version.', { current: before });
    }
    const editable = Object.keys(schemas[kind].update.shape).filter((k) => k !== 'version');
    const current = Object.fromEntries(editable.map((k) => [k, (before as unknown as Record<string, unknown>)[k]]));
    const merged: Record<string, unknown> = { ...current, ...changes };
    // A Forage check's judgement may have come from its dish: a new dish reading is judged again
    // unless the edit also says what the keeper judged.
    if (kind === 'forage-check' && !('judgement' in changes) && DISH_FIELDS.some((f) => f in changes)) merged.judgement = null;
    const parsed = schemas[kind].create.safeParse(merged);
    if (!parsed.success) throw fromZod(parsed.error);
    const { occurredAt, note, ...fields } = parsed.data as Record<string, unknown> & { occurredAt: string; note: string };
    const capacity = await hiveCapacity(tx, before);
    await checkAgainstHive(ctx, user, kind, before.hiveId, fields, capacity);
    await tx
      .update(t.table)
      .set({ ...fields, occurredAt: new Date(occurredAt), note, updatedBy: user.id, version: before.version + 1, updatedAt: ctx.now() } as never)
      .where(eq(t.id, recordId));
    const after = (await loadOne(tx, kind, recordId))!;
    await recordAudit(tx, ctx, { apiaryId: after.apiaryId, userId: user.id, entity: kind, entityId: recordId, action: 'update', before: { ...before }, after: { ...after } });
    return after;
  });
}

async function hiveCapacity(db: Conn, dto: RecordDto): Promise<number | null> {
  if (!dto.hiveId) return null;
  const [h] = await db.select({ boxes: hives.boxes }).from(hives).where(eq(hives.id, dto.hiveId)).limit(1);
  return h ? frameCapacity(h.boxes) : null;
}

/** Deletes a record, with its audit row (the whole record as it was). */
export async function deleteRecord(ctx: Ctx, user: SessionUser, kind: RecordFormKind, recordId: string): Promise<void> {
  const { dto, membership } = await requireRecord(ctx, ctx.db, user, kind, recordId);
  // Deleting needs its own right even for your own record: a sitter may record and correct, not remove.
  assertAllowed(ctx, membership, dto.createdBy.id === user.id ? 'record:delete-own' : 'record:delete-others');
  const { t } = RECORD_KINDS_TABLE[kind];
  await ctx.db.transaction(async (tx) => {
    const gone = (await tx.delete(t.table).where(eq(t.id, recordId)).returning({ id: t.id })) as { id: string }[];
    if (gone.length === 0) throw notFound('That record');
    await recordAudit(tx, ctx, { apiaryId: dto.apiaryId, userId: user.id, entity: kind, entityId: recordId, action: 'delete', before: { ...dto } });
  });
}
