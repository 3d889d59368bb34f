/**
 * The Due list: tasks the rules in shared/domain/due.ts derive from each hive's records, plus
 * tasks people add, minus what people have marked done or dismissed; snoozed tasks move to
 * the day they were snoozed to. Loading is one query per record table for the whole set of
 * hives (never a query per hive), so the list costs the same handful of queries for 6 hives
 * or 600.
 */
import { and, asc, desc, eq, gte, inArray, sql, type AnyColumn } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import {
  apiaries,
  feedings,
  hiveRecordStamps,
  hives,
  inspections,
  memberships,
  miteCounts,
  queenEvents,
  tasks,
  treatments,
  users,
} from '../../db/schema';
import { windowState } from '../../shared/domain/access';
import { addDays, compareDates, utcMsToDate, type IsoDate } from '../../shared/domain/dates';
import { DUE_RULES, deriveTasks, isOverdue, sortTasks, type DerivedTask, type DueRule } from '../../shared/domain/due';
import type { Box, Hemisphere } from '../../shared/domain/hives';
import type {
  FeedingRecord,
  HiveRecords,
  InspectionRecord,
  MiteCountRecord,
  QueenEventRecord,
  StoresEstimateRecord,
  TreatmentRecord,
} from '../../shared/domain/records';
import { storesFromHoneyFrames as storesEstimate } from '../../shared/domain/stores';
import type { DueTaskDto, TaskCreateInput, TaskResolutionDto } from '../../shared/schemas/tasks';
import { taskCreateSchema } from '../../shared/schemas/tasks';
import type { Ctx, SessionUser } from '../context';
import { AppError, notFound } from '../errors';
import { requireApiary, requireHive } from './access';
import { recordAudit } from './audit';

type Db = Ctx['db'];
type Tx = Parameters<Parameters<Db['transaction']>[0]>[0];

/**
 * How far back records are read for the rules: a task from a record older than this is past
 * acting on (Frameside's own choice: about one season). The newest Quick check of each hive is
 * always read, however old, so the next-inspection rule never mistakes an old hive for a new one.
 * Treatments and mite counts are read for a year: a treatment started longer ago and never
 * recorded as ended is past reminding.
 */
export const DUE_LOOKBACK_DAYS = 120;
/**
 * Checks and feedings are read for 60 days: every rule that reads them looks only a few weeks back
 * (capped cells → the new queen's eggs by day 29; a caged queen's checks by day ~12; a feeder
 * 3–7 days; supers back on at most ~8 weeks after a treatment starts). Frameside's own choice,
 * which halves what the Due list reads in the busy season.
 */
export const DUE_CHECK_LOOKBACK_DAYS = 60;
const TREATMENT_LOOKBACK_DAYS = 365;

export interface ApiaryInfo {
  id: string;
  name: string;
  hemisphere: Hemisphere;
  winterTargetKg: number;
}

interface HiveInfo {
  id: string;
  apiaryId: string;
  name: string;
  boxes: Box[];
}

const dateOf = (d: Date): IsoDate => utcMsToDate(d.getTime());
/** `column = any($1::uuid[])`: one parameter for a set of hives, however many. */
const anyId = (column: AnyColumn, ids: readonly string[]) => sql`${column} = any(${sql.param(ids)}::uuid[])`;
const opt = <T>(v: T | null): T | undefined => (v === null ? undefined : v);
const todayOf = (ctx: Ctx): IsoDate => dateOf(ctx.now());
const ADDED_KEY_PREFIX = 'task:';

/** kg of honey on a check's honey frames, via estimateStores (TRADE-REFERENCES §6). */
export function storesFromHoneyFrames(honeyFrames: number, boxes: readonly Box[]): number {
  return storesEstimate(honeyFrames, boxes).kg;
}

