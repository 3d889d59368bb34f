/**
 * The demo's 2026 season of hive records (invented; none of these numbers is a reference value):
 * a spring build-up from April with a Quick check every 7–10 days, a swarm-cell episode at
 * Clover in late May and the split that made Elder, a July–August dearth at Orchard Row read
 * from syrup dishes and met with 1:1 feeds, an August mite-wash round with treatments and a
 * recount, June–July harvests, and a 2:1 autumn feed in September. Some records are the
 * co-keeper's, so "who recorded it" varies.
 *
 * Every record is checked with the same zod schemas the API uses, then written in one batch
 * insert per table.
 */
import { RECORD_LIMITS, recordSchemas } from '../shared/schemas/records';
import { frameCapacity, type Box } from '../shared/domain/hives';
import type { DemoIds } from './seed';
import type { SeedTx } from './seed-extensions';
import { colonyEvents, feedings, forageChecks, harvests, inspections, miteCounts, queenEvents, treatments } from './schema';

const SEASON = 2026;
/** The seed's own clock for the "not in the future" rule: the season is over. */
const schemas = recordSchemas(() => new Date(Date.UTC(SEASON, 11, 31)));

/** A deterministic pseudo-random stream (mulberry32), so the demo is the same on every seed. */
function stream(seed: number) {
  let a = seed >>> 0;
  return () => {
    a = (a + 0x6d2b79f5) >>> 0;
    let t = a;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

const at = (date: string, hhmm = '11:00') => `${date}T${hhmm}:00.000Z`;
const addDays = (date: string, n: number) => new Date(Date.parse(`${date}T00:00:00Z`) + n * 86_400_000).toISOString().slice(0, 10);
const half = (n: number) => Math.round(n * 2) / 2;
const dayOfYear = (date: string) => (Date.parse(`${date}T00:00:00Z`) - Date.UTC(SEASON, 0, 1)) / 86_400_000;

interface HivePlan {
  name: string;
  boxes: Box[];
  apiary: 'orchardRow' | 'quarryHill';
  /** Frames of bees at the peak of the season. */
  peakBees: number;
  firstCheck: string;
  temperament: [number, number];
}

const deep: Box = { size: 'deep', frames: 10 };
const medium: Box = { size: 'medium', frames: 10 };
// Boxes as db/seed.ts gives them; the frame counts below stay within them.
const PLANS: HivePlan[] = [
  { name: 'Ash', boxes: [deep, deep, medium], apiary: 'orchardRow', peakBees: 19, firstCheck: '2026-04-04', temperament: [1, 2] },
  { name: 'Bramble', boxes: [deep, deep], apiary: 'orchardRow', peakBees: 13, firstCheck: '2026-04-04', temperament: [2, 3] },
  { name: 'Clover', boxes: [deep, medium], apiary: 'orchardRow', peakBees: 16, firstCheck: '2026-04-05', temperament: [1, 2] },
  { name: 'Damson', boxes: [deep, deep, medium], apiary: 'orchardRow', peakBees: 18, firstCheck: '2026-04-05', temperament: [3, 4] },
  { name: 'Elder', boxes: [deep], apiary: 'orchardRow', peakBees: 8, firstCheck: '2026-06-02', temperament: [1, 2] },
  { name: 'Fennel', boxes: [deep, deep], apiary: 'orchardRow', peakBees: 14, firstCheck: '2026-04-06', temperament: [2, 2] },
  { name: 'Granite', boxes: [deep, deep], apiary: 'quarryHill', peakBees: 14, firstCheck: '2026-04-11', temperament: [2, 3] },
  { name: 'Heather', boxes: [deep, medium, medium], apiary: 'quarryHill', peakBees: 20, firstCheck: '2026-04-11', temperament: [1, 3] },
  { name: 'Iris', boxes: [deep, deep], apiary: 'quarryHill', peakBees: 12, firstCheck: '2026-04-12', temperament: [1, 2] },
  { name: 'Juniper', boxes: [deep], apiary: 'quarryHill', peakBees: 7, firstCheck: '2026-04-12', temperament: [2, 2] },
];

/** Colony size through the season: build-up from April, a peak around the solstice, a slow fall. */
const strength = (doy: number) => {
  const peak = 172; // 21 June
  if (doy <= peak) return 0.3 + 0.7 * Math.min(1, Math.max(0, (doy - 90) / (peak - 90)));
  return Math.max(0.45, 1 - (doy - peak) * 0.0045);
};

/** What happens on particular days, applied over the generated check. */
type Tweak = Partial<Record<string, unknown>>;
const SPECIAL: Record<string, Record<string, Tweak>> = {
  Clover: {
    '2026-05-28': { queenCells: [{ kind: 'swarm', count: 3, capped: false }], note: 'Open swarm cells on the bottom bars. Back in four days.' },
    '2026-06-01': {
      queenCells: [{ kind: 'swarm', count: 4, capped: true }],
      queenStatus: 'queen-seen',
      note: 'Capped swarm cells. Split made: frame with the best cell and two of stores to Elder.',
    },
  },
  Elder: {
    '2026-06-02': {
      queenStatus: 'no-eggs-or-brood',
      eggsSeen: false,
      youngLarvaeSeen: false,
      queenCells: [{ kind: 'swarm', count: 1, capped: true }],
      framesBrood: 2,
      framesBees: 4,
      note: 'Made up from Clover with one capped swarm cell.',
    },
    '2026-06-09': { queenStatus: 'no-eggs-or-brood', eggsSeen: false, youngLarvaeSeen: false, framesBrood: 1, framesBees: 4, note: 'Cell emerged; no eggs yet.' },
    '2026-06-18': { queenStatus: 'no-eggs-or-brood', eggsSeen: false, youngLarvaeSeen: false, framesBrood: 0, framesBees: 3.5, note: 'Still waiting for the new queen to lay.' },
    '2026-06-28': { queenStatus: 'queen-seen', eggsSeen: true, framesBrood: 1.5, framesBees: 4, note: 'New queen laying, marked white.' },
  },
  Bramble: {
    '2026-07-13': { queenCells: [{ kind: 'supersedure', count: 2, capped: false }], broodPattern: 'patchy', note: 'Two supersedure cells mid-comb; left them.' },
  },
  Damson: {
    '2026-08-02': { diseaseSigns: ['deformed-wings'], note: 'A few bees with deformed wings. Mite wash today.' },
  },
  Iris: {
    '2026-05-10': { diseaseSigns: ['chalkbrood'], note: 'A little chalkbrood at the entrance.' },
  },
};

/**
 * Writes the season's records that happened by `now` (a demo seeded in mid-August has no
 * September feed yet), so nothing in the demo lies in the future of the app's clock.
 */
export async function seedRecords(tx: SeedTx, ids: DemoIds, now: Date = new Date()): Promise<void> {
  const keeper = ids.users.keeper;
  const cokeeper = ids.users.cokeeper;
  const hive = (name: string) => ids.hives[name]!;
  const rows = {
    inspections: [] as (typeof inspections.$inferInsert)[],
    feedings: [] as (typeof feedings.$inferInsert)[],
    treatments: [] as (typeof treatments.$inferInsert)[],
    miteCounts: [] as (typeof miteCounts.$inferInsert)[],
    harvests: [] as (typeof harvests.$inferInsert)[],
    queenEvents: [] as (typeof queenEvents.$inferInsert)[],
    colonyEvents: [] as (typeof colonyEvents.$inferInsert)[],
    forageChecks: [] as (typeof forageChecks.$inferInsert)[],
  };
  const meta = (v: { occurredAt: string }, by: string) => ({ occurredAt: new Date(v.occurredAt), createdBy: by, updatedBy: by, createdAt: new Date(v.occurredAt), updatedAt: new Date(v.occurredAt) });

  // --- Quick checks -------------------------------------------------------------------------
  PLANS.forEach((p, i) => {
    const rnd = stream(1000 + i);
    const capacity = frameCapacity(p.boxes);
    const steps = [7, 9, 10, 8];
    // The rota (every 7–10 days; two days longer at the out-apiary), plus the episode's own days.
    const dates = new Set<string>();
    for (let d = p.firstCheck, n = 0; d <= '2026-09-26'; d = addDays(d, steps[n++ % steps.length]! + (p.apiary === 'quarryHill' ? 2 : 0))) dates.add(d);
    for (const d of Object.keys(SPECIAL[p.name] ?? {})) dates.add(d);
    let k = 0;
    for (const date of [...dates].sort()) {
      const doy = dayOfYear(date);
      let factor = strength(doy);
      if (p.name === 'Clover' && date > '2026-06-01') factor *= 0.6; // after the split
      if (p.name === 'Elder') factor = Math.min(1, 0.5 + (doy - 153) * 0.006);
      const bees = Math.min(capacity, Math.max(1, half(p.peakBees * factor + (rnd() - 0.5))));
      const broodShare = doy < 200 ? 0.55 : 0.35;
      const brood = Math.min(bees, half(bees * broodShare + (rnd() - 0.5) * 0.5));
      const honey = half(Math.min(capacity - bees / 2, doy < 140 ? 2 + rnd() : doy < 200 ? 3 + rnd() * 3 : 2.5 + rnd() * 2));
      const superOn = doy >= 130 && doy < 137 && p.peakBees >= 13;
      const harvestDay = ['Ash', 'Damson', 'Heather'].includes(p.name) && (date >= '2026-07-10' && date < '2026-07-19');
      const draft = {
        occurredAt: at(date, `${String(9 + (i % 5)).padStart(2, '0')}:${i % 2 ? '30' : '05'}`),
        framesBrood: brood,
        framesBees: bees,
        honeyFrames: Math.max(0, honey),
        pollenFrames: half(0.5 + rnd() * 1.5),
        queenStatus: rnd() < 0.3 ? 'queen-seen' : 'eggs-seen',
        eggsSeen: true,
        youngLarvaeSeen: true,
        broodPattern: 'solid',
        temperament: p.temperament[0] + Math.round(rnd() * (p.temperament[1] - p.temperament[0])),
        spaceActions: superOn ? ['super-added'] : harvestDay ? ['super-removed'] : date === '2026-09-05' ? ['feeder-on'] : [],
        weather: (['sunny', 'cloudy', 'sunny', 'overcast', 'windy'] as const)[Math.floor(rnd() * 5)],
        airTempC: Math.round(10 + 12 * Math.sin(Math.PI * Math.min(1, Math.max(0, (doy - 80) / 200))) + rnd() * 4),
        ...(SPECIAL[p.name]?.[date] ?? {}),
      };
      const v = schemas.inspection.create.parse(draft);
      // The co-keeper did the Quarry Hill rounds in June and July, and every third check of Fennel.
      const by = (p.apiary === 'quarryHill' && date >= '2026-06-01' && date < '2026-08-01') || (p.name === 'Fennel' && k % 3 === 2) ? cokeeper : keeper;
      rows.inspections.push({ ...v, hiveId: hive(p.name), ...meta(v, by) });
      k++;
    }
  });
  const add = <T extends keyof typeof rows>(
    table: T,
    kind: 'feeding' | 'treatment' | 'mite-count' | 'harvest' | 'queen-event' | 'colony-event',
    hiveName: string,
    draft: Record<string, unknown> & { occurredAt: string },
    by = keeper,
  ) => {
    const v = schemas[kind].create.parse(draft) as { occurredAt: string };
    (rows[table] as unknown[]).push({ ...v, hiveId: hive(hiveName), ...meta(v, by) });
  };

  // --- The swarm-cell episode: Clover split into Elder on 1 June ----------------------------
  add('colonyEvents', 'colony-event', 'Clover', { kind: 'split-to', otherHiveId: hive('Elder'), occurredAt: at('2026-06-01', '16:30'), note: 'Artificial swarm for the capped swarm cells.' });
  add('colonyEvents', 'colony-event', 'Elder', { kind: 'split-from', otherHiveId: hive('Clover'), occurredAt: at('2026-06-01', '16:30') });
  add('queenEvents', 'queen-event', 'Clover', { kind: 'seen', occurredAt: at('2026-06-01', '16:00'), note: 'Old queen stays in Clover.' });
  add('queenEvents', 'queen-event', 'Elder', { kind: 'seen', occurredAt: at('2026-06-28', '11:00'), note: 'New queen from the swarm cell, laying.' });
  add('queenEvents', 'queen-event', 'Elder', { kind: 'marked', occurredAt: at('2026-06-28', '11:10'), note: 'White, for a 2026 queen.' });
  // A spring requeen at Iris, a supersedure at Bramble, and Juniper brought up from Orchard Row.
  add('queenEvents', 'queen-event', 'Iris', { kind: 'introduced-caged', occurredAt: at('2026-04-24', '15:00') }, cokeeper);
  add('queenEvents', 'queen-event', 'Iris', { kind: 'released', occurredAt: at('2026-04-28', '15:00') }, cokeeper);
  add('queenEvents', 'queen-event', 'Iris', { kind: 'seen', occurredAt: at('2026-05-06', '12:00') });
  add('queenEvents', 'queen-event', 'Bramble', { kind: 'superseded', occurredAt: at('2026-08-02', '11:00'), note: 'Unmarked young queen laying; the old one gone.' });
  add('colonyEvents', 'colony-event', 'Juniper', { kind: 'moved', occurredAt: at('2026-04-03', '19:00'), note: 'Nucleus moved up to Quarry Hill.' });

  // --- Feedings -----------------------------------------------------------------------------
  for (const [name, d] of [['Juniper', '2026-04-12'], ['Juniper', '2026-04-26'], ['Iris', '2026-04-28']] as const) {
    add('feedings', 'feeding', name, { kind: 'syrup', ratio: '1:1', basis: 'weight', amountL: 2, feederType: 'contact-feeder', occurredAt: at(d, '18:30') }, cokeeper);
  }
  add('feedings', 'feeding', 'Iris', { kind: 'pollen-patty', amountKg: 0.5, occurredAt: at('2026-04-12', '12:00') });
  // The dearth: thin syrup inside the hive, in the evening, for the small colonies.
  for (const d of ['2026-07-24', '2026-07-31', '2026-08-07', '2026-08-14']) {
    for (const name of ['Elder', 'Bramble']) {
      add('feedings', 'feeding', name, { kind: 'syrup', ratio: '1:1', basis: 'weight', amountL: name === 'Elder' ? 1.5 : 2.5, feederType: 'frame-feeder', occurredAt: at(d, '19:30'), note: 'Dearth: fed at dusk.' });
    }
  }
  // The autumn feed: heavy syrup in two rounds.
  PLANS.forEach((p, i) => {
    const litres = Math.max(3, Math.round((p.peakBees / 2 + (i % 3)) * 2) / 2);
    for (const [d, share] of [['2026-09-05', 0.6], ['2026-09-14', 0.4]] as const) {
      const by = p.apiary === 'quarryHill' && d === '2026-09-14' ? cokeeper : keeper;
      add('feedings', 'feeding', p.name, { kind: 'syrup', ratio: '2:1', basis: 'weight', amountL: Math.round(litres * share * 2) / 2, feederType: 'top-feeder', occurredAt: at(d, '18:45') }, by);
    }
  });

  // --- Harvests (before the treatments, supers then off) -------------------------------------
  add('harvests', 'harvest', 'Ash', { supers: 1, frames: 10, weightKg: 12.5, moisturePercent: 17.2, occurredAt: at('2026-06-20', '14:00') });
  add('harvests', 'harvest', 'Damson', { supers: 1, frames: 9, weightKg: 10.8, moisturePercent: 17.9, occurredAt: at('2026-06-20', '14:30') });
  add('harvests', 'harvest', 'Ash', { supers: 1, frames: 10, weightKg: 13.1, moisturePercent: 17.5, occurredAt: at('2026-07-14', '13:00') });
  add('harvests', 'harvest', 'Heather', { supers: 2, frames: 18, weightKg: 19.6, moisturePercent: 17.6, occurredAt: at('2026-07-16', '13:00') }, cokeeper);
  add('harvests', 'harvest', 'Fennel', { supers: 0, frames: 6, weightKg: 6.4, occurredAt: at('2026-07-14', '15:00') });

  // --- Mites: spring boards and rolls, the August washes, a treatment round, the recount ------
  add('miteCounts', 'mite-count', 'Ash', { method: 'sticky-board', mites: 9, days: 7, occurredAt: at('2026-04-18', '10:00') });
  add('miteCounts', 'mite-count', 'Damson', { method: 'sticky-board', mites: 14, days: 7, occurredAt: at('2026-04-18', '10:10') });
  for (const name of ['Bramble', 'Fennel', 'Granite', 'Heather']) {
    add('miteCounts', 'mite-count', name, { method: 'sugar-roll', beesSampled: RECORD_LIMITS.defaultBeesSampled, mites: 1 + (name.length % 3), occurredAt: at('2026-05-16', '12:00') });
  }
  // 3 mites per 100 bees is the treatment level the Due list uses (shared/domain/mites.ts); these invented counts cross it on Ash, Damson, Fennel and Heather.
  const august: [string, number][] = [['Ash', 13], ['Bramble', 5], ['Clover', 4], ['Damson', 16], ['Elder', 2], ['Fennel', 10], ['Granite', 7], ['Heather', 12], ['Iris', 3], ['Juniper', 2]];
  for (const [name, mites] of august) {
    const quarry = PLANS.find((p) => p.name === name)!.apiary === 'quarryHill';
    add('miteCounts', 'mite-count', name, { method: 'alcohol-wash', beesSampled: 300, mites, occurredAt: at(quarry ? '2026-08-04' : '2026-08-02', '12:30') }, quarry ? cokeeper : keeper);
  }
  for (const name of ['Ash', 'Damson', 'Fennel']) {
    add('treatments', 'treatment', name, {
      productName: 'Thymol gel (demo)',
      activeIngredient: 'thymol',
      method: 'gel',
      dose: 'One tray per brood box, repeated after two weeks, as on the label',
      batch: 'TG-2604-118',
      startDate: '2026-08-09',
      plannedEndDate: '2026-09-20',
      actualEndDate: '2026-09-20',
      schedule: ['2026-08-09', '2026-08-23'],
      supersOff: true,
      withdrawalUntil: '2026-09-20',
      appliedBy: 'Rowan Hale',
      occurredAt: at('2026-08-09', '18:00'),
      note: 'Supers off first. Daytime highs in the low twenties.',
    });
  }
  add(
    'treatments',
    'treatment',
    'Heather',
    {
      productName: 'Formic acid strips (demo)',
      activeIngredient: 'formic-acid',
      method: 'strips',
      dose: 'Two strips, as on the label',
      batch: 'FA-26-0731',
      startDate: '2026-08-11',
      plannedEndDate: '2026-08-25',
      actualEndDate: '2026-08-25',
      supersOff: false,
      appliedBy: 'Idris Penrose',
      occurredAt: at('2026-08-11', '08:30'),
      note: 'Cool morning, forecast under 27 °C for the week.',
    },
    cokeeper,
  );
  for (const [name, mites] of [['Ash', 2], ['Damson', 3], ['Fennel', 1], ['Heather', 2]] as const) {
    add('miteCounts', 'mite-count', name, { method: 'alcohol-wash', beesSampled: 300, mites, occurredAt: at('2026-09-27', '12:00'), note: 'Recount after treatment.' });
  }

  // --- Forage checks: a July–August dearth at Orchard Row ------------------------------------
  const forage = (apiary: 'orchardRow' | 'quarryHill', draft: Record<string, unknown> & { occurredAt: string }, by = keeper) => {
    const v = schemas['forage-check'].create.parse(draft) as { occurredAt: string };
    rows.forageChecks.push({ ...(v as object), apiaryId: ids[apiary], ...meta(v, by) } as typeof forageChecks.$inferInsert);
  };
  forage('orchardRow', { judgement: 'flow', occurredAt: at('2026-05-20', '15:00'), note: 'Apple and hawthorn over; field beans in flower.' });
  forage('orchardRow', { untouched: true, watchedMinutes: 45, occurredAt: at('2026-06-24', '14:00'), note: 'Dish not touched in 45 minutes: lime in flower.' });
  forage('orchardRow', { minutesToEmpty: 55, occurredAt: at('2026-07-10', '14:00') });
  forage('orchardRow', { minutesToEmpty: 20, occurredAt: at('2026-07-22', '14:00'), note: 'Dish emptied in about 20 minutes: dearth. Entrances reduced.' });
  forage('orchardRow', { minutesToEmpty: 15, occurredAt: at('2026-08-05', '14:00'), note: 'Robbing attempts at Elder.' });
  forage('orchardRow', { judgement: 'dearth', occurredAt: at('2026-08-19', '17:00'), note: 'Drones being thrown out; bees on the fallen plums.' });
  forage('orchardRow', { untouched: true, watchedMinutes: 40, occurredAt: at('2026-09-16', '13:00'), note: 'Ivy starting.' });
  forage('quarryHill', { judgement: 'some', occurredAt: at('2026-07-18', '12:00'), note: 'Heather not yet out.' }, cokeeper);
  forage('quarryHill', { judgement: 'flow', occurredAt: at('2026-08-15', '12:00'), note: 'Heather in full flower.' }, cokeeper);

  const past = <T extends { occurredAt: Date | unknown }>(list: T[]) => list.filter((r) => (r.occurredAt as Date).getTime() <= now.getTime());
  for (const k of Object.keys(rows) as (keyof typeof rows)[]) (rows as Record<string, unknown[]>)[k] = past(rows[k] as { occurredAt: unknown }[]);

  // One batch insert per table keeps the seed quick (it runs for every demo test server).
  if (rows.inspections.length) await tx.insert(inspections).values(rows.inspections);
  if (rows.feedings.length) await tx.insert(feedings).values(rows.feedings);
  if (rows.treatments.length) await tx.insert(treatments).values(rows.treatments);
  if (rows.miteCounts.length) await tx.insert(miteCounts).values(rows.miteCounts);
  if (rows.harvests.length) await tx.insert(harvests).values(rows.harvests);
  if (rows.queenEvents.length) await tx.insert(queenEvents).values(rows.queenEvents);
  if (rows.colonyEvents.length) await tx.insert(colonyEvents).values(rows.colonyEvents);
  if (rows.forageChecks.length) await tx.insert(forageChecks).values(rows.forageChecks);
}
