/*
 * Frameside's service worker: keeps the app shell on the device so a keeper who opened the app
 * once can open it again at an out-apiary with no signal. Written by hand, small on purpose.
 *
 * - /_expo/static/* (hashed bundles), /assets/* (fonts, images), favicon: cache first — a hashed
 *   file never changes, so the kept copy is always right; a miss is fetched and kept.
 * - Page loads (navigations, index.html): network first, falling back to the kept index.html
 *   (the single-page app answers every route with it) when the network fails or is too slow.
 * - /api/* is never touched here: data is kept by the app's query cache (React Query persistence),
 *   which knows who is signed in and when data is stale.
 *
 * The cache name carries the build (`sw.js?build=<entry bundle hash>`): a new build installs a
 * new worker with a new cache; it takes over only once no tab runs the old build (no
 * skipWaiting), and then drops the old caches. The page posts the URLs it loaded before the
 * worker ran ({ type: 'keep', urls }) so the first visit's fonts and chunks are kept too.
 */
const BUILD = new URL(self.location.href).searchParams.get('build') || 'dev';
const CACHE = `frameside-shell-${BUILD}`;
const INDEX = '/index.html';
/** How long a page load waits for the network before it opens the kept shell. */
const NAVIGATION_TIMEOUT_MS = 4000;

const isApi = (url) => url.pathname.startsWith('/api/') || url.pathname === '/api';
const isStatic = (url) =>
  url.pathname.startsWith('/_expo/static/') || url.pathname.startsWith('/assets/') || url.pathname === '/favicon.ico';

self.addEventListener('install', (event) => {
  event.waitUntil(
    (async () => {
      const cache = await caches.open(CACHE);
      const res = await fetch(INDEX, { cache: 'no-cache' });
      if (!res.ok) return;
      const html = await res.clone().text();
      await cache.put(INDEX, res);
      // The entry bundles and styles the shell names.
      const urls = [...html.matchAll(/(?:src|href)="(\/(?:_expo\/static|assets)\/[^"]+)"/g)].map((m) => m[1]);
      await Promise.all(urls.map((u) => cache.add(u).catch(() => undefined)));
    })(),
  );
});

self.addEventListener('activate', (event) => {
  event.waitUntil(
    (async () => {
      const names = await caches.keys();
      await Promise.all(names.filter((n) => n.startsWith('frameside-shell-') && n !== CACHE).map((n) => caches.delete(n)));
    })(),
  );
});

self.addEventListener('message', (event) => {
  const data = event.data;
  if (!data || data.type !== 'keep' || !Array.isArray(data.urls)) return;
  event.waitUntil(
    (async () => {
      const cache = await caches.open(CACHE);
      for (const u of data.urls) {
        let url;
        try {
          url = new URL(u, self.location.origin);
        } catch {
          continue;
        }
        if (url.origin !== self.location.origin || isApi(url) || !isStatic(url)) continue;
        if (await cache.match(url.pathname + url.search)) continue;
        await cache.add(url.pathname + url.search).catch(() => undefined);
      }
    })(),
  );
});

async function cacheFirst(request) {
  const cache = await caches.open(CACHE);
  const kept = await cache.match(request);
  if (kept) return kept;
  const res = await fetch(request);
  if (res.ok && res.type === 'basic') await cache.put(request, res.clone());
  return res;
}

async function networkFirstPage(request) {
  const cache = await caches.open(CACHE);
  try {
    const res = await Promise.race([
      fetch(request),
      new Promise((_, reject) => setTimeout(() => reject(new Error('slow network')), NAVIGATION_TIMEOUT_MS)),
    ]);
    // Every route answers with the same shell: keep the newest copy as index.html.
    if (res.ok && res.type === 'basic' && (res.headers.get('content-type') || '').includes('text/html')) {
      await cache.put(INDEX, res.clone());
    }
    return res;
  } catch (err) {
    const kept = await cache.match(INDEX);
    if (kept) return kept;
    throw err;
  }
}

self.addEventListener('fetch', (event) => {
  const request = event.request;
  if (request.method !== 'GET') return;
  const url = new URL(request.url);
  if (url.origin !== self.location.origin || isApi(url) || url.pathname.startsWith('/dev/')) return;
  if (request.mode === 'navigate' || url.pathname === INDEX) {
    event.respondWith(networkFirstPage(request));
    return;
  }
  if (isStatic(url)) event.respondWith(cacheFirst(request));
});