/** Records the rules need for each hive, read with one query per table (plus one for each hive's newest check). */
export async function loadDueRecords(db: Db, hiveList: readonly HiveInfo[], today: IsoDate): Promise<Map<string, HiveRecords>> {
  const ids = hiveList.map((h) => h.id);
  const out = new Map<string, MutableRecords>();
  if (ids.length === 0) return out;
  const since = new Date(`${addDays(today, -DUE_LOOKBACK_DAYS)}T00:00:00Z`);
  const checksSince = new Date(`${addDays(today, -DUE_CHECK_LOOKBACK_DAYS)}T00:00:00Z`);
  const treatmentsSince = addDays(today, -TREATMENT_LOOKBACK_DAYS);

  // Only the columns the rules read (frame counts other than honey, disease signs: not used).
  const inspectionCols = {
    id: inspections.id,
    hiveId: inspections.hiveId,
    occurredAt: inspections.occurredAt,
    queenStatus: inspections.queenStatus,
    eggsSeen: inspections.eggsSeen,
    queenCells: inspections.queenCells,
    honeyFrames: inspections.honeyFrames,
    spaceActions: inspections.spaceActions,
  };
  const [recentChecks, feedRows, treatRows, miteRows, queenRows] = await Promise.all([
    db
      .select(inspectionCols)
      .from(inspections)
      .where(and(anyId(inspections.hiveId, ids), gte(inspections.occurredAt, checksSince)))
      .orderBy(asc(inspections.occurredAt)),
    db
      .select({
        id: feedings.id,
        hiveId: feedings.hiveId,
        occurredAt: feedings.occurredAt,
        kind: feedings.kind,
        ratio: feedings.ratio,
        basis: feedings.basis,
        amountL: feedings.amountL,
        amountKg: feedings.amountKg,
        feederType: feedings.feederType,
      })
      .from(feedings)
      .where(and(anyId(feedings.hiveId, ids), gte(feedings.occurredAt, checksSince)))
      .orderBy(asc(feedings.occurredAt)),
    db
      .select({
        id: treatments.id,
        hiveId: treatments.hiveId,
        activeIngredient: treatments.activeIngredient,
        method: treatments.method,
        startDate: treatments.startDate,
        plannedEndDate: treatments.plannedEndDate,
        actualEndDate: treatments.actualEndDate,
        schedule: treatments.schedule,
        supersOff: treatments.supersOff,
        withdrawalUntil: treatments.withdrawalUntil,
      })
      .from(treatments)
      .where(and(anyId(treatments.hiveId, ids), gte(treatments.startDate, treatmentsSince)))
      .orderBy(asc(treatments.startDate)),
    db
      .select({
        id: miteCounts.id,
        hiveId: miteCounts.hiveId,
        occurredAt: miteCounts.occurredAt,
        method: miteCounts.method,
        mites: miteCounts.mites,
        beesSampled: miteCounts.beesSampled,
        days: miteCounts.days,
      })
      .from(miteCounts)
      .where(and(anyId(miteCounts.hiveId, ids), gte(miteCounts.occurredAt, new Date(`${treatmentsSince}T00:00:00Z`))))
      .orderBy(asc(miteCounts.occurredAt)),
    db
      .select({ id: queenEvents.id, hiveId: queenEvents.hiveId, occurredAt: queenEvents.occurredAt, kind: queenEvents.kind })
      .from(queenEvents)
      .where(and(anyId(queenEvents.hiveId, ids), gte(queenEvents.occurredAt, since)))
      .orderBy(asc(queenEvents.occurredAt)),
  ]);
  // Hives with no check in the window: their newest older check, one row per hive (DISTINCT ON over
  // the (hive, time) index). Usually none, so usually no query.
  const withRecent = new Set(recentChecks.map((r) => r.hiveId));
  const stale = ids.filter((id) => !withRecent.has(id));
  const newestChecks = stale.length
    ? await db
        .selectDistinctOn([inspections.hiveId], inspectionCols)
        .from(inspections)
        .where(and(anyId(inspections.hiveId, stale), sql`${inspections.occurredAt} < ${checksSince}`))
        .orderBy(inspections.hiveId, desc(inspections.occurredAt))
    : [];

  const bucket = (hiveId: string) => {
    let r = out.get(hiveId);
    if (!r) {
      r = { inspections: [], feedings: [], treatments: [], miteCounts: [], queenEvents: [], storesEstimates: [] };
      out.set(hiveId, r);
    }
    return r;
  };
  for (const h of hiveList) bucket(h.id);
  const toInspection = (r: (typeof recentChecks)[number]): InspectionRecord => ({
    id: r.id,
    date: dateOf(r.occurredAt),
    queenStatus: r.queenStatus,
    eggsSeen: r.eggsSeen,
    queenCells: r.queenCells ?? [],
    framesBrood: 0,
    framesBees: 0,
    honeyFrames: r.honeyFrames,
    pollenFrames: 0,
    diseaseSigns: [],
    spaceActions: r.spaceActions ?? [],
  });
  for (const r of newestChecks) bucket(r.hiveId).inspections.push(toInspection(r));
  for (const r of recentChecks) bucket(r.hiveId).inspections.push(toInspection(r));
  for (const r of feedRows) {
    bucket(r.hiveId).feedings.push({
      id: r.id,
      date: dateOf(r.occurredAt),
      kind: r.kind,
      ratio: opt(r.ratio),
      basis: opt(r.basis),
      amountL: opt(r.amountL),
      amountKg: opt(r.amountKg),
      feederType: opt(r.feederType),
    });
  }
  for (const r of treatRows) {
    bucket(r.hiveId).treatments.push({
      id: r.id,
      activeIngredient: r.activeIngredient,
      method: r.method,
      startDate: r.startDate,
      plannedEndDate: opt(r.plannedEndDate),
      actualEndDate: opt(r.actualEndDate),
      schedule: r.schedule ?? [],
      supersOff: r.supersOff,
      withdrawalUntil: opt(r.withdrawalUntil),
    });
  }
  for (const r of miteRows) {
    bucket(r.hiveId).miteCounts.push({
      id: r.id,
      date: dateOf(r.occurredAt),
      method: r.method,
      mites: r.mites,
      beesSampled: opt(r.beesSampled),
      days: opt(r.days),
    });
  }
  for (const r of queenRows) bucket(r.hiveId).queenEvents.push({ id: r.id, date: dateOf(r.occurredAt), kind: r.kind });

  // Stores: the newest check's honey frames through estimateStores (TRADE-REFERENCES §6).
  const boxesOf = new Map(hiveList.map((h) => [h.id, h.boxes]));
  for (const [hiveId, rec] of out) {
    const newest = rec.inspections[rec.inspections.length - 1];
    if (newest) {
      rec.storesEstimates.push({ id: newest.id, date: newest.date, storesKg: storesFromHoneyFrames(newest.honeyFrames, boxesOf.get(hiveId) ?? []) });
    }
  }
  return out;
}

