/**
 * The Season review: a hive's or an apiary's season as the series its charts draw, the table of
 * its records and the season's totals. One query per table for all the hives in scope.
 */
import { and, asc, eq, gte, inArray, lt, sql } from 'drizzle-orm';
import type { PgColumn } from 'drizzle-orm/pg-core';
import {
  apiaries,
  colonyEvents,
  feedings,
  harvests,
  hives,
  inspections,
  miteCounts,
  queenEvents,
  treatments,
  users,
} from '../../db/schema';
import { classifyWeightDays, dailyNetChange } from '../../shared/domain/forage';
import type { FrameSize, Hemisphere } from '../../shared/domain/hives';
import { miteLoad, type MiteMethod } from '../../shared/domain/mites';
import {
  BROOD_NEST_BAND_C,
  MITE_CHART_THRESHOLD,
  feedingSummary,
  harvestSummary,
  inspectionSummary,
  miteSummary,
  seasonOf,
  seasonRange,
  treatmentSummary,
} from '../../shared/domain/season';
import { estimateStores } from '../../shared/domain/stores';
import { mixSyrup } from '../../shared/domain/syrup';
import type {
  HiveSeason,
  SeasonDto,
  SeasonFeeding,
  SeasonMiteCount,
  SeasonRecord,
  SeasonTotals,
  SeasonWeightDay,
} from '../../shared/schemas/season';
import type { SensorPoint } from '../../shared/schemas/sensors';
import type { Ctx, SessionUser } from '../context';
import { notFound } from '../errors';
import { requireApiary, requireHive } from './access';
import { bucketedReadings } from './sensors';

/** Points per sensor trace on a chart: enough for a season at a few hours' resolution. */
const CHART_POINTS = 1000;

const iso = (d: Date) => d.toISOString();
const dateOnlyMs = (d: string) => Date.parse(`${d}T00:00:00Z`);

/** Honey on `frames` full frames of one size (fractions as a part-full frame), kg midpoint. */
export function storesForHoneyFrames(frames: number, size: FrameSize): number {
  if (!(frames > 0)) return 0;
  const whole = Math.floor(frames);
  const list = Array.from({ length: whole }, () => ({ size, fullness: 1 }));
  if (frames > whole) list.push({ size, fullness: frames - whole });
  return estimateStores({ frames: list }).kg;
}

/** Sugar in a feeding, kg: mixSyrup on the litres of 1:1 or 2:1 syrup; null for other ratios and solid feeds. */
export function sugarOfFeeding(f: { kind: string; ratio: string | null; basis: string | null; amountL: number | null }): number | null {
  if (f.kind !== 'syrup' || f.amountL == null || (f.ratio !== '1:1' && f.ratio !== '2:1')) return null;
  return mixSyrup({ ratio: f.ratio, basis: f.basis === 'volume' ? 'volume' : 'weight', finishedVolumeL: f.amountL }).sugarKg;
}

/** Averages consecutive points in groups so that at most `max` remain. */
function thin(points: SensorPoint[], max: number): SensorPoint[] {
  if (points.length <= max) return points;
  const k = Math.ceil(points.length / max);
  const out: SensorPoint[] = [];
  for (let i = 0; i < points.length; i += k) {
    const group = points.slice(i, i + k);
    const avg = (pick: (p: SensorPoint) => number | null) => {
      const vs = group.map(pick).filter((v): v is number => v != null);
      return vs.length ? Math.round((vs.reduce((a, b) => a + b, 0) / vs.length) * 1000) / 1000 : null;
    };
    out.push({ t: group[0].t, temperatureC: avg((p) => p.temperatureC), weightKg: avg((p) => p.weightKg), n: group.reduce((a, p) => a + p.n, 0) });
  }
  return out;
}

