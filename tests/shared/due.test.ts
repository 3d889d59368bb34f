/**
 * Due-list rules. Intervals: TRADE-REFERENCES §9 (7-day checks in swarm season, Trunch BKA;
 * 5 days when swarm risk is high), §1 (queen emerges 8 d after sealing, W. Shaw / Welsh BKA;
 * laying 14–21 d after emergence, BBKA via Trunch BKA; caged queen release 3–5 d, Britannica /
 * BEE-L; eggs ~7 d after release, BEE-L), §3 (recount 10–14 d after treatment; 3 per 100
 * bees, USDA-ARS), §4 (treatment defaults: label governs), §6 (Seeley 20 kg, Moeller 40.8 kg),
 * §2b (2:1 for autumn). 14-day checks outside swarm season, the monthly winter heft, the
 * 3–7 d feeder check and the week's queenless recheck are common practice; season month
 * boundaries are Frameside's own choice. Record ids and dates are test inputs.
 */
import {
  deriveTasks,
  DUE_INTERVALS,
  isOverdue,
  seasonOf,
  sortTasks,
  TREATMENT_DEFAULTS,
  type DerivedTask,
  type DeriveTasksInput,
} from '../../shared/domain/due';
import type {
  FeedingRecord,
  HiveRecords,
  InspectionRecord,
  MiteCountRecord,
  QueenEventRecord,
  TreatmentRecord,
} from '../../shared/domain/records';

const hive = { id: 'h1', name: 'Hive 1', boxes: [{ size: 'deep' as const, frames: 10 }] };
const apiary = { id: 'a1', winterTargetKg: 40.8 }; // Moeller (1977), §6

function inspection(id: string, date: string, extra: Partial<InspectionRecord> = {}): InspectionRecord {
  return {
    id,
    date,
    queenStatus: 'eggs-seen',
    eggsSeen: true,
    queenCells: [],
    framesBrood: 0,
    framesBees: 0,
    honeyFrames: 0,
    pollenFrames: 0,
    diseaseSigns: [],
    spaceActions: [],
    ...extra,
  };
}
const noEggs = { queenStatus: 'no-eggs-or-brood', eggsSeen: false } as const;

function derive(today: string, records: HiveRecords, over: Partial<DeriveTasksInput> = {}): DerivedTask[] {
  return deriveTasks({ today, hemisphere: 'north', apiary, hive, records, ...over });
}
const byRule = (tasks: DerivedTask[], rule: DerivedTask['rule']) => tasks.filter((t) => t.rule === rule);
const one = (tasks: DerivedTask[], rule: DerivedTask['rule']) => {
  const found = byRule(tasks, rule);
  expect(found).toHaveLength(1);
  return found[0];
};

describe('seasonOf (swarm season Apr–Jul north, §9; other month boundaries Frameside’s own choice; south shifted six months)', () => {
  it.each([
    ['2025-03-15', 'north', 'build-up'],
    ['2025-04-01', 'north', 'swarm'],
    ['2025-07-31', 'north', 'swarm'],
    ['2025-08-01', 'north', 'late-season'],
    ['2025-10-31', 'north', 'late-season'],
    ['2025-11-01', 'north', 'winter'],
    ['2025-02-28', 'north', 'winter'],
    ['2025-09-15', 'south', 'build-up'],
    ['2025-10-01', 'south', 'swarm'],
    ['2025-01-31', 'south', 'swarm'],
    ['2025-02-01', 'south', 'late-season'],
    ['2025-04-30', 'south', 'late-season'],
    ['2025-05-01', 'south', 'winter'],
    ['2025-08-31', 'south', 'winter'],
  ] as const)('%s in the %s → %s', (date, hemisphere, season) => {
    expect(seasonOf(date, hemisphere)).toBe(season);
  });
});

