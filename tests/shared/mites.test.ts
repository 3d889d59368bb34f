/**
 * Varroa load. Formula: COLOSS BEEBOOK, Dietemann et al. (2013). Thresholds: TRADE-REFERENCES §3
 * (USDA-ARS Tucson / Univ. of Florida 3 per 100 bees; R. Oliver 2–3 %; USDA-ARS sticky board
 * > 30/day). The sticky-board watch level (> 15/day) is Frameside's own choice.
 */
import { miteLoad, MITE_THRESHOLDS } from '../../shared/domain/mites';

describe('mites per 100 bees (BEEBOOK, Dietemann et al. 2013)', () => {
  it('computes 43 mites in 310 bees as 13.9 per 100 (the formula; the printed example says 14.3, which is 43/300)', () => {
    const r = miteLoad({ method: 'alcohol-wash', mites: 43, beesSampled: 310 });
    expect(r.perHundredBees).toBeCloseTo(13.9, 1);
    expect(r.perHundredBees).not.toBeCloseTo(14.3, 1);
    expect(miteLoad({ method: 'alcohol-wash', mites: 43, beesSampled: 300 }).perHundredBees).toBeCloseTo(14.3, 1);
  });

  it('divides by 3 for a 300-bee sample (BEEBOOK: "for a 300-bee sample, mites ÷ 3")', () => {
    expect(miteLoad({ method: 'sugar-roll', mites: 12, beesSampled: 300 }).perHundredBees).toBeCloseTo(4, 12);
  });

  it('corrects for dislodging efficiency 10/11 = 0.91 (BEEBOOK: 10 mites in the first wash of 11 in all)', () => {
    const r = miteLoad({ method: 'alcohol-wash', mites: 10, beesSampled: 300, efficiency: 10 / 11 });
    // 10 found at 10/11 efficiency stands for all 11 mites in the sample.
    expect(r.perHundredBees).toBeCloseTo((11 / 300) * 100, 10);
  });

  it('applies Y = X / 0.9 with a mean efficiency of 0.9 (BEEBOOK)', () => {
    const x = miteLoad({ method: 'alcohol-wash', mites: 9, beesSampled: 300 }).perHundredBees as number;
    const y = miteLoad({ method: 'alcohol-wash', mites: 9, beesSampled: 300, efficiency: 0.9 }).perHundredBees as number;
    expect(y).toBeCloseTo(x / 0.9, 12);
  });
});

describe('wash and roll levels at the threshold boundaries (§3)', () => {
  it('acts at 3 per 100 and watches from 2 (USDA-ARS/UF 3 %; Oliver 2–3 %)', () => {
    expect(MITE_THRESHOLDS.washActPerHundred).toBe(3);
    expect(MITE_THRESHOLDS.washWatchPerHundred).toBe(2);
  });

  it.each([
    ['alcohol-wash', 10, 300, 'act', 'above 3 % (USDA-ARS Tucson / UF); 10 mites is the top of Oliver’s 6–10 per ½-cup wash'],
    ['alcohol-wash', 9, 300, 'act', 'exactly 3 per 100: "Treatment is recommended if … 3 mites per 100 bees" (USDA-ARS via Gilroy BKA)'],
    ['sugar-roll', 9, 300, 'act', 'the same 3 % for a sugar shake (USDA-ARS via Gilroy BKA)'],
    ['alcohol-wash', 8, 300, 'watch', '2.67 %: inside Oliver’s 2–3 % ceiling'],
    ['alcohol-wash', 6, 300, 'watch', 'exactly 2 %: 6 mites in a wash, the bottom of Oliver’s 6–10'],
    ['alcohol-wash', 5, 300, 'low', '1.67 %: below Oliver’s 2–3 % level'],
    ['sugar-roll', 0, 300, 'low', 'no mites'],
  ] as const)('%s %s mites / %s bees → %s (%s)', (method, mites, beesSampled, level, _source) => {
    expect(miteLoad({ method, mites, beesSampled }).level).toBe(level);
  });

  it('lets an efficiency correction tip a count over 3 % (BEEBOOK correction, USDA-ARS threshold)', () => {
    expect(miteLoad({ method: 'sugar-roll', mites: 8, beesSampled: 300 }).level).toBe('watch');
    expect(miteLoad({ method: 'sugar-roll', mites: 8, beesSampled: 300, efficiency: 0.8 }).level).toBe('act');
  });

  it('names the threshold source in the basis sentence (§3)', () => {
    expect(miteLoad({ method: 'alcohol-wash', mites: 9, beesSampled: 300 }).basis).toMatch(/USDA-ARS/);
    expect(miteLoad({ method: 'alcohol-wash', mites: 6, beesSampled: 300 }).basis).toMatch(/Oliver/);
    expect(miteLoad({ method: 'alcohol-wash', mites: 1, beesSampled: 300 }).basis).toMatch(/Oliver|USDA/);
  });
});

describe('sticky board (§3: treat if more than 30 mites/day, USDA-ARS Tucson via Gilroy BKA)', () => {
  it('divides the count by the days the board was in (§3: "divide by three" for a 3-day count)', () => {
    expect(miteLoad({ method: 'sticky-board', mites: 90, days: 3 }).perDay).toBe(30);
  });

  it.each([
    [93, 3, 'act', '31/day: more than 30 (USDA-ARS)'],
    [90, 3, 'watch', '30/day exactly: not "more than 30" (USDA-ARS), above Frameside’s own 15/day watch level'],
    [48, 3, 'watch', '16/day: above the project’s own watch level of 15/day'],
    [45, 3, 'low', '15/day exactly: not above the project’s own watch level'],
    [0, 7, 'low', 'no fall'],
  ] as const)('%s mites over %s days → %s (%s)', (mites, days, level, _source) => {
    expect(miteLoad({ method: 'sticky-board', mites, days }).level).toBe(level);
  });

  it('marks the watch level as the project’s own choice in its basis', () => {
    expect(miteLoad({ method: 'sticky-board', mites: 48, days: 3 }).basis).toMatch(/own/);
    expect(miteLoad({ method: 'sticky-board', mites: 93, days: 3 }).basis).toMatch(/USDA-ARS/);
  });
});

describe('miteLoad input checks (RangeError)', () => {
  it.each([
    ['more mites than bees', { method: 'alcohol-wash', mites: 301, beesSampled: 300 }],
    ['zero bees', { method: 'alcohol-wash', mites: 0, beesSampled: 0 }],
    ['no bee count for a wash', { method: 'sugar-roll', mites: 3 }],
    ['negative mites', { method: 'alcohol-wash', mites: -1, beesSampled: 300 }],
    ['NaN mites', { method: 'alcohol-wash', mites: Number.NaN, beesSampled: 300 }],
    ['zero days on a board', { method: 'sticky-board', mites: 10, days: 0 }],
    ['no days on a board', { method: 'sticky-board', mites: 10 }],
    ['efficiency 0', { method: 'alcohol-wash', mites: 3, beesSampled: 300, efficiency: 0 }],
    ['efficiency above 1', { method: 'alcohol-wash', mites: 3, beesSampled: 300, efficiency: 1.1 }],
    ['an unknown method', { method: 'ether-roll', mites: 3, beesSampled: 300 }],
  ])('rejects %s', (_label, input) => {
    expect(() => miteLoad(input as never)).toThrow(RangeError);
  });
});
