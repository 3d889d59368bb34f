import { useEffect } from 'react';

const ID = 'frameside-print-style';

/*
 * Printing a react-native-web page: every box is a flex column of the viewport's height with its
 * own scrolling, so the printer would get one screenful. For print, heights go back to "as tall
 * as the content", scrolling turns off, and the app's navigation and every button are left out
 * (a sheet of paper cannot be tapped).
 */
const CSS = `
@media print {
  @page { margin: 12mm 10mm; }
  /* Paper is narrower than a desk screen: a smaller scale keeps the two-column layout and two pages at most. */
  html { zoom: 0.72; }
  html, body, #root, #root * { height: auto !important; min-height: 0 !important; max-height: none !important; overflow: visible !important; }
  #root * { flex-shrink: 0 !important; }
  [role="navigation"], [role="button"], [data-print="hide"] { display: none !important; }
  body { background: #fff !important; }
  [data-print="keep"] { break-inside: avoid; }
}`;

/** Adds the print stylesheet while the screen is shown. */
export function usePrintStyle(): void {
  useEffect(() => {
    if (typeof document === 'undefined' || document.getElementById(ID)) return;
    const el = document.createElement('style');
    el.id = ID;
    el.textContent = CSS;
    document.head.appendChild(el);
    return () => el.remove();
  }, []);
}

export function printPage(): void {
  if (typeof window !== 'undefined') window.print();
}

export const canPrint = true;

/** Marks a box for the print stylesheet: 'hide' leaves it off paper, 'keep' keeps it on one page. react-native-web writes dataSet as data-* attributes. */
export const printMark = (v: 'hide' | 'keep') => ({ dataSet: { print: v } }) as Record<string, unknown>;
