/**
 * Closed lists for the record forms and DB enums, and the record shapes the Due-list rules
 * read. Lists that already live elsewhere in shared/domain are re-exported, so each list has
 * one home. Dates are 'YYYY-MM-DD'; amounts carry their unit in the name.
 */

import type { IsoDate } from './dates';
import type { MiteMethod } from './mites';
import type { ForageJudgement } from './forage';
import type { FrameSize } from './hives';

export { ROLES, type Role } from './access';
export { FRAME_SIZES, HEMISPHERES, HIVE_STATUSES, type FrameSize, type Hemisphere, type HiveStatus } from './hives';
export { MITE_METHODS, type MiteMethod } from './mites';
export { FORAGE_JUDGEMENTS, type ForageJudgement } from './forage';

export const QUEEN_STATUSES = ['queen-seen', 'eggs-seen', 'young-larvae-only', 'no-eggs-or-brood'] as const;
export type QueenStatus = (typeof QUEEN_STATUSES)[number];

export const QUEEN_CELL_KINDS = ['swarm', 'supersedure', 'emergency'] as const;
export type QueenCellKind = (typeof QUEEN_CELL_KINDS)[number];

export const BROOD_PATTERNS = ['solid', 'patchy', 'spotty'] as const;
export type BroodPattern = (typeof BROOD_PATTERNS)[number];

/** Temperament words for scores 1 (calm) to 5 (very defensive): TEMPERAMENTS[score − 1]. */
export const TEMPERAMENTS = ['calm', 'steady', 'nervous', 'defensive', 'very-defensive'] as const;
export type Temperament = (typeof TEMPERAMENTS)[number];
export const TEMPERAMENT_SCORES = [1, 2, 3, 4, 5] as const;
export type TemperamentScore = (typeof TEMPERAMENT_SCORES)[number];

/** The word for a temperament score 1–5; RangeError for any other score. */
export function temperamentWord(score: number): Temperament {
  if (!Number.isInteger(score) || score < 1 || score > 5) throw new RangeError('Temperament is scored 1 (calm) to 5 (very defensive).');
  return TEMPERAMENTS[score - 1];
}

export const DISEASE_SIGNS = [
  'chalkbrood',
  'sacbrood',
  'suspected-foulbrood',
  'deformed-wings',
  'small-hive-beetle',
  'wax-moth',
  'other',
] as const;
export type DiseaseSign = (typeof DISEASE_SIGNS)[number];

export const SPACE_ACTIONS = ['super-added', 'super-removed', 'box-added', 'box-removed', 'feeder-on', 'feeder-off'] as const;
export type SpaceAction = (typeof SPACE_ACTIONS)[number];

export const WEATHER = ['sunny', 'cloudy', 'overcast', 'windy', 'light-rain'] as const;
export type Weather = (typeof WEATHER)[number];

export const FEEDING_KINDS = ['syrup', 'fondant', 'pollen-patty', 'other'] as const;
export type FeedingKind = (typeof FEEDING_KINDS)[number];

export const SYRUP_RATIOS = ['1:1', '2:1', 'other'] as const;
export type SyrupRatio = (typeof SYRUP_RATIOS)[number];

export const SYRUP_BASES = ['weight', 'volume'] as const;
export type SyrupBasis = (typeof SYRUP_BASES)[number];

export const FEEDER_TYPES = ['frame-feeder', 'top-feeder', 'contact-feeder', 'entrance-feeder', 'bag-feeder', 'other'] as const;
export type FeederType = (typeof FEEDER_TYPES)[number];

export const TREATMENT_ACTIVE_INGREDIENTS = ['oxalic-acid', 'formic-acid', 'thymol', 'amitraz', 'hop-beta-acids', 'other'] as const;
export type TreatmentActiveIngredient = (typeof TREATMENT_ACTIVE_INGREDIENTS)[number];

export const TREATMENT_METHODS = ['vaporisation', 'dribble', 'strips', 'pads', 'gel', 'other'] as const;
export type TreatmentMethod = (typeof TREATMENT_METHODS)[number];

