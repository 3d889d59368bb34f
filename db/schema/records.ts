import { boolean, date, index, integer, jsonb, pgEnum, pgTable, real, text, uuid } from 'drizzle-orm/pg-core';
import {
  BROOD_PATTERNS,
  COLONY_EVENT_KINDS,
  DISEASE_SIGNS,
  FEEDER_TYPES,
  FEEDING_KINDS,
  FORAGE_JUDGEMENTS,
  MITE_METHODS,
  QUEEN_EVENT_KINDS,
  QUEEN_STATUSES,
  SPACE_ACTIONS,
  SYRUP_BASES,
  SYRUP_RATIOS,
  TREATMENT_ACTIVE_INGREDIENTS,
  TREATMENT_METHODS,
  WEATHER,
  type QueenCellObservation,
} from '../../shared/domain/records';
import { apiaries } from './apiaries';
import { hives } from './hives';
import { recordColumns } from './record-columns';

export const queenStatusEnum = pgEnum('queen_status', QUEEN_STATUSES);
export const broodPatternEnum = pgEnum('brood_pattern', BROOD_PATTERNS);
export const diseaseSignEnum = pgEnum('disease_sign', DISEASE_SIGNS);
export const spaceActionEnum = pgEnum('space_action', SPACE_ACTIONS);
export const weatherEnum = pgEnum('weather', WEATHER);
export const feedingKindEnum = pgEnum('feeding_kind', FEEDING_KINDS);
export const syrupRatioEnum = pgEnum('syrup_ratio', SYRUP_RATIOS);
export const syrupBasisEnum = pgEnum('syrup_basis', SYRUP_BASES);
export const feederTypeEnum = pgEnum('feeder_type', FEEDER_TYPES);
export const activeIngredientEnum = pgEnum('active_ingredient', TREATMENT_ACTIVE_INGREDIENTS);
export const treatmentMethodEnum = pgEnum('treatment_method', TREATMENT_METHODS);
export const miteMethodEnum = pgEnum('mite_method', MITE_METHODS);
export const forageJudgementEnum = pgEnum('forage_judgement', FORAGE_JUDGEMENTS);
export const queenEventKindEnum = pgEnum('queen_event_kind', QUEEN_EVENT_KINDS);
export const colonyEventKindEnum = pgEnum('colony_event_kind', COLONY_EVENT_KINDS);

const hiveRef = () =>
  uuid('hive_id')
    .notNull()
    .references(() => hives.id, { onDelete: 'cascade' });

/** A Quick check. Frame counts are in half-frame steps, so they are stored as real numbers. */
export const inspections = pgTable(
  'inspections',
  {
    ...recordColumns(),
    hiveId: hiveRef(),
    framesBrood: real('frames_brood').notNull(),
    framesBees: real('frames_bees').notNull(),
    honeyFrames: real('honey_frames').notNull().default(0),
    pollenFrames: real('pollen_frames').notNull().default(0),
    queenStatus: queenStatusEnum('queen_status').notNull(),
    eggsSeen: boolean('eggs_seen').notNull().default(false),
    youngLarvaeSeen: boolean('young_larvae_seen').notNull().default(false),
    queenCells: jsonb('queen_cells').$type<QueenCellObservation[]>().notNull().default([]),
    broodPattern: broodPatternEnum('brood_pattern'),
    temperament: integer('temperament'),
    diseaseSigns: diseaseSignEnum('disease_signs').array().notNull().default([]),
    spaceActions: spaceActionEnum('space_actions').array().notNull().default([]),
    weather: weatherEnum('weather'),
    airTempC: real('air_temp_c'),
  },
  (t) => [index('inspections_hive_time_idx').on(t.hiveId, t.occurredAt)],
);

