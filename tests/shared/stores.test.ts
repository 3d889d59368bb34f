/**
 * Winter stores and the feed plan. Per-frame honey: TRADE-REFERENCES §6 (derived physical
 * estimates: deep 2.7–3.6 kg, medium 1.8–2.2 kg, shallow 1.5–1.8 kg). Targets used as inputs:
 * Seeley (2019) ≈ 20 kg, Moeller (1977) 40.8 kg (§6, confirmed primary). Syrup: §2a/§2b.
 * 0.8 kg sugar per kg honey is Frameside's own assumption (honey ≥ 80 % dry matter at the EU
 * 20 % moisture limit, §7).
 */
import { estimateStores, feedPlan, honeyFrameSize, HONEY_KG_PER_FULL_FRAME, storesFromHoneyFrames, SUGAR_KG_PER_HONEY_KG } from '../../shared/domain/stores';

describe('estimateStores per full frame (§6, derived)', () => {
  it.each([
    ['deep', 2.7, 3.6, 3.15],
    ['medium', 1.8, 2.2, 2.0],
    ['shallow', 1.5, 1.8, 1.65],
  ] as const)('a full %s frame holds %s–%s kg, midpoint %s kg (§6)', (size, lowKg, highKg, kg) => {
    const r = estimateStores({ frames: [{ size, fullness: 1 }] });
    expect(r.lowKg).toBeCloseTo(lowKg, 10);
    expect(r.highKg).toBeCloseTo(highKg, 10);
    expect(r.kg).toBeCloseTo(kg, 10);
  });

  it('puts a full deep frame at 6–8 lb (§6: "≈ 6–8 lb (2.7–3.6 kg)")', () => {
    expect(HONEY_KG_PER_FULL_FRAME.deep.lowKg / 0.45359237).toBeCloseTo(6, 0);
    expect(HONEY_KG_PER_FULL_FRAME.deep.highKg / 0.45359237).toBeCloseTo(8, 0);
  });

  it('scales by fullness and adds frames: 10 half-full deeps = 5 full deeps (§6 midpoint × 5 = 15.75 kg)', () => {
    const frames = Array.from({ length: 10 }, () => ({ size: 'deep' as const, fullness: 0.5 }));
    const r = estimateStores({ frames });
    expect(r.kg).toBeCloseTo(5 * 3.15, 10);
    expect(r.lowKg).toBeCloseTo(5 * 2.7, 10);
    expect(r.highKg).toBeCloseTo(5 * 3.6, 10);
  });

  it('mixes sizes: one full deep + one full medium + one full shallow (§6 midpoints 3.15 + 2.0 + 1.65)', () => {
    const r = estimateStores({
      frames: [
        { size: 'deep', fullness: 1 },
        { size: 'medium', fullness: 1 },
        { size: 'shallow', fullness: 1 },
      ],
    });
    expect(r.kg).toBeCloseTo(6.8, 10);
  });

  it('returns 0 kg for no frames and for empty frames', () => {
    expect(estimateStores({ frames: [] })).toEqual({ kg: 0, lowKg: 0, highKg: 0 });
    expect(estimateStores({ frames: [{ size: 'medium', fullness: 0 }] }).kg).toBe(0);
  });

  it.each([-0.1, 1.01, Number.NaN])('rejects fullness %s (RangeError)', (fullness) => {
    expect(() => estimateStores({ frames: [{ size: 'deep', fullness }] })).toThrow(RangeError);
  });

  it('rejects an unknown frame size (RangeError)', () => {
    expect(() => estimateStores({ frames: [{ size: 'jumbo' as never, fullness: 1 }] })).toThrow(RangeError);
  });
});

describe('feedPlan (shortfall → 2:1 syrup through mixSyrup)', () => {
  it('uses 0.8 kg sugar per kg of honey shortfall (Frameside’s own assumption; EU 20 % moisture limit, §7)', () => {
    expect(SUGAR_KG_PER_HONEY_KG).toBe(0.8);
  });

  it('a colony at 20 kg (Seeley 2019) against a 40.8 kg target (Moeller 1977) is 20.8 kg short: 16.64 kg sugar, 8.33 L water, 18.8 L of 2:1 (derived: ρ 1.3265, §2a)', () => {
    const p = feedPlan({ storesKg: 20, targetKg: 40.8, ratio: '2:1' });
    expect(p.shortfallKg).toBeCloseTo(20.8, 10);
    expect(p.sugarKg).toBeCloseTo(16.64, 10);
    expect(p.waterL).toBeCloseTo(16.64 / 2 / 0.998203, 6);
    expect(p.syrupL).toBeCloseTo((16.64 * 1.5) / 1.3265, 1);
  });

  it('makes a 5 kg shortfall into 4 kg sugar ≈ 4.5 L of 2:1 feed, in line with the Norfolk BKA recipe (1 UK gal from 4 kg; §2b, confirmed secondary)', () => {
    const p = feedPlan({ storesKg: 15, targetKg: 20, ratio: '2:1' });
    expect(p.sugarKg).toBeCloseTo(4, 10);
    expect(p.syrupL).toBeCloseTo(4.5, 1);
  });

  it('plans 1:1 by weight at 0.615 kg sugar per litre when asked (§2b, derived)', () => {
    const p = feedPlan({ storesKg: 0, targetKg: 10, ratio: '1:1' });
    expect(p.sugarKg / p.syrupL).toBeCloseTo(0.615, 3);
  });

  it('needs nothing when stores meet or pass the target', () => {
    expect(feedPlan({ storesKg: 41, targetKg: 40.8, ratio: '2:1' })).toEqual({ shortfallKg: 0, syrupL: 0, sugarKg: 0, waterL: 0 });
    expect(feedPlan({ storesKg: 40.8, targetKg: 40.8, ratio: '2:1' }).shortfallKg).toBe(0);
  });

  it.each([
    [{ storesKg: -1, targetKg: 20, ratio: '2:1' }],
    [{ storesKg: 10, targetKg: Number.NaN, ratio: '2:1' }],
    [{ storesKg: 10, targetKg: 20, ratio: -1 }],
  ])('rejects a bad input (RangeError)', (input) => {
    expect(() => feedPlan(input as never)).toThrow(RangeError);
  });
});

describe('storesFromHoneyFrames (a Quick check’s honey frames)', () => {
  it.each([
    // TRADE-REFERENCES §6: full deep frame 2.7–3.6 kg → 4 frames 10.8–14.4 kg, midpoint 12.6 (derived).
    [[{ size: 'deep', frames: 10 }, { size: 'deep', frames: 10 }, { size: 'medium', frames: 10 }], 4, 'deep', 12.6],
    // Medium 1.8–2.2 kg: 2½ frames → 4.5–5.5 kg, midpoint 5.0 (derived).
    [[{ size: 'deep', frames: 10 }, { size: 'medium', frames: 10 }, { size: 'medium', frames: 10 }], 2.5, 'medium', 5.0],
    // A tie in frames goes to the larger frame (Frameside's own choice).
    [[{ size: 'deep', frames: 10 }, { size: 'medium', frames: 10 }], 1, 'deep', 3.15],
  ] as const)('%j, %s honey frames → %s frames, %s kg', (boxes, honeyFrames, size, kg) => {
    expect(honeyFrameSize(boxes)).toBe(size);
    expect(storesFromHoneyFrames(honeyFrames, boxes).kg).toBeCloseTo(kg, 6);
  });
  it('refuses a negative count', () => {
    expect(() => storesFromHoneyFrames(-1, [{ size: 'deep', frames: 10 }])).toThrow(RangeError);
  });
});
