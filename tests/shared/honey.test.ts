/**
 * Honey moisture. Table: Chataway (1932) / Wedmore (1955) in the International Honey Commission's
 * Harmonised Methods (Bogdanov et al. 2009), TRADE-REFERENCES §7, confirmed rows; temperature
 * correction ±0.00023 RI per °C (IHC/AOAC, §7). Limits: EU Directive 2001/110/EC (20 %, heather
 * 23 %), USDA Grade A ≤ 18.6 %, fermentation bands from USDA Agriculture Handbook 335.
 */
import { HONEY_RI_TABLE_20C, honeyMoisture, honeyMoistureVerdict } from '../../shared/domain/honey';

describe('honeyMoisture at 20 °C: the IHC table rows (§7, confirmed secondary transcription)', () => {
  it.each([
    [1.5044, 13.0],
    [1.5018, 14.0],
    [1.4992, 15.0],
    [1.4966, 16.0],
    [1.489, 19.0],
    [1.4865, 20.0],
    [1.484, 21.0],
    [1.4815, 22.0],
  ])('RI %s → %s %% water (Chataway/Wedmore, IHC)', (refractiveIndex, moisture) => {
    expect(honeyMoisture({ refractiveIndex, temperatureC: 20 }).moisturePercent).toBeCloseTo(moisture, 6);
  });

  it('embeds exactly the eight confirmed rows', () => {
    expect(HONEY_RI_TABLE_20C).toHaveLength(8);
  });

  it('interpolates 1.4979, midway between the 15 % and 16 % rows, to 15.5 % (derived, linear)', () => {
    expect(honeyMoisture({ refractiveIndex: 1.4979, temperatureC: 20 }).moisturePercent).toBeCloseTo(15.5, 6);
  });

  it.each([
    [1.4941, 17.0],
    [1.4916, 18.0],
  ])('reads RI %s as ≈ %s %% (derived: −0.0025 RI per 1 %% water from the 16 %% row, §7)', (refractiveIndex, moisture) => {
    expect(honeyMoisture({ refractiveIndex, temperatureC: 20 }).moisturePercent).toBeCloseTo(moisture, 1);
  });

  it.each([
    [1.479, 23.0, 'the heather limit, one step past the 22 % row'],
    [1.5069, 12.0, 'one step drier than the 13 % row'],
  ])('extends the −0.0025 step beyond the table: RI %s → %s %% (%s; derived)', (refractiveIndex, moisture) => {
    expect(honeyMoisture({ refractiveIndex, temperatureC: 20 }).moisturePercent).toBeCloseTo(moisture, 6);
  });
});

describe('honeyMoisture temperature correction (§7: +0.00023 RI per °C above 20 °C, − below)', () => {
  it.each([
    [1.4865, 25, 19.54, 'read warm: RI corrected up by 0.00115, 0.46 % drier than the 20 % row'],
    [1.4865, 15, 20.46, 'read cool: RI corrected down by 0.00115, 0.46 % wetter'],
    [1.484, 21, 20.908, 'one degree warm: ≈ 0.09 % moisture per °C (derived in §7)'],
  ])('RI %s at %s °C → %s %% (%s)', (refractiveIndex, temperatureC, moisture) => {
    expect(honeyMoisture({ refractiveIndex, temperatureC }).moisturePercent).toBeCloseTo(moisture, 3);
  });

  it.each([
    [{ refractiveIndex: Number.NaN, temperatureC: 20 }],
    [{ refractiveIndex: 1.49, temperatureC: Number.NaN }],
  ])('rejects a NaN input (RangeError)', (input) => {
    expect(() => honeyMoisture(input)).toThrow(RangeError);
  });
});

describe('honeyMoistureVerdict boundaries (§7)', () => {
  it.each([
    [18.6, true, 'USDA Grade A: "moisture content <= 18.6%"'],
    [18.7, false, 'just over USDA Grade A'],
  ])('%s %% meets US Grade A: %s (%s)', (percent, grade) => {
    expect(honeyMoistureVerdict(percent).meetsUsdaGradeA).toBe(grade);
  });

  it.each([
    [20, false, true, 20, 'EU 2001/110/EC: "in general not more than 20 %"'],
    [20.1, false, false, 20, 'over the EU general limit'],
    [23, true, true, 23, 'EU 2001/110/EC: heather (Calluna) "not more than 23 %"'],
    [23.1, true, false, 23, 'over the heather limit'],
    [21, true, true, 23, 'heather honey at 21 % is within its own limit'],
  ])('%s %% (heather %s) meets the EU limit: %s, limit %s %% (%s)', (percent, heather, meets, limit) => {
    const v = honeyMoistureVerdict(percent, { heather });
    expect(v.meetsEu).toBe(meets);
    expect(v.euLimitPercent).toBe(limit);
  });

  it.each([
    [17.0, 'none', 'below 17.1 %: "will not ferment in a year, irrespective of the yeast count"'],
    [17.1, 'low', '17.1–18 %: safe unless more than 1,000 yeasts/g'],
    [18.0, 'low', 'top of the 17.1–18 % band'],
    [18.1, 'moderate', '18.1–19 %: safe only if ≤ 10 yeasts/g'],
    [19.0, 'moderate', 'top of the 18.1–19 % band'],
    [19.1, 'high', 'above 19 %: expect fermentation even at 1 spore/g'],
  ])('%s %% → fermentation risk %s (USDA Ag Handbook 335, %s)', (percent, risk) => {
    expect(honeyMoistureVerdict(percent).fermentationRisk).toBe(risk);
  });

  it('says what the figure means in a plain note', () => {
    const v = honeyMoistureVerdict(19.5);
    expect(v.note).toMatch(/19\.5 %/);
    expect(v.note).toMatch(/EU limit of 20 %/);
    expect(v.note).toMatch(/Grade A/);
  });

  it.each([-1, 101, Number.NaN])('rejects %s %% (RangeError)', (percent) => {
    expect(() => honeyMoistureVerdict(percent)).toThrow(RangeError);
  });

  it('chains with honeyMoisture: RI 1.4890 at 20 °C is 19 %, over Grade A, within the EU limit (§7)', () => {
    const v = honeyMoistureVerdict(honeyMoisture({ refractiveIndex: 1.489, temperatureC: 20 }).moisturePercent);
    expect(v).toMatchObject({ meetsEu: true, meetsUsdaGradeA: false, fermentationRisk: 'moderate' });
  });
});