describe('next inspection by season and hemisphere', () => {
  it('turns an autumn visit left undone into a winter heft once winter has come (common practice: the cluster stays closed)', () => {
    const records = { inspections: [inspection('i1', '2025-09-20')] };
    expect(one(derive('2025-10-10', records), 'next-inspection').dueDate).toBe('2025-10-04');
    const heft = one(derive('2025-12-01', records), 'winter-heft');
    expect(heft.dueDate).toBe('2025-10-20');
    expect(byRule(derive('2025-12-01', records), 'next-inspection')).toHaveLength(0);
  });

  it.each([
    ['north', '2025-06-10', 'next-inspection', '2025-06-17', '7 d in swarm season (§9, Trunch BKA)'],
    ['south', '2025-11-10', 'next-inspection', '2025-11-17', '7 d: November is swarm season in the south (§9 shifted six months)'],
    ['south', '2025-06-10', 'winter-heft', '2025-07-10', 'June is winter in the south: monthly heft (common practice)'],
    ['north', '2025-11-10', 'winter-heft', '2025-12-10', 'monthly heft in the northern winter (common practice)'],
    ['north', '2025-08-20', 'next-inspection', '2025-09-03', '14 d outside swarm season (common practice; §9 fewer checks)'],
    ['south', '2025-02-20', 'next-inspection', '2025-03-06', '14 d in the southern late season'],
    ['north', '2025-03-28', 'next-inspection', '2025-04-04', '7 d when the next visit falls in swarm season (§9)'],
    ['north', '2025-10-25', 'winter-heft', '2025-11-25', 'a 14-day visit would land in winter: heft a month on (common practice)'],
    ['north', '2025-02-10', 'next-inspection', '2025-03-10', 'a month after a winter check, winter is over: first spring check'],
  ] as const)('%s, last check %s → %s on %s (%s)', (hemisphere, date, rule, due, _source) => {
    const tasks = derive(date, { inspections: [inspection('i1', date)] }, { hemisphere });
    const t = one(tasks, rule);
    expect(t.dueDate).toBe(due);
    expect(t.key).toBe(`${rule}:h1:i1`);
    expect(t.sourceRecordId).toBe('i1');
  });

  it('counts the winter heft from a stores estimate made after the last check (common practice)', () => {
    const tasks = derive('2025-12-05', {
      inspections: [inspection('i1', '2025-10-25')],
      storesEstimates: [{ id: 's1', date: '2025-12-01', storesKg: 20 }],
    });
    const t = one(tasks, 'winter-heft');
    expect(t.dueDate).toBe('2026-01-01');
    expect(t.key).toBe('winter-heft:h1:s1');
  });

  it('asks for a first Quick check today when a hive has none', () => {
    const t = one(derive('2025-05-02', {}), 'next-inspection');
    expect(t.dueDate).toBe('2025-05-02');
    expect(t.key).toBe('next-inspection:h1:none');
  });

  it('gives each interval its source value', () => {
    expect(DUE_INTERVALS.swarmSeasonInspectionDays).toBe(7); // §9
    expect(DUE_INTERVALS.inspectionDays).toBe(14); // common practice
  });
});