export async function hiveSeason(ctx: Ctx, user: SessionUser, hiveId: string, season?: number): Promise<SeasonDto> {
  const m = await requireHive(ctx, user, hiveId, 'hive:read');
  return buildSeason(ctx, m.apiaryId, [hiveId], 'hive', season);
}

export async function apiarySeason(ctx: Ctx, user: SessionUser, apiaryId: string, season?: number): Promise<SeasonDto> {
  await requireApiary(ctx, user, apiaryId, 'hive:read');
  return buildSeason(ctx, apiaryId, null, 'apiary', season);
}

async function buildSeason(ctx: Ctx, apiaryId: string, onlyHives: string[] | null, scope: 'hive' | 'apiary', seasonIn?: number): Promise<SeasonDto> {
  const db = ctx.db;
  const [apiary] = await db.select().from(apiaries).where(eq(apiaries.id, apiaryId)).limit(1);
  if (!apiary) throw notFound('That apiary');
  const hemisphere = apiary.hemisphere as Hemisphere;
  const season = seasonIn ?? seasonOf(ctx.now(), hemisphere);
  const { fromMs, toMs } = seasonRange(season, hemisphere);
  const from = new Date(fromMs);
  const to = new Date(toMs);
  const fromDate = iso(from).slice(0, 10);
  const toDate = iso(to).slice(0, 10);

  const hiveRows = await db
    .select()
    .from(hives)
    .where(onlyHives ? inArray(hives.id, onlyHives) : eq(hives.apiaryId, apiaryId))
    .orderBy(asc(hives.name));
  const ids = hiveRows.map((h) => h.id);
  if (ids.length === 0) {
    return emptySeason(season, from, to, scope, apiary);
  }

  const inRange = (t: { hiveId: PgColumn; occurredAt: PgColumn }) =>
    and(inArray(t.hiveId, ids), gte(t.occurredAt, from), lt(t.occurredAt, to));
  const [insp, feeds, treats, mites, harvs, qEvents, cEvents, sensorMap] = await Promise.all([
    db.select().from(inspections).where(inRange(inspections)).orderBy(asc(inspections.occurredAt)),
    db.select().from(feedings).where(inRange(feedings)).orderBy(asc(feedings.occurredAt)),
    // A treatment belongs to every season it overlaps.
    db
      .select()
      .from(treatments)
      .where(
        and(
          inArray(treatments.hiveId, ids),
          lt(treatments.startDate, toDate),
          gte(sql`coalesce(${treatments.actualEndDate}, ${treatments.plannedEndDate}, ${treatments.startDate})`, fromDate),
        ),
      )
      .orderBy(asc(treatments.startDate)),
    db.select().from(miteCounts).where(inRange(miteCounts)).orderBy(asc(miteCounts.occurredAt)),
    db.select().from(harvests).where(inRange(harvests)).orderBy(asc(harvests.occurredAt)),
    db.select().from(queenEvents).where(inRange(queenEvents)).orderBy(asc(queenEvents.occurredAt)),
    db.select().from(colonyEvents).where(inRange(colonyEvents)).orderBy(asc(colonyEvents.occurredAt)),
    // Hourly averages: the resolution the daily weight change is read at (TRADE-REFERENCES §10).
    bucketedReadings(db, ids, from, to, 60),
  ]);

  const people = new Set<string>();
  for (const list of [insp, feeds, treats, mites, harvs, qEvents, cEvents]) for (const r of list) people.add(r.createdBy);
  const names = new Map(
    people.size
      ? (await db.select({ id: users.id, name: users.name }).from(users).where(inArray(users.id, [...people]))).map((u) => [u.id, u.name])
      : [],
  );
  const nameOf = (hiveId: string) => hiveRows.find((h) => h.id === hiveId)?.name ?? '';
  const by = (id: string) => names.get(id) ?? '';

  const records: SeasonRecord[] = [];
  const perHive = new Map<string, HiveSeason>();
  for (const h of hiveRows) {
    perHive.set(h.id, {
      id: h.id,
      name: h.name,
      honeyFrameSize: h.boxes[0]?.size ?? 'deep',
      inspections: [],
      feedings: [],
      treatments: [],
      miteCounts: [],
      harvests: [],
      sensors: null,
      totals: zeroTotals(),
    });
  }
  const base = (r: { id: string; hiveId: string; occurredAt: Date; createdBy: string; note: string }) => ({
    id: r.id,
    hiveId: r.hiveId,
    hiveName: nameOf(r.hiveId),
    at: iso(r.occurredAt),
    recordedBy: by(r.createdBy),
    note: r.note,
  });

  // Days the keeper changed a hive's weight by hand; the scale's change that day is not the bees'.
  const touched = new Map<string, Set<string>>(ids.map((id) => [id, new Set<string>()]));
  const touch = (hiveId: string, at: Date) => touched.get(hiveId)?.add(iso(at).slice(0, 10));
  for (const r of feeds) touch(r.hiveId, r.occurredAt);
  for (const r of harvs) touch(r.hiveId, r.occurredAt);
  for (const r of insp) if (r.spaceActions.some((a) => a !== 'feeder-on' && a !== 'feeder-off')) touch(r.hiveId, r.occurredAt);

  for (const r of insp) {
    const hs = perHive.get(r.hiveId)!;
    const storesKg = storesForHoneyFrames(r.honeyFrames, hs.honeyFrameSize as FrameSize);
    hs.inspections.push({ id: r.id, at: iso(r.occurredAt), framesBrood: r.framesBrood, framesBees: r.framesBees, honeyFrames: r.honeyFrames, storesKg });
    records.push({ ...base(r), kind: 'inspection', summary: inspectionSummary(r) });
  }
  for (const r of feeds) {
    const sugarKg = sugarOfFeeding(r);
    const f: SeasonFeeding = { id: r.id, at: iso(r.occurredAt), kind: r.kind, sugarKg };
    perHive.get(r.hiveId)!.feedings.push(f);
    records.push({ ...base(r), kind: 'feeding', summary: feedingSummary(r, sugarKg) });
  }
  for (const r of treats) {
    const end = r.actualEndDate ?? r.plannedEndDate ?? r.startDate;
    perHive.get(r.hiveId)!.treatments.push({
      id: r.id,
      activeIngredient: r.activeIngredient,
      productName: r.productName,
      start: `${r.startDate}T00:00:00.000Z`,
      // The span covers the whole end day.
      end: new Date(dateOnlyMs(end) + 86_400_000).toISOString(),
      ended: r.actualEndDate != null,
    });
    records.push({
      ...base({ ...r, occurredAt: new Date(dateOnlyMs(r.startDate)) }),
      kind: 'treatment',
      summary: treatmentSummary({ ...r, end }),
    });
  }
  for (const r of mites) {
    let load: Pick<SeasonMiteCount, 'perHundredBees' | 'perDay' | 'level'> = { perHundredBees: null, perDay: null, level: 'low' };
    try {
      const l = miteLoad({ method: r.method as MiteMethod, mites: r.mites, beesSampled: r.beesSampled ?? undefined, days: r.days ?? undefined });
      load = { perHundredBees: l.perHundredBees ?? null, perDay: l.perDay ?? null, level: l.level };
    } catch {
      // A count the rules cannot read (no bees sampled) still shows in the table, without a level.
    }
    perHive.get(r.hiveId)!.miteCounts.push({ id: r.id, at: iso(r.occurredAt), method: r.method, ...load });
    records.push({ ...base(r), kind: 'mite-count', summary: miteSummary(r, load) });
  }
  for (const r of harvs) {
    perHive.get(r.hiveId)!.harvests.push({ id: r.id, at: iso(r.occurredAt), weightKg: r.weightKg });
    records.push({ ...base(r), kind: 'harvest', summary: harvestSummary(r) });
  }
  for (const r of qEvents) records.push({ ...base(r), kind: 'queen-event', summary: `Queen ${r.kind.replace(/-/g, ' ')}` });
  for (const r of cEvents) records.push({ ...base(r), kind: 'colony-event', summary: `Colony ${r.kind.replace(/-/g, ' ')}` });

  for (const hs of perHive.values()) {
    const sensor = sensorMap.get(hs.id);
    if (sensor && sensor.points.length > 0) {
      hs.sensors = {
        points: thin(sensor.points, CHART_POINTS),
        bucketMinutes: 60 * Math.max(1, Math.ceil(sensor.points.length / CHART_POINTS)),
        readings: sensor.readings,
        weightDays: weightDays(sensor.points, touched.get(hs.id) ?? new Set()),
      };
    }
    hs.totals = totalsOf([hs]);
  }
  records.sort((a, b) => a.at.localeCompare(b.at) || a.kind.localeCompare(b.kind));
  const hivesOut = [...perHive.values()];
  return {
    season,
    from: iso(from),
    to: iso(to),
    scope,
    apiary: { id: apiary.id, name: apiary.name, hemisphere },
    hives: hivesOut,
    records,
    totals: totalsOf(hivesOut),
    references: references(),
  };
}

