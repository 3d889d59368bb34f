import { QueryClient } from '@tanstack/react-query';
import { sendCheckPhotos } from '@/components/photos/upload-queue';
import { draftStorageKey } from '@/components/records/use-record-draft';
import { OFFLINE_KEEP_MS } from './cache';
import { ApiError } from './client';
import { registerRecordMutationDefaults } from './records';

/** Errors a retry cannot fix: the server has answered and said no. */
function isFinal(error: unknown): boolean {
  return error instanceof ApiError && error.status >= 400 && error.status < 500;
}

export function createQueryClient(): QueryClient {
  const qc = new QueryClient({
    defaultOptions: {
      queries: {
        retry: (failures, error) => !isFinal(error) && failures < 2,
        // A keeper switching back from the camera should not trigger a refetch storm.
        refetchOnWindowFocus: false,
        // Kept in memory as long as on the device, so a restored cache is not dropped unused.
        gcTime: OFFLINE_KEEP_MS,
      },
      mutations: { retry: false },
    },
  });
  // A Quick check's photos wait for its id; they go once it is stored, also after an offline wait.
  registerRecordMutationDefaults(qc, (record, v) => {
    if (record.recordKind === 'inspection') void sendCheckPhotos(draftStorageKey('inspection', v.ownerId), record.id);
  });
  return qc;
}
