import { onlineManager, type QueryClient } from '@tanstack/react-query';
import { apiariesQuery, apiaryKey } from '@/components/api/apiaries';
import { dueQuery } from '@/components/api/due';
import { hiveKey, hivesQuery } from '@/components/api/hives';
import { hiveRecordsQuery } from '@/components/api/records';

/**
 * While there is signal, fetch ahead what a keeper needs at an out-apiary without it: every site
 * they may open, its hives (list and each hive), each hive's Quick checks (a new check starts from
 * the last one) and the Due list. The query cache keeps them on the device (offline-provider).
 * Fresh data is not fetched again (each query's staleTime); a refusal (an ended sitter window)
 * is simply not kept.
 */
export async function warmOfflineCache(qc: QueryClient): Promise<void> {
  if (!onlineManager.isOnline()) return;
  try {
    const [apiaries] = await Promise.all([qc.fetchQuery(apiariesQuery()), qc.prefetchQuery(dueQuery())]);
    await Promise.all(
      apiaries.map(async (a) => {
        if (!qc.getQueryData(apiaryKey(a.id))) qc.setQueryData(apiaryKey(a.id), a);
        const hives = await qc.fetchQuery(hivesQuery(a.id));
        for (const h of hives) if (!qc.getQueryData(hiveKey(h.id))) qc.setQueryData(hiveKey(h.id), h);
        await Promise.all(hives.map((h) => qc.prefetchQuery(hiveRecordsQuery(h.id, 'inspection'))));
      }),
    );
  } catch {
    // Signal lost half-way or access refused: what was fetched is kept, the rest is tried next time.
  }
}
