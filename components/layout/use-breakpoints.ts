import { useWindowDimensions } from 'react-native';

/** Named widths in CSS px: phones below `medium`, tablets and small laptops up to `wide`. */
export const breakpoints = {
  /** Below this: one column, bottom nav. Designed at 390, usable from 320. */
  medium: 600,
  /** From here: side rail and two panes. */
  wide: 1024,
} as const;

export interface Breakpoints {
  width: number;
  isCompact: boolean;
  isMedium: boolean;
  isWide: boolean;
  /** Medium or wide: room for two columns of cards. */
  gtCompact: boolean;
}

/** The one place that reads the window width; components ask for a name, not a number. */
export function useBreakpoints(): Breakpoints {
  const { width } = useWindowDimensions();
  const isWide = width >= breakpoints.wide;
  const gtCompact = width >= breakpoints.medium;
  return { width, isCompact: !gtCompact, isMedium: gtCompact && !isWide, isWide, gtCompact };
}
