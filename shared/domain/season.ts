/**
 * The Season review's rules: which months make a season, the one-line words for each record,
 * and the published values its charts draw. Pure: `now` is passed in.
 */
import type { Hemisphere } from './hives';
import { MITE_THRESHOLDS } from './mites';

/** Brood-nest temperature band, °C: Kleinhenz et al. (2003) J. Exp. Biol. 206: 4217 (TRADE-REFERENCES §8, confirmed primary). */
export const BROOD_NEST_BAND_C = { low: 33, high: 36, source: 'Kleinhenz et al. 2003' } as const;

/** The mite line the chart draws: the 3 per 100 bees economic threshold (TRADE-REFERENCES §3; USDA-ARS Tucson, Univ. of Florida). */
export const MITE_CHART_THRESHOLD = {
  perHundred: MITE_THRESHOLDS.washActPerHundred,
  source: 'USDA-ARS / UF',
} as const;

/**
 * A season is the calendar year in the north; in the south it runs 1 July to 30 June and is
 * named by the year it starts in. Frameside's own convention: one winter per season, not split.
 */
export function seasonRange(season: number, hemisphere: Hemisphere): { fromMs: number; toMs: number } {
  if (hemisphere === 'south') return { fromMs: Date.UTC(season, 6, 1), toMs: Date.UTC(season + 1, 6, 1) };
  return { fromMs: Date.UTC(season, 0, 1), toMs: Date.UTC(season + 1, 0, 1) };
}

/** The season `now` falls in. */
export function seasonOf(now: Date, hemisphere: Hemisphere): number {
  const y = now.getUTCFullYear();
  return hemisphere === 'south' && now.getUTCMonth() < 6 ? y - 1 : y;
}

const words = (v: string) => v.replace(/-/g, ' ');
const fmt = (n: number, digits = 1) => (Number.isInteger(n) ? String(n) : n.toFixed(digits));

export function inspectionSummary(r: {
  framesBrood: number;
  framesBees: number;
  honeyFrames: number;
  queenStatus: string;
  queenCells?: readonly { kind: string; count: number; capped: boolean }[];
}): string {
  const parts = [`${fmt(r.framesBrood)} frames of brood, ${fmt(r.framesBees)} of bees, ${fmt(r.honeyFrames)} of honey`, words(r.queenStatus)];
  const cells = (r.queenCells ?? []).filter((c) => c.count > 0);
  if (cells.length) parts.push(cells.map((c) => `${c.count} ${c.capped ? 'capped ' : ''}${c.kind} cell${c.count === 1 ? '' : 's'}`).join(', '));
  return parts.join('; ');
}

export function feedingSummary(r: { kind: string; ratio: string | null; amountL: number | null; amountKg: number | null }, sugarKg: number | null): string {
  if (r.kind === 'syrup') {
    const amount = r.amountL != null ? `${fmt(r.amountL)} L` : 'amount not given';
    const sugar = sugarKg != null ? ` (${fmt(sugarKg)} kg sugar)` : '';
    return `Syrup ${r.ratio ?? ''} ${amount}${sugar}`.replace(/\s+/g, ' ');
  }
  return `${words(r.kind).replace(/^./, (c) => c.toUpperCase())}${r.amountKg != null ? ` ${fmt(r.amountKg)} kg` : ''}`;
}

export function treatmentSummary(r: { activeIngredient: string; productName: string; method: string; batch: string; end: string | null }): string {
  const product = r.productName ? ` (${r.productName})` : '';
  const batch = r.batch ? `, batch ${r.batch}` : '';
  const end = r.end ? `, until ${r.end}` : '';
  return `${words(r.activeIngredient).replace(/^./, (c) => c.toUpperCase())}${product} by ${words(r.method)}${batch}${end}`;
}

export function miteSummary(r: { method: string; mites: number; beesSampled: number | null; days: number | null }, load: { perHundredBees: number | null; perDay: number | null; level: string }): string {
  if (load.perDay != null) return `Sticky board: ${r.mites} mites over ${fmt(r.days ?? 0)} days = ${fmt(load.perDay)} a day (${load.level})`;
  if (load.perHundredBees != null) {
    return `${words(r.method).replace(/^./, (c) => c.toUpperCase())}: ${r.mites} mites in ${r.beesSampled} bees = ${fmt(load.perHundredBees)} per 100 bees (${load.level})`;
  }
  return `${words(r.method)}: ${r.mites} mites`;
}

export function harvestSummary(r: { supers: number; frames: number; weightKg: number | null; moisturePercent: number | null }): string {
  const parts = [`${r.supers} super${r.supers === 1 ? '' : 's'}`, `${r.frames} frames`];
  if (r.weightKg != null) parts.push(`${fmt(r.weightKg)} kg`);
  if (r.moisturePercent != null) parts.push(`moisture ${fmt(r.moisturePercent)} %`);
  return `Harvest: ${parts.join(', ')}`;
}

export const SEASON_KIND_LABELS = {
  inspection: 'Quick check',
  feeding: 'Feeding',
  treatment: 'Treatment',
  'mite-count': 'Mite count',
  harvest: 'Harvest',
  'queen-event': 'Queen',
  'colony-event': 'Colony',
} as const;
