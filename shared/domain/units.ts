/**
 * Unit conversions for the calculators. The domain works in SI (kg, L); these helpers turn
 * keepers' pounds, gallons and cups into SI and back at the edges.
 * Factors: TRADE-REFERENCES §2b (US gallon = 3.785411784 L, lb = 0.45359237 kg, both exact by
 * definition; 1 US cup of granulated sugar ≈ 200 g, USDA "Sugars, granulated", confirmed secondary).
 */

/** Litres in one US liquid gallon (exact by definition). */
export const LITRES_PER_US_GALLON = 3.785411784;

/** Kilograms in one avoirdupois pound (exact by definition). */
export const KG_PER_LB = 0.45359237;

/** Litres in one US cup: 1/16 US gallon (exact, ≈ 0.2366 L). */
export const LITRES_PER_US_CUP = LITRES_PER_US_GALLON / 16;

/** Grams of granulated sugar in one level US cup (TRADE-REFERENCES §2b, USDA SR Legacy, confirmed secondary). */
export const SUGAR_G_PER_US_CUP = 200;

/** Bulk density of granulated sugar in g/mL (= kg/L): 200 g per US cup ≈ 0.845, the "≈ 0.85 g/mL" of §2b. */
export const SUGAR_BULK_DENSITY_G_PER_ML = SUGAR_G_PER_US_CUP / (LITRES_PER_US_CUP * 1000);

function finite(x: number, what: string): number {
  if (!Number.isFinite(x)) throw new RangeError(`${what} must be a finite number.`);
  return x;
}

/** US gallons → litres; throws a RangeError for NaN/∞. */
export function gallonsToLitres(gallons: number): number {
  return finite(gallons, 'Gallons') * LITRES_PER_US_GALLON;
}

/** Litres → US gallons; throws a RangeError for NaN/∞. */
export function litresToGallons(litres: number): number {
  return finite(litres, 'Litres') / LITRES_PER_US_GALLON;
}

/** Pounds → kilograms; throws a RangeError for NaN/∞. */
export function lbToKg(lb: number): number {
  return finite(lb, 'Pounds') * KG_PER_LB;
}

/** Kilograms → pounds; throws a RangeError for NaN/∞. */
export function kgToLb(kg: number): number {
  return finite(kg, 'Kilograms') / KG_PER_LB;
}

/** US cups → litres (any liquid); throws a RangeError for NaN/∞. */
export function cupsToLitres(cups: number): number {
  return finite(cups, 'Cups') * LITRES_PER_US_CUP;
}

/** Litres → US cups (any liquid); throws a RangeError for NaN/∞. */
export function litresToCups(litres: number): number {
  return finite(litres, 'Litres') / LITRES_PER_US_CUP;
}

/** Level US cups of granulated sugar → kg of sugar (200 g per cup). */
export function sugarCupsToKg(cups: number): number {
  return (finite(cups, 'Cups') * SUGAR_G_PER_US_CUP) / 1000;
}

/** kg of granulated sugar → level US cups (200 g per cup). */
export function sugarKgToCups(sugarKg: number): number {
  return (finite(sugarKg, 'Sugar kg') * 1000) / SUGAR_G_PER_US_CUP;
}

/** Total litres held by `count` feeders of `feederL` litres each; throws a RangeError for a negative or non-whole count, or a negative/NaN volume. */
export function feedersToLitres(count: number, feederL: number): number {
  if (!Number.isInteger(count) || count < 0) throw new RangeError('Feeder count must be a whole number, 0 or more.');
  if (!Number.isFinite(feederL) || feederL < 0) throw new RangeError('Feeder volume must be 0 L or more.');
  return count * feederL;
}
