/**
 * Queen marking colours: the international five-year code. Common practice (the trade's
 * convention; not a TRADE-REFERENCES value): years ending 1/6 white, 2/7 yellow, 3/8 red,
 * 4/9 green, 5/0 blue.
 */
import { QUEEN_MARK_COLOURS, queenMarkColour } from '../../shared/domain/queen';

describe('queenMarkColour (common practice: international five-year code)', () => {
  it('lists the colours in code order', () => {
    expect(QUEEN_MARK_COLOURS).toEqual(['white', 'yellow', 'red', 'green', 'blue']);
  });

  it.each([
    [2021, 'white'],
    [2022, 'yellow'],
    [2023, 'red'],
    [2024, 'green'],
    [2025, 'blue'],
    [2026, 'white'],
    [2027, 'yellow'],
    [2028, 'red'],
    [2029, 'green'],
    [2030, 'blue'],
    [2020, 'blue'],
    [2016, 'white'],
    [1999, 'green'],
  ] as const)('a queen of %s is marked %s (common practice)', (year, colour) => {
    expect(queenMarkColour(year)).toBe(colour);
  });

  it.each([2025.5, Number.NaN])('rejects %s as a year (RangeError)', (year) => {
    expect(() => queenMarkColour(year)).toThrow(RangeError);
  });
});
