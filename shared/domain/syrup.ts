/**
 * Syrup mixer: sugar and water for a ratio mixed by weight or by volume, and what it makes.
 * Sources (TRADE-REFERENCES §2): sucrose density at 20 °C from the CRC Handbook rows of §2a;
 * water 0.998203 g/mL at 20 °C and granulated sugar 200 g per US cup from §2b.
 */

import { SUGAR_BULK_DENSITY_G_PER_ML } from './units';

/** Density of pure water at 20 °C in g/mL (= kg/L), TRADE-REFERENCES §2b. */
export const WATER_DENSITY_20C_G_PER_ML = 0.998203;

/**
 * Density of aqueous sucrose at 20 °C, mass % 0–80: CRC Handbook 102nd ed. (0–60, 70, 80 %)
 * and the older CRC edition in the Flanagan `Sucrose` data (62–68 %), TRADE-REFERENCES §2a,
 * all "confirmed". sucroseGPerL is the table's own column (= w% × ρ × 10).
 */
export const SUCROSE_DENSITY_20C = [
  { sucrosePercentWw: 0, densityGPerMl: 0.9982, sucroseGPerL: 0 },
  { sucrosePercentWw: 5, densityGPerMl: 1.0178, sucroseGPerL: 50.9 },
  { sucrosePercentWw: 10, densityGPerMl: 1.0381, sucroseGPerL: 103.8 },
  { sucrosePercentWw: 15, densityGPerMl: 1.0592, sucroseGPerL: 158.9 },
  { sucrosePercentWw: 20, densityGPerMl: 1.081, sucroseGPerL: 216.2 },
  { sucrosePercentWw: 30, densityGPerMl: 1.127, sucroseGPerL: 338.1 },
  { sucrosePercentWw: 40, densityGPerMl: 1.1765, sucroseGPerL: 470.6 },
  { sucrosePercentWw: 50, densityGPerMl: 1.2295, sucroseGPerL: 614.8 },
  { sucrosePercentWw: 60, densityGPerMl: 1.2864, sucroseGPerL: 771.8 },
  { sucrosePercentWw: 62, densityGPerMl: 1.2983, sucroseGPerL: 804.9 },
  { sucrosePercentWw: 64, densityGPerMl: 1.3103, sucroseGPerL: 838.6 },
  { sucrosePercentWw: 66, densityGPerMl: 1.3224, sucroseGPerL: 872.8 },
  { sucrosePercentWw: 68, densityGPerMl: 1.3348, sucroseGPerL: 907.6 },
  { sucrosePercentWw: 70, densityGPerMl: 1.3472, sucroseGPerL: 943.0 },
  { sucrosePercentWw: 80, densityGPerMl: 1.4117, sucroseGPerL: 1129.4 },
] as const;

/** Density in g/mL of sucrose solution at 20 °C and `percentWw` mass % (0–80), linear between CRC rows; RangeError outside 0–80 or NaN. */
export function sucroseDensity20C(percentWw: number): number {
  const rows = SUCROSE_DENSITY_20C;
  const first = rows[0];
  const last = rows[rows.length - 1];
  if (!Number.isFinite(percentWw) || percentWw < first.sucrosePercentWw || percentWw > last.sucrosePercentWw) {
    throw new RangeError(`Sucrose density is tabulated for 0–80 % w/w only, got ${percentWw}.`);
  }
  for (let i = 1; i < rows.length; i++) {
    const lo = rows[i - 1];
    const hi = rows[i];
    if (percentWw <= hi.sucrosePercentWw) {
      const f = (percentWw - lo.sucrosePercentWw) / (hi.sucrosePercentWw - lo.sucrosePercentWw);
      return lo.densityGPerMl + f * (hi.densityGPerMl - lo.densityGPerMl);
    }
  }
  return last.densityGPerMl;
}

/** A syrup ratio: '1:1', '2:1', or sugar parts per one part water. */
export type SyrupRatioInput = '1:1' | '2:1' | number;

/** How the ratio's parts are measured: by weight (kg to kg) or by volume (cups of sugar to cups of water). */
export type SyrupMixBasis = 'weight' | 'volume';

