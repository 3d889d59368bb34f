/**
 * A hive's story for one season: every record in order, what changed since the previous check,
 * the dates that follow from each record (a queen's emergence, a release check, a mite recount),
 * who recorded it and its photos. Access and the hive are one query; all the records are one
 * UNION ALL query over the (hive, time) indexes of each record table.
 */
import { and, eq, sql } from 'drizzle-orm';
import { PgDialect } from 'drizzle-orm/pg-core';
import { apiaries, hiveRecordStamps, hives, memberships } from '../../db/schema';
import { broodCalendar } from '../../shared/domain/brood';
import { addDays, monthOf, utcMsToDate, yearOf, type IsoDate } from '../../shared/domain/dates';
import { DUE_INTERVALS, TREATMENT_DEFAULTS } from '../../shared/domain/due';
import type { Box, Hemisphere } from '../../shared/domain/hives';
import { honeyMoistureVerdict } from '../../shared/domain/honey';
import { miteLoad, type MiteMethod } from '../../shared/domain/mites';
import type {
  ColonyEventKind,
  FeedingKind,
  QueenCellObservation,
  QueenEventKind,
  QueenStatus,
  SpaceAction,
  TreatmentActiveIngredient,
} from '../../shared/domain/records';
import { temperamentWord } from '../../shared/domain/records';
import { mixSyrup } from '../../shared/domain/syrup';
import type { StoryChange, StoryDerivedDate, StoryDto, StoryItemDto, StoryKind } from '../../shared/schemas/story';
import type { Ctx, SessionUser } from '../context';
import { notFound } from '../errors';
import { assertAllowed } from './access';
import { storesFromHoneyFrames } from './due';
import { attachPhotos } from './story-photos';

/**
 * The season a date falls in. North: the calendar year. South: July to June, named by the year
 * it starts in (the 2026 season runs 1 July 2026 – 30 June 2027, with its spring and summer in
 * late 2026), so a season is never split across its flow. Frameside's own convention.
 */
export function seasonOfDate(date: IsoDate, hemisphere: Hemisphere): number {
  const y = yearOf(date);
  return hemisphere === 'south' && monthOf(date) < 7 ? y - 1 : y;
}

/** [from, to) of a season, YYYY-MM-DD. */
export function seasonRange(season: number, hemisphere: Hemisphere): { from: IsoDate; to: IsoDate } {
  const pad = (y: number) => String(y).padStart(4, '0');
  return hemisphere === 'south'
    ? { from: `${pad(season)}-07-01`, to: `${pad(season + 1)}-07-01` }
    : { from: `${pad(season)}-01-01`, to: `${pad(season + 1)}-01-01` };
}

/** One prepared query: the hive, its apiary, and the person's membership there. */
function accessQuery(db: Ctx['db']) {
  return db
    .select({
      id: hives.id,
      name: hives.name,
      boxes: hives.boxes,
      apiaryId: hives.apiaryId,
      apiaryName: apiaries.name,
      hemisphere: apiaries.hemisphere,
      role: memberships.role,
      startsAt: memberships.startsAt,
      endsAt: memberships.endsAt,
      stamp: hiveRecordStamps.stamp,
    })
    .from(hives)
    .innerJoin(apiaries, eq(apiaries.id, hives.apiaryId))
    .leftJoin(hiveRecordStamps, eq(hiveRecordStamps.hiveId, hives.id))
    .leftJoin(memberships, and(eq(memberships.apiaryId, hives.apiaryId), eq(memberships.userId, sql.placeholder('userId'))))
    .where(eq(hives.id, sql.placeholder('hiveId')))
    .limit(1)
    .prepare('hive_story_access_v2');
}
const accessQueries = new WeakMap<Ctx['db'], ReturnType<typeof accessQuery>>();

