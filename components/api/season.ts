import { useQuery } from '@tanstack/react-query';
import type { SeasonDto } from '@/shared/schemas/season';
import { cacheLife } from './cache';
import { apiFetch } from './client';

/** Key root for Season reviews: per hive and per apiary, each season on its own key. */
export const seasonRoot = ['season'] as const;
export const hiveSeasonKey = (hiveId: string, season: number | null) => [...seasonRoot, 'hive', hiveId, season ?? 'current'] as const;
export const apiarySeasonKey = (apiaryId: string, season: number | null) => [...seasonRoot, 'apiary', apiaryId, season ?? 'current'] as const;

const qs = (season: number | null) => (season ? `?season=${season}` : '');

export function useHiveSeasonQuery(hiveId: string | undefined, season: number | null) {
  return useQuery({
    queryKey: hiveSeasonKey(hiveId ?? '', season),
    queryFn: ({ signal }) =>
      apiFetch<{ season: SeasonDto }>(`/api/hives/${encodeURIComponent(hiveId ?? '')}/season${qs(season)}`, { signal }).then((r) => r.season),
    enabled: Boolean(hiveId),
    ...cacheLife.detail,
  });
}

export function useApiarySeasonQuery(apiaryId: string | undefined, season: number | null) {
  return useQuery({
    queryKey: apiarySeasonKey(apiaryId ?? '', season),
    queryFn: ({ signal }) =>
      apiFetch<{ season: SeasonDto }>(`/api/apiaries/${encodeURIComponent(apiaryId ?? '')}/season${qs(season)}`, { signal }).then((r) => r.season),
    enabled: Boolean(apiaryId),
    ...cacheLife.detail,
  });
}

/** Where the CSV exports of an apiary's season download from (attachments; the session cookie goes along). */
export const treatmentsCsvUrl = (apiaryId: string, season: number) => `/api/apiaries/${encodeURIComponent(apiaryId)}/treatments.csv?season=${season}`;
export const recordsCsvUrl = (apiaryId: string, season: number) => `/api/apiaries/${encodeURIComponent(apiaryId)}/records.csv?season=${season}`;