/** Syrup is stored as litres of finished syrup; solid feeds as kilograms. */
export const feedings = pgTable(
  'feedings',
  {
    ...recordColumns(),
    hiveId: hiveRef(),
    kind: feedingKindEnum('kind').notNull(),
    ratio: syrupRatioEnum('ratio'),
    basis: syrupBasisEnum('basis'),
    amountL: real('amount_l'),
    amountKg: real('amount_kg'),
    feederType: feederTypeEnum('feeder_type'),
  },
  (t) => [index('feedings_hive_time_idx').on(t.hiveId, t.occurredAt)],
);

/** A treatment round, with the fields a veterinary medicine record needs. */
export const treatments = pgTable(
  'treatments',
  {
    ...recordColumns(),
    hiveId: hiveRef(),
    productName: text('product_name').notNull().default(''),
    activeIngredient: activeIngredientEnum('active_ingredient').notNull(),
    method: treatmentMethodEnum('method').notNull(),
    /** The dose as the label writes it; the app records it and does not prescribe. */
    dose: text('dose').notNull().default(''),
    batch: text('batch').notNull().default(''),
    startDate: date('start_date').notNull(),
    plannedEndDate: date('planned_end_date'),
    actualEndDate: date('actual_end_date'),
    /** Planned repeat doses or strip changes, from the label (YYYY-MM-DD). */
    schedule: jsonb('schedule').$type<string[]>().notNull().default([]),
    supersOff: boolean('supers_off').notNull().default(true),
    withdrawalUntil: date('withdrawal_until'),
    appliedBy: text('applied_by').notNull().default(''),
  },
  (t) => [index('treatments_hive_start_idx').on(t.hiveId, t.startDate)],
);

export const miteCounts = pgTable(
  'mite_counts',
  {
    ...recordColumns(),
    hiveId: hiveRef(),
    method: miteMethodEnum('method').notNull(),
    beesSampled: integer('bees_sampled'),
    mites: integer('mites').notNull(),
    /** Days the sticky board was in (sticky boards only). */
    days: real('days'),
  },
  (t) => [index('mite_counts_hive_time_idx').on(t.hiveId, t.occurredAt)],
);

export const harvests = pgTable(
  'harvests',
  {
    ...recordColumns(),
    hiveId: hiveRef(),
    supers: integer('supers').notNull().default(0),
    frames: integer('frames').notNull().default(0),
    weightKg: real('weight_kg'),
    moisturePercent: real('moisture_percent'),
  },
  (t) => [index('harvests_hive_time_idx').on(t.hiveId, t.occurredAt)],
);

export const queenEvents = pgTable(
  'queen_events',
  {
    ...recordColumns(),
    hiveId: hiveRef(),
    kind: queenEventKindEnum('kind').notNull(),
  },
  (t) => [index('queen_events_hive_time_idx').on(t.hiveId, t.occurredAt)],
);

export const colonyEvents = pgTable(
  'colony_events',
  {
    ...recordColumns(),
    hiveId: hiveRef(),
    kind: colonyEventKindEnum('kind').notNull(),
    /** The other hive of a split or combine, when it is in Frameside. */
    otherHiveId: uuid('other_hive_id').references(() => hives.id, { onDelete: 'set null' }),
  },
  (t) => [index('colony_events_hive_time_idx').on(t.hiveId, t.occurredAt)],
);

/** A Forage check, per apiary: a syrup-dish test or a plain judgement. */
export const forageChecks = pgTable(
  'forage_checks',
  {
    ...recordColumns(),
    apiaryId: uuid('apiary_id')
      .notNull()
      .references(() => apiaries.id, { onDelete: 'cascade' }),
    /** Minutes until the bees emptied the dish; null when untouched or not a dish test. */
    minutesToEmpty: real('minutes_to_empty'),
    /** How long the keeper watched, for a dish left untouched. */
    watchedMinutes: real('watched_minutes'),
    untouched: boolean('untouched').notNull().default(false),
    judgement: forageJudgementEnum('judgement').notNull(),
  },
  (t) => [index('forage_checks_apiary_time_idx').on(t.apiaryId, t.occurredAt)],
);
