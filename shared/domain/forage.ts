/**
 * Forage check: is there a nectar flow, some forage, or a dearth? From the syrup-dish field
 * check and from hive-scale weights. Sources: TRADE-REFERENCES §9 (dearth signs) and §10
 * (Meikle et al. 2005 running average; daily net change, derived; no published kg cut-off).
 */

import { utcMsToDate, type IsoDate, parseInstant } from './dates';

export const FORAGE_JUDGEMENTS = ['flow', 'some', 'dearth'] as const;
export type ForageJudgement = (typeof FORAGE_JUDGEMENTS)[number];

/**
 * Syrup-dish thresholds. A dish of thin syrup set out away from the hives and emptied within
 * about 30 minutes means dearth: common practice, the trade's field check (§9 lists "bees
 * quickly finding any syrup or honey left out" as a dearth sign, confirmed secondary; the
 * 30-minute figure is common practice). A dish left untouched for a watch at least that long
 * means the foragers have better things to work, a flow; Frameside's own choice, as is calling
 * a dish found but not emptied within the window 'some'.
 */
export const SYRUP_DISH = { dearthWithinMinutes: 30, minimumWatchMinutes: 30 } as const;

export interface SyrupDishObservation {
  /** Minutes from setting the dish out until it was empty. */
  minutesToEmpty?: number;
  /** Minutes the dish was watched (when it was not emptied). */
  watchedMinutes?: number;
  /** True when no bee worked the dish during the watch. */
  untouched?: boolean;
}

function nonNegative(value: number, name: string): number {
  if (!Number.isFinite(value) || value < 0) throw new RangeError(`${name} must be a number, 0 or more.`);
  return value;
}

/**
 * 'dearth' when the dish was emptied within 30 min, 'some' when emptied later or found but not
 * emptied during a watch of ≥ 30 min, 'flow' when untouched (after ≥ 30 min if the watch is
 * given). RangeError for no observation, a contradiction (emptied and untouched), a watch shorter
 * than 30 min without the dish emptied, or negative/NaN minutes.
 */
export function syrupDishVerdict(obs: SyrupDishObservation): ForageJudgement {
  const { dearthWithinMinutes, minimumWatchMinutes } = SYRUP_DISH;
  if (obs.minutesToEmpty !== undefined) {
    const minutes = nonNegative(obs.minutesToEmpty, 'Minutes to empty');
    if (obs.untouched) throw new RangeError('A dish cannot be both emptied and untouched.');
    return minutes <= dearthWithinMinutes ? 'dearth' : 'some';
  }
  const watched = obs.watchedMinutes === undefined ? undefined : nonNegative(obs.watchedMinutes, 'Minutes watched');
  if (obs.untouched) {
    if (watched !== undefined && watched < minimumWatchMinutes) {
      throw new RangeError(`Watch the dish at least ${minimumWatchMinutes} minutes before calling it untouched.`);
    }
    return 'flow';
  }
  if (watched !== undefined) {
    if (watched < minimumWatchMinutes) throw new RangeError(`Watch the dish at least ${minimumWatchMinutes} minutes, or until it is empty.`);
    return 'some';
  }
  throw new RangeError('Give the minutes until the dish was empty, or the minutes watched.');
}

/** A hive-scale reading: an instant (ISO 8601 string, read as UTC when it has no zone, or epoch ms) and the weight in kg. */
export interface WeightPoint {
  t: string | number;
  kg: number;
}

export interface RunningAveragePoint {
  /** The centre hour as an ISO 8601 UTC string. */
  t: string;
  tMs: number;
  /** The reading at the centre hour, kg. */
  rawKg: number;
  /** 25-hour centred running average, kg. */
  kg: number;
  /** rawKg − kg (Meikle et al. 2005: the hourly detrended data). */
  detrendedKg: number;
}

const HOUR_MS = 3_600_000;
const DAY_MS = 86_400_000;

/**
 * Slack on "one hour apart" for logger clock drift: ±5 min, Frameside's own choice. Readings
 * further off break the window rather than being silently averaged as if hourly.
 */
export const HOURLY_STEP_TOLERANCE_MS = 5 * 60_000;

interface TimedWeight {
  ms: number;
  kg: number;
}

