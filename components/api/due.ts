import { useMutation, useQuery, useQueryClient } from '@tanstack/react-query';
import type { DueTaskDto, TaskCreateInput, TaskResolutionDto } from '@/shared/schemas/tasks';
import { cacheLife } from './cache';
import { apiFetch } from './client';

/** Key root for the Due list: the whole list, or one apiary's or hive's part of it. */
export const dueRoot = ['due'] as const;
export const dueKey = (filter: { apiaryId?: string; hiveId?: string } = {}) => [...dueRoot, 'list', filter.apiaryId ?? '', filter.hiveId ?? ''] as const;

/** The Due list (or part of it): the hook's query, also fetched ahead for offline use (components/offline). */
export function dueQuery(filter: { apiaryId?: string; hiveId?: string } = {}) {
  const params = new URLSearchParams();
  if (filter.apiaryId) params.set('apiaryId', filter.apiaryId);
  if (filter.hiveId) params.set('hiveId', filter.hiveId);
  const qs = params.toString();
  return {
    queryKey: dueKey(filter),
    queryFn: ({ signal }: { signal?: AbortSignal }) => apiFetch<{ tasks: DueTaskDto[] }>(`/api/due${qs ? `?${qs}` : ''}`, { signal }).then((r) => r.tasks),
    ...cacheLife.list,
  };
}

export function useDueQuery(filter: { apiaryId?: string; hiveId?: string } = {}) {
  return useQuery(dueQuery(filter));
}

export type TaskAction = { kind: 'done' } | { kind: 'dismiss' } | { kind: 'snooze'; until: string };

/** Done, snooze or dismiss one task by its key. The Due list (every filter of it) refetches after. */
export function useTaskResolveMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: ({ key, action }: { key: string; action: TaskAction }) =>
      apiFetch<{ task: TaskResolutionDto }>(`/api/tasks/${encodeURIComponent(key)}/${action.kind}`, {
        method: 'POST',
        body: action.kind === 'snooze' ? { until: action.until } : {},
      }).then((r) => r.task),
    onSuccess: (task) => {
      // Take the task out of every cached list at once, then refetch to be sure.
      qc.setQueriesData<DueTaskDto[]>({ queryKey: dueRoot }, (list) =>
        list && task.status !== 'snoozed' ? list.filter((t) => t.key !== task.key) : list,
      );
      void qc.invalidateQueries({ queryKey: dueRoot });
    },
  });
}

export function useTaskCreateMutation() {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (input: TaskCreateInput) => apiFetch<{ task: DueTaskDto }>('/api/tasks', { method: 'POST', body: input }).then((r) => r.task),
    onSuccess: () => void qc.invalidateQueries({ queryKey: dueRoot }),
  });
}