async function hiveWithAccess(ctx: Ctx, user: SessionUser, hiveId: string) {
  let prepared = accessQueries.get(ctx.db);
  if (!prepared) accessQueries.set(ctx.db, (prepared = accessQuery(ctx.db)));
  const [row] = await prepared.execute({ hiveId, userId: user.id });
  if (!row || !row.role) throw notFound('That hive');
  assertAllowed(ctx, { apiaryId: row.apiaryId, userId: user.id, role: row.role, startsAt: row.startsAt, endsAt: row.endsAt }, 'hive:read');
  return row;
}

/** A row of the story query: `kind` is a record kind, 'prev-…' for the record before the season, or 'span'. */
export interface StoryRow {
  kind: StoryKind | 'prev-inspection' | 'prev-mite-count' | 'span';
  id: string | null;
  at: Date | string | null;
  by: string | null;
  by_name: string | null;
  note: string | null;
  d: Record<string, unknown>;
}

/**
 * The SQL that reads a hive's season (and the apiary's forage checks), one row per record, plus
 * the last inspection and mite count before the season (for the first deltas) and the span of
 * years with Quick checks (for the season picker). Exported so the benchmark's raw baseline runs
 * the very same query.
 */
export function storySql(hiveId: string, apiaryId: string, from: IsoDate, to: IsoDate) {
  const f = `${from}T00:00:00Z`;
  const t = `${to}T00:00:00Z`;
  return sql`
    select 'inspection' as kind, r.id, r.occurred_at as at, r.created_by as by, u.name as by_name, r.note,
      json_build_object('framesBrood', r.frames_brood, 'framesBees', r.frames_bees, 'honeyFrames', r.honey_frames,
        'pollenFrames', r.pollen_frames, 'queenStatus', r.queen_status, 'eggsSeen', r.eggs_seen, 'youngLarvaeSeen', r.young_larvae_seen,
        'queenCells', r.queen_cells, 'broodPattern', r.brood_pattern, 'temperament', r.temperament, 'diseaseSigns', r.disease_signs,
        'spaceActions', r.space_actions, 'weather', r.weather, 'airTempC', r.air_temp_c) as d
    from inspections r join users u on u.id = r.created_by
    where r.hive_id = ${hiveId} and r.occurred_at >= ${f} and r.occurred_at < ${t}
    union all
    (select 'prev-inspection', r.id, r.occurred_at, r.created_by, null, null,
      json_build_object('framesBrood', r.frames_brood, 'framesBees', r.frames_bees, 'honeyFrames', r.honey_frames,
        'pollenFrames', r.pollen_frames, 'queenStatus', r.queen_status, 'temperament', r.temperament)
     from inspections r where r.hive_id = ${hiveId} and r.occurred_at < ${f} order by r.occurred_at desc limit 1)
    union all
    select 'feeding', r.id, r.occurred_at, r.created_by, u.name, r.note,
      json_build_object('kind', r.kind, 'ratio', r.ratio, 'basis', r.basis, 'amountL', r.amount_l, 'amountKg', r.amount_kg, 'feederType', r.feeder_type)
    from feedings r join users u on u.id = r.created_by
    where r.hive_id = ${hiveId} and r.occurred_at >= ${f} and r.occurred_at < ${t}
    union all
    select 'treatment', r.id, r.occurred_at, r.created_by, u.name, r.note,
      json_build_object('productName', r.product_name, 'activeIngredient', r.active_ingredient, 'method', r.method, 'dose', r.dose,
        'batch', r.batch, 'startDate', r.start_date, 'plannedEndDate', r.planned_end_date, 'actualEndDate', r.actual_end_date,
        'schedule', r.schedule, 'supersOff', r.supers_off, 'withdrawalUntil', r.withdrawal_until, 'appliedBy', r.applied_by)
    from treatments r join users u on u.id = r.created_by
    where r.hive_id = ${hiveId} and r.occurred_at >= ${f} and r.occurred_at < ${t}
    union all
    select 'mite-count', r.id, r.occurred_at, r.created_by, u.name, r.note,
      json_build_object('method', r.method, 'beesSampled', r.bees_sampled, 'mites', r.mites, 'days', r.days)
    from mite_counts r join users u on u.id = r.created_by
    where r.hive_id = ${hiveId} and r.occurred_at >= ${f} and r.occurred_at < ${t}
    union all
    (select 'prev-mite-count', r.id, r.occurred_at, r.created_by, null, null,
      json_build_object('method', r.method, 'beesSampled', r.bees_sampled, 'mites', r.mites, 'days', r.days)
     from mite_counts r where r.hive_id = ${hiveId} and r.occurred_at < ${f} order by r.occurred_at desc limit 1)
    union all
    select 'harvest', r.id, r.occurred_at, r.created_by, u.name, r.note,
      json_build_object('supers', r.supers, 'frames', r.frames, 'weightKg', r.weight_kg, 'moisturePercent', r.moisture_percent)
    from harvests r join users u on u.id = r.created_by
    where r.hive_id = ${hiveId} and r.occurred_at >= ${f} and r.occurred_at < ${t}
    union all
    select 'queen-event', r.id, r.occurred_at, r.created_by, u.name, r.note, json_build_object('kind', r.kind)
    from queen_events r join users u on u.id = r.created_by
    where r.hive_id = ${hiveId} and r.occurred_at >= ${f} and r.occurred_at < ${t}
    union all
    select 'colony-event', r.id, r.occurred_at, r.created_by, u.name, r.note,
      json_build_object('kind', r.kind, 'otherHiveId', r.other_hive_id, 'otherHiveName', o.name)
    from colony_events r join users u on u.id = r.created_by left join hives o on o.id = r.other_hive_id
    where r.hive_id = ${hiveId} and r.occurred_at >= ${f} and r.occurred_at < ${t}
    union all
    select 'forage-check', r.id, r.occurred_at, r.created_by, u.name, r.note,
      json_build_object('minutesToEmpty', r.minutes_to_empty, 'watchedMinutes', r.watched_minutes, 'untouched', r.untouched, 'judgement', r.judgement)
    from forage_checks r join users u on u.id = r.created_by
    where r.apiary_id = ${apiaryId} and r.occurred_at >= ${f} and r.occurred_at < ${t}
    union all
    select 'span', null, null, null, null, null,
      json_build_object('first', (select min(occurred_at) from inspections where hive_id = ${hiveId}),
        'last', (select max(occurred_at) from inspections where hive_id = ${hiveId}))
    order by at nulls last, kind, id`;
}

