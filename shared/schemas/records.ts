/**
 * Request and response shapes of the hive and apiary records (Quick check, feeding, treatment,
 * mite count, harvest, queen event, colony event, Forage check). The same schemas validate the
 * forms on the client and the requests on the server.
 *
 * How to use them:
 * - Create: `inspectionCreateSchema` (and likewise per kind) parses a POST body. Omitted optional
 *   fields get their defaults (`occurredAt` = now, lists = [], `note` = '').
 * - Edit: `inspectionUpdateSchema` parses a PATCH body: any subset of the fields plus the
 *   required `version` the edit was based on (a stale one answers 409 `{ error, current }`). The
 *   server merges the patch into the current record and re-checks the whole record with the
 *   create schema, so cross-field rules hold after every edit. To clear an optional field send
 *   `null` (e.g. `ratio: null` when a syrup feeding becomes fondant).
 * - The "visit more than a day in the future" rule needs a clock. The exported schemas use the
 *   device clock; the server builds its own with `recordSchemas(ctx.now)`.
 * - Frame counts are checked here against 0…MAX_FRAMES in half-frame steps; the server also
 *   checks them against the hive's boxes (`frameCapacity`), which it alone has at hand.
 * - Every DTO carries `recordKind` (the record's kind; `kind` is a field of feedings, queen and
 *   colony events), `createdBy: { id, name }`, `updatedBy` and `version`.
 * - Every DTO carries `cautions` (ids into CAUTIONS in shared/domain/cautions.ts); forms can show
 *   them before saving with `cautionsFor(kind, draft)`.
 */
import { z } from 'zod';
import type { CautionId } from '../domain/cautions';
import { syrupDishVerdict } from '../domain/forage';
import {
  BROOD_PATTERNS,
  COLONY_EVENT_KINDS,
  DISEASE_SIGNS,
  FEEDER_TYPES,
  FEEDING_KINDS,
  FORAGE_JUDGEMENTS,
  MITE_METHODS,
  QUEEN_CELL_KINDS,
  QUEEN_EVENT_KINDS,
  QUEEN_STATUSES,
  SPACE_ACTIONS,
  SYRUP_BASES,
  SYRUP_RATIOS,
  TREATMENT_ACTIVE_INGREDIENTS,
  TREATMENT_METHODS,
  WEATHER,
} from '../domain/records';
import { idSchema } from './common';

// ---------------------------------------------------------------------------------------------
// Kinds and URL segments

export const HIVE_RECORD_KINDS = ['inspection', 'feeding', 'treatment', 'mite-count', 'harvest', 'queen-event', 'colony-event'] as const;
export type HiveRecordKind = (typeof HIVE_RECORD_KINDS)[number];
export const APIARY_RECORD_KINDS = ['forage-check'] as const;
export type ApiaryRecordKind = (typeof APIARY_RECORD_KINDS)[number];
export const RECORD_KINDS_WITH_FORMS = [...HIVE_RECORD_KINDS, ...APIARY_RECORD_KINDS] as const;
export type RecordFormKind = (typeof RECORD_KINDS_WITH_FORMS)[number];

/**
 * The URL segment of each kind: POST/GET /api/hives/:hiveId/<segment> (or
 * /api/apiaries/:apiaryId/forage-checks) and GET/PATCH/DELETE /api/<segment>/:recordId.
 */
export const RECORD_KIND_PATHS: Readonly<Record<RecordFormKind, string>> = {
  inspection: 'inspections',
  feeding: 'feedings',
  treatment: 'treatments',
  'mite-count': 'mite-counts',
  harvest: 'harvests',
  'queen-event': 'queen-events',
  'colony-event': 'colony-events',
  'forage-check': 'forage-checks',
};