export interface MixSyrupInput {
  ratio: SyrupRatioInput;
  basis: SyrupMixBasis;
  /** Litres of finished syrup wanted. */
  finishedVolumeL?: number;
  /** Litres of water to be used. */
  waterL?: number;
  /** Kilograms of sugar to be used. */
  sugarKg?: number;
}

export interface MixSyrupResult {
  sugarKg: number;
  waterL: number;
  finishedVolumeL: number;
  finishedMassKg: number;
  /** Sucrose mass fraction of the syrup in % (= °Brix). */
  sucrosePercentWw: number;
}

/** Sugar parts per water part for a ratio; RangeError for an unknown string or a ratio that is not a positive finite number. */
export function ratioParts(ratio: SyrupRatioInput): number {
  if (ratio === '1:1') return 1;
  if (ratio === '2:1') return 2;
  if (typeof ratio !== 'number' || !Number.isFinite(ratio) || ratio <= 0) {
    throw new RangeError(`A syrup ratio is '1:1', '2:1' or a positive number of sugar parts per water part, got ${String(ratio)}.`);
  }
  return ratio;
}

function checkAmount(value: number, name: string): number {
  if (!Number.isFinite(value) || value < 0) throw new RangeError(`${name} must be a number, 0 or more.`);
  return value;
}

/**
 * Sugar (kg), water (L) and finished syrup (L, kg, % w/w) for a ratio by weight or volume,
 * from exactly one of finishedVolumeL, waterL or sugarKg. Throws a RangeError when none or
 * more than one amount is given, for a negative/NaN amount, a bad ratio, or a mix above 80 %
 * w/w (beyond the density table; 2:1 by weight, 66.7 %, is already near saturation at 20 °C).
 */
export function mixSyrup(input: MixSyrupInput): MixSyrupResult {
  const { basis } = input;
  if (basis !== 'weight' && basis !== 'volume') throw new RangeError(`Mix by 'weight' or 'volume', got ${String(basis)}.`);
  const parts = ratioParts(input.ratio);
  const given = (['finishedVolumeL', 'waterL', 'sugarKg'] as const).filter((k) => input[k] !== undefined);
  if (given.length !== 1) {
    throw new RangeError('Give exactly one of finishedVolumeL, waterL or sugarKg.');
  }

  // kg of sugar per litre of water: by weight the parts are masses (water 0.998203 kg/L);
  // by volume they are cups, and a cup of sugar weighs 200 g against a cup of water's 236 g.
  const partDensity = basis === 'weight' ? WATER_DENSITY_20C_G_PER_ML : SUGAR_BULK_DENSITY_G_PER_ML;
  const sugarKgPerWaterL = parts * partDensity;
  const sucroseFraction = sugarKgPerWaterL / (sugarKgPerWaterL + WATER_DENSITY_20C_G_PER_ML);
  const sucrosePercentWw = sucroseFraction * 100;
  if (sucrosePercentWw > 80) {
    throw new RangeError(`That ratio makes ${sucrosePercentWw.toFixed(1)} % w/w syrup; the density table stops at 80 %.`);
  }
  const densityKgPerL = sucroseDensity20C(sucrosePercentWw);

  let sugarKg: number;
  let waterL: number;
  if (input.waterL !== undefined) {
    waterL = checkAmount(input.waterL, 'waterL');
    sugarKg = waterL * sugarKgPerWaterL;
  } else if (input.sugarKg !== undefined) {
    sugarKg = checkAmount(input.sugarKg, 'sugarKg');
    waterL = sugarKg / sugarKgPerWaterL;
  } else {
    const volumeL = checkAmount(input.finishedVolumeL as number, 'finishedVolumeL');
    const massKg = volumeL * densityKgPerL;
    sugarKg = massKg * sucroseFraction;
    waterL = (massKg - sugarKg) / WATER_DENSITY_20C_G_PER_ML;
  }
  const finishedMassKg = sugarKg + waterL * WATER_DENSITY_20C_G_PER_ML;
  return {
    sugarKg,
    waterL,
    finishedVolumeL: finishedMassKg / densityKgPerL,
    finishedMassKg,
    sucrosePercentWw,
  };
}
