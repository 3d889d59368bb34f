/**
 * Which cautions a record shows. Sources: TRADE-REFERENCES §4 (the label governs; oxalic PPE,
 * D. Cushman; formic 10–30 °C, R. Oliver ABJ 2022; thymol ≤ 30 °C, supers off), §2b and §9
 * (Phillips 1919: feed in the evening if robbing is likely; no open feeding near the apiary).
 * Suspected foulbrood and sting reactions: PRODUCT.md §11 and common practice.
 */
import { CAUTIONS, CAUTION_IDS, cautionsFor } from '../../shared/domain/cautions';

describe('cautionsFor', () => {
  it.each([
    ['inspection', { diseaseSigns: ['suspected-foulbrood'] }, ['notifiable-disease']],
    ['inspection', { diseaseSigns: ['chalkbrood'] }, []],
    ['inspection', { temperament: 4 }, ['stings']],
    ['inspection', { temperament: 3 }, []],
    ['inspection', {}, []],
    ['treatment', { activeIngredient: 'oxalic-acid', method: 'vaporisation' }, ['acid-treatment', 'oxalic-vapour', 'treatment-supers']],
    ['treatment', { activeIngredient: 'oxalic-acid', method: 'dribble' }, ['acid-treatment', 'treatment-supers']],
    ['treatment', { activeIngredient: 'formic-acid', method: 'strips' }, ['acid-treatment', 'treatment-temperature', 'treatment-supers']],
    ['treatment', { activeIngredient: 'thymol', method: 'gel' }, ['treatment-temperature', 'treatment-supers']],
    ['treatment', { activeIngredient: 'amitraz' }, ['treatment-supers']],
    ['treatment', {}, []],
    ['feeding', { feederType: 'frame-feeder' }, ['robbing']],
    ['forage-check', { minutesToEmpty: 20 }, ['robbing']],
    ['forage-check', { judgement: 'dearth' }, ['robbing']],
    ['forage-check', { judgement: 'flow' }, []],
    ['harvest', {}, []],
  ] as const)('%s %j → %j', (kind, input, expected) => {
    expect(cautionsFor(kind, input)).toEqual(expected);
  });

  it('says what to do and defers to the label or local rules', () => {
    for (const id of CAUTION_IDS) {
      expect(CAUTIONS[id].id).toBe(id);
      expect(CAUTIONS[id].lines.length).toBeGreaterThan(0);
    }
    const text = (id: (typeof CAUTION_IDS)[number]) => CAUTIONS[id].lines.join(' ');
    expect(text('notifiable-disease')).toMatch(/Do not move frames/);
    expect(text('notifiable-disease')).toMatch(/local bee inspector/);
    expect(text('notifiable-disease')).toMatch(/local rules/);
    expect(text('acid-treatment')).toMatch(/label/);
    expect(text('oxalic-vapour')).toMatch(/respirator/);
    // Formic: 10–30 °C, ≥ 33 °C in the first 3 days harms (Oliver, ABJ Sept 2022; §4). Thymol: not above 30 °C (§4).
    expect(text('treatment-temperature')).toMatch(/10–30 °C/);
    expect(text('treatment-temperature')).toMatch(/33 °C/);
    expect(text('treatment-temperature')).toMatch(/above 30 °C/);
    // Phillips (1919, §2b): feed in the evening if robbing is likely; §9: feed inside the hive.
    expect(text('robbing')).toMatch(/inside the hive, in the evening/);
    expect(text('stings')).toMatch(/call emergency services/);
  });
});
