/**
 * Varroa load from a mite count, and a low / watch / act level against published thresholds.
 * Sources: TRADE-REFERENCES §3.
 */

export const MITE_METHODS = ['alcohol-wash', 'sugar-roll', 'sticky-board'] as const;
export type MiteMethod = (typeof MITE_METHODS)[number];

export const MITE_LEVELS = ['low', 'watch', 'act'] as const;
export type MiteLevel = (typeof MITE_LEVELS)[number];

/**
 * Thresholds. Washes and rolls: act at 3 mites per 100 bees, the economic threshold of
 * USDA-ARS Carl Hayden Bee Research Center (Tucson) and the University of Florida Honey Bee
 * Lab (§3, confirmed secondary; Front. Ecol. Evol. 2023, primary); watch from 2, the bottom of
 * R. Oliver's "never above around the 2-3% level" (ABJ 2020, §3, confirmed secondary).
 * Sticky board: act above 30 mites/day (USDA-ARS Tucson, quoted by Gilroy BKA, §3, confirmed
 * secondary). The sticky-board watch level, above 15/day (half the act level), is Frameside's
 * own choice: no published watch level was found, and natural fall tracks wash results poorly
 * (Oliver, §3), so a middling fall should prompt a wash rather than wait for 30/day.
 */
export const MITE_THRESHOLDS = {
  washActPerHundred: 3,
  washWatchPerHundred: 2,
  boardActAbovePerDay: 30,
  boardWatchAbovePerDay: 15,
} as const;

export interface MiteLoadInput {
  method: MiteMethod;
  /** Mites counted (in the wash or roll, or on the board over `days`). */
  mites: number;
  /** Adult bees in the wash or roll sample (about 300 for ½ US cup). */
  beesSampled?: number;
  /** Days the sticky board was in. */
  days?: number;
  /** Share of the mites the method dislodges, 0 < efficiency ≤ 1 (BEEBOOK: first-wash mites ÷ total). */
  efficiency?: number;
}

export interface MiteLoad {
  perHundredBees?: number;
  perDay?: number;
  level: MiteLevel;
  /** One plain sentence naming the threshold and its source. */
  basis: string;
}

function requireCount(value: number | undefined, name: string): number {
  if (value === undefined || !Number.isFinite(value) || value < 0) throw new RangeError(`${name} must be a number, 0 or more.`);
  return value;
}

/**
 * Mites per 100 bees (washes, rolls: mites ÷ bees × 100, BEEBOOK, Dietemann et al. 2013,
 * divided by `efficiency` when given) or per day (sticky board: mites ÷ days), with a level.
 * Throws a RangeError when mites < 0 or NaN, bees ≤ 0 or fewer than mites, days ≤ 0, or
 * efficiency outside (0, 1].
 */
export function miteLoad(input: MiteLoadInput): MiteLoad {
  const mites = requireCount(input.mites, 'Mites');
  const t = MITE_THRESHOLDS;

  if (input.method === 'sticky-board') {
    const days = input.days;
    if (days === undefined || !Number.isFinite(days) || days <= 0) throw new RangeError('A sticky board needs the days it was in (more than 0).');
    const perDay = mites / days;
    if (perDay > t.boardActAbovePerDay) {
      return { perDay, level: 'act', basis: 'More than 30 mites a day on a sticky board: the treatment level used by USDA-ARS (Tucson).' };
    }
    if (perDay > t.boardWatchAbovePerDay) {
      return {
        perDay,
        level: 'watch',
        basis: 'More than 15 mites a day (Frameside’s own watch level, half the USDA-ARS 30 a day): confirm with a wash.',
      };
    }
    return { perDay, level: 'low', basis: 'Up to 15 mites a day on a sticky board: below Frameside’s watch level and the USDA-ARS 30 a day.' };
  }

  if (input.method !== 'alcohol-wash' && input.method !== 'sugar-roll') {
    throw new RangeError(`Mite method is alcohol-wash, sugar-roll or sticky-board, got ${String(input.method)}.`);
  }
  const bees = input.beesSampled;
  if (bees === undefined || !Number.isFinite(bees) || bees <= 0) throw new RangeError('A wash or roll needs the bees sampled (more than 0).');
  if (mites > bees) throw new RangeError('A sample cannot hold more mites than bees.');
  let perHundredBees = (mites * 100) / bees;
  if (input.efficiency !== undefined) {
    const e = input.efficiency;
    if (!Number.isFinite(e) || e <= 0 || e > 1) throw new RangeError('Efficiency is a share between 0 (exclusive) and 1.');
    perHundredBees /= e;
  }
  if (perHundredBees >= t.washActPerHundred) {
    return {
      perHundredBees,
      level: 'act',
      basis: '3 or more mites per 100 bees: the economic threshold used by USDA-ARS (Tucson) and the University of Florida.',
    };
  }
  if (perHundredBees >= t.washWatchPerHundred) {
    return { perHundredBees, level: 'watch', basis: '2 to 3 mites per 100 bees: at the 2–3 % ceiling R. Oliver advises never to exceed.' };
  }
  return { perHundredBees, level: 'low', basis: 'Under 2 mites per 100 bees: below the 2–3 % practical ceiling (R. Oliver) and the 3 % threshold (USDA-ARS).' };
}
