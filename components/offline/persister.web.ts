import { createAsyncStoragePersister } from '@tanstack/query-async-storage-persister';
import type { Persister } from '@tanstack/react-query-persist-client';

/** Where the device keeps the query cache and the waiting records (web: localStorage, survives a closed tab). */
export const PERSIST_KEY = 'frameside:offline-cache';

export function createPersister(): Persister | null {
  let storage: Storage | undefined;
  try {
    storage = globalThis.localStorage;
  } catch {
    storage = undefined;
  }
  if (!storage) return null;
  // Written shortly after each change, so a record saved offline is kept even if the tab closes at once.
  return createAsyncStoragePersister({ storage, key: PERSIST_KEY, throttleTime: 50 });
}
