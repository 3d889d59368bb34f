import { z } from 'zod';
import type { WeightTrend } from '../domain/forage';
import type { MiteLevel } from '../domain/mites';
import type { SensorPoint } from './sensors';

export const seasonQuerySchema = z
  .object({
    season: z.coerce
      .number({ message: 'The season is a year, like 2026.' })
      .int({ message: 'The season is a year, like 2026.' })
      .min(2000, { message: 'The season is a year from 2000 on.' })
      .max(2100, { message: 'The season is a year before 2100.' })
      .optional(),
  })
  .strict();

export const SEASON_RECORD_KINDS = ['inspection', 'feeding', 'treatment', 'mite-count', 'harvest', 'queen-event', 'colony-event'] as const;
export type SeasonRecordKind = (typeof SEASON_RECORD_KINDS)[number];

/** One row of the season's record table, and what a chart mark shows when tapped or hovered. */
export interface SeasonRecord {
  id: string;
  kind: SeasonRecordKind;
  hiveId: string;
  hiveName: string;
  /** ISO instant the record happened (a treatment: its start). */
  at: string;
  /** One plain line: "6 frames of brood, 9 of bees, queen seen". */
  summary: string;
  recordedBy: string;
  note: string;
}

export interface SeasonInspection {
  id: string;
  at: string;
  framesBrood: number;
  framesBees: number;
  honeyFrames: number;
  /** estimateStores midpoint for the honey frames, kg. */
  storesKg: number;
}

export interface SeasonFeeding {
  id: string;
  at: string;
  kind: string;
  /** Sugar in the syrup (mixSyrup on the litres and ratio), or the kg of fondant; null when unknown. */
  sugarKg: number | null;
}

export interface SeasonTreatment {
  id: string;
  activeIngredient: string;
  productName: string;
  start: string;
  /** Actual end, else planned end, else the start (one-day span). */
  end: string;
  ended: boolean;
}

export interface SeasonMiteCount {
  id: string;
  at: string;
  method: string;
  perHundredBees: number | null;
  perDay: number | null;
  level: MiteLevel;
}

export interface SeasonHarvest {
  id: string;
  at: string;
  weightKg: number | null;
}

export interface SeasonWeightDay {
  date: string;
  deltaKg: number;
  trend: WeightTrend;
}

export interface SeasonSensors {
  points: SensorPoint[];
  bucketMinutes: number;
  readings: number;
  weightDays: SeasonWeightDay[];
}

export interface SeasonTotals {
  honeyHarvestedKg: number;
  sugarFedKg: number;
  treatments: number;
  peakBrood: { frames: number; at: string; hiveName: string } | null;
  inspections: number;
}

export interface HiveSeason {
  id: string;
  name: string;
  /** Frame size the honey frames are counted as (the bottom box's). */
  honeyFrameSize: string;
  inspections: SeasonInspection[];
  feedings: SeasonFeeding[];
  treatments: SeasonTreatment[];
  miteCounts: SeasonMiteCount[];
  harvests: SeasonHarvest[];
  sensors: SeasonSensors | null;
  totals: SeasonTotals;
}

/** Published values the charts draw, with their sources, so the legend names them. */
export interface SeasonReferences {
  miteThresholdPerHundred: number;
  miteThresholdSource: string;
  broodNestLowC: number;
  broodNestHighC: number;
  broodNestSource: string;
  weightDaySource: string;
}

export interface SeasonDto {
  season: number;
  /** The season's range, ISO instants: [from, to). */
  from: string;
  to: string;
  scope: 'hive' | 'apiary';
  apiary: { id: string; name: string; hemisphere: string };
  hives: HiveSeason[];
  records: SeasonRecord[];
  totals: SeasonTotals;
  references: SeasonReferences;
}