describe('capped queen cells (§9 visit within 5–7 d; §1 emergence 8 d after sealing, laying check ~3 weeks after)', () => {
  const cells = [{ kind: 'swarm' as const, count: 4, capped: true }];
  const i1 = inspection('i1', '2025-05-20', { queenCells: cells });

  it('capped swarm cells → visit after 5 days and a laying check 8 + 21 days on, instead of the routine visit', () => {
    const tasks = derive('2025-05-20', { inspections: [i1] });
    expect(one(tasks, 'queen-cells-visit').dueDate).toBe('2025-05-25');
    expect(one(tasks, 'new-queen-laying-check').dueDate).toBe('2025-06-18');
    expect(byRule(tasks, 'next-inspection')).toHaveLength(0);
  });

  it('a later visit clears the cell visit but keeps the laying check under the same key', () => {
    const before = one(derive('2025-05-20', { inspections: [i1] }), 'new-queen-laying-check');
    const tasks = derive('2025-05-25', { inspections: [i1, inspection('i2', '2025-05-25', noEggs)] });
    expect(byRule(tasks, 'queen-cells-visit')).toHaveLength(0);
    const after = one(tasks, 'new-queen-laying-check');
    expect(after.key).toBe(before.key);
    expect(after.dueDate).toBe('2025-06-18');
    expect(one(tasks, 'next-inspection').dueDate).toBe('2025-06-01'); // 7 d, swarm season (§9)
    // No eggs is expected while the new queen matures; the laying check covers it, no 7-day recheck.
    expect(byRule(tasks, 'queenless-recheck')).toHaveLength(0);
  });

  it('eggs seen after the cells clear the laying check', () => {
    const tasks = derive('2025-06-15', {
      inspections: [i1, inspection('i2', '2025-05-25', noEggs), inspection('i3', '2025-06-15')],
    });
    expect(byRule(tasks, 'new-queen-laying-check')).toHaveLength(0);
  });

  it('capped supersedure cells → a laying check but no swarm-cell visit', () => {
    const tasks = derive('2025-06-01', {
      inspections: [inspection('i1', '2025-06-01', { queenCells: [{ kind: 'supersedure', count: 2, capped: true }] })],
    });
    expect(byRule(tasks, 'queen-cells-visit')).toHaveLength(0);
    expect(one(tasks, 'new-queen-laying-check').dueDate).toBe('2025-06-30');
    expect(one(tasks, 'next-inspection').dueDate).toBe('2025-06-08');
  });

  it('open (uncapped) swarm cells set no queen-cell deadline', () => {
    const tasks = derive('2025-05-20', {
      inspections: [inspection('i1', '2025-05-20', { queenCells: [{ kind: 'swarm', count: 3, capped: false }] })],
    });
    expect(byRule(tasks, 'queen-cells-visit')).toHaveLength(0);
    expect(byRule(tasks, 'new-queen-laying-check')).toHaveLength(0);
  });
});

describe('caged queen (§1: release check 3–5 d, Britannica / BEE-L; eggs ~7 d after release, BEE-L)', () => {
  const introduced: QueenEventRecord = { id: 'q1', date: '2025-06-01', kind: 'introduced-caged' };
  const released: QueenEventRecord = { id: 'q2', date: '2025-06-04', kind: 'released' };

  it('introduced caged → release check after 3 days', () => {
    const t = one(derive('2025-06-01', { queenEvents: [introduced] }), 'queen-release-check');
    expect(t.dueDate).toBe('2025-06-04');
    expect(t.key).toBe('queen-release-check:h1:q1');
  });

  it('released → eggs check 7 days later, release check gone', () => {
    const tasks = derive('2025-06-04', { queenEvents: [introduced, released] });
    expect(byRule(tasks, 'queen-release-check')).toHaveLength(0);
    expect(one(tasks, 'queen-eggs-check').dueDate).toBe('2025-06-11');
  });

  it('eggs seen after release clear the eggs check', () => {
    const tasks = derive('2025-06-12', { queenEvents: [introduced, released], inspections: [inspection('i1', '2025-06-12')] });
    expect(byRule(tasks, 'queen-eggs-check')).toHaveLength(0);
  });
});

describe('queenless recheck in 7 days (common practice; eggs hatch on day 3, §1)', () => {
  it('no eggs or brood → look again a week later', () => {
    const t = one(derive('2025-07-01', { inspections: [inspection('i1', '2025-07-01', noEggs)] }), 'queenless-recheck');
    expect(t.dueDate).toBe('2025-07-08');
  });

  it('no eggs but capped emergency cells → the laying check instead (emergence +8, laying +21, §1)', () => {
    const tasks = derive('2025-07-01', {
      inspections: [inspection('i1', '2025-07-01', { ...noEggs, queenCells: [{ kind: 'emergency', count: 2, capped: true }] })],
    });
    expect(byRule(tasks, 'queenless-recheck')).toHaveLength(0);
    expect(one(tasks, 'new-queen-laying-check').dueDate).toBe('2025-07-30');
  });

  it('a queen recorded lost after the last check → recheck a week after the loss', () => {
    const tasks = derive('2025-07-05', {
      inspections: [inspection('i1', '2025-07-01')],
      queenEvents: [{ id: 'q1', date: '2025-07-05', kind: 'lost' }],
    });
    const t = one(tasks, 'queenless-recheck');
    expect(t.dueDate).toBe('2025-07-12');
    expect(t.key).toBe('queenless-recheck:h1:q1');
  });
});

