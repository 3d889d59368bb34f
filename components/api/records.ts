import { useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import {
  RECORD_KIND_KEYS,
  RECORD_KIND_PATHS,
  type ApiaryRecordKind,
  type ColonyEventCreateInput,
  type FeedingCreateInput,
  type ForageCheckCreateInput,
  type HarvestCreateInput,
  type HiveRecordKind,
  type InspectionCreateInput,
  type MiteCountCreateInput,
  type QueenEventCreateInput,
  type RecordDto,
  type RecordFormKind,
  type RecordListDto,
  type TreatmentCreateInput,
  type ColonyEventUpdateInput,
  type FeedingUpdateInput,
  type ForageCheckUpdateInput,
  type HarvestUpdateInput,
  type InspectionUpdateInput,
  type MiteCountUpdateInput,
  type QueenEventUpdateInput,
  type TreatmentUpdateInput,
} from '@/shared/schemas/records';
import { cacheLife } from './cache';
import { ApiError, apiFetch } from './client';

/**
 * Key roots for records: lists per hive (or apiary) and kind, and single records by kind and id.
 * Writes also invalidate the Due list (`['due']`) and the Hive story (`['story', hiveId]`),
 * which other screens derive from records.
 */
export const recordsRoot = ['records'] as const;
export const hiveRecordsRoot = (hiveId: string) => [...recordsRoot, 'hive', hiveId] as const;
export const hiveRecordsKey = (hiveId: string, kind: HiveRecordKind) => [...hiveRecordsRoot(hiveId), kind] as const;
export const apiaryRecordsRoot = (apiaryId: string) => [...recordsRoot, 'apiary', apiaryId] as const;
export const apiaryRecordsKey = (apiaryId: string, kind: ApiaryRecordKind) => [...apiaryRecordsRoot(apiaryId), kind] as const;
export const recordKey = (kind: RecordFormKind, recordId: string) => [...recordsRoot, 'detail', kind, recordId] as const;
/** Key roots owned by other screens that records feed. */
export const dueRoot = ['due'] as const;
export const storyRoot = ['story'] as const;
export const storyRootOf = (hiveId: string) => [...storyRoot, hiveId] as const;

export interface CreateInputByKind {
  inspection: InspectionCreateInput;
  feeding: FeedingCreateInput;
  treatment: TreatmentCreateInput;
  'mite-count': MiteCountCreateInput;
  harvest: HarvestCreateInput;
  'queen-event': QueenEventCreateInput;
  'colony-event': ColonyEventCreateInput;
  'forage-check': ForageCheckCreateInput;
}

export interface UpdateInputByKind {
  inspection: InspectionUpdateInput;
  feeding: FeedingUpdateInput;
  treatment: TreatmentUpdateInput;
  'mite-count': MiteCountUpdateInput;
  harvest: HarvestUpdateInput;
  'queen-event': QueenEventUpdateInput;
  'colony-event': ColonyEventUpdateInput;
  'forage-check': ForageCheckUpdateInput;
}

const enc = encodeURIComponent;

/** Where a kind's list lives: /api/hives/:hiveId/<path> or /api/apiaries/:apiaryId/forage-checks. */
function listPath(kind: RecordFormKind, ownerId: string): string {
  return kind === 'forage-check' ? `/api/apiaries/${enc(ownerId)}/${RECORD_KIND_PATHS[kind]}` : `/api/hives/${enc(ownerId)}/${RECORD_KIND_PATHS[kind]}`;
}

const recordPath = (kind: RecordFormKind, recordId: string) => `/api/${RECORD_KIND_PATHS[kind]}/${enc(recordId)}`;

function unwrap<K extends RecordFormKind>(kind: K, body: unknown): RecordDto<K> {
  return (body as Record<string, RecordDto<K>>)[RECORD_KIND_KEYS[kind]];
}

/** Mark everything a write to `record` changed as stale. */
function invalidateAfterWrite(qc: QueryClient, record: Pick<RecordDto, 'recordKind' | 'hiveId' | 'apiaryId'>) {
  if (record.hiveId) {
    void qc.invalidateQueries({ queryKey: hiveRecordsRoot(record.hiveId) });
    void qc.invalidateQueries({ queryKey: storyRootOf(record.hiveId) });
  } else {
    void qc.invalidateQueries({ queryKey: apiaryRecordsRoot(record.apiaryId) });
    // A Forage check belongs to the whole apiary: it shows in every hive's story there.
    void qc.invalidateQueries({ queryKey: storyRoot });
  }
  void qc.invalidateQueries({ queryKey: dueRoot });
}

/** A hive's records of one kind, newest first: the hook's query, also fetched ahead for offline use (the Quick check starts from the last one). */
export const hiveRecordsQuery = <K extends HiveRecordKind>(hiveId: string, kind: K) => ({
  queryKey: hiveRecordsKey(hiveId, kind),
  queryFn: ({ signal }: { signal?: AbortSignal }) => apiFetch<RecordListDto<K>>(listPath(kind, hiveId), { signal }).then((r) => r.records),
  ...cacheLife.list,
});

export function useHiveRecordsQuery<K extends HiveRecordKind>(hiveId: string | undefined, kind: K) {
  return useQuery({ ...hiveRecordsQuery(hiveId ?? '', kind), enabled: Boolean(hiveId) });
}

/** An apiary's Forage checks, newest first. */
export function useForageChecksQuery(apiaryId: string | undefined) {
  return useQuery({
    queryKey: apiaryRecordsKey(apiaryId ?? '', 'forage-check'),
    queryFn: ({ signal }) => apiFetch<RecordListDto<'forage-check'>>(listPath('forage-check', apiaryId ?? ''), { signal }).then((r) => r.records),
    enabled: Boolean(apiaryId),
    ...cacheLife.list,
  });
}

export function useRecordQuery<K extends RecordFormKind>(kind: K, recordId: string | undefined) {
  return useQuery({
    queryKey: recordKey(kind, recordId ?? ''),
    queryFn: ({ signal }) => apiFetch<unknown>(recordPath(kind, recordId ?? ''), { signal }).then((b) => unwrap(kind, b)),
    enabled: Boolean(recordId),
    ...cacheLife.detail,
  });
}

export interface RecordCreateVariables<K extends RecordFormKind = RecordFormKind> {
  kind: K;
  /** The hive (or, for a Forage check, the apiary). */
  ownerId: string;
  input: CreateInputByKind[K];
  /** The draft's key: the same on every retry, so a lost answer never stores the record twice. */
  idempotencyKey: string;
  /** The form's draft as it was sent, so a refused record can be reopened and fixed. */
  draft?: unknown;
  /**
   * True when it was saved with no connection and left to the offline queue (the form closed);
   * false while its form waits for the answer (the form shows a refusal, and keeps the draft).
   */
  queued?: boolean;
}

/**
 * Mutation keys of record creates. The function that sends one is registered once per client
 * (`registerRecordMutationDefaults`), not in the hook, so a create that waited offline, was kept
 * on the device and restored after a reload still knows how to send itself.
 */
export const recordCreateRoot = [...recordsRoot, 'create'] as const;
export const recordCreateKey = (kind: RecordFormKind, ownerId: string) => [...recordCreateRoot, kind, ownerId] as const;

/** Sends a record create with its draft's Idempotency-Key. */
export function sendRecordCreate<K extends RecordFormKind>({ kind, ownerId, input, idempotencyKey }: RecordCreateVariables<K>): Promise<RecordDto<K>> {
  return apiFetch<unknown>(listPath(kind, ownerId), { method: 'POST', body: input, headers: { 'Idempotency-Key': idempotencyKey } }).then((b) =>
    unwrap(kind, b),
  );
}

/**
 * Record creates on this client: sent when online, paused while offline (networkMode 'online');
 * not retried by themselves (a form shows its own error; the offline queue sends a create whose
 * connection failed again when the browser is back online); kept until they are sent or the
 * keeper discards them (gcTime Infinity), so a refusal stays visible.
 * `afterSaved` runs for every stored record, also one resumed after a reload (the Quick check's
 * photos go then).
 */
export function registerRecordMutationDefaults(qc: QueryClient, afterSaved: (record: RecordDto, variables: RecordCreateVariables) => void = () => undefined) {
  qc.setMutationDefaults(recordCreateRoot, {
    mutationFn: (v: RecordCreateVariables) => sendRecordCreate(v),
    networkMode: 'online',
    retry: false,
    gcTime: Infinity,
    onSuccess: (record: RecordDto, variables: RecordCreateVariables) => {
      qc.setQueryData(recordKey(record.recordKind, record.id), record);
      invalidateAfterWrite(qc, record);
      afterSaved(record, variables);
    },
  });
}

/** Create a record of `kind` for a hive (or, for a Forage check, an apiary); the defaults above send it. */
export function useRecordCreateMutation<K extends RecordFormKind>(kind: K, ownerId: string) {
  return useMutation<RecordDto<K>, unknown, RecordCreateVariables<K>>({ mutationKey: recordCreateKey(kind, ownerId) });
}

/** A 409's body: the record as it is now, so the form can show it. */
export function staleRecordOf<K extends RecordFormKind>(error: unknown): RecordDto<K> | null {
  if (!(error instanceof ApiError) || error.status !== 409) return null;
  const body = error.body as { current?: RecordDto<K> } | null;
  return body?.current ?? null;
}

/** Edit a record; `input.version` is the version the edit was based on (a stale one answers 409). */
export function useRecordUpdateMutation<K extends RecordFormKind>(kind: K, recordId: string) {
  const qc = useQueryClient();
  const settle = (record: RecordDto<K>) => {
    qc.setQueryData(recordKey(kind, record.id), record);
    invalidateAfterWrite(qc, record);
  };
  return useMutation({
    mutationFn: (input: UpdateInputByKind[K]) =>
      apiFetch<unknown>(recordPath(kind, recordId), { method: 'PATCH', body: input }).then((b) => unwrap(kind, b)),
    onSuccess: settle,
    onError: (error) => {
      const current = staleRecordOf<K>(error);
      if (current) settle(current);
    },
  });
}

/** Delete a record; pass the record so its lists, the story and the Due list are refreshed. */
export function useRecordDeleteMutation<K extends RecordFormKind>(kind: K) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (record: Pick<RecordDto<K>, 'id' | 'recordKind' | 'hiveId' | 'apiaryId'>) =>
      apiFetch<void>(recordPath(kind, record.id), { method: 'DELETE' }).then(() => record),
    onSuccess: (record) => {
      qc.removeQueries({ queryKey: recordKey(kind, record.id) });
      invalidateAfterWrite(qc, record);
    },
  });
}
