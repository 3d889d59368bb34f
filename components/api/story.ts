import { useQuery } from '@tanstack/react-query';
import type { StoryDto } from '@/shared/schemas/story';
import { cacheLife } from './cache';
import { apiFetch } from './client';

/** Key root for one hive's story; each season has its own key. Record mutations invalidate storyRoot(hiveId). */
export const storyRoot = (hiveId: string) => ['story', hiveId] as const;
export const storyKey = (hiveId: string, season?: number) => [...storyRoot(hiveId), season ?? 'current'] as const;

export function useStoryQuery(hiveId: string | undefined, season?: number) {
  return useQuery({
    queryKey: storyKey(hiveId ?? '', season),
    queryFn: ({ signal }) =>
      apiFetch<{ story: StoryDto }>(`/api/hives/${encodeURIComponent(hiveId ?? '')}/story${season ? `?season=${season}` : ''}`, { signal }).then(
        (r) => r.story,
      ),
    enabled: Boolean(hiveId),
    ...cacheLife.list,
  });
}