interface MutableRecords {
  inspections: InspectionRecord[];
  feedings: FeedingRecord[];
  treatments: TreatmentRecord[];
  miteCounts: MiteCountRecord[];
  queenEvents: QueenEventRecord[];
  storesEstimates: StoresEstimateRecord[];
}

/** The apiaries a person may see now (inside their window), with what the rules need of each. */
async function visibleApiaries(ctx: Ctx, user: SessionUser): Promise<ApiaryInfo[]> {
  const rows = await ctx.db
    .select({
      id: apiaries.id,
      name: apiaries.name,
      hemisphere: apiaries.hemisphere,
      winterTargetKg: apiaries.winterStoresTargetKg,
      startsAt: memberships.startsAt,
      endsAt: memberships.endsAt,
    })
    .from(memberships)
    .innerJoin(apiaries, eq(apiaries.id, memberships.apiaryId))
    .where(eq(memberships.userId, user.id))
    .orderBy(asc(apiaries.name));
  const now = ctx.now();
  return rows.filter((r) => windowState(r, now) === 'active').map(({ startsAt: _s, endsAt: _e, ...a }) => a);
}

async function apiaryInfo(db: Db | Tx, apiaryId: string): Promise<ApiaryInfo | null> {
  const [a] = await db
    .select({ id: apiaries.id, name: apiaries.name, hemisphere: apiaries.hemisphere, winterTargetKg: apiaries.winterStoresTargetKg })
    .from(apiaries)
    .where(eq(apiaries.id, apiaryId))
    .limit(1);
  return a ?? null;
}

/**
 * Derived tasks per hive, kept between requests and reused while the key (day, the hive's change
 * stamp — set by database triggers on every record write — its apiary's hemisphere and target, its
 * name and boxes) is the same. One cache per database; the oldest entries go past MAX_CACHED_HIVES.
 */
class DerivedCache {
  private readonly map = new Map<string, { key: string; tasks: DerivedTask[] }>();
  get(hiveId: string) {
    return this.map.get(hiveId);
  }
  set(hiveId: string, entry: { key: string; tasks: DerivedTask[] }) {
    this.map.delete(hiveId);
    this.map.set(hiveId, entry);
    while (this.map.size > MAX_CACHED_HIVES) this.map.delete(this.map.keys().next().value!);
  }
}
const MAX_CACHED_HIVES = 50_000;
const derivedCaches = new WeakMap<Db, DerivedCache>();
function derivedCacheOf(db: Db): DerivedCache {
  let c = derivedCaches.get(db);
  if (!c) derivedCaches.set(db, (c = new DerivedCache()));
  return c;
}

