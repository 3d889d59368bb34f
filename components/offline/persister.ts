import type { Persister } from '@tanstack/react-query-persist-client';

/** Native: no persisted cache yet (the web build is the one used at out-apiaries for now). */
export const PERSIST_KEY = 'frameside:offline-cache';

export function createPersister(): Persister | null {
  return null;
}
