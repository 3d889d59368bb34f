import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { ApiaryCreateInput, ApiaryDto, ApiaryUpdateInput } from '@/shared/schemas/apiaries';
import { meKey } from './auth';
import { cacheLife } from './cache';
import { apiFetch } from './client';

/** Key root for apiaries; the list and each detail have their own keys under it. */
export const apiariesRoot = ['apiaries'] as const;
export const apiariesKey = () => [...apiariesRoot, 'list'] as const;
export const apiaryKey = (apiaryId: string) => [...apiariesRoot, 'detail', apiaryId] as const;

/** The apiaries the person may open: the hook's query, also fetched ahead for offline use (components/offline). */
export const apiariesQuery = () => ({
  queryKey: apiariesKey(),
  queryFn: ({ signal }: { signal?: AbortSignal }) => apiFetch<{ apiaries: ApiaryDto[] }>('/api/apiaries', { signal }).then((r) => r.apiaries),
  ...cacheLife.list,
});

export function useApiariesQuery() {
  return useQuery(apiariesQuery());
}

export function useApiaryQuery(apiaryId: string | undefined) {
  return useQuery({
    queryKey: apiaryKey(apiaryId ?? ''),
    queryFn: ({ signal }) =>
      apiFetch<{ apiary: ApiaryDto }>(`/api/apiaries/${encodeURIComponent(apiaryId ?? '')}`, { signal }).then((r) => r.apiary),
    enabled: Boolean(apiaryId),
    ...cacheLife.detail,
  });
}

export function useApiaryCreateMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: ApiaryCreateInput) =>
      apiFetch<{ apiary: ApiaryDto }>('/api/apiaries', { method: 'POST', body: input }).then((r) => r.apiary),
    onSuccess: (apiary) => {
      qc.setQueryData(apiaryKey(apiary.id), apiary);
      void qc.invalidateQueries({ queryKey: apiariesKey() });
      // The creator becomes the owner: the session's memberships changed too.
      void qc.invalidateQueries({ queryKey: meKey });
    },
  });
}

export function useApiaryUpdateMutation(apiaryId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: ApiaryUpdateInput) =>
      apiFetch<{ apiary: ApiaryDto }>(`/api/apiaries/${encodeURIComponent(apiaryId)}`, { method: 'PATCH', body: input }).then(
        (r) => r.apiary,
      ),
    onSuccess: (apiary) => {
      qc.setQueryData(apiaryKey(apiary.id), apiary);
      void qc.invalidateQueries({ queryKey: apiariesKey() });
      // Membership rows carry the apiary's name.
      void qc.invalidateQueries({ queryKey: meKey });
    },
  });
}