describe('treatments (§4: the label governs; TREATMENT_DEFAULTS fill gaps; §3 recount 10–14 d after the end)', () => {
  const base = { method: 'strips', supersOff: false } as const;

  it('marks every default "check the label" and keeps the confirmed §4 values', () => {
    for (const d of Object.values(TREATMENT_DEFAULTS)) expect(d.checkTheLabel).toBe(true);
    expect(TREATMENT_DEFAULTS.thymol.supersAllowed).toBe(false); // "remove all honey supers", confirmed secondary
    expect(TREATMENT_DEFAULTS.thymol.durationDays).toBe(42); // six to eight weeks, confirmed secondary
    expect(TREATMENT_DEFAULTS.amitraz.durationDays).toBe(42); // 6–8 week placement, confirmed secondary
    expect(TREATMENT_DEFAULTS['formic-acid'].supersAllowed).toBe(true); // supers on, confirmed secondary
    expect(TREATMENT_DEFAULTS['formic-acid'].temperatureC).toEqual({ min: 10, max: 30 }); // confirmed secondary
    expect(TREATMENT_DEFAULTS['hop-beta-acids'].supersAllowed).toBe(true); // confirmed secondary
    expect(TREATMENT_DEFAULTS.amitraz.resuperAfterDays).toBe(14); // from memory, per §4
    expect(TREATMENT_DEFAULTS.amitraz.sources.resuperAfterDays).toMatch(/from memory/);
  });

  it('thymol without an end date: ends after the 42-day default, recount 10 d later, supers back at the end with "check the label"', () => {
    const t: TreatmentRecord = { ...base, id: 't1', activeIngredient: 'thymol', method: 'gel', startDate: '2025-08-15', supersOff: true };
    const tasks = derive('2025-08-15', { treatments: [t] });
    expect(one(tasks, 'treatment-end').dueDate).toBe('2025-09-26');
    expect(one(tasks, 'mite-recount').dueDate).toBe('2025-10-06');
    const supers = one(tasks, 'supers-back-on');
    expect(supers.dueDate).toBe('2025-09-26');
    expect(supers.reason).toMatch(/check the label/);
  });

  it('amitraz with a planned end: supers back 14 d after the end (§4, from memory)', () => {
    const t: TreatmentRecord = { ...base, id: 't1', activeIngredient: 'amitraz', startDate: '2025-08-01', plannedEndDate: '2025-09-12', supersOff: true };
    const tasks = derive('2025-08-01', { treatments: [t] });
    expect(one(tasks, 'treatment-end').dueDate).toBe('2025-09-12');
    expect(one(tasks, 'mite-recount').dueDate).toBe('2025-09-22');
    expect(one(tasks, 'supers-back-on').dueDate).toBe('2025-09-26');
  });

  it('does not put supers back on in winter (north November)', () => {
    const t: TreatmentRecord = { ...base, id: 't1', activeIngredient: 'amitraz', startDate: '2025-10-01', plannedEndDate: '2025-11-12', supersOff: true };
    const tasks = derive('2025-10-01', { treatments: [t] });
    expect(byRule(tasks, 'supers-back-on')).toHaveLength(0);
    expect(one(tasks, 'mite-recount').dueDate).toBe('2025-11-22');
  });

  it('drops a supers-back-on task left over once winter has come (north December)', () => {
    const t: TreatmentRecord = { ...base, id: 't1', activeIngredient: 'thymol', method: 'gel', startDate: '2025-08-01', plannedEndDate: '2025-09-12', supersOff: true, withdrawalUntil: '2025-09-20' };
    expect(byRule(derive('2025-10-20', { treatments: [t] }), 'supers-back-on')).toHaveLength(1);
    expect(byRule(derive('2025-12-01', { treatments: [t] }), 'supers-back-on')).toHaveLength(0);
  });

  it('uses the withdrawal date from the label when recorded', () => {
    const t: TreatmentRecord = {
      ...base,
      id: 't1',
      activeIngredient: 'thymol',
      method: 'gel',
      startDate: '2025-08-15',
      plannedEndDate: '2025-09-26',
      supersOff: true,
      withdrawalUntil: '2025-10-01',
    };
    expect(one(derive('2025-08-15', { treatments: [t] }), 'supers-back-on').dueDate).toBe('2025-10-01');
  });

  it('formic acid with a second application 10 d on: a step task keyed by its date, the end, the recount, no supers task', () => {
    const t: TreatmentRecord = {
      ...base,
      id: 't1',
      activeIngredient: 'formic-acid',
      method: 'pads',
      startDate: '2025-08-01',
      schedule: ['2025-08-01', '2025-08-11'],
      plannedEndDate: '2025-08-21',
    };
    const tasks = derive('2025-08-01', { treatments: [t] });
    const step = one(tasks, 'treatment-step');
    expect(step.dueDate).toBe('2025-08-11');
    expect(step.key).toBe('treatment-step:h1:t1:2025-08-11');
    expect(one(tasks, 'treatment-end').dueDate).toBe('2025-08-21');
    expect(one(tasks, 'mite-recount').dueDate).toBe('2025-08-31');
    expect(byRule(tasks, 'supers-back-on')).toHaveLength(0);
  });

  it('an ended treatment has no step or end task; the recount follows the actual end and clears once a count is recorded', () => {
    const t: TreatmentRecord = {
      ...base,
      id: 't1',
      activeIngredient: 'formic-acid',
      startDate: '2025-08-01',
      nextStepDate: '2025-08-11',
      actualEndDate: '2025-08-15',
    };
    const tasks = derive('2025-08-15', { treatments: [t] });
    expect(byRule(tasks, 'treatment-step')).toHaveLength(0);
    expect(byRule(tasks, 'treatment-end')).toHaveLength(0);
    expect(one(tasks, 'mite-recount').dueDate).toBe('2025-08-25');
    const count: MiteCountRecord = { id: 'm1', date: '2025-08-26', method: 'alcohol-wash', mites: 1, beesSampled: 300 };
    expect(byRule(derive('2025-08-26', { treatments: [t], miteCounts: [count] }), 'mite-recount')).toHaveLength(0);
  });

  it('a single oxalic acid application has no end task, only the recount', () => {
    const t: TreatmentRecord = { ...base, id: 't1', activeIngredient: 'oxalic-acid', method: 'dribble', startDate: '2025-12-10' };
    const tasks = derive('2025-12-10', { treatments: [t] });
    expect(byRule(tasks, 'treatment-end')).toHaveLength(0);
    expect(one(tasks, 'mite-recount').dueDate).toBe('2025-12-20');
  });

  it('a super added after the treatment started clears the supers task', () => {
    const t: TreatmentRecord = { ...base, id: 't1', activeIngredient: 'amitraz', startDate: '2025-08-01', plannedEndDate: '2025-09-12', supersOff: true };
    const tasks = derive('2025-09-27', { treatments: [t], inspections: [inspection('i1', '2025-09-27', { spaceActions: ['super-added'] })] });
    expect(byRule(tasks, 'supers-back-on')).toHaveLength(0);
  });
});