/** The JSON key a single record comes back under, e.g. `{ inspection: {...} }`; lists come back as `{ records: [...] }`. */
export const RECORD_KIND_KEYS: Readonly<Record<RecordFormKind, string>> = {
  inspection: 'inspection',
  feeding: 'feeding',
  treatment: 'treatment',
  'mite-count': 'miteCount',
  harvest: 'harvest',
  'queen-event': 'queenEvent',
  'colony-event': 'colonyEvent',
  'forage-check': 'forageCheck',
};

// ---------------------------------------------------------------------------------------------
// Limits (sanity bounds; the hive's own boxes set the real frame ceiling on the server)

export const RECORD_LIMITS = {
  /** Frames in a count: more than 8 boxes × 12 frames cannot be (matches boxesSchema). */
  maxFrames: 96,
  noteChars: 280,
  maxQueenCells: 60,
  /** A visit may be dated at most this far ahead (clock skew, time zones), never further. */
  futureLeewayMs: 24 * 60 * 60 * 1000,
  earliestYear: 1990,
  /** Default mite-wash sample: ≈ 300 bees, ½ US cup (Lee et al. 2010; Oliver 2020; TRADE-REFERENCES §3). */
  defaultBeesSampled: 300,
  maxBeesSampled: 2000,
  maxMites: 5000,
  maxBoardDays: 60,
  maxAmountL: 100,
  maxAmountKg: 50,
  minAirTempC: -30,
  maxAirTempC: 50,
} as const;

// ---------------------------------------------------------------------------------------------
// Field builders

const frames = (label: string) =>
  z
    .number({ message: `${label} must be a number of frames.` })
    .min(0, { message: `${label} cannot be below 0.` })
    .max(RECORD_LIMITS.maxFrames, { message: `${label} must be ${RECORD_LIMITS.maxFrames} or fewer.` })
    .refine((n) => Number.isInteger(n * 2), { message: `${label}: count whole or half frames.` });

const count = (label: string, max: number, min = 0) =>
  z
    .number({ message: `${label} must be a number.` })
    .int({ message: `${label} must be a whole number.` })
    .min(min, { message: min === 0 ? `${label} cannot be below 0.` : `${label} must be at least ${min}.` })
    .max(max, { message: `${label} must be ${max} or fewer.` });

const amount = (label: string, unit: string, max: number) =>
  z
    .number({ message: `${label} must be a number of ${unit}.` })
    .gt(0, { message: `${label} must be more than 0 ${unit}.` })
    .max(max, { message: `${label} must be ${max} ${unit} or less.` });

const choice = <const T extends readonly [string, ...string[]]>(values: T, label: string) =>
  z.enum(values, { message: `Choose ${label}: ${values.map((v) => v.replace(/-/g, ' ')).join(', ')}.` });

const uniqueList = <T extends readonly [string, ...string[]]>(values: T, label: string) =>
  z
    .array(choice(values, label), { message: `${label} must be a list.` })
    .max(values.length, { message: `${label}: each choice at most once.` })
    .refine((xs) => new Set(xs).size === xs.length, { message: `${label}: each choice at most once.` });

const text = (label: string, max: number) =>
  z.string({ message: `${label} must be text.` }).trim().max(max, { message: `${label} must be at most ${max} characters.` });

const requiredText = (label: string, max: number) => text(label, max).min(1, { message: `${label} is required.` });

const isoDate = (label: string) => z.iso.date({ message: `${label} must be a date written YYYY-MM-DD.` });

const noteField = text('The note', RECORD_LIMITS.noteChars);

/** occurredAt: an ISO timestamp with a time zone, not more than a day ahead of `now`. */
const occurredAtField = (now: () => Date) =>
  z.iso
    .datetime({ offset: true, message: 'The visit time must be a date and time (ISO 8601, with a time zone).' })
    .refine((s) => Date.parse(s) <= now().getTime() + RECORD_LIMITS.futureLeewayMs, {
      message: 'The visit time cannot be more than a day in the future.',
    })
    .refine((s) => new Date(s).getUTCFullYear() >= RECORD_LIMITS.earliestYear, {
      message: `The visit time cannot be before ${RECORD_LIMITS.earliestYear}.`,
    });