const dialect = new PgDialect();

/** Prepared-statement name; change it whenever storySql's text changes. */
export const STORY_STATEMENT = 'hive_story_v1';

/** GET /api/hives/:hiveId/story: the hive's season (default: the current one), oldest record first. */
export async function getStory(ctx: Ctx, user: SessionUser, hiveId: string, opts: { season?: number } = {}): Promise<StoryDto> {
  const hive = await hiveWithAccess(ctx, user, hiveId);
  const today = utcMsToDate(ctx.now().getTime());
  const season = opts.season ?? seasonOfDate(today, hive.hemisphere);
  const { from, to } = seasonRange(season, hive.hemisphere);
  const cacheKey = `${hive.stamp ?? 0}|${hive.hemisphere}|${hive.name}|${hive.apiaryName}|${JSON.stringify(hive.boxes)}`;
  const cache = storyCacheOf(ctx.db);
  const hit = cache.get(`${hive.id}|${season}`);
  if (hit && hit.key === cacheKey) return { ...hit.story, items: await attachPhotos(ctx, hit.story.items.map((i) => ({ ...i }))) };

  // A named (prepared) statement: the ten-part union costs more to plan than to run.
  const q = dialect.sqlToQuery(storySql(hive.id, hive.apiaryId, from, to));
  const result = await ctx.db.$client.query<StoryRow>({ name: STORY_STATEMENT, text: q.sql, values: q.params as unknown[] });
  const items = buildStory(result.rows, { boxes: hive.boxes, hemisphere: hive.hemisphere });
  const span = result.rows.find((r) => r.kind === 'span')?.d as { first: string | null; last: string | null } | undefined;
  const seasons: number[] = [];
  if (span?.first && span.last) {
    const first = seasonOfDate(isoDay(span.first), hive.hemisphere);
    const last = seasonOfDate(isoDay(span.last), hive.hemisphere);
    for (let y = last; y >= first; y--) seasons.push(y);
  }
  const story: StoryDto = { hiveId: hive.id, hiveName: hive.name, apiaryId: hive.apiaryId, apiaryName: hive.apiaryName, season, from, to, seasons, items };
  cache.set(`${hive.id}|${season}`, { key: cacheKey, story });
  return { ...story, items: await attachPhotos(ctx, items.map((i) => ({ ...i }))) };
}

