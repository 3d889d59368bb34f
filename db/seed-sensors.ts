/**
 * Demo hive-scale and brood-temperature log for the hive Ash (Orchard Row). Invented data: a
 * reading every two hours from 1 March to 31 October (about 2,900 rows, one insert), with a
 * spring build-up gain, a harvest step, a summer dearth loss and the autumn decline of the brood
 * nest. Readings stop at `now`. No number here is a reference value.
 */
import { sensorReadings } from './schema';
import type { SeedExtension } from './seed-extensions';

const HOUR = 3_600_000;
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
  const year = now.getUTCMonth() < 2 ? now.getUTCFullYear() - 1 : now.getUTCFullYear();
  const start = Date.UTC(year, 2, 1);
  const end = Math.min(Date.UTC(year, 10, 1), now.getTime());
  const rnd = noise(20260301);
  const rows: (typeof sensorReadings.$inferInsert)[] = [];
  let trendKg = 41;
  for (let t = start; t < end; t += 2 * HOUR) {
    const at = new Date(t);
    const hour = at.getUTCHours();
    if (hour === 0) trendKg += dailyTrendKg(new Date(t - DAY)) + rnd() * 0.08;
    // The honey supers came off on 8 July (invented): a step down.
    if (at.getUTCMonth() === 6 && at.getUTCDate() === 8 && hour === 12) trendKg -= 14;
    // Within a day foragers leave in the morning and come back loaded in the afternoon.
    const flying = hour >= 8 && hour <= 18 ? -0.35 * Math.sin(((hour - 8) / 10) * Math.PI) : 0;
    const m = at.getUTCMonth() + 1;
    // Brood nest held near 34.5–35 °C while there is brood; cooler early and late in the year.
    const baseC = m <= 3 ? 32.5 : m >= 10 ? 29 + (31 - at.getUTCDate()) / 15 : 34.7;
    const daily = 0.4 * Math.sin(((hour - 14) / 24) * 2 * Math.PI);
    rows.push({
      hiveId,
      at,
      weightKg: Math.round((trendKg + flying + rnd() * 0.05) * 100) / 100,
      temperatureC: Math.round((baseC + daily + rnd() * 0.4) * 100) / 100,
    });
  }
  for (let i = 0; i < rows.length; i += 3000) await tx.insert(sensorReadings).values(rows.slice(i, i + 3000));
};
