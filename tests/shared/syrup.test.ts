/**
 * Syrup mixer and units. Expected values: TRADE-REFERENCES §2a (CRC sucrose density at 20 °C)
 * and §2b (worked sugar quantities, derived from ρ = 1.2295 and 1.3265 g/mL); each row names it.
 */
import { mixSyrup, ratioParts, sucroseDensity20C, SUCROSE_DENSITY_20C, WATER_DENSITY_20C_G_PER_ML } from '../../shared/domain/syrup';
import {
  cupsToLitres,
  feedersToLitres,
  gallonsToLitres,
  KG_PER_LB,
  kgToLb,
  lbToKg,
  litresToCups,
  litresToGallons,
  LITRES_PER_US_GALLON,
  SUGAR_BULK_DENSITY_G_PER_ML,
  sugarCupsToKg,
  sugarKgToCups,
} from '../../shared/domain/units';

const GAL = 3.785411784; // §2b assumption, exact by definition
const LB = 0.45359237; // §2b assumption, exact by definition

describe('units (TRADE-REFERENCES §2b assumptions)', () => {
  it('uses 1 US gal = 3.785411784 L and 1 lb = 0.45359237 kg (§2b)', () => {
    expect(LITRES_PER_US_GALLON).toBe(GAL);
    expect(KG_PER_LB).toBe(LB);
    expect(gallonsToLitres(1)).toBe(GAL);
    expect(litresToGallons(GAL)).toBeCloseTo(1, 12);
    expect(lbToKg(1)).toBe(LB);
    expect(kgToLb(LB)).toBeCloseTo(1, 12);
  });

  it('counts 200 g of granulated sugar per US cup, ≈ 0.85 g/mL bulk (§2b, USDA SR Legacy, confirmed secondary)', () => {
    expect(sugarCupsToKg(1)).toBeCloseTo(0.2, 12);
    expect(sugarKgToCups(0.2)).toBeCloseTo(1, 12);
    expect(SUGAR_BULK_DENSITY_G_PER_ML).toBeCloseTo(0.85, 2);
  });

  it('puts 1 lb of sugar at 2.25–2.3 cups (§2b)', () => {
    const cups = sugarKgToCups(lbToKg(1));
    expect(cups).toBeGreaterThanOrEqual(2.25);
    expect(cups).toBeLessThanOrEqual(2.3);
  });

  it('makes a US cup 1/16 gallon (definition)', () => {
    expect(cupsToLitres(16)).toBeCloseTo(GAL, 12);
    expect(litresToCups(GAL)).toBeCloseTo(16, 12);
  });

  it('adds up feeders: nine one-gallon feeders hold 9 gal (arithmetic)', () => {
    expect(feedersToLitres(9, gallonsToLitres(1))).toBeCloseTo(9 * GAL, 12);
    expect(() => feedersToLitres(-1, 1)).toThrow(RangeError);
    expect(() => feedersToLitres(1.5, 1)).toThrow(RangeError);
    expect(() => feedersToLitres(2, Number.NaN)).toThrow(RangeError);
    expect(() => lbToKg(Number.NaN)).toThrow(RangeError);
  });
});

