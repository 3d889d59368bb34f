/**
 * Web variant of local-store.ts: localStorage, so a draft outlives a reload or a closed tab.
 * Every call tolerates a browser that refuses storage (private mode, quota): the form keeps
 * working, it just cannot promise the draft.
 */
export function readLocal(key: string): string | null {
  try {
    return globalThis.localStorage?.getItem(key) ?? null;
  } catch {
    return null;
  }
}

export function writeLocal(key: string, value: string): void {
  try {
    globalThis.localStorage?.setItem(key, value);
  } catch {
    // Storage full or refused: nothing to do but keep the draft in memory.
  }
}

export function removeLocal(key: string): void {
  try {
    globalThis.localStorage?.removeItem(key);
  } catch {
    // As above.
  }
}