function toSorted(points: readonly WeightPoint[]): TimedWeight[] {
  const out = points.map((p) => {
    if (!Number.isFinite(p.kg)) throw new RangeError('Each weight must be a number in kg.');
    return { ms: parseInstant(p.t), kg: p.kg };
  });
  out.sort((a, b) => a.ms - b.ms);
  for (let i = 1; i < out.length; i++) {
    if (out[i].ms === out[i - 1].ms) throw new RangeError(`Two readings share the time ${new Date(out[i].ms).toISOString()}.`);
  }
  return out;
}

/**
 * Meikle et al. (2005) 25-hour centred running average of hourly weights: for each hour, the
 * mean of the previous 12 readings, that hour and the next 12. Returned only for hours whose
 * full window exists (25 consecutive readings, each 1 h ± 5 min after the last), in time order.
 * RangeError for an unreadable time, a NaN weight or two readings at the same instant.
 */
export function runningAverage25h(points: readonly WeightPoint[]): RunningAveragePoint[] {
  const sorted = toSorted(points);
  const half = 12;
  // stepOk[i]: reading i follows reading i−1 by one hour (within tolerance).
  const stepOk = sorted.map((p, i) => i > 0 && Math.abs(p.ms - sorted[i - 1].ms - HOUR_MS) <= HOURLY_STEP_TOLERANCE_MS);
  const result: RunningAveragePoint[] = [];
  for (let i = half; i + half < sorted.length; i++) {
    let complete = true;
    let sum = 0;
    for (let j = i - half; j <= i + half; j++) {
      if (j > i - half && !stepOk[j]) {
        complete = false;
        break;
      }
      sum += sorted[j].kg;
    }
    if (!complete) continue;
    const kg = sum / (2 * half + 1);
    const centre = sorted[i];
    result.push({ t: new Date(centre.ms).toISOString(), tMs: centre.ms, rawKg: centre.kg, kg, detrendedKg: centre.kg - kg });
  }
  return result;
}

export interface DailyNetChange {
  /** The day the change happened: from the reading at `hourUtc` on this date to the same hour next day. */
  date: IsoDate;
  deltaKg: number;
  fromKg: number;
  toKg: number;
}

/** How far from the chosen hour a reading may be and still stand for it: ±30 min, Frameside's own choice. */
export const DAILY_READING_TOLERANCE_MS = 30 * 60_000;

/**
 * Net weight change per day: reading at `hourUtc` (default 0, midnight UTC; use a pre-dawn hour
 * when foragers are home, §10) on day d+1 minus the same reading on day d, for every pair of
 * consecutive days that both have a reading within ±30 min of that hour (the nearest is used).
 * The derived method of TRADE-REFERENCES §10. RangeError for an hour outside 0–23.
 */
export function dailyNetChange(points: readonly WeightPoint[], options: { hourUtc?: number } = {}): DailyNetChange[] {
  const hourUtc = options.hourUtc ?? 0;
  if (!Number.isInteger(hourUtc) || hourUtc < 0 || hourUtc > 23) throw new RangeError('hourUtc is a whole hour from 0 to 23.');
  const offsetMs = hourUtc * HOUR_MS;
  // For each day slot keep the reading nearest to that day's chosen hour.
  const bySlot = new Map<number, { kg: number; distance: number }>();
  for (const p of toSorted(points)) {
    const slot = Math.round((p.ms - offsetMs) / DAY_MS);
    const distance = Math.abs(p.ms - (slot * DAY_MS + offsetMs));
    if (distance > DAILY_READING_TOLERANCE_MS) continue;
    const held = bySlot.get(slot);
    if (!held || distance < held.distance) bySlot.set(slot, { kg: p.kg, distance });
  }
  const slots = [...bySlot.keys()].sort((a, b) => a - b);
  const out: DailyNetChange[] = [];
  for (const slot of slots) {
    const next = bySlot.get(slot + 1);
    if (!next) continue;
    const from = bySlot.get(slot) as { kg: number };
    out.push({ date: utcMsToDate(slot * DAY_MS), deltaKg: next.kg - from.kg, fromKg: from.kg, toKg: next.kg });
  }
  return out;
}

export const WEIGHT_TRENDS = ['gaining', 'flat', 'losing'] as const;
export type WeightTrend = (typeof WEIGHT_TRENDS)[number];

/**
 * Default daily change, kg, inside which a day counts as flat: 0.1 kg. Frameside's own choice;
 * no published flow/dearth cut-off exists (§10). It is about one day of a winter cluster's
 * average consumption (110–135 g/day, derived from Seeley 2019 in §6), so a smaller change
 * cannot be told from the colony simply eating.
 */
