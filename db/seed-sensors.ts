/**
 * Demo hive-scale and brood-temperature log for the hive Ash (Orchard Row). Invented data: a
 * reading every three hours from 1 March to 31 October (about 1,950 rows, one insert), with a
 * spring build-up gain, a summer dearth loss and the autumn decline of the brood nest. Ash's own
 * demo harvests take weight off and its feedings put weight on, on the days they were recorded,
 * so the scale and the records tell one story. Readings stop at `now`. No number here is a
 * reference value.
 */
import { asc, eq, sql } from 'drizzle-orm';
import { feedings, harvests, inspections } from './schema';
import type { SeedExtension } from './seed-extensions';

const HOUR = 3_600_000;
const STEP = 3 * HOUR;
const DAY = 24 * HOUR;

/** A small deterministic noise source, so every seed draws the same demo. */
function noise(seed: number) {
  let s = seed >>> 0;
  return () => {
    s = (Math.imul(s, 1664525) + 1013904223) >>> 0;
    return s / 2 ** 32 - 0.5;
  };
}

/** Invented daily net change of Ash's weight (kg/day) by day of the season. */
function dailyTrendKg(date: Date): number {
  const m = date.getUTCMonth() + 1;
  const d = date.getUTCDate();
  const md = m * 100 + d;
  if (md < 410) return -0.08; // late winter: living on stores
  if (md < 501) return 0.2; // first spring flow
  if (md < 705) return 0.45; // main flow
  if (md < 715) return 0.0;
  if (md < 825) return -0.22; // summer dearth
  if (md < 915) return 0.05;
  return -0.06;
}

export const seedSensors: SeedExtension = async (tx, ids, now) => {
  const hiveId = ids.hives.Ash;
  if (!hiveId) return;
  // The season of Ash's demo records when there are any, else the one `now` is in.
  const [firstCheck] = await tx.select({ at: inspections.occurredAt }).from(inspections).where(eq(inspections.hiveId, hiveId)).orderBy(asc(inspections.occurredAt)).limit(1);
  const year = firstCheck ? firstCheck.at.getUTCFullYear() : now.getUTCMonth() < 2 ? now.getUTCFullYear() - 1 : now.getUTCFullYear();
  // Weight changes by hand: a harvested super comes off with its box and frames (about 3 kg more
  // than the honey, invented), syrup goes on at about 1.3 kg a litre (invented round figure).
  const steps: { at: number; kg: number }[] = [];
  for (const h of await tx.select().from(harvests).where(eq(harvests.hiveId, hiveId))) {
    steps.push({ at: h.occurredAt.getTime(), kg: -((h.weightKg ?? 10) + 3 * Math.max(1, h.supers)) });
  }
  for (const f of await tx.select().from(feedings).where(eq(feedings.hiveId, hiveId))) {
    steps.push({ at: f.occurredAt.getTime(), kg: f.amountL != null ? f.amountL * 1.3 : f.amountKg ?? 0 });
  }
  const start = Date.UTC(year, 2, 1);
  const end = Math.min(Date.UTC(year, 10, 1), now.getTime());
  const rnd = noise(20260301);
  const at: string[] = [];
  const temp: number[] = [];
  const weight: number[] = [];
  let trendKg = 41;
  for (let t = start; t < end; t += STEP) {
    const when = new Date(t);
    const hour = when.getUTCHours();
    if (hour === 0) trendKg += dailyTrendKg(new Date(t - DAY)) + rnd() * 0.08;
    for (const step of steps) if (step.at > t - STEP && step.at <= t) trendKg += step.kg;
    // Within a day foragers leave in the morning and come back loaded in the afternoon.
    const flying = hour >= 8 && hour <= 18 ? -0.35 * Math.sin(((hour - 8) / 10) * Math.PI) : 0;
    const m = when.getUTCMonth() + 1;
    // Brood nest held near 34.5–35 °C while there is brood; cooler early and late in the year.
    const baseC = m <= 3 ? 32.5 : m >= 10 ? 29 + (31 - when.getUTCDate()) / 15 : 34.7;
    const daily = 0.4 * Math.sin(((hour - 14) / 24) * 2 * Math.PI);
    at.push(when.toISOString());
    weight.push(Math.round((trendKg + flying + rnd() * 0.05) * 100) / 100);
    temp.push(Math.round((baseC + daily + rnd() * 0.4) * 100) / 100);
  }
  // One statement from three arrays: keeps the demo seed quick.
  await tx.execute(sql`
    INSERT INTO sensor_readings (hive_id, at, temperature_c, weight_kg)
    SELECT ${hiveId}::uuid, u.at, u.t, u.w
    FROM unnest(${sql.param(at)}::timestamptz[], ${sql.param(temp)}::real[], ${sql.param(weight)}::real[]) AS u(at, t, w)`);
};
