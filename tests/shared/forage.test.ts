/**
 * Forage check. Syrup dish: emptied within ~30 min = dearth is common practice (the trade's
 * field check; TRADE-REFERENCES §9 lists bees quickly finding syrup left out as a dearth sign);
 * the other dish thresholds are Frameside's own choice. Hive scale: Meikle et al. (2005) 25-hour
 * centred running average and daily net change (§10, derived); no published kg/day cut-off
 * exists, so the flat band (±0.1 kg) is Frameside's own choice. All weight series below are
 * synthetic inputs whose expected outputs are worked out by hand.
 */
import {
  classifyWeightDays,
  dailyNetChange,
  DEFAULT_FLAT_THRESHOLD_KG,
  forageStatus,
  runningAverage25h,
  syrupDishVerdict,
  type WeightPoint,
} from '../../shared/domain/forage';

const HOUR = 3_600_000;
const T0 = Date.UTC(2025, 6, 1, 0, 0, 0); // 2025-07-01T00:00Z, an arbitrary start

/** Hourly synthetic series: kg(h) for h = 0 … n−1. */
function hourly(n: number, kg: (h: number) => number): WeightPoint[] {
  return Array.from({ length: n }, (_, h) => ({ t: T0 + h * HOUR, kg: kg(h) }));
}

describe('syrupDishVerdict', () => {
  it.each([
    [{ minutesToEmpty: 10 }, 'dearth', 'emptied fast: dearth (common practice)'],
    [{ minutesToEmpty: 30 }, 'dearth', 'emptied within ~30 min: dearth (common practice; boundary)'],
    [{ minutesToEmpty: 31 }, 'some', 'emptied after 30 min: some (Frameside’s own choice)'],
    [{ minutesToEmpty: 90 }, 'some', 'emptied slowly: some (own choice)'],
    [{ watchedMinutes: 45 }, 'some', 'found but not emptied in a 45-min watch: some (own choice)'],
    [{ untouched: true, watchedMinutes: 30 }, 'flow', 'untouched after a 30-min watch: flow (own choice; boundary)'],
    [{ untouched: true, watchedMinutes: 60 }, 'flow', 'untouched after an hour: flow (own choice)'],
    [{ untouched: true }, 'flow', 'untouched, watch length not given: flow (own choice)'],
  ] as const)('%j → %s (%s)', (obs, verdict, _source) => {
    expect(syrupDishVerdict(obs)).toBe(verdict);
  });

  it.each([
    [{}, 'nothing observed'],
    [{ untouched: true, watchedMinutes: 10 }, 'too short a watch to call untouched'],
    [{ watchedMinutes: 20 }, 'too short a watch, dish not emptied'],
    [{ minutesToEmpty: 10, untouched: true }, 'emptied and untouched at once'],
    [{ minutesToEmpty: -5 }, 'negative minutes'],
    [{ minutesToEmpty: Number.NaN }, 'NaN minutes'],
  ])('rejects %j: %s (RangeError)', (obs, _why) => {
    expect(() => syrupDishVerdict(obs)).toThrow(RangeError);
  });
});

describe('runningAverage25h (Meikle et al. 2005: mean of the previous 12 h, that hour and the next 12 h)', () => {
  it('on a linear ramp the centred average equals the centre reading (derived: a symmetric window over a straight line)', () => {
    const ramp = hourly(49, (h) => 40 + 0.01 * h);
    const out = runningAverage25h(ramp);
    expect(out).toHaveLength(49 - 24); // only hours 12 … 36 have a full window
    expect(out[0].tMs).toBe(T0 + 12 * HOUR);
    expect(out[out.length - 1].tMs).toBe(T0 + 36 * HOUR);
    for (const p of out) {
      expect(p.kg).toBeCloseTo(p.rawKg, 10);
      expect(p.detrendedKg).toBeCloseTo(0, 10);
    }
    expect(out[0].kg).toBeCloseTo(40.12, 10);
    expect(out[0].t).toBe('2025-07-01T12:00:00.000Z');
  });

  it('spreads a single 1.25 kg spike over 25 hours: average 50.05 kg, detrended 1.2 kg at the spike (derived by hand; detrended = raw − average, Meikle 2005)', () => {
    const series = hourly(25, (h) => (h === 12 ? 51.25 : 50));
    const [only] = runningAverage25h(series);
    expect(only.kg).toBeCloseTo(50.05, 10);
    expect(only.detrendedKg).toBeCloseTo(1.2, 10);
  });

  it('returns nothing when fewer than 25 hourly readings exist (no full window)', () => {
    expect(runningAverage25h(hourly(24, () => 50))).toEqual([]);
  });

  it('leaves out every hour whose window spans a missing reading (hours 12–17 survive a gap at hour 30 in 0–48)', () => {
    const withGap = hourly(49, (h) => 40 + h).filter((_, h) => h !== 30);
    const out = runningAverage25h(withGap);
    expect(out.map((p) => (p.tMs - T0) / HOUR)).toEqual([12, 13, 14, 15, 16, 17]);
  });

  it('reads ISO strings (without a zone as UTC) and epoch ms alike, in any order', () => {
    const asStrings = hourly(25, (h) => 40 + h).map((p) => ({ t: new Date(p.t as number).toISOString().slice(0, 16), kg: p.kg }));
    const out = runningAverage25h([...asStrings].reverse());
    expect(out).toHaveLength(1);
    expect(out[0].t).toBe('2025-07-01T12:00:00.000Z');
    expect(out[0].kg).toBeCloseTo(52, 10);
  });

  it('rejects two readings at the same instant and unreadable times (RangeError)', () => {
    expect(() => runningAverage25h([{ t: T0, kg: 1 }, { t: T0, kg: 2 }])).toThrow(RangeError);
    expect(() => runningAverage25h([{ t: 'yesterday', kg: 1 }])).toThrow(RangeError);
    expect(() => runningAverage25h([{ t: T0, kg: Number.NaN }])).toThrow(RangeError);
  });
});