const notAfterTomorrow = (date: string, now: () => Date) => Date.parse(`${date}T00:00:00Z`) <= now().getTime() + RECORD_LIMITS.futureLeewayMs;

export const queenCellSchema = z
  .object({
    kind: choice(QUEEN_CELL_KINDS, 'the kind of queen cell'),
    count: count('The number of queen cells', RECORD_LIMITS.maxQueenCells, 1),
    capped: z.boolean({ message: 'Capped is yes or no.' }),
  })
  .strict();

// ---------------------------------------------------------------------------------------------
// Shapes: every field without defaults (PATCH uses them as they are; create adds defaults)

type Shape = Record<string, z.ZodType>;
type Ctx = z.core.$RefinementCtx;

interface KindSpec<S extends Shape, D extends { [K in keyof S]?: z.input<S[K]> }, O> {
  shape: S;
  defaults: D;
  /** Cross-field rules on the whole record (after defaults), reported against a field. */
  rules: (v: z.output<z.ZodObject<S>>, ctx: Ctx, now: () => Date) => void;
  /** Fills derived values (e.g. a Forage check's judgement from the dish), after the rules. */
  finish: (v: z.output<z.ZodObject<S>>) => O;
}

/** Identity, so TypeScript infers each spec's shape before it types the rules. */
const kind = <S extends Shape, D extends { [K in keyof S]?: z.input<S[K]> }, O>(spec: KindSpec<S, D, O>) => spec;

const issue = (ctx: Ctx, path: string, message: string) => ctx.addIssue({ code: 'custom', path: [path], message });

const commonShape = (now: () => Date) => ({ occurredAt: occurredAtField(now), note: noteField });