describe('SUCROSE_DENSITY_20C (TRADE-REFERENCES §2a, CRC Handbook)', () => {
  it('holds the 15 rows of §2a, 0–80 %', () => {
    expect(SUCROSE_DENSITY_20C.map((r) => r.sucrosePercentWw)).toEqual([0, 5, 10, 15, 20, 30, 40, 50, 60, 62, 64, 66, 68, 70, 80]);
  });

  it.each(SUCROSE_DENSITY_20C.map((r) => [r.sucrosePercentWw, r.densityGPerMl, r.sucroseGPerL] as const))(
    'row %s %%: g/L = w%% × ρ × 10 within the rounding of both columns (§2a: "each satisfies g/L = w% × ρ")',
    (w, rho, gPerL) => {
      // g/L is printed to 0.1 (±0.05) and ρ to 4 decimals (±0.00005 g/mL, i.e. ±w × 0.0005 g/L).
      expect(Math.abs(w * rho * 10 - gPerL)).toBeLessThanOrEqual(0.05 + w * 0.0005 + 1e-9);
    },
  );

  it.each([
    [0, 0.9982, 'CRC 102nd ed.'],
    [50, 1.2295, 'CRC 102nd ed. ("50 0.5 2.921 1.796 1.2295")'],
    [60, 1.2864, 'CRC 102nd ed.'],
    [66, 1.3224, 'older CRC ed. (Flanagan data)'],
    [70, 1.3472, 'CRC 102nd ed.'],
    [80, 1.4117, 'CRC 102nd ed.'],
  ])('returns the table row at %s %% → %s g/mL (§2a, %s)', (w, rho) => {
    expect(sucroseDensity20C(w)).toBeCloseTo(rho, 10);
  });

  it('interpolates 66.67 % (2:1 by weight) to 1.3265 ± 0.0005 g/mL (§2a, derived)', () => {
    expect(Math.abs(sucroseDensity20C(200 / 3) - 1.3265)).toBeLessThanOrEqual(0.0005);
  });

  it.each([-0.1, 80.1, Number.NaN])('rejects %s %% as outside the table (RangeError)', (w) => {
    expect(() => sucroseDensity20C(w)).toThrow(RangeError);
  });

  it('uses water at 0.998203 g/mL (§2b)', () => {
    expect(WATER_DENSITY_20C_G_PER_ML).toBe(0.998203);
  });
});

describe('mixSyrup: worked quantities of TRADE-REFERENCES §2b (derived)', () => {
  it('1 US gal of finished 1:1 syrup weighs 4.654 kg (10.26 lb) and holds 2.33 kg (5.13 lb) sugar, ≈ 0.62 gal water (§2b, derived)', () => {
    const r = mixSyrup({ ratio: '1:1', basis: 'weight', finishedVolumeL: GAL });
    expect(r.finishedMassKg).toBeCloseTo(4.654, 3);
    expect(r.finishedMassKg / LB).toBeCloseTo(10.26, 2);
    expect(r.sugarKg).toBeCloseTo(2.33, 2);
    expect(r.sugarKg / LB).toBeCloseTo(5.13, 2);
    expect(r.waterL / GAL).toBeCloseTo(0.62, 2);
    expect(r.sucrosePercentWw).toBeCloseTo(50, 10);
    expect(r.finishedVolumeL).toBeCloseTo(GAL, 10);
  });

  it('1 US gal of finished 2:1 syrup weighs 5.021 kg (11.07 lb) and holds 3.35 kg (7.38 lb) sugar + 3.69 lb water ≈ 0.44 gal (§2b, derived)', () => {
    const r = mixSyrup({ ratio: '2:1', basis: 'weight', finishedVolumeL: GAL });
    expect(r.finishedMassKg).toBeCloseTo(5.021, 2);
    expect(r.finishedMassKg / LB).toBeCloseTo(11.07, 2);
    expect(r.sugarKg).toBeCloseTo(3.35, 2);
    expect(r.sugarKg / LB).toBeCloseTo(7.38, 2);
    expect((r.waterL * WATER_DENSITY_20C_G_PER_ML) / LB).toBeCloseTo(3.69, 2);
    expect(r.waterL / GAL).toBeCloseTo(0.44, 2);
    expect(r.sucrosePercentWw).toBeCloseTo(66.67, 2);
  });

  it.each([
    ['1:1', 0.615],
    ['2:1', 0.884],
  ] as const)('%s syrup carries %s kg sugar per litre finished (§2b, derived)', (ratio, kgPerL) => {
    expect(mixSyrup({ ratio, basis: 'weight', finishedVolumeL: 1 }).sugarKg).toBeCloseTo(kgPerL, 3);
  });

  it('1 gal water + its own weight of sugar (8.33 lb) makes ≈ 1.62 gal of 1:1 syrup (§2b, derived; "over a gallon and a half", retailer)', () => {
    const r = mixSyrup({ ratio: '1:1', basis: 'weight', waterL: GAL });
    expect(r.sugarKg / LB).toBeCloseTo(8.33, 2);
    expect(r.finishedVolumeL / GAL).toBeCloseTo(1.62, 2);
    expect(r.finishedVolumeL / GAL).toBeGreaterThan(1.5);
  });

  it('1 gal water + 16.66 lb sugar makes ≈ 2.26 gal of 2:1 syrup (§2b, derived)', () => {
    const r = mixSyrup({ ratio: '2:1', basis: 'weight', waterL: GAL });
    expect(r.sugarKg / LB).toBeCloseTo(16.66, 2);
    expect(r.finishedVolumeL / GAL).toBeCloseTo(2.26, 2);
  });

  it('gives the same syrup whichever amount is the starting point (consistency: sugarKg in → same water out)', () => {
    const fromWater = mixSyrup({ ratio: '2:1', basis: 'weight', waterL: GAL });
    const fromSugar = mixSyrup({ ratio: '2:1', basis: 'weight', sugarKg: fromWater.sugarKg });
    expect(fromSugar.waterL).toBeCloseTo(GAL, 10);
    expect(fromSugar.finishedVolumeL).toBeCloseTo(fromWater.finishedVolumeL, 10);
  });

  it('common practice: nine one-gallon feeders of 1:1 syrup take about 50 lb of sugar (within 10 %)', () => {
    const r = mixSyrup({ ratio: '1:1', basis: 'weight', finishedVolumeL: feedersToLitres(9, GAL) });
    expect(Math.abs(r.sugarKg / LB - 50) / 50).toBeLessThanOrEqual(0.1);
  });

  it('4 kg sugar mixed 2:1 by weight makes ≈ 4.5 L, as in the Norfolk BKA feed recipe (§2b, confirmed secondary: 1 UK gal from 4 kg; 2:1 is our reading of the recipe)', () => {
    expect(mixSyrup({ ratio: '2:1', basis: 'weight', sugarKg: 4 }).finishedVolumeL).toBeCloseTo(4.5, 1);
  });
});

