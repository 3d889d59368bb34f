import { useCallback, useEffect, useRef, useState } from 'react';
import { newIdempotencyKey } from './idempotency-key';
import { readLocal, removeLocal, writeLocal } from './local-store';

/** Bump when a draft's shape changes, so an old draft is dropped rather than misread. */
const DRAFT_VERSION = 1;

/** Where a draft lives on the device: one per record kind and hive (or apiary). */
export const draftStorageKey = (kind: string, ownerId: string) => `frameside:draft:${kind}:${ownerId}`;

interface StoredDraft<V> {
  v: number;
  idempotencyKey: string;
  values: V;
  /** When the draft was last changed (ISO), shown as "Draft kept from 10:42". */
  updatedAt: string;
}

export interface RecordDraft<V> {
  /** Null until the form knows where to start (a stored draft, or the pre-fill once loaded). */
  values: V | null;
  /** Sent as `Idempotency-Key`; the same for every retry of this draft. */
  idempotencyKey: string;
  /** Set when the form opened on a draft kept from an earlier visit to the page. */
  restoredAt: string | null;
  /** Change the draft; each change is written to the device at once. */
  update: (change: Partial<V> | ((v: V) => V)) => void;
  /** Write the draft now (before sending it, so a reload after a lost answer resends the same key). */
  persist: () => void;
  /** Forget the draft (after a save), leaving the form as it is. */
  clear: () => void;
  /** Throw the draft away and start again from `initial()`, with a new key. */
  reset: () => void;
  /** A new key for the same draft: after the server refused it (4xx), nothing was stored under the old one. */
  rotateKey: () => void;
}

function readDraft<V>(storageKey: string): StoredDraft<V> | null {
  const raw = readLocal(storageKey);
  if (!raw) return null;
  try {
    const d = JSON.parse(raw) as StoredDraft<V>;
    if (d && d.v === DRAFT_VERSION && typeof d.idempotencyKey === 'string' && d.values && typeof d.values === 'object') return d;
  } catch {
    // A damaged draft is dropped below.
  }
  removeLocal(storageKey);
  return null;
}

/**
 * A record form's state, kept on the device on every change: reload the tab mid-check and the
 * draft is back; `clear()` after a save forgets it. `initial` is called once `ready` is true
 * (e.g. when the previous check has loaded) if no draft was kept.
 */
export function useRecordDraft<V extends object>(storageKey: string, ready: boolean, initial: () => V): RecordDraft<V> {
  const [state, setState] = useState<{ values: V | null; idempotencyKey: string; restoredAt: string | null }>(() => {
    const kept = readDraft<V>(storageKey);
    return kept
      ? { values: kept.values, idempotencyKey: kept.idempotencyKey, restoredAt: kept.updatedAt }
      : { values: null, idempotencyKey: newIdempotencyKey(), restoredAt: null };
  });
  const initialRef = useRef(initial);
  initialRef.current = initial;
  const stateRef = useRef(state);
  stateRef.current = state;

  useEffect(() => {
    if (ready && state.values === null) setState((s) => (s.values === null ? { ...s, values: initialRef.current() } : s));
  }, [ready, state.values]);

  const write = useCallback(
    (values: V, idempotencyKey: string) => {
      const d: StoredDraft<V> = { v: DRAFT_VERSION, idempotencyKey, values, updatedAt: new Date().toISOString() };
      writeLocal(storageKey, JSON.stringify(d));
    },
    [storageKey],
  );

  const update = useCallback(
    (change: Partial<V> | ((v: V) => V)) => {
      const s = stateRef.current;
      if (s.values === null) return;
      const values = typeof change === 'function' ? change(s.values) : { ...s.values, ...change };
      const next = { ...s, values };
      stateRef.current = next;
      setState(next);
      write(values, s.idempotencyKey);
    },
    [write],
  );

  const persist = useCallback(() => {
    const s = stateRef.current;
    if (s.values !== null) write(s.values, s.idempotencyKey);
  }, [write]);

  const clear = useCallback(() => removeLocal(storageKey), [storageKey]);

  const reset = useCallback(() => {
    removeLocal(storageKey);
    const next = { values: initialRef.current(), idempotencyKey: newIdempotencyKey(), restoredAt: null };
    stateRef.current = next;
    setState(next);
  }, [storageKey]);

  const rotateKey = useCallback(() => {
    const s = stateRef.current;
    const next = { ...s, idempotencyKey: newIdempotencyKey() };
    stateRef.current = next;
    setState(next);
    if (next.values !== null) write(next.values, next.idempotencyKey);
  }, [write]);

  return { ...state, update, persist, clear, reset, rotateKey };
}
