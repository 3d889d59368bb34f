/**
 * Photos on their way to the server. Each waits on the device (photo-store) until it can go:
 * a Quick check's photos once the check is saved (they need its id), the others at once. One
 * upload at a time, with progress; a lost connection leaves it waiting and it goes again when
 * the browser is back online; a refusal stays visible with the server's words and a Retry.
 * Lives outside React so an upload carries on after the Quick check screen has closed.
 */
import { useSyncExternalStore } from 'react';
import { ApiError } from '@/components/api/client';
import { uploadPhotos } from '@/components/api/photos';
import { frameLabel } from '@/shared/domain/photos';
import { loadStoredPhotos, removeStoredPhoto, saveStoredPhoto, type StoredPhoto } from './photo-store';

export type QueuedState = 'waiting-check' | 'queued' | 'uploading' | 'offline' | 'failed';

export interface QueuedPhoto {
  localId: string;
  draftKey: string;
  hiveId: string;
  label: string;
  state: QueuedState;
  /** 0…1 while uploading. */
  progress: number;
  error: string | null;
  /** An object URL of the picture on this device, for its thumbnail. */
  previewUri: string;
}

interface Entry {
  stored: StoredPhoto;
  view: QueuedPhoto;
}

const entries = new Map<string, Entry>();
const listeners = new Set<() => void>();
const uploadedListeners = new Set<(hiveId: string) => void>();
let snapshot: QueuedPhoto[] = [];
let loaded: Promise<void> | null = null;
let sending = false;

const newLocalId = () =>
  globalThis.crypto?.randomUUID?.() ?? `${Date.now().toString(36)}-${Math.random().toString(36).slice(2, 10)}`;

function emit() {
  snapshot = [...entries.values()].map((e) => e.view);
  for (const l of listeners) l();
}

function setView(localId: string, change: Partial<QueuedPhoto>) {
  const e = entries.get(localId);
  if (!e) return;
  e.view = { ...e.view, ...change };
  emit();
}

function previewOf(blob: Blob): string {
  try {
    return URL.createObjectURL(blob);
  } catch {
    return '';
  }
}

function add(stored: StoredPhoto) {
  const ready = stored.sendWith === 'now' || stored.inspectionId !== null;
  entries.set(stored.localId, {
    stored,
    view: {
      localId: stored.localId,
      draftKey: stored.draftKey,
      hiveId: stored.hiveId,
      label: frameLabel(stored, stored.sendWith === 'check'),
      state: ready ? 'queued' : 'waiting-check',
      progress: 0,
      error: null,
      previewUri: previewOf(stored.blob),
    },
  });
}

/** Loads what waited on the device from an earlier visit, once, and starts sending what may go. */
export function resumePhotoQueue(): Promise<void> {
  loaded ??= loadStoredPhotos().then((kept) => {
    for (const p of kept) if (!entries.has(p.localId)) add(p);
    emit();
    if (typeof window !== 'undefined') window.addEventListener?.('online', () => retryOffline());
    pump();
  });
  return loaded;
}

export interface NewPhoto {
  blob: Blob;
  name: string;
}

/** Keeps new photos on the device and queues them; 'now' photos start sending at once. */
export async function queuePhotos(
  target: { draftKey: string; hiveId: string; sendWith: 'check' | 'now'; inspectionId?: string | null; box: number | null; frame: number | null },
  photos: NewPhoto[],
): Promise<void> {
  await resumePhotoQueue();
  for (const p of photos) {
    const stored: StoredPhoto = {
      localId: newLocalId(),
      draftKey: target.draftKey,
      hiveId: target.hiveId,
      inspectionId: target.inspectionId ?? null,
      box: target.box,
      frame: target.box === null ? null : target.frame,
      sendWith: target.sendWith,
      name: p.name,
      blob: p.blob,
      addedAt: new Date().toISOString(),
    };
    await saveStoredPhoto(stored);
    add(stored);
  }
  emit();
  pump();
}

/** The Quick check was saved: its waiting photos now know their check and go. */
export async function sendCheckPhotos(draftKey: string, inspectionId: string): Promise<void> {
  await resumePhotoQueue();
  for (const e of entries.values()) {
    if (e.stored.draftKey !== draftKey || e.stored.inspectionId !== null || e.stored.sendWith !== 'check') continue;
    e.stored = { ...e.stored, inspectionId };
    await saveStoredPhoto(e.stored);
    e.view = { ...e.view, state: 'queued' };
  }
  emit();
  pump();
}

export function retryPhoto(localId: string) {
  const e = entries.get(localId);
  if (!e || e.view.state === 'uploading') return;
  setView(localId, { state: e.stored.sendWith === 'now' || e.stored.inspectionId ? 'queued' : 'waiting-check', error: null, progress: 0 });
  pump();
}

function retryOffline() {
  for (const e of entries.values()) if (e.view.state === 'offline') e.view = { ...e.view, state: 'queued', error: null };
  emit();
  pump();
}

/** Throws a waiting photo away (before it was sent). */
export async function discardPhoto(localId: string): Promise<void> {
  const e = entries.get(localId);
  if (!e || e.view.state === 'uploading') return;
  entries.delete(localId);
  if (e.view.previewUri) URL.revokeObjectURL?.(e.view.previewUri);
  await removeStoredPhoto(localId);
  emit();
}

function pump() {
  if (sending) return;
  const next = [...entries.values()].find((e) => e.view.state === 'queued');
  if (!next) return;
  sending = true;
  const { stored } = next;
  setView(stored.localId, { state: 'uploading', progress: 0, error: null });
  uploadPhotos(stored.hiveId, [{ blob: stored.blob, name: stored.name }], stored, (f) => setView(stored.localId, { progress: f }))
    .then(async () => {
      const e = entries.get(stored.localId);
      entries.delete(stored.localId);
      if (e?.view.previewUri) URL.revokeObjectURL?.(e.view.previewUri);
      await removeStoredPhoto(stored.localId);
      emit();
      for (const l of uploadedListeners) l(stored.hiveId);
    })
    .catch((err: unknown) => {
      const offline = err instanceof ApiError && err.status === 0;
      const message = err instanceof Error ? err.message : 'The photo could not be sent.';
      setView(stored.localId, { state: offline ? 'offline' : 'failed', error: message, progress: 0 });
    })
    .finally(() => {
      sending = false;
      pump();
    });
}

function subscribe(l: () => void) {
  listeners.add(l);
  return () => listeners.delete(l);
}

/** The photos waiting or sending for one draft (or one hive's own photos). */
export function useQueuedPhotos(draftKey: string): QueuedPhoto[] {
  const all = useSyncExternalStore(subscribe, () => snapshot, () => snapshot);
  return all.filter((p) => p.draftKey === draftKey);
}

/** Every photo waiting or sending on this device (the offline queue in the app shell lists them). */
export function useAllQueuedPhotos(): QueuedPhoto[] {
  return useSyncExternalStore(subscribe, () => snapshot, () => snapshot);
}

/** Called with the hive id after each photo reached the server (screens refresh their lists). */
export function onPhotoUploaded(l: (hiveId: string) => void): () => void {
  uploadedListeners.add(l);
  return () => uploadedListeners.delete(l);
}

/** The key under which a hive's own photos (not tied to a check) wait. */
export const hivePhotosDraftKey = (hiveId: string) => `frameside:photos:hive:${hiveId}`;