function shapes(now: () => Date) {
  const inspection = kind({
    shape: {
      ...commonShape(now),
      framesBrood: frames('Frames of brood'),
      framesBees: frames('Frames covered with bees'),
      honeyFrames: frames('Honey frames'),
      pollenFrames: frames('Pollen frames'),
      queenStatus: choice(QUEEN_STATUSES, 'the queen status'),
      eggsSeen: z.boolean({ message: 'Eggs seen is yes or no.' }),
      youngLarvaeSeen: z.boolean({ message: 'Young larvae seen is yes or no.' }),
      queenCells: z
        .array(queenCellSchema, { message: 'Queen cells must be a list.' })
        .max(6, { message: 'List each kind of queen cell once, capped and open apart.' })
        .refine((cs) => new Set(cs.map((c) => `${c.kind}:${c.capped}`)).size === cs.length, {
          message: 'List each kind of queen cell once, capped and open apart.',
        }),
      broodPattern: choice(BROOD_PATTERNS, 'the brood pattern').nullable(),
      temperament: z
        .number({ message: 'Temperament is a score from 1 (calm) to 5 (very defensive).' })
        .int({ message: 'Temperament is a whole score from 1 (calm) to 5 (very defensive).' })
        .min(1, { message: 'Temperament is a score from 1 (calm) to 5 (very defensive).' })
        .max(5, { message: 'Temperament is a score from 1 (calm) to 5 (very defensive).' })
        .nullable(),
      diseaseSigns: uniqueList(DISEASE_SIGNS, 'Disease and pest signs'),
      spaceActions: uniqueList(SPACE_ACTIONS, 'Space actions'),
      weather: choice(WEATHER, 'the weather').nullable(),
      airTempC: z
        .number({ message: 'The air temperature must be a number of °C.' })
        .min(RECORD_LIMITS.minAirTempC, { message: `The air temperature must be ${RECORD_LIMITS.minAirTempC} °C or warmer.` })
        .max(RECORD_LIMITS.maxAirTempC, { message: `The air temperature must be ${RECORD_LIMITS.maxAirTempC} °C or cooler.` })
        .nullable(),
    },
    defaults: {
      note: '',
      honeyFrames: 0,
      pollenFrames: 0,
      eggsSeen: false,
      youngLarvaeSeen: false,
      queenCells: [],
      broodPattern: null,
      temperament: null,
      diseaseSigns: [],
      spaceActions: [],
      weather: null,
      airTempC: null,
    },
    rules: (v, ctx) => {
      if (v.queenStatus === 'no-eggs-or-brood' && (v.eggsSeen || v.youngLarvaeSeen)) {
        issue(ctx, 'queenStatus', 'The queen status says no eggs or young brood, but eggs or young larvae are marked as seen.');
      }
      if (v.queenStatus === 'young-larvae-only' && v.eggsSeen) {
        issue(ctx, 'queenStatus', 'The queen status says young larvae only, but eggs are marked as seen.');
      }
    },
    finish: (v) => v,
  });

  const feeding = kind({
    shape: {
      ...commonShape(now),
      kind: choice(FEEDING_KINDS, 'the feed'),
      ratio: choice(SYRUP_RATIOS, 'the syrup ratio').nullable(),
      basis: choice(SYRUP_BASES, 'whether the syrup was mixed by weight or by volume').nullable(),
      amountL: amount('The amount of syrup', 'litres', RECORD_LIMITS.maxAmountL).nullable(),
      amountKg: amount('The amount of feed', 'kg', RECORD_LIMITS.maxAmountKg).nullable(),
      feederType: choice(FEEDER_TYPES, 'the feeder').nullable(),
    },
    defaults: { note: '', ratio: null, basis: null, amountL: null, amountKg: null, feederType: null },
    rules: (v, ctx) => {
      if (v.kind === 'syrup') {
        if (v.ratio == null) issue(ctx, 'ratio', 'Syrup needs its ratio: 1:1, 2:1 or other.');
        if (v.basis == null) issue(ctx, 'basis', 'Syrup needs its basis: mixed by weight or by volume.');
        if (v.amountL == null) issue(ctx, 'amountL', 'Syrup needs the amount given, in litres.');
        if (v.amountKg != null) issue(ctx, 'amountKg', 'Syrup is measured in litres; leave the kilograms empty.');
      } else {
        if (v.ratio != null) issue(ctx, 'ratio', 'Only syrup has a ratio.');
        if (v.basis != null) issue(ctx, 'basis', 'Only syrup is mixed by weight or volume.');
        if (v.kind !== 'other') {
          if (v.amountKg == null) issue(ctx, 'amountKg', 'Fondant and pollen patties need the amount given, in kg.');
          if (v.amountL != null) issue(ctx, 'amountL', 'Fondant and pollen patties are weighed in kg; leave the litres empty.');
        } else if (v.amountL != null && v.amountKg != null) {
          issue(ctx, 'amountKg', 'Give the amount in litres or in kg, not both.');
        }
      }
    },
    finish: (v) => v,
  });

  const treatment = kind({
    shape: {
      ...commonShape(now),
      productName: text('The product name', 120),
      activeIngredient: choice(TREATMENT_ACTIVE_INGREDIENTS, 'the active ingredient'),
      method: choice(TREATMENT_METHODS, 'the method'),
      dose: requiredText('The dose (as written on the label)', 200),
      batch: requiredText('The batch or lot number (from the pack)', 60),
      startDate: isoDate('The start date'),
      plannedEndDate: isoDate('The planned end date').nullable(),
      actualEndDate: isoDate('The actual end date').nullable(),
      schedule: z.array(isoDate('Each planned step'), { message: 'The planned steps must be a list of dates.' }).max(12, {
        message: 'At most 12 planned steps.',
      }),
      supersOff: z.boolean({ message: 'Supers off is yes or no.' }),
      withdrawalUntil: isoDate('The withdrawal date').nullable(),
      appliedBy: text('Applied by', 80),
    },
    defaults: {
      note: '',
      productName: '',
      plannedEndDate: null,
      actualEndDate: null,
      schedule: [],
      supersOff: true,
      withdrawalUntil: null,
      appliedBy: '',
    },
    rules: (v, ctx, clock) => {
      if (!notAfterTomorrow(v.startDate, clock)) issue(ctx, 'startDate', 'The start date cannot be more than a day in the future.');
      if (v.plannedEndDate && v.plannedEndDate < v.startDate) issue(ctx, 'plannedEndDate', 'The planned end cannot be before the start.');
      if (v.actualEndDate && v.actualEndDate < v.startDate) issue(ctx, 'actualEndDate', 'The treatment cannot end before it starts.');
      if (v.actualEndDate && !notAfterTomorrow(v.actualEndDate, clock)) {
        issue(ctx, 'actualEndDate', 'The actual end cannot be in the future; use the planned end for that.');
      }
      if (v.withdrawalUntil && v.withdrawalUntil < v.startDate) issue(ctx, 'withdrawalUntil', 'The withdrawal date cannot be before the start.');
      if (v.schedule.some((d) => d < v.startDate)) issue(ctx, 'schedule', 'Planned steps cannot be before the start.');
    },
    finish: (v) => ({ ...v, schedule: [...new Set(v.schedule)].sort() }),
  });

  const miteCount = kind({
    shape: {
      ...commonShape(now),
      method: choice(MITE_METHODS, 'the method'),
      beesSampled: count('Bees sampled', RECORD_LIMITS.maxBeesSampled, 1).nullable(),
      mites: count('Mites counted', RECORD_LIMITS.maxMites),
      days: z
        .number({ message: 'Days on the board must be a number.' })
        .gt(0, { message: 'Days on the board must be more than 0.' })
        .max(RECORD_LIMITS.maxBoardDays, { message: `Days on the board must be ${RECORD_LIMITS.maxBoardDays} or fewer.` })
        .nullable(),
    },
    defaults: { note: '', beesSampled: null, days: null },
    rules: (v, ctx) => {
      if (v.method === 'sticky-board') {
        if (v.days == null) issue(ctx, 'days', 'A sticky board needs the days it was in.');
        if (v.beesSampled != null) issue(ctx, 'beesSampled', 'A sticky board has no bee sample; leave bees sampled empty.');
      } else {
        const bees = v.beesSampled ?? RECORD_LIMITS.defaultBeesSampled;
        if (v.mites > bees) issue(ctx, 'mites', 'A sample cannot hold more mites than bees sampled.');
        if (v.days != null) issue(ctx, 'days', 'Days on the board are for sticky boards only.');
      }
    },
    // A wash or roll without a bee count is the standard ½-cup sample (≈ 300 bees; Lee et al. 2010, Oliver 2020).
    finish: (v) => (v.method !== 'sticky-board' && v.beesSampled == null ? { ...v, beesSampled: RECORD_LIMITS.defaultBeesSampled } : v),
  });

  const harvest = kind({
    shape: {
      ...commonShape(now),
      supers: count('Supers taken', 50),
      frames: count('Frames taken', 500),
      weightKg: amount('The weight', 'kg', 1000).nullable(),
      moisturePercent: z
        .number({ message: 'Moisture must be a percentage.' })
        .min(10, { message: 'Moisture below 10 % is not a honey reading; check the refractometer.' })
        .max(30, { message: 'Moisture above 30 % is not a honey reading; check the refractometer.' })
        .nullable(),
    },
    defaults: { note: '', supers: 0, frames: 0, weightKg: null, moisturePercent: null },
    rules: (v, ctx) => {
      if (v.supers === 0 && v.frames === 0) issue(ctx, 'frames', 'A harvest takes at least one super or one frame.');
    },
    finish: (v) => v,
  });

  const queenEvent = kind({
    shape: { ...commonShape(now), kind: choice(QUEEN_EVENT_KINDS, 'what happened to the queen') },
    defaults: { note: '' },
    rules: () => {},
    finish: (v) => v,
  });

  const colonyEvent = kind({
    shape: {
      ...commonShape(now),
      kind: choice(COLONY_EVENT_KINDS, 'what happened to the colony'),
      /** The other hive of a split or combine, when it is in Frameside. */
      otherHiveId: idSchema.nullable(),
    },
    defaults: { note: '', otherHiveId: null },
    rules: (v, ctx) => {
      if (v.otherHiveId && !['split-from', 'split-to', 'combined'].includes(v.kind)) {
        issue(ctx, 'otherHiveId', 'Only a split or a combine names another hive.');
      }
    },
    finish: (v) => v,
  });

  const forageCheck = kind({
    shape: {
      ...commonShape(now),
      minutesToEmpty: z
        .number({ message: 'Minutes until the dish was empty must be a number.' })
        .min(0, { message: 'Minutes until the dish was empty cannot be below 0.' })
        .max(600, { message: 'Minutes until the dish was empty must be 600 or fewer.' })
        .nullable(),
      watchedMinutes: z
        .number({ message: 'Minutes watched must be a number.' })
        .gt(0, { message: 'Minutes watched must be more than 0.' })
        .max(600, { message: 'Minutes watched must be 600 or fewer.' })
        .nullable(),
      untouched: z.boolean({ message: 'Untouched is yes or no.' }),
      judgement: choice(FORAGE_JUDGEMENTS, 'flow, some or dearth').nullable(),
    },
    defaults: { note: '', minutesToEmpty: null, watchedMinutes: null, untouched: false, judgement: null },
    rules: (v, ctx) => {
      const dish = v.minutesToEmpty != null || v.watchedMinutes != null || v.untouched;
      if (!dish && v.judgement == null) {
        issue(ctx, 'judgement', 'Give the syrup-dish result (minutes until empty, or untouched) or choose flow, some or dearth.');
        return;
      }
      if (dish && v.judgement == null) {
        try {
          syrupDishVerdict(dishObservation(v));
        } catch (e) {
          issue(ctx, v.minutesToEmpty != null ? 'minutesToEmpty' : 'watchedMinutes', (e as Error).message);
        }
      } else if (v.minutesToEmpty != null && v.untouched) {
        issue(ctx, 'untouched', 'A dish cannot be both emptied and untouched.');
      }
    },
    // A dish test without the keeper's own judgement takes the dish's verdict (shared/domain/forage.ts).
    finish: (v) => ({ ...v, judgement: v.judgement ?? syrupDishVerdict(dishObservation(v)) }),
  });

  return { inspection, feeding, treatment, miteCount, harvest, queenEvent, colonyEvent, forageCheck };
}

