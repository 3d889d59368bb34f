/**
 * Web variant of photo-store.ts: IndexedDB, which stores Blobs as they are (localStorage holds
 * only strings, and a few photos would overflow its quota). Every call tolerates a browser that
 * refuses storage (private mode, quota): the photo then waits in memory for as long as the tab.
 */
import type { StoredPhoto } from './photo-store';

export type { StoredPhoto } from './photo-store';

const DB_NAME = 'frameside-photos';
const STORE = 'waiting';
const memory = new Map<string, StoredPhoto>();

let dbPromise: Promise<IDBDatabase | null> | null = null;

function openDb(): Promise<IDBDatabase | null> {
  dbPromise ??= new Promise((resolve) => {
    try {
      const req = globalThis.indexedDB?.open(DB_NAME, 1);
      if (!req) return resolve(null);
      req.onupgradeneeded = () => {
        if (!req.result.objectStoreNames.contains(STORE)) req.result.createObjectStore(STORE, { keyPath: 'localId' });
      };
      req.onsuccess = () => resolve(req.result);
      req.onerror = () => resolve(null);
      req.onblocked = () => resolve(null);
    } catch {
      resolve(null);
    }
  });
  return dbPromise;
}

function run<T>(mode: IDBTransactionMode, fn: (s: IDBObjectStore) => IDBRequest<T>): Promise<T | null> {
  return openDb().then(
    (db) =>
      new Promise<T | null>((resolve) => {
        if (!db) return resolve(null);
        try {
          const tx = db.transaction(STORE, mode);
          const req = fn(tx.objectStore(STORE));
          tx.oncomplete = () => resolve(req.result);
          tx.onerror = () => resolve(null);
          tx.onabort = () => resolve(null);
        } catch {
          resolve(null);
        }
      }),
  );
}

export async function loadStoredPhotos(): Promise<StoredPhoto[]> {
  const kept = ((await run<StoredPhoto[]>('readonly', (s) => s.getAll() as IDBRequest<StoredPhoto[]>)) ?? []).filter(
    (p) => p && typeof p.localId === 'string' && p.blob instanceof Blob,
  );
  const byId = new Map(kept.map((p) => [p.localId, p]));
  for (const p of memory.values()) byId.set(p.localId, p);
  return [...byId.values()].sort((a, b) => a.addedAt.localeCompare(b.addedAt));
}

export async function saveStoredPhoto(p: StoredPhoto): Promise<void> {
  const ok = await run('readwrite', (s) => s.put(p));
  if (ok === null) memory.set(p.localId, p);
}

export async function removeStoredPhoto(localId: string): Promise<void> {
  memory.delete(localId);
  await run('readwrite', (s) => s.delete(localId));
}