const creator = alias(users, 'task_creator');
const resolver = alias(users, 'task_resolver');

/**
 * Every open task for the given apiaries (optionally one hive), sorted overdue first, then by
 * due date. `window` keeps only tasks due in [from, to] (inclusive).
 */
async function collectDue(
  ctx: Ctx,
  apiaryList: readonly ApiaryInfo[],
  opts: { hiveId?: string; window?: { from: IsoDate; to: IsoDate } },
): Promise<DueTaskDto[]> {
  if (apiaryList.length === 0) return [];
  const today = todayOf(ctx);
  const apiaryIds = apiaryList.map((a) => a.id);
  const byApiary = new Map(apiaryList.map((a) => [a.id, a]));

  // Each hive's change stamp is read before its records, so a cached derivation is never newer than its stamp.
  const hiveRows = await ctx.db
    .select({ id: hives.id, apiaryId: hives.apiaryId, name: hives.name, boxes: hives.boxes, stamp: hiveRecordStamps.stamp })
    .from(hives)
    .leftJoin(hiveRecordStamps, eq(hiveRecordStamps.hiveId, hives.id))
    .where(and(inArray(hives.apiaryId, apiaryIds), eq(hives.status, 'active'), opts.hiveId ? eq(hives.id, opts.hiveId) : undefined));
  const hiveById = new Map(hiveRows.map((h) => [h.id, h]));
  const cache = derivedCacheOf(ctx.db);
  const cacheKey = (h: (typeof hiveRows)[number]) => {
    const a = byApiary.get(h.apiaryId)!;
    return `${today}|${h.stamp ?? 0}|${a.hemisphere}|${a.winterTargetKg}|${h.name}|${JSON.stringify(h.boxes)}`;
  };
  const derivedByHive = new Map<string, DerivedTask[]>();
  const misses: typeof hiveRows = [];
  for (const h of hiveRows) {
    const hit = cache.get(h.id);
    if (hit && hit.key === cacheKey(h)) derivedByHive.set(h.id, hit.tasks);
    else misses.push(h);
  }

  const [records, addedRows] = await Promise.all([
    loadDueRecords(ctx.db, misses, today),
    ctx.db
      .select({ t: tasks, byName: creator.name })
      .from(tasks)
      .innerJoin(creator, eq(creator.id, tasks.createdBy))
      .where(
        and(
          inArray(tasks.apiaryId, apiaryIds),
          eq(tasks.kind, 'added'),
          inArray(tasks.status, ['open', 'snoozed']),
          opts.hiveId ? eq(tasks.hiveId, opts.hiveId) : undefined,
        ),
      ),
  ]);

  for (const h of misses) {
    const a = byApiary.get(h.apiaryId)!;
    const tasksOfHive = deriveTasks({
      today,
      hemisphere: a.hemisphere,
      apiary: { id: a.id, winterTargetKg: a.winterTargetKg },
      hive: { id: h.id, name: h.name, boxes: h.boxes, status: 'active' },
      records: records.get(h.id) ?? {},
    });
    derivedByHive.set(h.id, tasksOfHive);
    cache.set(h.id, { key: cacheKey(h), tasks: tasksOfHive });
  }
  const derived: DerivedTask[] = hiveRows.flatMap((h) => derivedByHive.get(h.id) ?? []);

  // Resolutions for exactly the keys derived now: the unique index answers each.
  // Snoozing only moves a task later, so a task due after the window cannot come into it.
  const windowTo = opts.window?.to;
  const candidates = windowTo ? derived.filter((t) => compareDates(t.dueDate, windowTo) <= 0) : derived;
  const keys = candidates.map((t) => t.key);
  const resolutions = keys.length
    ? await ctx.db
        .select({ key: tasks.derivedKey, status: tasks.status, snoozedUntil: tasks.snoozedUntil, resolvedAt: tasks.resolvedAt, byId: tasks.resolvedBy, byName: resolver.name })
        .from(tasks)
        .leftJoin(resolver, eq(resolver.id, tasks.resolvedBy))
        // One array parameter rather than a list of thousands.
        .where(sql`${tasks.derivedKey} = any(${sql.param(keys)}::text[])`)
    : [];
  const resolutionOf = new Map(resolutions.map((r) => [r.key!, r]));

  const out: DueTaskDto[] = [];
  for (const t of candidates) {
    const r = resolutionOf.get(t.key);
    if (r && (r.status === 'done' || r.status === 'dismissed')) continue;
    const snoozed = r?.status === 'snoozed' && r.snoozedUntil ? r.snoozedUntil : null;
    const dueDate = snoozed && compareDates(snoozed, t.dueDate) > 0 ? snoozed : t.dueDate;
    const h = hiveById.get(t.hiveId)!;
    const a = byApiary.get(t.apiaryId)!;
    out.push({
      key: t.key,
      rule: t.rule,
      title: t.title,
      reason: t.reason,
      dueDate,
      source: t.source,
      hiveId: h.id,
      hiveName: h.name,
      apiaryId: a.id,
      apiaryName: a.name,
      status: snoozed ? 'snoozed' : 'open',
      overdue: isOverdue({ dueDate }, today),
      snoozedUntil: snoozed,
      by: snoozed && r?.byId ? { id: r.byId, name: r.byName ?? '' } : null,
      at: snoozed && r?.resolvedAt ? r.resolvedAt.toISOString() : null,
      note: '',
    });
  }
  for (const { t, byName } of addedRows) {
    const a = byApiary.get(t.apiaryId)!;
    const h = t.hiveId ? hiveById.get(t.hiveId) : undefined;
    // A task for a hive that is no longer active (sold, dead-out) leaves the list with it.
    if (t.hiveId && !h) continue;
    const snoozed = t.status === 'snoozed' && t.snoozedUntil ? t.snoozedUntil : null;
    const dueDate = snoozed && compareDates(snoozed, t.dueDate) > 0 ? snoozed : t.dueDate;
    out.push({
      key: `${ADDED_KEY_PREFIX}${t.id}`,
      rule: 'added',
      title: t.title,
      reason: t.note ? t.note : `Added by ${byName}.`,
      dueDate,
      source: `Added by ${byName} on ${dateOf(t.createdAt)}`,
      hiveId: h?.id ?? null,
      hiveName: h?.name ?? null,
      apiaryId: a.id,
      apiaryName: a.name,
      status: snoozed ? 'snoozed' : 'open',
      overdue: isOverdue({ dueDate }, today),
      snoozedUntil: snoozed,
      by: { id: t.createdBy, name: byName },
      at: t.createdAt.toISOString(),
      note: t.note,
    });
  }
  const w = opts.window;
  const inWindow = w ? out.filter((t) => compareDates(t.dueDate, w.from) >= 0 && compareDates(t.dueDate, w.to) <= 0) : out;
  return sortTasks(inWindow, today);
}

