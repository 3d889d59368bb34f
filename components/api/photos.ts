import { useMutation, useQuery, useQueryClient, type QueryClient } from '@tanstack/react-query';
import type { PhotoSize } from '@/shared/domain/photos';
import type { PhotoDto } from '@/shared/schemas/photos';
import { cacheLife } from './cache';
import { API_BASE, ApiError, apiFetch } from './client';
import { storyRoot } from './story';

/** Key root for photos: a hive's list, optionally narrowed to one Quick check. */
export const photosRoot = ['photos'] as const;
export const hivePhotosKey = (hiveId: string, inspectionId?: string | null) => [...photosRoot, 'hive', hiveId, inspectionId ?? 'all'] as const;

/** Where a stored size is served: always the access-checked route, never a file path. */
export const photoUrl = (photoId: string, size: PhotoSize) => `${API_BASE}/api/photos/${encodeURIComponent(photoId)}?size=${size}`;

/** How often a list with photos still processing asks again (the image worker takes seconds). */
const PROCESSING_POLL_MS = 1_500;

export function useHivePhotosQuery(hiveId: string | undefined, inspectionId?: string | null) {
  return useQuery({
    queryKey: hivePhotosKey(hiveId ?? '', inspectionId),
    queryFn: ({ signal }) => {
      const q = inspectionId ? `?inspectionId=${encodeURIComponent(inspectionId)}` : '';
      return apiFetch<{ photos: PhotoDto[] }>(`/api/hives/${encodeURIComponent(hiveId ?? '')}/photos${q}`, { signal }).then((r) => r.photos);
    },
    enabled: Boolean(hiveId),
    refetchInterval: (query) => (query.state.data?.some((p) => p.status === 'processing') ? PROCESSING_POLL_MS : false),
    ...cacheLife.list,
  });
}

/** After an upload or a delete: the hive's photo lists and its story (which shows check photos). */
export function invalidateHivePhotos(qc: QueryClient, hiveId: string) {
  void qc.invalidateQueries({ queryKey: [...photosRoot, 'hive', hiveId] });
  void qc.invalidateQueries({ queryKey: storyRoot(hiveId) });
}

export function usePhotoDeleteMutation(hiveId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (photoId: string) => apiFetch<void>(`/api/photos/${encodeURIComponent(photoId)}`, { method: 'DELETE' }),
    onSuccess: () => invalidateHivePhotos(qc, hiveId),
  });
}

export interface PhotoUploadFields {
  inspectionId?: string | null;
  box?: number | null;
  frame?: number | null;
}

export interface UploadBody {
  blob: Blob;
  name: string;
}

/**
 * Sends photos as multipart form data through XMLHttpRequest, the one browser API that reports
 * upload progress (fetch does not). `onProgress` gets 0…1. Rejects with an ApiError like apiFetch.
 */
export function uploadPhotos(
  hiveId: string,
  files: UploadBody[],
  fields: PhotoUploadFields,
  onProgress?: (fraction: number) => void,
  signal?: AbortSignal,
): Promise<PhotoDto[]> {
  return new Promise((resolve, reject) => {
    const form = new FormData();
    if (fields.inspectionId) form.append('inspectionId', fields.inspectionId);
    if (fields.box != null) form.append('box', String(fields.box));
    if (fields.frame != null) form.append('frame', String(fields.frame));
    for (const f of files) form.append('photos', f.blob, f.name);

    const xhr = new XMLHttpRequest();
    xhr.open('POST', `${API_BASE}/api/hives/${encodeURIComponent(hiveId)}/photos`);
    xhr.withCredentials = true;
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.responseType = 'text';
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable && e.total > 0) onProgress?.(Math.min(1, e.loaded / e.total));
    };
    xhr.onerror = () => reject(new ApiError(0, 'network', 'No connection to Frameside. The photo waits on this device: try again when you have signal.'));
    xhr.onabort = () => reject(new DOMException('Upload cancelled', 'AbortError'));
    xhr.onload = () => {
      let body: unknown = null;
      try {
        body = xhr.responseText ? JSON.parse(xhr.responseText) : null;
      } catch {
        body = null;
      }
      if (xhr.status >= 200 && xhr.status < 300) {
        onProgress?.(1);
        resolve((body as { photos: PhotoDto[] }).photos);
        return;
      }
      const err = (body as { error?: { code?: string; message?: string; fields?: Record<string, string> } } | null)?.error;
      const message =
        err?.message ?? (xhr.status >= 500 ? 'Frameside’s server had a problem. Try again in a moment.' : `The upload failed (${xhr.status}).`);
      reject(new ApiError(xhr.status, err?.code ?? 'http', message, err?.fields ?? {}, body));
    };
    signal?.addEventListener('abort', () => xhr.abort());
    xhr.send(form);
  });
}
