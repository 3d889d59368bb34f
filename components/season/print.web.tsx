import { useEffect, useState } from 'react';
import { API_BASE } from '@/components/api/client';
import { colours } from '@/components/theme/tokens';

// react-native-web renders through react-dom; flushSync makes the print layout land before the browser snapshots the page.
// eslint-disable-next-line @typescript-eslint/no-require-imports
const { flushSync } = require('react-dom') as { flushSync: (fn: () => void) => void };

/**
 * Width the charts are drawn at for paper, CSS px: A4 (210 mm) and US Letter (8.5 in) both fit
 * 186 mm ≈ 703 px between 12 mm margins, less the page column's own 2 × 32 px padding: 620
 * serves both.
 */
export const PRINT_WIDTH = 620;

/**
 * The print stylesheet: A4 or Letter, the app's navigation, controls and buttons left off, the
 * page allowed to run over several sheets (the screen layout scrolls inside a fixed-height
 * box), and the wide-screen columns stacked to the paper's width.
 */
const CSS = `
@page { size: auto; margin: 12mm; }
@media print {
  html, body, #root { height: auto !important; min-height: 0 !important; overflow: visible !important; background: ${colours.surface} !important; }
  #root div { overflow: visible !important; }
  #root div:has(> [data-testid="season-screen"]), [data-testid="season-screen"], [data-testid="season-screen"] div { height: auto !important; max-height: none !important; flex-shrink: 0 !important; }
  [role="navigation"], div:has(> [data-testid="nav-sign-out"]), [data-testid="season-controls"], [data-print="hide"],
  [data-testid="season-selection"], [data-testid="season-table-controls"], [data-testid="season-back"] { display: none !important; }
  [data-testid="season-columns"] { flex-direction: column !important; }
  [data-testid="season-columns"] > div { width: 100% !important; max-width: 100% !important; flex-basis: auto !important; }
  [data-testid="season-screen"] svg { max-width: 100% !important; height: auto !important; }
  [data-testid^="season-chart-h"], [data-testid^="season-hive-"] { break-inside: avoid; page-break-inside: avoid; }
  [data-testid="season-table-row"] { break-inside: avoid; page-break-inside: avoid; }
}
`;

export function PrintStyle() {
  return <style dangerouslySetInnerHTML={{ __html: CSS }} />;
}

/**
 * True while the page is being printed: the Season review then draws its charts at paper
 * width and stacks its columns. Chrome and Firefox fire beforeprint and the print media query;
 * both are listened to, and the state is flushed at once so the printout sees the new layout.
 */
export function usePrinting(): boolean {
  const [printing, setPrinting] = useState(() => typeof window !== 'undefined' && window.matchMedia?.('print').matches === true);
  useEffect(() => {
    const set = (v: boolean) => flushSync(() => setPrinting(v));
    const before = () => set(true);
    const after = () => set(false);
    const mq = window.matchMedia?.('print');
    const onChange = (e: MediaQueryListEvent) => set(e.matches);
    window.addEventListener('beforeprint', before);
    window.addEventListener('afterprint', after);
    mq?.addEventListener?.('change', onChange);
    return () => {
      window.removeEventListener('beforeprint', before);
      window.removeEventListener('afterprint', after);
      mq?.removeEventListener?.('change', onChange);
    };
  }, []);
  return printing;
}

export const canPrint = true;

export function printPage() {
  window.print();
}

/** Downloads an attachment from the API in place (the answer's Content-Disposition names the file). */
export function download(url: string) {
  const a = document.createElement('a');
  a.href = `${API_BASE}${url}`;
  a.rel = 'noopener';
  document.body.appendChild(a);
  a.click();
  a.remove();
}
