/** The written words for every closed list the record forms offer as chips. */
import type {
  BroodPattern,
  ColonyEventKind,
  DiseaseSign,
  FeederType,
  FeedingKind,
  QueenCellKind,
  QueenEventKind,
  QueenStatus,
  SpaceAction,
  SyrupBasis,
  SyrupRatio,
  TreatmentActiveIngredient,
  TreatmentMethod,
  Weather,
} from '@/shared/domain/records';
import type { MiteMethod } from '@/shared/domain/mites';
import type { ForageJudgement } from '@/shared/domain/forage';
import type { ChipOption } from '@/components/ui/choice-chips';

export const QUEEN_STATUS_LABELS: Readonly<Record<QueenStatus, string>> = {
  'queen-seen': 'Queen seen',
  'eggs-seen': 'Eggs seen',
  'young-larvae-only': 'Young larvae only',
  'no-eggs-or-brood': 'No eggs or young brood',
};

export const QUEEN_CELL_KIND_LABELS: Readonly<Record<QueenCellKind, string>> = {
  swarm: 'Swarm cells',
  supersedure: 'Supersedure cells',
  emergency: 'Emergency cells',
};

export const BROOD_PATTERN_LABELS: Readonly<Record<BroodPattern, string>> = {
  solid: 'Solid',
  patchy: 'Patchy',
  spotty: 'Spotty',
};

/** Temperament 1–5 with its word, written on the chip: "1 · calm". */
export const TEMPERAMENT_LABELS: Readonly<Record<'1' | '2' | '3' | '4' | '5', string>> = {
  '1': '1 · Calm',
  '2': '2 · Steady',
  '3': '3 · Nervous',
  '4': '4 · Defensive',
  '5': '5 · Very defensive',
};

export const DISEASE_SIGN_LABELS: Readonly<Record<DiseaseSign, string>> = {
  chalkbrood: 'Chalkbrood',
  sacbrood: 'Sacbrood',
  'suspected-foulbrood': 'Suspected foulbrood',
  'deformed-wings': 'Deformed wings',
  'small-hive-beetle': 'Small hive beetle',
  'wax-moth': 'Wax moth',
  other: 'Other',
};

export const SPACE_ACTION_LABELS: Readonly<Record<SpaceAction, string>> = {
  'super-added': 'Super added',
  'super-removed': 'Super removed',
  'box-added': 'Box added',
  'box-removed': 'Box removed',
  'feeder-on': 'Feeder on',
  'feeder-off': 'Feeder off',
};

export const WEATHER_LABELS: Readonly<Record<Weather, string>> = {
  sunny: 'Sunny',
  cloudy: 'Cloudy',
  overcast: 'Overcast',
  windy: 'Windy',
  'light-rain': 'Light rain',
};

export const FEEDING_KIND_LABELS: Readonly<Record<FeedingKind, string>> = {
  syrup: 'Syrup',
  fondant: 'Fondant',
  'pollen-patty': 'Pollen patty',
  other: 'Other',
};

export const SYRUP_RATIO_LABELS: Readonly<Record<SyrupRatio, string>> = {
  '1:1': '1:1 (thin)',
  '2:1': '2:1 (heavy)',
  other: 'Other',
};

export const SYRUP_BASIS_LABELS: Readonly<Record<SyrupBasis, string>> = {
  weight: 'By weight',
  volume: 'By volume',
};

export const FEEDER_TYPE_LABELS: Readonly<Record<FeederType, string>> = {
  'frame-feeder': 'Frame feeder',
  'top-feeder': 'Top feeder',
  'contact-feeder': 'Contact feeder',
  'entrance-feeder': 'Entrance feeder',
  'bag-feeder': 'Bag feeder',
  other: 'Other',
};

export const ACTIVE_INGREDIENT_LABELS: Readonly<Record<TreatmentActiveIngredient, string>> = {
  'oxalic-acid': 'Oxalic acid',
  'formic-acid': 'Formic acid',
  thymol: 'Thymol',
  amitraz: 'Amitraz',
  'hop-beta-acids': 'Hop beta acids',
  other: 'Other',
};

export const TREATMENT_METHOD_LABELS: Readonly<Record<TreatmentMethod, string>> = {
  vaporisation: 'Vaporisation',
  dribble: 'Dribble',
  strips: 'Strips',
  pads: 'Pads',
  gel: 'Gel',
  other: 'Other',
};

export const MITE_METHOD_LABELS: Readonly<Record<MiteMethod, string>> = {
  'alcohol-wash': 'Alcohol wash',
  'sugar-roll': 'Sugar roll',
  'sticky-board': 'Sticky board',
};

export const FORAGE_JUDGEMENT_LABELS: Readonly<Record<ForageJudgement, string>> = {
  flow: 'Flow',
  some: 'Some forage',
  dearth: 'Dearth',
};

export const QUEEN_EVENT_LABELS: Readonly<Record<QueenEventKind, string>> = {
  'introduced-caged': 'Introduced (caged)',
  released: 'Released',
  seen: 'Seen',
  marked: 'Marked',
  clipped: 'Clipped',
  lost: 'Lost',
  superseded: 'Superseded',
  replaced: 'Replaced',
};

export const COLONY_EVENT_LABELS: Readonly<Record<ColonyEventKind, string>> = {
  'split-from': 'Split from another hive',
  'split-to': 'Split into a new hive',
  combined: 'Combined',
  swarmed: 'Swarmed',
  'dead-out': 'Dead-out',
  moved: 'Moved',
};

/** Chip options from a closed list and its labels, in the list's order. */
export function optionsOf<T extends string>(list: readonly T[], labels: Readonly<Record<T, string>>): ChipOption<T>[] {
  return list.map((value) => ({ value, label: labels[value] }));
}