/** How far ahead GET /api/due looks by default: two weeks (Frameside's own choice; `days` widens it). */
export const DUE_HORIZON_DAYS = 14;

/**
 * GET /api/due: every task across the apiaries the person may see now, overdue first, then what
 * falls due in the next `days` (default 14); filter by apiary or hive.
 */
export async function listDue(
  ctx: Ctx,
  user: SessionUser,
  opts: { apiaryId?: string; hiveId?: string; days?: number } = {},
): Promise<DueTaskDto[]> {
  const window = { from: '1970-01-01', to: addDays(todayOf(ctx), opts.days ?? DUE_HORIZON_DAYS) };
  if (opts.hiveId) {
    const m = await requireHive(ctx, user, opts.hiveId, 'hive:read');
    if (opts.apiaryId && opts.apiaryId !== m.apiaryId) return [];
    const a = await apiaryInfo(ctx.db, m.apiaryId);
    return a ? collectDue(ctx, [a], { hiveId: opts.hiveId, window }) : [];
  }
  if (opts.apiaryId) {
    await requireApiary(ctx, user, opts.apiaryId, 'apiary:read');
    const a = await apiaryInfo(ctx.db, opts.apiaryId);
    return a ? collectDue(ctx, [a], { window }) : [];
  }
  return collectDue(ctx, await visibleApiaries(ctx, user), { window });
}

/**
 * Everything due in one apiary between `from` and `to` (YYYY-MM-DD, inclusive), sorted like the
 * Due list. No access check: the caller (e.g. the sitter's Handover brief) checks. With
 * `includeOverdue`, tasks already overdue before `from` come too: they are still waiting.
 */
