/**
 * Registers public/sw.js, which keeps the app shell on the device (see that file). The build's
 * entry bundle hash goes into the worker's address, so a new build installs a new worker with
 * its own cache and the old cache is dropped when it takes over.
 */
export function registerServiceWorker(): void {
  if (typeof navigator === 'undefined' || !('serviceWorker' in navigator)) return;
  // Only on the exported build: the dev server's bundles change on every edit.
  const entry = document.querySelector<HTMLScriptElement>('script[src*="/_expo/static/js/web/"]');
  const build = entry?.src.match(/-([0-9a-f]{8,})\.js/)?.[1];
  if (!build) return;
  const start = () => {
    navigator.serviceWorker
      .register(`/sw.js?build=${build}`, { scope: '/' })
      .then(() => navigator.serviceWorker.ready)
      .then((reg) => {
        // This first page loaded before the worker ran: hand it what the page already fetched
        // (fonts, chunks, images of the shell) so the next start without signal finds them.
        const urls = performance
          .getEntriesByType('resource')
          .map((e) => e.name)
          .filter((u) => u.startsWith(location.origin) && !new URL(u).pathname.startsWith('/api/'));
        reg.active?.postMessage({ type: 'keep', urls: [...new Set(urls)] });
      })
      .catch(() => undefined);
  };
  if (document.readyState === 'complete') start();
  else window.addEventListener('load', start, { once: true });
}