/**
 * Each day's net weight change (reading at 00:00 UTC to the next, TRADE-REFERENCES §10, derived)
 * labelled by classifyWeightDays. Days the keeper changed the hive's weight by hand — a feeding,
 * a harvest, or a check that added or took off a box — are left out, as §10 says.
 */
function weightDays(points: SensorPoint[], touched: Set<string>): SeasonWeightDay[] {
  const weights = points.filter((p) => p.weightKg != null).map((p) => ({ t: p.t, kg: p.weightKg as number }));
  if (weights.length < 2) return [];
  return classifyWeightDays(dailyNetChange(weights)).filter((d) => !touched.has(d.date));
}

const zeroTotals = (): SeasonTotals => ({ honeyHarvestedKg: 0, sugarFedKg: 0, treatments: 0, peakBrood: null, inspections: 0 });

function totalsOf(list: HiveSeason[]): SeasonTotals {
  const t = zeroTotals();
  for (const h of list) {
    t.honeyHarvestedKg += h.harvests.reduce((a, x) => a + (x.weightKg ?? 0), 0);
    t.sugarFedKg += h.feedings.reduce((a, x) => a + (x.sugarKg ?? 0), 0);
    t.treatments += h.treatments.length;
    t.inspections += h.inspections.length;
    for (const i of h.inspections) {
      if (!t.peakBrood || i.framesBrood > t.peakBrood.frames) t.peakBrood = { frames: i.framesBrood, at: i.at, hiveName: h.name };
    }
  }
  t.honeyHarvestedKg = Math.round(t.honeyHarvestedKg * 10) / 10;
  t.sugarFedKg = Math.round(t.sugarFedKg * 10) / 10;
  return t;
}

function references() {
  return {
    miteThresholdPerHundred: MITE_CHART_THRESHOLD.perHundred,
    miteThresholdSource: MITE_CHART_THRESHOLD.source,
    broodNestLowC: BROOD_NEST_BAND_C.low,
    broodNestHighC: BROOD_NEST_BAND_C.high,
    broodNestSource: BROOD_NEST_BAND_C.source,
    weightDaySource: 'daily change at midnight UTC, ±0.1 kg flat (Frameside’s own cut-off; no published one)',
  };
}

function emptySeason(season: number, from: Date, to: Date, scope: 'hive' | 'apiary', apiary: { id: string; name: string; hemisphere: string }): SeasonDto {
  return {
    season,
    from: iso(from),
    to: iso(to),
    scope,
    apiary: { id: apiary.id, name: apiary.name, hemisphere: apiary.hemisphere },
    hives: [],
    records: [],
    totals: zeroTotals(),
    references: references(),
  };
}