export async function dueForApiary(
  ctx: Ctx,
  apiaryId: string,
  { from, to, includeOverdue = false }: { from: IsoDate; to: IsoDate; includeOverdue?: boolean },
): Promise<DueTaskDto[]> {
  const a = await apiaryInfo(ctx.db, apiaryId);
  if (!a) throw notFound('That apiary');
  const window = { from: includeOverdue ? '1970-01-01' : from, to };
  return collectDue(ctx, [a], { window });
}

// ---------------------------------------------------------------- person-added tasks

export async function createTask(ctx: Ctx, user: SessionUser, input: TaskCreateInput): Promise<DueTaskDto> {
  const v = taskCreateSchema.parse(input);
  await requireApiary(ctx, user, v.apiaryId, 'task:create');
  let hiveName: string | null = null;
  if (v.hiveId) {
    const [h] = await ctx.db.select({ apiaryId: hives.apiaryId, name: hives.name }).from(hives).where(eq(hives.id, v.hiveId)).limit(1);
    if (!h || h.apiaryId !== v.apiaryId) throw new AppError('invalid', 'That hive is not in this apiary.', 400, { fields: { hiveId: 'That hive is not in this apiary.' } });
    hiveName = h.name;
  }
  const a = (await apiaryInfo(ctx.db, v.apiaryId))!;
  const row = await ctx.db.transaction(async (tx) => {
    const [t] = await tx
      .insert(tasks)
      .values({ kind: 'added', apiaryId: v.apiaryId, hiveId: v.hiveId ?? null, title: v.title, dueDate: v.dueDate, note: v.note, createdBy: user.id, createdAt: ctx.now(), updatedAt: ctx.now() })
      .returning();
    await recordAudit(tx, ctx, { apiaryId: v.apiaryId, userId: user.id, entity: 'task', entityId: t!.id, action: 'create', after: { ...t! } });
    return t!;
  });
  const today = todayOf(ctx);
  return {
    key: `${ADDED_KEY_PREFIX}${row.id}`,
    rule: 'added',
    title: row.title,
    reason: row.note ? row.note : `Added by ${user.name}.`,
    dueDate: row.dueDate,
    source: `Added by ${user.name} on ${dateOf(row.createdAt)}`,
    hiveId: row.hiveId,
    hiveName,
    apiaryId: a.id,
    apiaryName: a.name,
    status: 'open',
    overdue: isOverdue(row, today),
    snoozedUntil: null,
    by: { id: user.id, name: user.name },
    at: row.createdAt.toISOString(),
    note: row.note,
  };
}

// ---------------------------------------------------------------- resolving tasks

export type Resolution = { status: 'done' } | { status: 'dismissed' } | { status: 'snoozed'; until: IsoDate };

const UUID_RE = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;
/** Snoozing further than this is dismissing: Frameside's own limit. */
export const MAX_SNOOZE_DAYS = 366;

/**
 * Which task a URL names. A person's task: `task:<uuid>` (the key the Due list gives) or the bare
 * uuid. A derived task: its key `rule:hiveId:…`. Anything else cannot exist (404).
 */
export function parseTaskRef(ref: string): { kind: 'added'; id: string } | { kind: 'derived'; key: string; rule: DueRule; hiveId: string } {
  const bare = ref.startsWith(ADDED_KEY_PREFIX) ? ref.slice(ADDED_KEY_PREFIX.length) : ref;
  if (UUID_RE.test(bare)) return { kind: 'added', id: bare.toLowerCase() };
  const [rule, hiveId, ...rest] = ref.split(':');
  if (!rule || !(DUE_RULES as readonly string[]).includes(rule) || !hiveId || !UUID_RE.test(hiveId) || rest.length === 0 || ref.length > 300) {
    throw notFound('That task');
  }
  return { kind: 'derived', key: ref, rule: rule as DueRule, hiveId: hiveId.toLowerCase() };
}

function checkSnooze(ctx: Ctx, r: Resolution) {
  if (r.status !== 'snoozed') return;
  const today = todayOf(ctx);
  if (compareDates(r.until, today) <= 0) {
    throw new AppError('invalid', 'Snooze to a day after today.', 400, { fields: { until: 'Snooze to a day after today.' } });
  }
  if (compareDates(r.until, addDays(today, MAX_SNOOZE_DAYS)) > 0) {
    throw new AppError('invalid', 'Snooze for at most a year; dismiss the task if it no longer applies.', 400, {
      fields: { until: 'Snooze for at most a year.' },
    });
  }
}

type TaskRow = typeof tasks.$inferSelect;