describe('dailyNetChange (§10, derived: same-time readings on consecutive days)', () => {
  it('takes midnight UTC by default: +0.5, −0.2, 0 kg over three days of synthetic readings', () => {
    const pts = [40.0, 40.5, 40.3, 40.3].map((kg, d) => ({ t: `2025-07-0${d + 1}T00:00:00Z`, kg }));
    const out = dailyNetChange(pts);
    expect(out.map((c) => c.date)).toEqual(['2025-07-01', '2025-07-02', '2025-07-03']);
    expect(out[0].deltaKg).toBeCloseTo(0.5, 10);
    expect(out[1].deltaKg).toBeCloseTo(-0.2, 10);
    expect(out[2].deltaKg).toBeCloseTo(0, 10);
  });

  it('uses a pre-dawn hour when asked, picking the 04:00 reading out of hourly data (ramp of 0.01 kg/h → 0.24 kg/day)', () => {
    const out = dailyNetChange(hourly(72, (h) => 40 + 0.01 * h), { hourUtc: 4 });
    expect(out.map((c) => c.date)).toEqual(['2025-07-01', '2025-07-02']);
    for (const c of out) expect(c.deltaKg).toBeCloseTo(0.24, 10);
  });

  it('accepts a reading within 30 min of the hour and skips a day without one (Frameside’s own tolerance)', () => {
    const pts = [
      { t: '2025-07-01T00:20:00Z', kg: 40 },
      { t: '2025-07-02T00:00:00Z', kg: 41 },
      { t: '2025-07-03T00:45:00Z', kg: 42 }, // too far from midnight
      { t: '2025-07-04T00:00:00Z', kg: 43 },
    ];
    const out = dailyNetChange(pts);
    expect(out).toEqual([{ date: '2025-07-01', deltaKg: 1, fromKg: 40, toKg: 41 }]);
  });

  it('rejects an hour outside 0–23 (RangeError)', () => {
    expect(() => dailyNetChange([], { hourUtc: 24 })).toThrow(RangeError);
  });
});

describe('classifyWeightDays (threshold: Frameside’s own choice, §10 has no published cut-off)', () => {
  it('defaults to a ±0.1 kg flat band (project’s own choice)', () => {
    expect(DEFAULT_FLAT_THRESHOLD_KG).toBe(0.1);
  });

  it.each([
    [0.5, 'gaining'],
    [0.11, 'gaining'],
    [0.1, 'flat'],
    [0, 'flat'],
    [-0.1, 'flat'],
    [-0.11, 'losing'],
    [-0.2, 'losing'],
  ] as const)('Δ %s kg with the default band → %s (boundary of the project’s own threshold)', (deltaKg, trend) => {
    expect(classifyWeightDays([{ date: '2025-07-01', deltaKg }])[0].trend).toBe(trend);
  });

  it('takes a stated threshold', () => {
    expect(classifyWeightDays([{ date: '2025-07-01', deltaKg: 0.3 }], { thresholdKg: 0.5 })[0].trend).toBe('flat');
    expect(() => classifyWeightDays([], { thresholdKg: -1 })).toThrow(RangeError);
  });
});

describe('forageStatus (dish and scale together; the 3-day "sustained" rule is Frameside’s own choice)', () => {
  const days = (...deltas: number[]) => deltas.map((deltaKg, i) => ({ date: `2025-07-0${i + 1}`, deltaKg }));

  it.each([
    [{ changes: days(0.5, 0.8, 1.2) }, 'flow', 'scale'],
    [{ changes: days(-0.3, -0.2, -0.4) }, 'dearth', 'scale'],
    [{ changes: days(-0.3, 0.5, -0.4) }, 'some', 'scale'],
    [{ dish: { minutesToEmpty: 15 } }, 'dearth', 'dish'],
    [{ dish: { minutesToEmpty: 15 }, changes: days(-0.3, -0.2, -0.4) }, 'dearth', 'both'],
    [{ dish: { minutesToEmpty: 15 }, changes: days(-0.3, 0.5, -0.4) }, 'dearth', 'dish'],
    [{ dish: { watchedMinutes: 40 }, changes: days(0.5, 0.8, 1.2) }, 'flow', 'scale'],
    [{ dish: { minutesToEmpty: 15 }, changes: days(0.5, 0.8, 1.2) }, 'some', 'both'],
  ] as const)('%j → %s from %s', (input, judgement, from) => {
    const r = forageStatus(input);
    expect(r.judgement).toBe(judgement);
    expect(r.from).toBe(from);
    expect(r.reason.length).toBeGreaterThan(0);
  });

  it('reads only the last 3 days, in date order', () => {
    const changes = [...days(-1, -1, 0.5, 0.6, 0.7)].reverse();
    expect(forageStatus({ changes }).judgement).toBe('flow');
  });

  it('rejects an empty input or too few days (RangeError)', () => {
    expect(() => forageStatus({})).toThrow(RangeError);
    expect(() => forageStatus({ changes: days(0.5, 0.5) })).toThrow(RangeError);
  });
});
