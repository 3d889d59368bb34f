/**
 * A tiny key–value store for what must survive on this device: record drafts and the keeper's
 * units. Native builds keep it in memory for now (the web app is what ships); the web variant
 * (local-store.web.ts) writes to localStorage, so a closed or reloaded tab keeps its draft.
 */
const memory = new Map<string, string>();

export function readLocal(key: string): string | null {
  return memory.get(key) ?? null;
}

export function writeLocal(key: string, value: string): void {
  memory.set(key, value);
}

export function removeLocal(key: string): void {
  memory.delete(key);
}