describe('mixSyrup by volume (TRADE-REFERENCES §2b, 200 g sugar per US cup)', () => {
  it.each([
    ['1:1', 45.9],
    ['2:1', 62.9],
  ] as const)('"%s by volume" is ≈ %s %% w/w (§2b, derived: 200 g per cup against 236.2 g of water)', (ratio, percent) => {
    expect(mixSyrup({ ratio, basis: 'volume', waterL: 1 }).sucrosePercentWw).toBeCloseTo(percent, 1);
  });

  it('puts one cup of sugar (200 g) against each cup of water for 1:1 by volume (§2b)', () => {
    const r = mixSyrup({ ratio: '1:1', basis: 'volume', waterL: cupsToLitres(1) });
    expect(r.sugarKg).toBeCloseTo(0.2, 10);
  });
});

describe('mixSyrup input checks (RangeError)', () => {
  it.each([
    ['no amount', { ratio: '1:1', basis: 'weight' }],
    ['two amounts', { ratio: '1:1', basis: 'weight', waterL: 1, sugarKg: 1 }],
    ['all three amounts', { ratio: '1:1', basis: 'weight', waterL: 1, sugarKg: 1, finishedVolumeL: 1 }],
    ['a negative amount', { ratio: '1:1', basis: 'weight', waterL: -1 }],
    ['a NaN amount', { ratio: '2:1', basis: 'weight', sugarKg: Number.NaN }],
    ['an infinite amount', { ratio: '2:1', basis: 'weight', finishedVolumeL: Number.POSITIVE_INFINITY }],
    ['ratio 0', { ratio: 0, basis: 'weight', waterL: 1 }],
    ['a negative ratio', { ratio: -2, basis: 'weight', waterL: 1 }],
    ['an unknown ratio string', { ratio: '3:2', basis: 'weight', waterL: 1 }],
    ['an unknown basis', { ratio: '1:1', basis: 'cups', waterL: 1 }],
    ['a mix above the 80 % end of the CRC table (§2a)', { ratio: 4.5, basis: 'weight', waterL: 1 }],
  ])('rejects %s', (_label, input) => {
    expect(() => mixSyrup(input as never)).toThrow(RangeError);
  });

  it('accepts a numeric ratio as sugar parts per water part', () => {
    expect(ratioParts(1.5)).toBe(1.5);
    expect(mixSyrup({ ratio: 1, basis: 'weight', waterL: 1 }).sucrosePercentWw).toBeCloseTo(50, 10);
  });

  it('returns zeros for zero water', () => {
    expect(mixSyrup({ ratio: '1:1', basis: 'weight', waterL: 0 })).toEqual({
      sugarKg: 0,
      waterL: 0,
      finishedVolumeL: 0,
      finishedMassKg: 0,
      sucrosePercentWw: 50,
    });
  });
});
