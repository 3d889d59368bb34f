/**
 * Frameside's design tokens: the only file in the client that holds colour codes.
 * Components read these through `useTheme()`.
 *
 * Palette: smoker-ash charcoal on warm wax cream, field green for healthy/done, brick red for
 * overdue/warning. Contrast ratios (WCAG 2.x relative luminance, measured for these exact
 * values; AA needs 4.5:1 for text and 3:1 for control outlines and focus rings):
 *
 *   ink        on bg        12.30   body text, headings, focus ring
 *   ink        on surface   13.53   text on cards and unselected controls
 *   ink        on sunk      10.65   text on pressed secondary controls
 *   ink        on greenTint 11.36   text on "done" panels
 *   ink        on redTint   10.99   text on warning panels
 *   inkMuted   on bg         6.52   secondary text
 *   inkMuted   on surface    7.17
 *   inkMuted   on sunk       5.65   disabled labels stay readable
 *   onInk      on ink       12.30   primary button label, selected chip label
 *   onInk      on inkPressed 8.29   primary button while pressed
 *   green      on bg         5.60   "done"/healthy text and icons
 *   green      on surface    6.16
 *   onInk      on green      5.60   label on a green fill
 *   red        on bg         5.85   error and overdue text
 *   red        on surface    6.43
 *   red        on redTint    5.23
 *   onInk      on red        5.85   danger button label
 *   onInk      on redPressed 8.14   danger button while pressed
 *   line       on bg         3.67   borders of unselected controls (non-text, 3:1)
 *   line       on surface    4.04
 *
 * Queen marking swatches are never the only cue (the colour name is always written) and sit
 * inside an ink outline, so their own contrast does not carry meaning.
 */

export const colours = {
  /** Warm wax cream: the page. */
  bg: '#F6EFE1',
  /** Lighter wax: cards, unselected controls. */
  surface: '#FFFAF0',
  /** Darker wax: pressed secondary controls, quiet panels. */
  sunk: '#EADFC9',
  /** Smoker ash: text, primary fills, focus ring. */
  ink: '#2E2B28',
  inkPressed: '#4A453F',
  inkMuted: '#5B544B',
  /** Text and icons placed on an ink, green or red fill. */
  onInk: '#F6EFE1',
  /** Outline of unselected controls and dividers. */
  line: '#857A6C',
  /** Field green: healthy, done. */
  green: '#2C6B3C',
  greenPressed: '#21522E',
  greenTint: '#DDEBD8',
  /** Brick red: overdue, warning, errors, destructive actions. */
  red: '#A3372A',
  redPressed: '#7F2A20',
  redTint: '#F7DED8',
} as const;

/** The conventional queen marking paints, shown as swatches next to their written name. */
export const markSwatch = {
  white: '#FFFFFF',
  yellow: '#F2C200',
  red: '#C8302B',
  green: '#2F8F3E',
  blue: '#2463B8',
} as const;

/** 4-px grid; `gap` between touch targets is `targetGap` below. */
export const space = {
  xxs: 4,
  xs: 8,
  sm: 12,
  md: 16,
  lg: 24,
  xl: 32,
  xxl: 48,
} as const;

/** Sizes in CSS px. Body text is 18 rather than 16: read at arm's length, through a veil, in sun. */
export const fontSize = {
  small: 16,
  body: 18,
  label: 18,
  button: 20,
  heading: 22,
  title: 28,
  display: 34,
} as const;

export const lineHeight = {
  small: 22,
  body: 26,
  label: 24,
  button: 24,
  heading: 28,
  title: 34,
  display: 40,
} as const;

/**
 * Family names as registered with expo-font in app/_layout.tsx. One family per weight, because
 * expo-font's web @font-face carries no weight, and asking a bold face for fontWeight 700 would
 * be synthesised bolder still. The regular face keeps the typeface's own name, which is what
 * `document.fonts` checks look for.
 */
export const fontFamily = {
  regular: 'Atkinson Hyperlegible',
  bold: 'Atkinson Hyperlegible Bold',
  italic: 'Atkinson Hyperlegible Italic',
} as const;

export const radius = {
  sm: 6,
  md: 10,
  lg: 16,
  pill: 999,
} as const;

export const borderWidth = {
  thin: 2,
  /** Selected chips and focused fields: a shape cue that does not depend on colour. */
  thick: 4,
} as const;

/** Gloved-thumb minimum for every control (CSS px), and the space kept between two targets. */
export const minTarget = 64;
export const targetGap = 12;

export const tokens = {
  colours,
  markSwatch,
  space,
  fontSize,
  lineHeight,
  fontFamily,
  radius,
  borderWidth,
  minTarget,
  targetGap,
} as const;

export type Tokens = typeof tokens;
