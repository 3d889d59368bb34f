/** Native has no print: nothing to install. */
export function usePrintStyle(): void {}
export function printPage(): void {}
export const canPrint = false;

/** Marks a box for the print stylesheet: 'hide' leaves it off paper, 'keep' keeps it on one page. react-native-web writes dataSet as data-* attributes. */
export const printMark = (v: 'hide' | 'keep') => ({ dataSet: { print: v } }) as Record<string, unknown>;
