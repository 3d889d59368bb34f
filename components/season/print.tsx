/** Printing is a web feature; on a phone app these render nothing. See print.web.tsx. */
export function PrintStyle() {
  return null;
}

export function usePrinting(): boolean {
  return false;
}

export const canPrint = false;

export const PRINT_WIDTH = 620;

export function printPage() {}

/** Opens an attachment URL; on native there is no download folder to put it in. */
export function download(_url: string) {}
