import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { HiveCreateInput, HiveDto, HiveUpdateInput } from '@/shared/schemas/hives';
import { apiariesKey, apiaryKey } from './apiaries';
import { cacheLife } from './cache';
import { ApiError, apiFetch } from './client';

/** Key root for hives: lists per apiary and single hives, each with its own key. */
export const hivesRoot = ['hives'] as const;
export const hivesKey = (apiaryId: string) => [...hivesRoot, 'list', apiaryId] as const;
export const hiveKey = (hiveId: string) => [...hivesRoot, 'detail', hiveId] as const;

/** An apiary's hives: the hook's query, also fetched ahead for offline use (components/offline). */
export const hivesQuery = (apiaryId: string) => ({
  queryKey: hivesKey(apiaryId),
  queryFn: ({ signal }: { signal?: AbortSignal }) =>
    apiFetch<{ hives: HiveDto[] }>(`/api/apiaries/${encodeURIComponent(apiaryId)}/hives`, { signal }).then((r) => r.hives),
  ...cacheLife.list,
});

export function useHivesQuery(apiaryId: string | undefined) {
  return useQuery({ ...hivesQuery(apiaryId ?? ''), enabled: Boolean(apiaryId) });
}

export function useHiveQuery(hiveId: string | undefined) {
  return useQuery({
    queryKey: hiveKey(hiveId ?? ''),
    queryFn: ({ signal }) => apiFetch<{ hive: HiveDto }>(`/api/hives/${encodeURIComponent(hiveId ?? '')}`, { signal }).then((r) => r.hive),
    enabled: Boolean(hiveId),
    ...cacheLife.detail,
  });
}

export function useHiveCreateMutation(apiaryId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: HiveCreateInput) =>
      apiFetch<{ hive: HiveDto }>(`/api/apiaries/${encodeURIComponent(apiaryId)}/hives`, { method: 'POST', body: input }).then(
        (r) => r.hive,
      ),
    onSuccess: (hive) => {
      qc.setQueryData(hiveKey(hive.id), hive);
      void qc.invalidateQueries({ queryKey: hivesKey(apiaryId) });
      // Apiary rows show a hive count.
      void qc.invalidateQueries({ queryKey: apiariesKey() });
      void qc.invalidateQueries({ queryKey: apiaryKey(apiaryId) });
    },
  });
}

/** A 409's body: the hive as it is now, so the form can show it. */
export function staleHiveOf(error: unknown): HiveDto | null {
  if (!(error instanceof ApiError) || error.status !== 409) return null;
  const body = error.body as { current?: HiveDto } | null;
  return body?.current ?? null;
}

export function useHiveUpdateMutation(hiveId: string) {
  const qc = useQueryClient();
  const settle = (hive: HiveDto) => {
    qc.setQueryData(hiveKey(hive.id), hive);
    void qc.invalidateQueries({ queryKey: hivesKey(hive.apiaryId) });
    // Status changes (dead-out, sold) can change an apiary's hive count.
    void qc.invalidateQueries({ queryKey: apiariesKey() });
    void qc.invalidateQueries({ queryKey: apiaryKey(hive.apiaryId) });
  };
  return useMutation({
    mutationFn: (input: HiveUpdateInput) =>
      apiFetch<{ hive: HiveDto }>(`/api/hives/${encodeURIComponent(hiveId)}`, { method: 'PATCH', body: input }).then((r) => r.hive),
    onSuccess: settle,
    onError: (error) => {
      // Someone else saved first: the cache takes the current version the server sent.
      const current = staleHiveOf(error);
      if (current) settle(current);
    },
  });
}
