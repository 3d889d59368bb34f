/**
 * Honey moisture from a refractometer reading, and what the figure means for sale and keeping.
 * Sources: TRADE-REFERENCES §7 (honey-specific table; the sucrose table of §2a is not used here).
 */

/**
 * Refractive index at 20 °C ↔ water content, the Chataway (1932) / Wedmore (1955) table of the
 * Harmonised Methods of the International Honey Commission (Bogdanov et al. 2009, method 1),
 * TRADE-REFERENCES §7: these eight rows are confirmed (secondary transcription). Values between
 * 16 % and 19 % are interpolated linearly between the confirmed rows (derived).
 */
export const HONEY_RI_TABLE_20C = [
  { moisturePercent: 13, refractiveIndex: 1.5044 },
  { moisturePercent: 14, refractiveIndex: 1.5018 },
  { moisturePercent: 15, refractiveIndex: 1.4992 },
  { moisturePercent: 16, refractiveIndex: 1.4966 },
  { moisturePercent: 19, refractiveIndex: 1.489 },
  { moisturePercent: 20, refractiveIndex: 1.4865 },
  { moisturePercent: 21, refractiveIndex: 1.484 },
  { moisturePercent: 22, refractiveIndex: 1.4815 },
] as const;

/** Refractive index change per 1 % more water: −0.0025 (§7, the confirmed step), used beyond the table's 13–22 % (derived). */
export const HONEY_RI_PER_PERCENT_WATER = -0.0025;

/** Refractive index correction per °C: add 0.00023 per °C above 20 °C, subtract below (IHC/AOAC, §7, confirmed secondary). */
export const HONEY_RI_TEMPERATURE_CORRECTION_PER_C = 0.00023;

export interface HoneyMoistureInput {
  /** Refractive index read on the refractometer (nD). */
  refractiveIndex: number;
  /** Temperature of the sample/prism when read, °C. */
  temperatureC: number;
}

/**
 * Water content (% by mass) of honey from a refractive index read at `temperatureC`: corrected
 * to 20 °C (+0.00023 per °C above, − below), then read off the IHC table by linear interpolation;
 * outside 13–22 % the −0.0025-per-% step is extended. RangeError for NaN/∞ inputs.
 */
export function honeyMoisture(input: HoneyMoistureInput): { moisturePercent: number } {
  const { refractiveIndex, temperatureC } = input;
  if (!Number.isFinite(refractiveIndex)) throw new RangeError('The refractive index must be a number.');
  if (!Number.isFinite(temperatureC)) throw new RangeError('The temperature must be a number in °C.');
  const ri20 = refractiveIndex + HONEY_RI_TEMPERATURE_CORRECTION_PER_C * (temperatureC - 20);
  const rows = HONEY_RI_TABLE_20C;
  const driest = rows[0];
  const wettest = rows[rows.length - 1];
  if (ri20 >= driest.refractiveIndex) {
    return { moisturePercent: driest.moisturePercent + (ri20 - driest.refractiveIndex) / HONEY_RI_PER_PERCENT_WATER };
  }
  if (ri20 <= wettest.refractiveIndex) {
    return { moisturePercent: wettest.moisturePercent + (ri20 - wettest.refractiveIndex) / HONEY_RI_PER_PERCENT_WATER };
  }
  for (let i = 1; i < rows.length; i++) {
    const lo = rows[i - 1];
    const hi = rows[i];
    if (ri20 >= hi.refractiveIndex) {
      const f = (lo.refractiveIndex - ri20) / (lo.refractiveIndex - hi.refractiveIndex);
      return { moisturePercent: lo.moisturePercent + f * (hi.moisturePercent - lo.moisturePercent) };
    }
  }
  return { moisturePercent: wettest.moisturePercent };
}

/** Moisture limits: EU Directive 2001/110/EC (20 %, heather 23 %, confirmed primary); USDA Grade A ≤ 18.6 % (confirmed secondary). */
export const HONEY_MOISTURE_LIMITS = { euGeneralPercent: 20, euHeatherPercent: 23, usdaGradeAPercent: 18.6 } as const;

export type FermentationRisk = 'none' | 'low' | 'moderate' | 'high';

export interface HoneyMoistureVerdict {
  meetsEu: boolean;
  euLimitPercent: 20 | 23;
  meetsUsdaGradeA: boolean;
  fermentationRisk: FermentationRisk;
  note: string;
}

/**
 * Fermentation risk by moisture, USDA Agriculture Handbook 335 (after Lochhead), §7 confirmed
 * secondary: < 17.1 % will not ferment; 17.1–18 % only with > 1,000 yeasts/g; 18.1–19 % with
 * > 10/g; > 19 % even at 1 spore/g. The handbook's bands are written to 0.1 %; a reading that
 * falls in a gap (18.0–18.1) goes to the wetter band.
 */
function fermentationRisk(percent: number): FermentationRisk {
  if (percent < 17.1) return 'none';
  if (percent <= 18) return 'low';
  if (percent <= 19) return 'moderate';
  return 'high';
}

const RISK_WORDS: Readonly<Record<FermentationRisk, string>> = {
  none: 'will not ferment in a year whatever its yeast count',
  low: 'keeps unless its yeast count is high',
  moderate: 'may ferment unless its yeast count is very low',
  high: 'is likely to ferment within a year',
};

/** Whether honey at `percent` moisture meets the EU limit (20 %, 23 % for heather), USDA Grade A (≤ 18.6 %), and its fermentation risk; RangeError unless 0 ≤ percent ≤ 100. */
export function honeyMoistureVerdict(percent: number, options: { heather?: boolean } = {}): HoneyMoistureVerdict {
  if (!Number.isFinite(percent) || percent < 0 || percent > 100) throw new RangeError('Moisture is a percentage from 0 to 100.');
  const L = HONEY_MOISTURE_LIMITS;
  const euLimitPercent = options.heather ? L.euHeatherPercent : L.euGeneralPercent;
  const meetsEu = percent <= euLimitPercent;
  const meetsUsdaGradeA = percent <= L.usdaGradeAPercent;
  const risk = fermentationRisk(percent);
  const shown = `${Math.round(percent * 10) / 10} %`;
  const eu = meetsEu ? `within the EU limit of ${euLimitPercent} %` : `over the EU limit of ${euLimitPercent} %`;
  const us = meetsUsdaGradeA ? 'dry enough for US Grade A (18.6 %)' : 'too wet for US Grade A (18.6 %)';
  return {
    meetsEu,
    euLimitPercent,
    meetsUsdaGradeA,
    fermentationRisk: risk,
    note: `At ${shown} water the honey is ${eu}, ${us}, and ${RISK_WORDS[risk]}.`,
  };
}
