/**
 * Brood calendar. Offsets: TRADE-REFERENCES §1 "Note for tests" (queen hatch d3, capped d8,
 * emerges d16, mature d21–22, laying from ~d23–24; worker d3/d9/d21; drone d3/d10/d24).
 * Input dates are arbitrary calendar days; expected dates are those offsets counted by hand.
 */
import { broodCalendar, QUEEN_MILESTONE_DAYS } from '../../shared/domain/brood';
import { diffDays } from '../../shared/domain/dates';

describe('broodCalendar from the egg-laying day (§1 Note for tests)', () => {
  it.each([
    ['worker', '2025-05-01', { eggLaid: '2025-05-01', hatch: '2025-05-04', capped: '2025-05-10', emerges: '2025-05-22' }],
    ['drone', '2025-05-01', { eggLaid: '2025-05-01', hatch: '2025-05-04', capped: '2025-05-11', emerges: '2025-05-25' }],
  ] as const)('%s laid %s: hatch d3, capped d9/d10, emerges d21/d24 (§1; Winston 1987 via Sanford)', (caste, date, expected) => {
    expect(broodCalendar({ caste, from: 'egg-laid', date })).toEqual(expected);
  });

  it('queen laid 2025-05-01: hatch d3, capped d8, emerges d16 (W. Shaw, Welsh BKA), mature d21, earliest laying d23, worry d37 (§1)', () => {
    expect(broodCalendar({ caste: 'queen', from: 'egg-laid', date: '2025-05-01' })).toEqual({
      eggLaid: '2025-05-01',
      hatch: '2025-05-04',
      capped: '2025-05-09',
      emerges: '2025-05-17',
      mature: '2025-05-22',
      earliestLaying: '2025-05-24',
      worryIfNoEggsBy: '2025-06-07',
    });
  });

  it('counts a worker across 29 February in a leap year (calendar arithmetic)', () => {
    expect(broodCalendar({ caste: 'worker', from: 'egg-laid', date: '2024-02-20' })).toEqual({
      eggLaid: '2024-02-20',
      hatch: '2024-02-23',
      capped: '2024-02-29',
      emerges: '2024-03-12',
    });
  });
});

describe('broodCalendar from the capping day counts back (§1)', () => {
  it('a queen cell capped 2025-06-10 emerges 8 days later, 2025-06-18 (§1, W. Shaw: "Emergence… 8 days after Sealing")', () => {
    const c = broodCalendar({ caste: 'queen', from: 'cell-capped', date: '2025-06-10' });
    expect(c).toEqual({
      eggLaid: '2025-06-02',
      hatch: '2025-06-05',
      capped: '2025-06-10',
      emerges: '2025-06-18',
      mature: '2025-06-23',
      earliestLaying: '2025-06-25',
      worryIfNoEggsBy: '2025-07-09',
    });
  });

  it('a drone capped 2025-01-05 was laid on 2024-12-26 and emerges 2025-01-19 (§1: capped d10, emerges d24), across a year end', () => {
    expect(broodCalendar({ caste: 'drone', from: 'cell-capped', date: '2025-01-05' })).toEqual({
      eggLaid: '2024-12-26',
      hatch: '2024-12-29',
      capped: '2025-01-05',
      emerges: '2025-01-19',
    });
  });

  it('a worker capped on a day emerges 12 days later (§1: sealed stage 12 d for workers)', () => {
    const c = broodCalendar({ caste: 'worker', from: 'cell-capped', date: '2025-07-01' });
    expect(diffDays(c.capped, c.emerges)).toBe(12);
  });
});

describe('queen milestones agree with the §1 ranges', () => {
  const q = broodCalendar({ caste: 'queen', from: 'egg-laid', date: '2025-05-01' });

  it('matures 5 days after emergence, the early end of 5–6 (McNeil, The Hive and the Honey Bee, via AHPA)', () => {
    expect(diffDays(q.emerges, q.mature)).toBe(5);
  });

  it('lays at the earliest 2 days after maturity (BBKA via Trunch BKA: "min. 2-3 days"), day 23 (Wikipedia: "~Day 23 and up")', () => {
    expect(diffDays(q.mature, q.earliestLaying)).toBe(2);
    expect(diffDays(q.eggLaid, q.earliestLaying)).toBe(23);
  });

  it('worries 21 days after emergence (BBKA via Trunch BKA: emergence to laying 14–21 d, worry after ~3 weeks)', () => {
    expect(diffDays(q.emerges, q.worryIfNoEggsBy)).toBe(21);
    expect(QUEEN_MILESTONE_DAYS.worryIfNoEggsBy).toBe(37);
  });

  it('puts the typical egg-to-laying-queen time of ~30 days (Trunch/BBKA) between earliest laying and the worry date', () => {
    expect(diffDays(q.eggLaid, q.earliestLaying)).toBeLessThanOrEqual(30);
    expect(diffDays(q.eggLaid, q.worryIfNoEggsBy)).toBeGreaterThanOrEqual(30);
  });
});

describe('broodCalendar input checks (RangeError)', () => {
  it.each([
    ['an unknown caste', { caste: 'king', from: 'egg-laid', date: '2025-05-01' }],
    ['an unknown anchor', { caste: 'worker', from: 'hatched', date: '2025-05-01' }],
    ['a malformed date', { caste: 'worker', from: 'egg-laid', date: '1/5/2025' }],
    ['a day that does not exist', { caste: 'worker', from: 'egg-laid', date: '2025-02-30' }],
  ])('rejects %s', (_label, input) => {
    expect(() => broodCalendar(input as never)).toThrow(RangeError);
  });
});
