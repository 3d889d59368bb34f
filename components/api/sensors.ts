import { useMutation, useQueryClient } from '@tanstack/react-query';
import type { SensorImportQuery, SensorImportResult } from '@/shared/schemas/sensors';
import { API_BASE, ApiError } from './client';
import { seasonRoot } from './season';

export const sensorsRoot = ['sensors'] as const;

export interface SensorUpload {
  /** The mapping, sent as query parameters (see SensorImportQuery). */
  query: Partial<Record<keyof SensorImportQuery, string | null>>;
  csv: string;
  /** Share of the file sent so far, 0..1; the server's own work follows the last byte. */
  onProgress?: (sent: number) => void;
}

/**
 * Sends the raw logger file as text/csv. XMLHttpRequest rather than fetch because only it
 * reports upload progress in browsers; errors come back as the same ApiError the fetch wrapper
 * throws.
 */
export function uploadSensorCsv(hiveId: string, { query, csv, onProgress }: SensorUpload): Promise<SensorImportResult> {
  const params = new URLSearchParams();
  for (const [k, v] of Object.entries(query)) if (v !== undefined && v !== null && v !== '') params.set(k, String(v));
  return new Promise((resolve, reject) => {
    const xhr = new XMLHttpRequest();
    xhr.open('POST', `${API_BASE}/api/hives/${encodeURIComponent(hiveId)}/sensor-imports?${params.toString()}`);
    xhr.withCredentials = true;
    xhr.setRequestHeader('Content-Type', 'text/csv; charset=utf-8');
    xhr.setRequestHeader('Accept', 'application/json');
    xhr.upload.onprogress = (e) => {
      if (e.lengthComputable) onProgress?.(e.loaded / e.total);
    };
    xhr.onerror = () => reject(new ApiError(0, 'network', 'No connection to Frameside. Check your signal and try again.'));
    xhr.onload = () => {
      let body: unknown = null;
      try {
        body = JSON.parse(xhr.responseText);
      } catch {
        body = null;
      }
      if (xhr.status >= 200 && xhr.status < 300) {
        resolve((body as { import: SensorImportResult }).import);
        return;
      }
      const err = (body as { error?: { code: string; message: string; fields?: Record<string, string> } } | null)?.error;
      reject(new ApiError(xhr.status, err?.code ?? 'http', err?.message ?? `The import failed (${xhr.status}).`, err?.fields ?? {}, body));
    };
    xhr.send(csv);
  });
}

export function useSensorImportMutation(hiveId: string) {
  const qc = useQueryClient();
  return useMutation({
    mutationFn: (upload: SensorUpload) => uploadSensorCsv(hiveId, upload),
    onSuccess: () => {
      void qc.invalidateQueries({ queryKey: seasonRoot });
      void qc.invalidateQueries({ queryKey: sensorsRoot });
    },
  });
}