function resolutionDto(t: TaskRow, byName: string | null): TaskResolutionDto {
  return {
    id: t.id,
    key: t.kind === 'added' ? `${ADDED_KEY_PREFIX}${t.id}` : t.derivedKey!,
    kind: t.kind,
    status: t.status,
    snoozedUntil: t.snoozedUntil,
    resolvedBy: t.resolvedBy ? { id: t.resolvedBy, name: byName ?? '' } : null,
    resolvedAt: t.resolvedAt ? t.resolvedAt.toISOString() : null,
    title: t.title,
    dueDate: t.dueDate,
    hiveId: t.hiveId,
    apiaryId: t.apiaryId,
  };
}

/**
 * Marks a task done, snoozed or dismissed, recording who and when. A derived task is checked
 * against the rules first (it must be due now for that hive); its resolution is stored under its
 * key, so a done task stays done while the rule moves on to the next record.
 */
export async function resolveTask(ctx: Ctx, user: SessionUser, ref: string, resolution: Resolution): Promise<TaskResolutionDto> {
  const target = parseTaskRef(ref);
  checkSnooze(ctx, resolution);
  const now = ctx.now();
  const fields = {
    status: resolution.status,
    snoozedUntil: resolution.status === 'snoozed' ? resolution.until : null,
    resolvedBy: user.id,
    resolvedAt: now,
    updatedAt: now,
  } as const;

  if (target.kind === 'added') {
    const [t] = await ctx.db.select().from(tasks).where(and(eq(tasks.id, target.id), eq(tasks.kind, 'added'))).limit(1);
    if (!t) throw notFound('That task');
    await requireApiary(ctx, user, t.apiaryId, 'task:resolve');
    const after = await ctx.db.transaction(async (tx) => {
      const [locked] = await tx.select().from(tasks).where(eq(tasks.id, t.id)).for('update');
      if (!locked) throw notFound('That task');
      const [u] = await tx.update(tasks).set({ ...fields, version: locked.version + 1 }).where(eq(tasks.id, t.id)).returning();
      await recordAudit(tx, ctx, { apiaryId: t.apiaryId, userId: user.id, entity: 'task', entityId: t.id, action: 'update', before: { ...locked }, after: { ...u! } });
      return u!;
    });
    return resolutionDto(after, user.name);
  }

  const m = await requireHive(ctx, user, target.hiveId, 'task:resolve');
  const a = await apiaryInfo(ctx.db, m.apiaryId);
  const [h] = await ctx.db
    .select({ id: hives.id, apiaryId: hives.apiaryId, name: hives.name, boxes: hives.boxes, status: hives.status })
    .from(hives)
    .where(eq(hives.id, target.hiveId))
    .limit(1);
  if (!a || !h) throw notFound('That task');
  const today = todayOf(ctx);
  const records = await loadDueRecords(ctx.db, [h], today);
  const task = deriveTasks({
    today,
    hemisphere: a.hemisphere,
    apiary: { id: a.id, winterTargetKg: a.winterTargetKg },
    hive: { id: h.id, name: h.name, boxes: h.boxes, status: h.status },
    records: records.get(h.id) ?? {},
  }).find((t) => t.key === target.key);
  if (!task) throw notFound('That task is not due any more, or it');

  const after = await ctx.db.transaction(async (tx) => {
    const [existing] = await tx.select().from(tasks).where(eq(tasks.derivedKey, target.key)).for('update');
    if (existing) {
      const [u] = await tx
        .update(tasks)
        .set({ ...fields, title: task.title, dueDate: task.dueDate, version: existing.version + 1 })
        .where(eq(tasks.id, existing.id))
        .returning();
      await recordAudit(tx, ctx, { apiaryId: a.id, userId: user.id, entity: 'task', entityId: existing.id, action: 'update', before: { ...existing }, after: { ...u! } });
      return u!;
    }
    const [c] = await tx
      .insert(tasks)
      .values({
        kind: 'derived',
        apiaryId: a.id,
        hiveId: h.id,
        derivedKey: task.key,
        rule: task.rule,
        title: task.title,
        dueDate: task.dueDate,
        createdBy: user.id,
        createdAt: now,
        ...fields,
      })
      .returning();
    await recordAudit(tx, ctx, { apiaryId: a.id, userId: user.id, entity: 'task', entityId: c!.id, action: 'create', after: { ...c! } });
    return c!;
  });
  return resolutionDto(after, user.name);
}