const dishObservation = (v: { minutesToEmpty: number | null; watchedMinutes: number | null; untouched: boolean }) => ({
  minutesToEmpty: v.minutesToEmpty ?? undefined,
  watchedMinutes: v.watchedMinutes ?? undefined,
  untouched: v.untouched,
});

// ---------------------------------------------------------------------------------------------
// Building create and update schemas from a spec

type WithDefaults<S extends Shape, D> = { [K in keyof S]: K extends keyof D | 'occurredAt' ? z.ZodOptional<S[K]> : S[K] };
type Filled<S extends Shape> = z.output<z.ZodObject<S>>;

function createSchema<S extends Shape, D extends { [K in keyof S]?: z.input<S[K]> }, O>(spec: KindSpec<S, D, O>, now: () => Date) {
  const shape = Object.fromEntries(
    Object.entries(spec.shape).map(([k, s]) => [k, k in spec.defaults || k === 'occurredAt' ? s.optional() : s]),
  ) as WithDefaults<S, D>;
  return z
    .object(shape)
    .strict()
    .transform((v) => {
      const filled: Record<string, unknown> = { ...v };
      for (const [k, d] of Object.entries(spec.defaults)) if (filled[k] === undefined) filled[k] = d;
      if (filled.occurredAt === undefined) filled.occurredAt = now().toISOString();
      return filled as Filled<S>;
    })
    .superRefine((v, ctx) => spec.rules(v, ctx, now))
    .transform((v) => spec.finish(v));
}