describe('feeder refill check (common practice: 3–7 days after feeding)', () => {
  it.each([
    ['syrup', '2025-04-10', '2025-04-13', '3 d for syrup'],
    ['fondant', '2025-01-10', '2025-01-17', '7 d for solid feed'],
  ] as const)('%s on %s → check on %s (%s)', (kind, date, due, _source) => {
    const f: FeedingRecord = { id: 'f1', date, kind, amountL: kind === 'syrup' ? 4 : undefined };
    expect(one(derive(date, { feedings: [f] }), 'feeder-refill').dueDate).toBe(due);
  });

  it('a check after the feeding clears it', () => {
    const f: FeedingRecord = { id: 'f1', date: '2025-04-10', kind: 'syrup', ratio: '1:1', amountL: 4 };
    expect(byRule(derive('2025-04-12', { feedings: [f], inspections: [inspection('i1', '2025-04-12')] }), 'feeder-refill')).toHaveLength(0);
  });
});

describe('winter feed in the late season (§6 targets; §2b 2:1 for autumn, Moeller 1977; 0.8 kg sugar/kg honey, own assumption)', () => {
  const estimate = { id: 's1', date: '2025-08-25', storesKg: 20 }; // Seeley (2019) ≈ 20 kg

  it('20 kg against 40.8 kg in the northern late season → feed ≈ 18.8 L of 2:1 (derived, as in the feedPlan test)', () => {
    const t = one(derive('2025-09-01', { storesEstimates: [estimate] }), 'winter-feed');
    expect(t.dueDate).toBe('2025-08-25');
    expect(t.title).toMatch(/18\.8 L of 2:1/);
    expect(t.reason).toMatch(/20\.8 kg short of the 40\.8 kg/);
    expect(t.reason).toMatch(/16\.6 kg sugar/);
    expect(t.key).toBe('winter-feed:h1:s1');
  });

  it('counts syrup fed since the estimate: 10 L of 2:1 (0.884 kg sugar/L, §2b) ÷ 0.8 ≈ 11.05 kg, leaving ≈ 9.7 kg short', () => {
    const fed: FeedingRecord = { id: 'f1', date: '2025-08-28', kind: 'syrup', ratio: '2:1', basis: 'weight', amountL: 10 };
    const t = one(derive('2025-09-01', { storesEstimates: [estimate], feedings: [fed] }), 'winter-feed');
    expect(t.reason).toMatch(/9\.7 kg short/);
    expect(t.key).toBe('winter-feed:h1:s1');
  });

  it.each([
    ['north', '2025-07-15', { ...estimate, date: '2025-07-10' }, 'July is swarm season, not the feeding window'],
    ['north', '2025-03-01', { ...estimate, date: '2025-02-25' }, 'February–March is winter/build-up in the north'],
    ['north', '2025-09-01', { ...estimate, storesKg: 41 }, 'stores already meet the target'],
    ['north', '2025-09-01', { ...estimate, date: '2024-09-01' }, 'last year’s estimate'],
  ] as const)('%s, today %s: no feed task (%s)', (hemisphere, today, est, _why) => {
    expect(byRule(derive(today, { storesEstimates: [est] }, { hemisphere }), 'winter-feed')).toHaveLength(0);
  });

  it('shifts six months in the south: a late-February estimate is in the southern late season', () => {
    const t = one(derive('2025-03-01', { storesEstimates: [{ ...estimate, date: '2025-02-25' }] }, { hemisphere: 'south' }), 'winter-feed');
    expect(t.dueDate).toBe('2025-02-25');
  });

  it('sets no feed task without a winter target', () => {
    expect(byRule(derive('2025-09-01', { storesEstimates: [estimate] }, { apiary: { id: 'a1', winterTargetKg: null } }), 'winter-feed')).toHaveLength(0);
  });
});

