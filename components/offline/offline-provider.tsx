import { dehydrate, onlineManager, QueryClientProvider, type DehydrateOptions, type QueryClient } from '@tanstack/react-query';
import { PersistQueryClientProvider, type Persister } from '@tanstack/react-query-persist-client';
import { useEffect, useState, type ReactNode } from 'react';
import { OFFLINE_KEEP_MS } from '@/components/api/cache';
import { apiFetch } from '@/components/api/client';
import { recordCreateRoot } from '@/components/api/records';
import { resumePhotoQueue } from '@/components/photos/upload-queue';
import { createPersister, PERSIST_KEY } from './persister';
import { registerServiceWorker } from './register-service-worker';

// React Query starts out "online" and then follows the browser's online/offline events; a page
// opened with no signal gets no event, so start from what the browser says now.
if (typeof navigator !== 'undefined' && navigator.onLine === false) onlineManager.setOnline(false);

/** Bump when the shape of cached data changes, so an old copy on a device is dropped rather than misread. */
const CACHE_VERSION = 'frameside-1';

const isRecordCreate = (m: { options: { mutationKey?: readonly unknown[] } }) => m.options.mutationKey?.[0] === recordCreateRoot[0] && m.options.mutationKey?.[1] === recordCreateRoot[1];

const DEHYDRATE: DehydrateOptions = {
  shouldDehydrateQuery: (q) => q.state.status === 'success',
  // Waiting, being sent (the tab may close mid-send) or refused in the queue: kept until settled.
  shouldDehydrateMutation: (m) =>
    isRecordCreate(m) && (m.state.status === 'pending' || (m.state.status === 'error' && (m.state.variables as { queued?: boolean } | undefined)?.queued === true)),
};

/**
 * The persister writes shortly after each change; a tab closed (or a page left) within that moment
 * is written at once, in the persister's own format, so a record saved a moment ago is never lost.
 */
function flushOnPageHide(client: QueryClient): () => void {
  if (typeof window === 'undefined' || typeof window.addEventListener !== 'function') return () => undefined;
  const flush = () => {
    try {
      const kept = { buster: CACHE_VERSION, timestamp: Date.now(), clientState: dehydrate(client, DEHYDRATE) };
      globalThis.localStorage?.setItem(PERSIST_KEY, JSON.stringify(kept));
    } catch {
      // Storage full or refused: the throttled write may still have made it.
    }
  };
  window.addEventListener('pagehide', flush);
  return () => window.removeEventListener('pagehide', flush);
}

/**
 * The query client, kept on the device (React Query persistence): what the keeper last saw (hives,
 * the Due list, records) opens when the app starts without signal, and record creates made offline wait as paused
 * mutations in the same copy, each with its Idempotency-Key. After the copy is restored they are
 * resumed (sent now when online, or when the connection returns: the client listens to
 * onlineManager). Refused ones are kept too, until the keeper retries, edits or discards them.
 */
export function OfflineProvider({ client, children }: { client: QueryClient; children: ReactNode }) {
  const [persister] = useState(() => onlyMutationsWhenOnline(createPersister()));
  useEffect(() => {
    registerServiceWorker();
    void resumePhotoQueue();
  }, []);
  useEffect(() => (persister ? flushOnPageHide(client) : undefined), [client, persister]);
  if (!persister) return <QueryClientProvider client={client}>{children}</QueryClientProvider>;
  return (
    <PersistQueryClientProvider
      client={client}
      persistOptions={{
        persister,
        maxAge: OFFLINE_KEEP_MS,
        buster: CACHE_VERSION,
        // The persister bundles its own copy of query-core (types differ by version, not shape).
        dehydrateOptions: DEHYDRATE as never,
      }}
      onSuccess={() => {
        resumeRestored(client);
      }}
    >
      {children}
    </PersistQueryClientProvider>
  );
}

/**
 * The kept data is for opening the app without signal. With a connection, screens fetch as they
 * always do (access may have ended; a form must start from the stored version, not from a kept
 * copy refreshed under it), so only the waiting records (mutations) are restored then.
 */
function onlyMutationsWhenOnline(p: Persister | null): Persister | null {
  if (!p) return null;
  return {
    ...p,
    restoreClient: async () => {
      const kept = await p.restoreClient();
      if (!kept || !onlineManager.isOnline()) return kept;
      // "Online" is only the browser's guess (a weak signal at the gate says online too): keep the
      // copy unless the server really answers.
      const reachable = await apiFetch('/api/health', { signal: AbortSignal.timeout(2500) }).then(
        () => true,
        () => false,
      );
      return reachable ? { ...kept, clientState: { ...kept.clientState, queries: [] } } : kept;
    },
  };
}

/**
 * Restored creates that were waiting or in flight are sent again, with the key they were made
 * with (the server replays a create it already stored). Offline, each pauses until the
 * connection returns.
 */
function resumeRestored(client: QueryClient) {
  for (const m of client.getMutationCache().getAll()) {
    if (isRecordCreate(m) && m.state.status === 'pending') void m.continue().catch(() => undefined);
  }
}