const versionField = z
  .number({ message: 'The edit needs the version of the record it was based on.' })
  .int({ message: 'The version must be a whole number.' })
  .min(1, { message: 'The version must be 1 or more.' });

function updateSchema<S extends Shape>(shape: S) {
  return z.object(shape).partial().extend({ version: versionField }).strict();
}

/** Create and update schemas of every kind, with the "not in the future" rule read from `now`. */
export function recordSchemas(now: () => Date = () => new Date()) {
  const s = shapes(now);
  return {
    inspection: { create: createSchema(s.inspection, now), update: updateSchema(s.inspection.shape) },
    feeding: { create: createSchema(s.feeding, now), update: updateSchema(s.feeding.shape) },
    treatment: { create: createSchema(s.treatment, now), update: updateSchema(s.treatment.shape) },
    'mite-count': { create: createSchema(s.miteCount, now), update: updateSchema(s.miteCount.shape) },
    harvest: { create: createSchema(s.harvest, now), update: updateSchema(s.harvest.shape) },
    'queen-event': { create: createSchema(s.queenEvent, now), update: updateSchema(s.queenEvent.shape) },
    'colony-event': { create: createSchema(s.colonyEvent, now), update: updateSchema(s.colonyEvent.shape) },
    'forage-check': { create: createSchema(s.forageCheck, now), update: updateSchema(s.forageCheck.shape) },
  } as const;
}
export type RecordSchemas = ReturnType<typeof recordSchemas>;

