import type { Href } from 'expo-router';
import { onlineManager } from '@tanstack/react-query';
import { useCallback, useState } from 'react';
import type { ZodType } from 'zod';
import type { RecordFormKind } from '@/shared/schemas/records';
import { staleRecordOf, useRecordCreateMutation, useRecordUpdateMutation, type CreateInputByKind, type UpdateInputByKind } from '@/components/api/records';
import { useLeaveAfterSave } from './use-leave-after-save';
import { draftStorageKey, useRecordDraft, type RecordDraft } from './use-record-draft';
import { visitInstant, type VisitTime } from './when';

/** Every record draft says when it happened: a visit-time chip, fixed to an instant at the first Save press. */
export interface TimedValues {
  visitTime: VisitTime;
  occurredAt: string | null;
}

export interface RecordFormOptions<K extends RecordFormKind, V extends TimedValues> {
  kind: K;
  /** The hive (or, for a Forage check, the apiary) the record belongs to. */
  ownerId: string;
  /** False while the form waits for something it starts from (the previous check). */
  ready?: boolean;
  initial: () => V;
  /** The request body from the draft and its fixed visit instant. */
  build: (values: V, occurredAt: string) => CreateInputByKind[K];
  /** The shared create schema: the form checks the body with it before sending. */
  schema: ZodType;
  /** A check the schema cannot make (e.g. the hive's frame capacity): a message, or null. */
  extraCheck?: (values: V) => string | null;
  leaveTo: Href;
  /** Called with the stored record just before leaving (the Quick check sends its photos then). */
  onSaved?: (record: { id: string }) => void;
  /**
   * Edit a stored record instead of creating one: the draft is kept under the record's id and
   * Save sends a PATCH with the version the form started from.
   */
  edit?: { recordId: string; version: number } | null;
  /** A stale edit (409): someone saved first. The draft is dropped; the caller shows their version. */
  onStale?: () => void;
}

export interface RecordForm<V extends TimedValues> {
  draft: RecordDraft<V>;
  /** Change the draft (and forget a shown error). */
  set: (change: Partial<V> | ((v: V) => V)) => void;
  save: () => void;
  saving: boolean;
  error: unknown;
}

/**
 * The life of a record form: a draft kept on the device, checked with the shared zod schema,
 * sent with the draft's Idempotency-Key (the same on every retry), cleared once saved, then back
 * to the page it came from. The server frees a key whose request it refused (400, 403…), so a
 * fixed draft is resent under the same key; "already being processed" (409) is retried as is.
 */
export function useRecordForm<K extends RecordFormKind, V extends TimedValues>(o: RecordFormOptions<K, V>): RecordForm<V> {
  const editing = o.edit ?? null;
  const storageKey = editing ? draftStorageKey(`${o.kind}-edit`, editing.recordId) : draftStorageKey(o.kind, o.ownerId);
  const draft = useRecordDraft<V>(storageKey, o.ready ?? true, o.initial);
  const create = useRecordCreateMutation(o.kind, o.ownerId);
  const update = useRecordUpdateMutation(o.kind, editing?.recordId ?? '');
  const pending = create.isPending || update.isPending;
  const leave = useLeaveAfterSave(o.leaveTo);
  const [formError, setFormError] = useState<unknown>(null);

  const set = useCallback(
    (change: Partial<V> | ((v: V) => V)) => {
      setFormError(null);
      create.reset();
      update.reset();
      draft.update(change);
    },
    // eslint-disable-next-line react-hooks/exhaustive-deps
    [draft.update, create.reset, update.reset],
  );

  const save = () => {
    const v = draft.values;
    if (!v || pending) return;
    const occurredAt = v.occurredAt ?? visitInstant(v.visitTime, new Date());
    const input = o.build(v, occurredAt);
    const parsed = o.schema.safeParse(input);
    if (!parsed.success) {
      setFormError(parsed.error);
      return;
    }
    const extra = o.extraCheck?.(v) ?? null;
    if (extra) {
      setFormError(new Error(extra));
      return;
    }
    // Fix the instant in the kept draft before sending, so a retry (even after a reload) is the same request.
    if (v.occurredAt === null) draft.update({ occurredAt } as Partial<V>);
    else draft.persist();
    setFormError(null);
    const saved = (record: { id: string }) => {
      draft.clear();
      o.onSaved?.(record);
      leave();
    };
    if (editing) {
      update.mutate({ ...input, version: editing.version } as UpdateInputByKind[K], {
        onSuccess: saved,
        onError: (error) => {
          if (staleRecordOf(error)) {
            draft.clear();
            o.onStale?.();
          }
        },
      });
      return;
    }
    const variables = { kind: o.kind, ownerId: o.ownerId, input, idempotencyKey: draft.idempotencyKey, draft: { ...v, occurredAt }, queued: false };
    if (!onlineManager.isOnline()) {
      // No connection: the create waits in the offline queue (kept on the device, sent when the
      // connection returns, with this draft's key), so the draft itself can go.
      create.mutate({ ...variables, queued: true });
      draft.clear();
      leave();
      return;
    }
    create.mutate(variables, { onSuccess: saved });
  };

  return { draft, set, save, saving: pending, error: formError ?? create.error ?? update.error };
}