/**
 * Built stories (before photos), reused while the hive's change stamp — set by database triggers
 * on every write to its records, its harvests and its apiary's forage checks — and its names and
 * boxes are unchanged. Photos are attached on every request. One cache per database, bounded.
 */
const MAX_CACHED_STORIES = 5_000;
const storyCaches = new WeakMap<Ctx['db'], Map<string, { key: string; story: StoryDto }>>();
function storyCacheOf(db: Ctx['db']) {
  let c = storyCaches.get(db);
  if (!c) storyCaches.set(db, (c = new Map()));
  const map = c;
  return {
    get: (k: string) => map.get(k),
    set: (k: string, v: { key: string; story: StoryDto }) => {
      map.delete(k);
      map.set(k, v);
      while (map.size > MAX_CACHED_STORIES) map.delete(map.keys().next().value!);
    },
  };
}

const isoDay = (v: Date | string): IsoDate => (v instanceof Date ? v.toISOString() : new Date(v).toISOString()).slice(0, 10);
const isoInstant = (v: Date | string): string => (v instanceof Date ? v : new Date(v)).toISOString();

const round1 = (x: number) => Math.round(x * 10) / 10;
const signed = (x: number) => (x > 0 ? `+${round1(x)}` : `${round1(x)}`);
const frames = (n: number) => `${round1(n)} ${n === 1 ? 'frame' : 'frames'}`;

const QUEEN_STATUS_WORDS: Readonly<Record<QueenStatus, string>> = {
  'queen-seen': 'Queen seen',
  'eggs-seen': 'Eggs seen',
  'young-larvae-only': 'Young larvae, no eggs',
  'no-eggs-or-brood': 'No eggs or brood',
};
const SPACE_WORDS: Readonly<Record<SpaceAction, string>> = {
  'super-added': 'Super added',
  'super-removed': 'Super removed',
  'box-added': 'Box added',
  'box-removed': 'Box removed',
  'feeder-on': 'Feeder on',
  'feeder-off': 'Feeder off',
};
const INGREDIENT_WORDS: Readonly<Record<TreatmentActiveIngredient, string>> = {
  'oxalic-acid': 'Oxalic acid',
  'formic-acid': 'Formic acid',
  thymol: 'Thymol',
  amitraz: 'Amitraz',
  'hop-beta-acids': 'Hop beta acids',
  other: 'Other active ingredient',
};
const QUEEN_EVENT_WORDS: Readonly<Record<QueenEventKind, string>> = {
  'introduced-caged': 'Caged queen introduced',
  released: 'Queen released',
  seen: 'Queen seen',
  marked: 'Queen marked',
  clipped: 'Queen clipped',
  lost: 'Queen lost',
  superseded: 'Queen superseded',
  replaced: 'Queen replaced',
};
const COLONY_EVENT_WORDS: Readonly<Record<ColonyEventKind, string>> = {
  'split-from': 'Made from a split',
  'split-to': 'Split made from this hive',
  combined: 'Combined',
  swarmed: 'Swarmed',
  'dead-out': 'Dead-out',
  moved: 'Moved',
};
const FEED_WORDS: Readonly<Record<FeedingKind, string>> = { syrup: 'Syrup', fondant: 'Fondant', 'pollen-patty': 'Pollen patty', other: 'Feed' };
const METHOD_WORDS: Readonly<Record<MiteMethod, string>> = { 'alcohol-wash': 'Alcohol wash', 'sugar-roll': 'Sugar roll', 'sticky-board': 'Sticky board' };