const deviceClock = recordSchemas();

export const inspectionCreateSchema = deviceClock.inspection.create;
export const inspectionUpdateSchema = deviceClock.inspection.update;
export const feedingCreateSchema = deviceClock.feeding.create;
export const feedingUpdateSchema = deviceClock.feeding.update;
export const treatmentCreateSchema = deviceClock.treatment.create;
export const treatmentUpdateSchema = deviceClock.treatment.update;
export const miteCountCreateSchema = deviceClock['mite-count'].create;
export const miteCountUpdateSchema = deviceClock['mite-count'].update;
export const harvestCreateSchema = deviceClock.harvest.create;
export const harvestUpdateSchema = deviceClock.harvest.update;
export const queenEventCreateSchema = deviceClock['queen-event'].create;
export const queenEventUpdateSchema = deviceClock['queen-event'].update;
export const colonyEventCreateSchema = deviceClock['colony-event'].create;
export const colonyEventUpdateSchema = deviceClock['colony-event'].update;
export const forageCheckCreateSchema = deviceClock['forage-check'].create;
export const forageCheckUpdateSchema = deviceClock['forage-check'].update;

export type InspectionCreateInput = z.input<typeof inspectionCreateSchema>;
export type InspectionUpdateInput = z.input<typeof inspectionUpdateSchema>;
export type Inspection = z.output<typeof inspectionCreateSchema>;
export type FeedingCreateInput = z.input<typeof feedingCreateSchema>;
export type FeedingUpdateInput = z.input<typeof feedingUpdateSchema>;
export type Feeding = z.output<typeof feedingCreateSchema>;
export type TreatmentCreateInput = z.input<typeof treatmentCreateSchema>;
export type TreatmentUpdateInput = z.input<typeof treatmentUpdateSchema>;
export type Treatment = z.output<typeof treatmentCreateSchema>;
export type MiteCountCreateInput = z.input<typeof miteCountCreateSchema>;
export type MiteCountUpdateInput = z.input<typeof miteCountUpdateSchema>;
export type MiteCount = z.output<typeof miteCountCreateSchema>;
export type HarvestCreateInput = z.input<typeof harvestCreateSchema>;
export type HarvestUpdateInput = z.input<typeof harvestUpdateSchema>;
export type Harvest = z.output<typeof harvestCreateSchema>;
export type QueenEventCreateInput = z.input<typeof queenEventCreateSchema>;
export type QueenEventUpdateInput = z.input<typeof queenEventUpdateSchema>;
export type QueenEvent = z.output<typeof queenEventCreateSchema>;
export type ColonyEventCreateInput = z.input<typeof colonyEventCreateSchema>;
export type ColonyEventUpdateInput = z.input<typeof colonyEventUpdateSchema>;
export type ColonyEvent = z.output<typeof colonyEventCreateSchema>;
export type ForageCheckCreateInput = z.input<typeof forageCheckCreateSchema>;
export type ForageCheckUpdateInput = z.input<typeof forageCheckUpdateSchema>;
export type ForageCheck = z.output<typeof forageCheckCreateSchema>;

