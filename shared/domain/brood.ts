/**
 * Brood calendar: what hatches, is capped and emerges when, counted in whole days from the
 * day the egg was laid (day 0). Offsets: TRADE-REFERENCES §1 "Note for tests".
 */

import { addDays, type IsoDate } from './dates';

export const CASTES = ['queen', 'worker', 'drone'] as const;
export type Caste = (typeof CASTES)[number];

/** The day a calendar is counted from: the egg being laid, or the cell being capped (counted back). */
export type BroodAnchor = 'egg-laid' | 'cell-capped';

interface CasteOffsets {
  hatch: number;
  capped: number;
  emerges: number;
}

/**
 * Day offsets from egg-laying. Egg hatches d3 for all castes (§1, Wikipedia / Sanford, confirmed
 * secondary). Queen capped d8, emerges d16 (W. Shaw, Welsh BKA, confirmed secondary). Worker
 * capped d9 and drone capped d10 are 3 + larval days (§1: derived / from memory); emergence
 * worker d21, drone d24 (Winston 1987 via Sanford, confirmed secondary).
 */
export const BROOD_OFFSETS_DAYS: Readonly<Record<Caste, CasteOffsets>> = {
  queen: { hatch: 3, capped: 8, emerges: 16 },
  worker: { hatch: 3, capped: 9, emerges: 21 },
  drone: { hatch: 3, capped: 10, emerges: 24 },
};

/**
 * Queen milestones after the cell (days from egg-laying):
 * - mature d21: emergence d16 + 5 d, the early end of "sexually mature five to six days after
 *   emergence" (McNeil, The Hive and the Honey Bee, via AHPA; §1), so the range is d21–22.
 * - earliestLaying d23: maturity d21 + the minimum 2 d from mating to first eggs (BBKA via
 *   Trunch BKA, "min. 2-3 days"), which agrees with Wikipedia's "Egg Laying ~Day 23 and up".
 * - worryIfNoEggsBy d37: emergence + 21 d, the top of the BBKA planning range "emergence to
 *   laying two and three weeks (14-21 days)" after which the same page says to worry (§1).
 *   The later date is chosen so a keeper is not told to worry while laying is still normal.
 */
export const QUEEN_MILESTONE_DAYS = { mature: 21, earliestLaying: 23, worryIfNoEggsBy: 37 } as const;

export interface BroodCalendarInput {
  caste: Caste;
  from: BroodAnchor;
  /** The egg-laying or capping day, 'YYYY-MM-DD'. */
  date: IsoDate;
}

export interface BroodCalendar {
  eggLaid: IsoDate;
  hatch: IsoDate;
  capped: IsoDate;
  emerges: IsoDate;
}

export interface QueenBroodCalendar extends BroodCalendar {
  mature: IsoDate;
  earliestLaying: IsoDate;
  worryIfNoEggsBy: IsoDate;
}

/** Dates ('YYYY-MM-DD') of hatch, capping and emergence for a caste, plus maturity, earliest laying and the worry date for a queen; 'cell-capped' counts back to the laying day. Throws a RangeError for an unknown caste or anchor, or a bad date. */
export function broodCalendar(input: BroodCalendarInput & { caste: 'queen' }): QueenBroodCalendar;
export function broodCalendar(input: BroodCalendarInput): BroodCalendar | QueenBroodCalendar;
export function broodCalendar(input: BroodCalendarInput): BroodCalendar | QueenBroodCalendar {
  const offsets = BROOD_OFFSETS_DAYS[input.caste];
  if (!offsets) throw new RangeError(`Caste is queen, worker or drone, got ${String(input.caste)}.`);
  if (input.from !== 'egg-laid' && input.from !== 'cell-capped') {
    throw new RangeError(`Count from 'egg-laid' or 'cell-capped', got ${String(input.from)}.`);
  }
  const eggLaid = input.from === 'egg-laid' ? addDays(input.date, 0) : addDays(input.date, -offsets.capped);
  const base: BroodCalendar = {
    eggLaid,
    hatch: addDays(eggLaid, offsets.hatch),
    capped: addDays(eggLaid, offsets.capped),
    emerges: addDays(eggLaid, offsets.emerges),
  };
  if (input.caste !== 'queen') return base;
  return {
    ...base,
    mature: addDays(eggLaid, QUEEN_MILESTONE_DAYS.mature),
    earliestLaying: addDays(eggLaid, QUEEN_MILESTONE_DAYS.earliestLaying),
    worryIfNoEggsBy: addDays(eggLaid, QUEEN_MILESTONE_DAYS.worryIfNoEggsBy),
  };
}
