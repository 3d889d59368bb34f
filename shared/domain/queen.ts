/**
 * Queen marking colour by year: the international five-year code (common practice: the trade's
 * convention, not a value from TRADE-REFERENCES).
 */

import type { MarkColour } from './hives';

/** The five marking colours, in the order of years ending 1/6, 2/7, 3/8, 4/9, 5/0. */
export const QUEEN_MARK_COLOURS = ['white', 'yellow', 'red', 'green', 'blue'] as const;
export type QueenMarkColour = (typeof QUEEN_MARK_COLOURS)[number];

// Keeps this list a subset of the hive record's colours (which add 'unmarked').
const _fitsHiveRecord: readonly MarkColour[] = QUEEN_MARK_COLOURS;
void _fitsHiveRecord;

/** The marking colour for a queen of `year` (years ending 1/6 white, 2/7 yellow, 3/8 red, 4/9 green, 5/0 blue); RangeError unless `year` is a whole number. */
export function queenMarkColour(year: number): QueenMarkColour {
  if (!Number.isInteger(year)) throw new RangeError(`A year is a whole number, got ${year}.`);
  // Years ending 1 and 6 start the cycle; ((y - 1) mod 5) indexes the list for any sign of y.
  const index = (((year - 1) % 5) + 5) % 5;
  return QUEEN_MARK_COLOURS[index];
}
