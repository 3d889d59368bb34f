import type { Box, HiveStatus, MarkColour, QueenLifeStatus, QueenOrigin } from '@/shared/domain/hives';
import type { HiveCreateInput, HiveDto, HiveUpdateInput } from '@/shared/schemas/hives';

/**
 * The hive form's values: the request body's shape, plus the two switches the controls need
 * ("is a queen recorded", "is her year known") so a hidden section keeps its choices while
 * the keeper toggles it. Paths match the schema's, so zod's errors land on the right control.
 */
export interface QueenFormValues {
  origin: QueenOrigin;
  year: number;
  yearKnown: boolean;
  markColour: MarkColour;
  clipped: boolean;
  status: QueenLifeStatus;
}

export interface HiveFormValues {
  name: string;
  boxes: Box[];
  status: HiveStatus;
  hasQueen: boolean;
  queen: QueenFormValues;
}

export const MAX_BOXES = 8;
export const FRAMES_MIN = 1;
export const FRAMES_MAX = 12;
export const QUEEN_YEAR_MIN = 1990;

const thisYear = () => new Date().getFullYear();
export const queenYearMax = () => thisYear() + 1;

export function newHiveValues(): HiveFormValues {
  return {
    name: '',
    // Most hives start as one deep brood box of ten frames.
    boxes: [{ size: 'deep', frames: 10 }],
    status: 'active',
    hasQueen: true,
    queen: { origin: 'unknown', year: thisYear(), yearKnown: true, markColour: 'unmarked', clipped: false, status: 'present' },
  };
}

export function hiveToValues(hive: HiveDto): HiveFormValues {
  const q = hive.queen;
  return {
    name: hive.name,
    boxes: hive.boxes.map((b) => ({ ...b })),
    status: hive.status,
    hasQueen: q !== null,
    queen: q
      ? { origin: q.origin, year: q.year ?? thisYear(), yearKnown: q.year !== null, markColour: q.markColour, clipped: q.clipped, status: q.status }
      : newHiveValues().queen,
  };
}

/** Every queen field filled in: the form always knows them, and the update schema wants them all. */
type QueenBody = NonNullable<HiveUpdateInput['queen']>;

function toQueenInput(v: HiveFormValues): QueenBody | null {
  if (!v.hasQueen) return null;
  const { yearKnown, year, ...rest } = v.queen;
  return { ...rest, year: yearKnown ? year : null };
}

export function toCreateInput(v: HiveFormValues): HiveCreateInput {
  return { name: v.name, boxes: v.boxes, status: v.status, queen: toQueenInput(v) };
}

/** The edit sends the version it started from; the server answers 409 if someone saved since. */
export function toUpdateInput(v: HiveFormValues, version?: number): HiveUpdateInput {
  return { name: v.name, boxes: v.boxes, status: v.status, queen: toQueenInput(v), ...(version === undefined ? {} : { version }) };
}