export const QUEEN_EVENT_KINDS = ['introduced-caged', 'released', 'seen', 'marked', 'clipped', 'lost', 'superseded', 'replaced'] as const;
export type QueenEventKind = (typeof QUEEN_EVENT_KINDS)[number];

export const COLONY_EVENT_KINDS = ['split-from', 'split-to', 'combined', 'swarmed', 'dead-out', 'moved'] as const;
export type ColonyEventKind = (typeof COLONY_EVENT_KINDS)[number];

/** What a person can do with a Due-list task. */
export const TASK_RESOLUTIONS = ['done', 'snoozed', 'dismissed'] as const;
export type TaskResolution = (typeof TASK_RESOLUTIONS)[number];

export interface QueenCellObservation {
  kind: QueenCellKind;
  count: number;
  capped: boolean;
}

/** A Quick check. Frame counts are whole or half frames. */
export interface InspectionRecord {
  id: string;
  date: IsoDate;
  queenStatus: QueenStatus;
  eggsSeen: boolean;
  queenCells: readonly QueenCellObservation[];
  framesBrood: number;
  framesBees: number;
  honeyFrames: number;
  pollenFrames: number;
  diseaseSigns: readonly DiseaseSign[];
  spaceActions: readonly SpaceAction[];
  broodPattern?: BroodPattern;
  temperament?: TemperamentScore;
  weather?: Weather;
}

/** A feeding: syrup in litres of finished syrup, solid feed in kg. */
export interface FeedingRecord {
  id: string;
  date: IsoDate;
  kind: FeedingKind;
  ratio?: SyrupRatio;
  basis?: SyrupBasis;
  amountL?: number;
  amountKg?: number;
  feederType?: FeederType;
}

/** A varroa treatment round. Dates the label sets (end, withdrawal) are entered from the label. */
export interface TreatmentRecord {
  id: string;
  activeIngredient: TreatmentActiveIngredient;
  method: TreatmentMethod;
  startDate: IsoDate;
  plannedEndDate?: IsoDate;
  actualEndDate?: IsoDate;
  /** The next dose, strip change or check the label calls for. */
  nextStepDate?: IsoDate;
  /** All planned steps of the round (repeat doses, strip changes), if entered. */
  schedule?: readonly IsoDate[];
  /** True when supers were taken off for this treatment. */
  supersOff: boolean;
  /** Date from which supers for harvest may go back on, from the label. */
  withdrawalUntil?: IsoDate;
}

export interface MiteCountRecord {
  id: string;
  date: IsoDate;
  method: MiteMethod;
  mites: number;
  beesSampled?: number;
  days?: number;
}

export interface QueenEventRecord {
  id: string;
  date: IsoDate;
  kind: QueenEventKind;
}

export interface ColonyEventRecord {
  id: string;
  date: IsoDate;
  kind: ColonyEventKind;
}

/** A stores estimate, kg of honey (e.g. from estimateStores or hefting). */
export interface StoresEstimateRecord {
  id: string;
  date: IsoDate;
  storesKg: number;
}

export interface ForageCheckRecord {
  id: string;
  date: IsoDate;
  judgement: ForageJudgement;
  minutesToEmpty?: number;
}

export interface HarvestRecord {
  id: string;
  date: IsoDate;
  frames?: number;
  frameSize?: FrameSize;
  weightKg?: number;
  moisturePercent?: number;
}

/** Everything recorded for one hive, as the Due-list rules read it. Missing lists count as empty. */
export interface HiveRecords {
  inspections?: readonly InspectionRecord[];
  feedings?: readonly FeedingRecord[];
  treatments?: readonly TreatmentRecord[];
  miteCounts?: readonly MiteCountRecord[];
  queenEvents?: readonly QueenEventRecord[];
  colonyEvents?: readonly ColonyEventRecord[];
  storesEstimates?: readonly StoresEstimateRecord[];
}