describe('treatment after an "act" mite count (§3: 3 per 100 bees, USDA-ARS / UF; sticky board > 30/day, USDA-ARS)', () => {
  const wash = (mites: number): MiteCountRecord => ({ id: 'm1', date: '2025-08-01', method: 'alcohol-wash', mites, beesSampled: 300 });

  it('9 mites in 300 bees (3 %) → a treatment task on the count date', () => {
    const t = one(derive('2025-08-02', { miteCounts: [wash(9)] }), 'treat-varroa');
    expect(t.dueDate).toBe('2025-08-01');
    expect(t.reason).toMatch(/3 mites per 100 bees/);
  });

  it('8 mites in 300 bees (2.7 %, watch) → no treatment task', () => {
    expect(byRule(derive('2025-08-02', { miteCounts: [wash(8)] }), 'treat-varroa')).toHaveLength(0);
  });

  it('a treatment started since the count clears it', () => {
    const t: TreatmentRecord = { id: 't1', activeIngredient: 'formic-acid', method: 'strips', startDate: '2025-08-05', supersOff: false };
    expect(byRule(derive('2025-08-05', { miteCounts: [wash(9)], treatments: [t] }), 'treat-varroa')).toHaveLength(0);
  });

  it('a sticky board of 93 mites over 3 days (31/day) → treatment task', () => {
    const board: MiteCountRecord = { id: 'm2', date: '2025-08-01', method: 'sticky-board', mites: 93, days: 3 };
    expect(byRule(derive('2025-08-01', { miteCounts: [board] }), 'treat-varroa')).toHaveLength(1);
  });

  it('skips an unreadable count instead of failing the whole list', () => {
    const bad: MiteCountRecord = { id: 'm3', date: '2025-08-01', method: 'alcohol-wash', mites: 5 };
    expect(() => derive('2025-08-01', { miteCounts: [bad] })).not.toThrow();
  });
});

