/**
 * Where photos that have not been sent yet wait on the device. Native builds keep them in memory
 * for now (the web app is what ships); the web variant (photo-store.web.ts) keeps the picture
 * itself in IndexedDB, so a photo taken at an out-apiary without signal survives a closed tab.
 */
export interface StoredPhoto {
  localId: string;
  /** The draft it waits with (a Quick check's draft key), or a hive's own key for photos sent at once. */
  draftKey: string;
  hiveId: string;
  /** Set once the check is saved; until then a 'check' photo waits. */
  inspectionId: string | null;
  box: number | null;
  frame: number | null;
  /** 'check': goes with the Quick check when it is saved; 'now': sent as soon as there is signal. */
  sendWith: 'check' | 'now';
  name: string;
  blob: Blob;
  addedAt: string;
}

const memory = new Map<string, StoredPhoto>();

export async function loadStoredPhotos(): Promise<StoredPhoto[]> {
  return [...memory.values()];
}

export async function saveStoredPhoto(p: StoredPhoto): Promise<void> {
  memory.set(p.localId, p);
}

export async function removeStoredPhoto(localId: string): Promise<void> {
  memory.delete(localId);
}