const LABEL_CAUTION = 'The product label (or SPC) is the legal instruction: follow it for dose, timing, protective equipment and supers.';
const FOULBROOD_CAUTION =
  'Suspected foulbrood is notifiable in many places: do not move combs or equipment, and report it as your local rules require.';

interface MiteFigure {
  perHundredBees?: number;
  perDay?: number;
  level?: string;
}

function miteFigure(d: { method: MiteMethod; mites: number; beesSampled: number | null; days: number | null }): MiteFigure {
  try {
    const l = miteLoad({ method: d.method, mites: d.mites, beesSampled: d.beesSampled ?? undefined, days: d.days ?? undefined });
    return { perHundredBees: l.perHundredBees, perDay: l.perDay, level: l.level };
  } catch {
    return {};
  }
}

/** Turns the query's rows into story items, oldest first, each with its changes and derived dates. */
export function buildStory(rows: readonly StoryRow[], hive: { boxes: readonly Box[]; hemisphere: Hemisphere }): StoryItemDto[] {
  let prevCheck = rows.find((r) => r.kind === 'prev-inspection')?.d as Record<string, unknown> | undefined;
  const prevCountRow = rows.find((r) => r.kind === 'prev-mite-count')?.d as Parameters<typeof miteFigure>[0] | undefined;
  let prevCount: MiteFigure | undefined = prevCountRow ? miteFigure(prevCountRow) : undefined;
  const items: StoryItemDto[] = [];

  for (const r of rows) {
    if (r.kind === 'prev-inspection' || r.kind === 'prev-mite-count' || r.kind === 'span' || !r.id || !r.at) continue;
    const date = isoDay(r.at);
    const base = {
      id: r.id,
      kind: r.kind,
      occurredAt: isoInstant(r.at),
      date,
      note: r.note ?? '',
      recordedBy: { id: r.by ?? '', name: r.by_name ?? '' },
      scope: r.kind === 'forage-check' ? ('apiary' as const) : ('hive' as const),
      photos: [],
    };
    const facts: string[] = [];
    const changes: StoryChange[] = [];
    const derivedDates: StoryDerivedDate[] = [];
    const cautions: string[] = [];
    let title = '';
    const d = r.d;

    switch (r.kind) {
      case 'inspection': {
        title = 'Quick check';
        const c = d as {
          framesBrood: number;
          framesBees: number;
          honeyFrames: number;
          pollenFrames: number;
          queenStatus: QueenStatus;
          eggsSeen: boolean;
          queenCells: QueenCellObservation[] | null;
          temperament: number | null;
          diseaseSigns: string[] | null;
          spaceActions: SpaceAction[] | null;
        };
        facts.push(QUEEN_STATUS_WORDS[c.queenStatus] ?? c.queenStatus);
        facts.push(`${frames(c.framesBrood)} of brood`, `${frames(c.framesBees)} of bees`, `${frames(c.honeyFrames)} of honey`);
        if (c.pollenFrames > 0) facts.push(`${frames(c.pollenFrames)} of pollen`);
        if (c.honeyFrames > 0) facts.push(`About ${round1(storesFromHoneyFrames(c.honeyFrames, hive.boxes))} kg of honey stores (estimate)`);
        for (const cell of c.queenCells ?? []) {
          if (cell.count > 0) facts.push(`${cell.count} ${cell.capped ? 'capped' : 'open'} ${cell.kind} ${cell.count === 1 ? 'cell' : 'cells'}`);
        }
        if (c.temperament) {
          try {
            facts.push(`Temperament: ${temperamentWord(c.temperament).replace('-', ' ')}`);
          } catch {
            /* out-of-range scores are refused at entry; a stray one is just not shown */
          }
        }
        for (const s of c.spaceActions ?? []) facts.push(SPACE_WORDS[s] ?? s);
        for (const s of c.diseaseSigns ?? []) facts.push(`Sign: ${s.replace(/-/g, ' ')}`);
        if ((c.diseaseSigns ?? []).includes('suspected-foulbrood')) cautions.push(FOULBROOD_CAUTION);

        if (prevCheck) {
          const p = prevCheck as typeof c;
          const num = (field: 'framesBrood' | 'framesBees' | 'honeyFrames' | 'pollenFrames', label: string) => {
            const delta = Number(c[field]) - Number(p[field]);
            if (Number.isFinite(delta) && Math.abs(delta) >= 0.05) changes.push({ field, label, from: p[field], to: c[field], text: `${label} ${signed(delta)}` });
          };
          num('framesBrood', 'Brood frames');
          num('framesBees', 'Frames of bees');
          num('honeyFrames', 'Honey frames');
          num('pollenFrames', 'Pollen frames');
          if (p.queenStatus && p.queenStatus !== c.queenStatus) {
            changes.push({
              field: 'queenStatus',
              label: 'Queen',
              from: p.queenStatus,
              to: c.queenStatus,
              text: `${QUEEN_STATUS_WORDS[p.queenStatus] ?? p.queenStatus} → ${QUEEN_STATUS_WORDS[c.queenStatus] ?? c.queenStatus}`,
            });
          }
          if (p.temperament && c.temperament && p.temperament !== c.temperament) {
            changes.push({ field: 'temperament', label: 'Temperament', from: p.temperament, to: c.temperament, text: `Temperament ${p.temperament} → ${c.temperament} (1 calm, 5 very defensive)` });
          }
        }
        prevCheck = c;

        // Capped queen cells: the cell was sealed on or before this day, so a queen emerges within ~8 days.
        const capped = (c.queenCells ?? []).filter((q) => q.capped && q.count > 0);
        if (capped.length > 0) {
          const cal = broodCalendar({ caste: 'queen', from: 'cell-capped', date });
          derivedDates.push({
            label: 'A queen could emerge by',
            date: cal.emerges,
            source: 'TRADE-REFERENCES §1: emergence 8 days after sealing (W. Shaw, Welsh BKA)',
          });
          derivedDates.push({
            label: 'Worry if no eggs by',
            date: cal.worryIfNoEggsBy,
            source: 'TRADE-REFERENCES §1: laying 14–21 days after emergence (BBKA via Trunch BKA)',
          });
        }
        if (c.queenStatus === 'no-eggs-or-brood') {
          derivedDates.push({ label: 'Look again for eggs', date: addDays(date, DUE_INTERVALS.queenlessRecheckDays), source: 'Common practice; eggs hatch on day 3 (TRADE-REFERENCES §1)' });
        }
        break;
      }
      case 'feeding': {
        const f = d as { kind: FeedingKind; ratio: string | null; basis: 'weight' | 'volume' | null; amountL: number | null; amountKg: number | null };
        title = `Fed ${FEED_WORDS[f.kind]?.toLowerCase() ?? 'feed'}`;
        if (f.kind === 'syrup') {
          facts.push(`${f.ratio ?? ''} syrup${f.basis ? ` by ${f.basis}` : ''}${f.amountL ? `, ${round1(f.amountL)} L` : ''}`.trim());
          if ((f.ratio === '1:1' || f.ratio === '2:1') && f.amountL && f.amountL > 0) {
            const mix = mixSyrup({ ratio: f.ratio, basis: f.basis ?? 'weight', finishedVolumeL: f.amountL });
            facts.push(`Took about ${round1(mix.sugarKg)} kg of sugar and ${round1(mix.waterL)} L of water`);
          }
        } else if (f.amountKg) {
          facts.push(`${round1(f.amountKg)} kg`);
        }
        derivedDates.push({
          label: 'Check the feeder',
          date: addDays(date, f.kind === 'syrup' ? DUE_INTERVALS.syrupRefillCheckDays : DUE_INTERVALS.solidFeedCheckDays),
          source: 'Common practice: check a feeder 3–7 days after feeding',
        });
        break;
      }
      case 'treatment': {
        const t = d as {
          productName: string;
          activeIngredient: TreatmentActiveIngredient;
          method: string;
          dose: string;
          batch: string;
          startDate: string;
          plannedEndDate: string | null;
          actualEndDate: string | null;
          supersOff: boolean;
          withdrawalUntil: string | null;
        };
        const def = TREATMENT_DEFAULTS[t.activeIngredient] ?? TREATMENT_DEFAULTS.other;
        title = `Treatment: ${INGREDIENT_WORDS[t.activeIngredient] ?? t.activeIngredient}`;
        if (t.productName) facts.push(t.productName);
        facts.push(`Method: ${t.method}`, `Started ${t.startDate}`);
        if (t.dose) facts.push(`Dose (from the label): ${t.dose}`);
        if (t.batch) facts.push(`Batch ${t.batch}`);
        facts.push(t.supersOff ? 'Supers off' : 'Supers on');
        cautions.push(LABEL_CAUTION);
        const end = t.actualEndDate ?? t.plannedEndDate ?? (def.durationDays === null ? null : addDays(t.startDate, def.durationDays));
        if (end) {
          derivedDates.push({
            label: t.actualEndDate ? 'Ended' : 'Ends',
            date: end,
            source: t.actualEndDate || t.plannedEndDate ? 'The treatment record (from the label)' : `Default for the ingredient: ${def.sources.durationDays}`,
          });
          derivedDates.push({
            label: 'Count mites again',
            date: addDays(end, DUE_INTERVALS.miteRecountAfterEndDays),
            source: 'TRADE-REFERENCES §3: re-test 10–14 days after treatment ends',
          });
          if (t.supersOff) {
            const resuper = t.withdrawalUntil ?? (def.resuperAfterDays === null ? null : addDays(end, def.resuperAfterDays));
            if (resuper) {
              derivedDates.push({
                label: 'Supers may go back on',
                date: resuper,
                source: t.withdrawalUntil ? 'The treatment record’s withdrawal date (from the label)' : `Default, check the label: ${def.sources.resuperAfterDays}`,
              });
            }
          }
        }
        break;
      }
      case 'mite-count': {
        const m = d as { method: MiteMethod; beesSampled: number | null; mites: number; days: number | null };
        title = `Mite count: ${METHOD_WORDS[m.method]?.toLowerCase() ?? m.method}`;
        const fig = miteFigure(m);
        facts.push(m.method === 'sticky-board' ? `${m.mites} mites over ${m.days ?? '?'} days` : `${m.mites} mites in ${m.beesSampled ?? '?'} bees`);
        if (fig.perHundredBees !== undefined) facts.push(`${round1(fig.perHundredBees)} mites per 100 bees`);
        if (fig.perDay !== undefined) facts.push(`${round1(fig.perDay)} mites a day`);
        if (fig.level) facts.push(`Level: ${fig.level}`);
        if (prevCount) {
          if (fig.perHundredBees !== undefined && prevCount.perHundredBees !== undefined) {
            changes.push({
              field: 'perHundredBees',
              label: 'Mites per 100 bees',
              from: round1(prevCount.perHundredBees),
              to: round1(fig.perHundredBees),
              text: `Mites per 100 bees ${round1(prevCount.perHundredBees)} → ${round1(fig.perHundredBees)}`,
            });
          } else if (fig.perDay !== undefined && prevCount.perDay !== undefined) {
            changes.push({
              field: 'perDay',
              label: 'Mites a day',
              from: round1(prevCount.perDay),
              to: round1(fig.perDay),
              text: `Mites a day ${round1(prevCount.perDay)} → ${round1(fig.perDay)}`,
            });
          }
        }
        if (fig.perHundredBees !== undefined || fig.perDay !== undefined) prevCount = fig;
        break;
      }
      case 'harvest': {
        const h = d as { supers: number; frames: number; weightKg: number | null; moisturePercent: number | null };
        title = 'Harvest';
        if (h.supers) facts.push(`${h.supers} ${h.supers === 1 ? 'super' : 'supers'}`);
        if (h.frames) facts.push(`${h.frames} frames`);
        if (h.weightKg) facts.push(`${round1(h.weightKg)} kg of honey`);
        if (h.moisturePercent !== null && h.moisturePercent !== undefined) {
          facts.push(`${round1(h.moisturePercent)} % water`);
          try {
            facts.push(honeyMoistureVerdict(h.moisturePercent).note);
          } catch {
            /* refused at entry */
          }
        }
        break;
      }
      case 'queen-event': {
        const q = d as { kind: QueenEventKind };
        title = QUEEN_EVENT_WORDS[q.kind] ?? q.kind;
        if (q.kind === 'introduced-caged') {
          derivedDates.push({
            label: 'Check she is released',
            date: addDays(date, DUE_INTERVALS.releaseCheckDays),
            source: 'TRADE-REFERENCES §1: after 3–5 days (Britannica; BEE-L 1997)',
          });
          derivedDates.push({
            label: 'Look for her eggs (if released on time)',
            date: addDays(date, DUE_INTERVALS.releaseCheckDays + DUE_INTERVALS.eggsCheckAfterReleaseDays),
            source: 'TRADE-REFERENCES §1: about a week after release (BEE-L 1997)',
          });
        }
        if (q.kind === 'released') {
          derivedDates.push({
            label: 'Look for her eggs',
            date: addDays(date, DUE_INTERVALS.eggsCheckAfterReleaseDays),
            source: 'TRADE-REFERENCES §1: about a week after release (BEE-L 1997)',
          });
        }
        if (q.kind === 'lost') {
          derivedDates.push({ label: 'Look for eggs or emergency cells', date: addDays(date, DUE_INTERVALS.queenlessRecheckDays), source: 'Common practice' });
        }
        break;
      }
      case 'colony-event': {
        const c = d as { kind: ColonyEventKind; otherHiveName: string | null };
        title = COLONY_EVENT_WORDS[c.kind] ?? c.kind;
        if (c.otherHiveName) facts.push(`With ${c.otherHiveName}`);
        break;
      }
      case 'forage-check': {
        const f = d as { minutesToEmpty: number | null; watchedMinutes: number | null; untouched: boolean; judgement: string };
        title = 'Forage check (whole apiary)';
        if (f.minutesToEmpty !== null) facts.push(`Syrup dish emptied in ${round1(f.minutesToEmpty)} min`);
        if (f.untouched) facts.push(`Dish untouched${f.watchedMinutes ? ` after ${round1(f.watchedMinutes)} min` : ''}`);
        facts.push(f.judgement === 'dearth' ? 'Dearth: little or no nectar coming in' : f.judgement === 'flow' ? 'Flow: nectar coming in' : 'Some forage');
        if (f.judgement === 'dearth') cautions.push('In a dearth, robbing is likely: keep visits short, reduce entrances, and feed only inside the hive, in the evening.');
        break;
      }
    }
    items.push({ ...base, title, facts, changes, derivedDates, cautions });
  }
  return items;
}