describe('task shape, keys and order', () => {
  const records: HiveRecords = {
    inspections: [inspection('i1', '2025-05-20', { queenCells: [{ kind: 'swarm', count: 2, capped: true }] })],
    feedings: [{ id: 'f1', date: '2025-05-19', kind: 'syrup', ratio: '1:1', amountL: 4 }],
    miteCounts: [{ id: 'm1', date: '2025-05-20', method: 'sugar-roll', mites: 12, beesSampled: 300 }],
  };

  it('carries hive, apiary, a plain reason and a source on every task, with unique keys', () => {
    const tasks = derive('2025-05-20', records);
    expect(tasks.length).toBeGreaterThan(0);
    for (const t of tasks) {
      expect(t).toMatchObject({ hiveId: 'h1', apiaryId: 'a1' });
      expect(t.reason.length).toBeGreaterThan(10);
      expect(t.source.length).toBeGreaterThan(5);
      expect(t.key.startsWith(`${t.rule}:h1:`)).toBe(true);
    }
    expect(new Set(tasks.map((t) => t.key)).size).toBe(tasks.length);
  });

  it('derives the same keys on a later day (so a task marked done still matches)', () => {
    const keys = (today: string) => derive(today, records).map((t) => t.key).sort();
    expect(keys('2025-05-21')).toEqual(keys('2025-05-20'));
  });

  it('returns nothing for a hive that is not active', () => {
    expect(deriveTasks({ today: '2025-05-20', hemisphere: 'north', apiary, hive: { ...hive, status: 'dead-out' }, records })).toEqual([]);
  });

  it('isOverdue: before today is overdue, today is not', () => {
    expect(isOverdue({ dueDate: '2025-05-19' }, '2025-05-20')).toBe(true);
    expect(isOverdue({ dueDate: '2025-05-20' }, '2025-05-20')).toBe(false);
  });

  it('sortTasks puts overdue first, then by date, then by key, without touching the input', () => {
    const input = [
      { key: 'c', dueDate: '2025-06-01' },
      { key: 'b', dueDate: '2025-05-10' },
      { key: 'a', dueDate: '2025-05-20' },
      { key: 'd', dueDate: '2025-05-10' },
      { key: 'e', dueDate: '2025-05-01' },
    ];
    const sorted = sortTasks(input, '2025-05-20');
    expect(sorted.map((t) => t.key)).toEqual(['e', 'b', 'd', 'a', 'c']);
    expect(input[0].key).toBe('c');
  });
});