export const DEFAULT_FLAT_THRESHOLD_KG = 0.1;

/** Each day's change labelled 'gaining' (Δ > threshold), 'losing' (Δ < −threshold) or 'flat'; threshold in kg, default 0.1; RangeError for a negative/NaN threshold. */
export function classifyWeightDays(
  changes: readonly { date: IsoDate; deltaKg: number }[],
  options: { thresholdKg?: number } = {},
): { date: IsoDate; deltaKg: number; trend: WeightTrend }[] {
  const threshold = options.thresholdKg ?? DEFAULT_FLAT_THRESHOLD_KG;
  if (!Number.isFinite(threshold) || threshold < 0) throw new RangeError('thresholdKg must be 0 kg or more.');
  return changes.map(({ date, deltaKg }) => {
    if (!Number.isFinite(deltaKg)) throw new RangeError('Each change must be a number in kg.');
    const trend: WeightTrend = deltaKg > threshold ? 'gaining' : deltaKg < -threshold ? 'losing' : 'flat';
    return { date, deltaKg, trend };
  });
}

/** Days in a row the scale must agree before it calls a flow or a dearth: 3, Frameside's own choice for §10's "sustained". */
export const SUSTAINED_DAYS = 3;

export interface ForageStatusInput {
  dish?: SyrupDishObservation;
  /** Daily net changes, e.g. from dailyNetChange. */
  changes?: readonly { date: IsoDate; deltaKg: number }[];
  thresholdKg?: number;
}

export interface ForageStatus {
  judgement: ForageJudgement;
  from: 'dish' | 'scale' | 'both';
  reason: string;
}

/**
 * One forage judgement from a syrup dish and/or the scale's last 3 daily changes (all gaining =
 * flow, all losing = dearth, otherwise some). When both speak and one says 'some', the other
 * wins; flow against dearth gives 'some'. RangeError when neither gives an answer.
 */
export function forageStatus(input: ForageStatusInput): ForageStatus {
  const dish = input.dish ? syrupDishVerdict(input.dish) : undefined;
  let scale: ForageJudgement | undefined;
  const changes = input.changes ?? [];
  if (changes.length >= SUSTAINED_DAYS) {
    const recent = classifyWeightDays([...changes].sort((a, b) => (a.date < b.date ? -1 : 1)).slice(-SUSTAINED_DAYS), {
      thresholdKg: input.thresholdKg,
    });
    scale = recent.every((d) => d.trend === 'gaining') ? 'flow' : recent.every((d) => d.trend === 'losing') ? 'dearth' : 'some';
  }
  const dishWords: Readonly<Record<ForageJudgement, string>> = {
    dearth: 'the syrup dish was emptied within 30 minutes',
    some: 'the syrup dish was found but not emptied quickly',
    flow: 'the syrup dish was left untouched',
  };
  const scaleWords: Readonly<Record<ForageJudgement, string>> = {
    flow: `the hive gained weight on each of the last ${SUSTAINED_DAYS} days`,
    dearth: `the hive lost weight on each of the last ${SUSTAINED_DAYS} days`,
    some: `the hive's weight was mixed over the last ${SUSTAINED_DAYS} days`,
  };
  if (dish && scale) {
    if (dish === scale) return { judgement: dish, from: 'both', reason: `Both agree: ${dishWords[dish]} and ${scaleWords[scale]}.` };
    if (scale === 'some') return { judgement: dish, from: 'dish', reason: `Going by the dish: ${dishWords[dish]}; ${scaleWords[scale]}.` };
    if (dish === 'some') return { judgement: scale, from: 'scale', reason: `Going by the scale: ${scaleWords[scale]}; ${dishWords[dish]}.` };
    return { judgement: 'some', from: 'both', reason: `They disagree: ${dishWords[dish]}, but ${scaleWords[scale]}. Look again.` };
  }
  if (dish) return { judgement: dish, from: 'dish', reason: `${capitalise(dishWords[dish])}.` };
  if (scale) return { judgement: scale, from: 'scale', reason: `${capitalise(scaleWords[scale])}.` };
  throw new RangeError(`Give a syrup dish observation or at least ${SUSTAINED_DAYS} daily weight changes.`);
}

function capitalise(s: string): string {
  return s.charAt(0).toUpperCase() + s.slice(1);
}