/** The stored fields of each kind (what the create schema outputs). */
export interface RecordFieldsByKind {
  inspection: Inspection;
  feeding: Feeding;
  treatment: Treatment;
  'mite-count': MiteCount;
  harvest: Harvest;
  'queen-event': QueenEvent;
  'colony-event': ColonyEvent;
  'forage-check': ForageCheck;
}

/**
 * GET list query: `?season=YYYY` (calendar year of occurredAt, UTC) and `?limit=N` (1–500;
 * `limit=1` is the previous check a Quick check starts from). Lists come back newest first.
 */
export const recordListQuerySchema = z
  .object({
    season: z
      .string({ message: 'The season must be a year, like 2026.' })
      .regex(/^\d{4}$/, { message: 'The season must be a year, like 2026.' })
      .transform(Number)
      .optional(),
    limit: z
      .string({ message: 'The limit must be a whole number from 1 to 500.' })
      .regex(/^\d{1,3}$/, { message: 'The limit must be a whole number from 1 to 500.' })
      .transform(Number)
      .refine((n) => n >= 1 && n <= 500, { message: 'The limit must be a whole number from 1 to 500.' })
      .optional(),
  })
  .strict();
export type RecordListQuery = z.output<typeof recordListQuerySchema>;

// ---------------------------------------------------------------------------------------------
// Responses

export interface PersonRef {
  id: string;
  name: string;
}

/** What every record DTO carries besides its own fields. */
export interface RecordMeta<K extends RecordFormKind> {
  id: string;
  /**
   * Which kind of record this is. Not `kind`: feedings, queen events and colony events have a
   * field of their own called `kind` (syrup, seen, split-to…).
   */
  recordKind: K;
  /** Set for hive records; null for a Forage check. */
  hiveId: K extends ApiaryRecordKind ? null : string;
  apiaryId: string;
  occurredAt: string;
  note: string;
  createdBy: PersonRef;
  updatedBy: PersonRef | null;
  version: number;
  createdAt: string;
  updatedAt: string;
  /** Cautions that apply to this record (ids into CAUTIONS, shared/domain/cautions.ts). */
  cautions: CautionId[];
}

export type RecordDto<K extends RecordFormKind = RecordFormKind> = K extends RecordFormKind
  ? RecordMeta<K> & Omit<RecordFieldsByKind[K], 'occurredAt' | 'note'>
  : never;

export type InspectionDto = RecordDto<'inspection'>;
export type FeedingDto = RecordDto<'feeding'>;
export type TreatmentDto = RecordDto<'treatment'>;
export type MiteCountDto = RecordDto<'mite-count'>;
export type HarvestDto = RecordDto<'harvest'>;
export type QueenEventDto = RecordDto<'queen-event'>;
export type ColonyEventDto = RecordDto<'colony-event'>;
export type ForageCheckDto = RecordDto<'forage-check'>;

/** GET list answer. */
export interface RecordListDto<K extends RecordFormKind = RecordFormKind> {
  records: RecordDto<K>[];
}
