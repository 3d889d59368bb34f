import type { UseQueryResult } from '@tanstack/react-query';
import { LoadError, Loading } from '@/components/ui/query-state';
import { Screen } from '@/components/ui/screen';

/** While a form waits for the saved record it will edit (or could not load it). */
export function EditLoading({ title, query }: { title: string; query: Pick<UseQueryResult<unknown>, 'isPending' | 'error' | 'refetch'> }) {
  return (
    <Screen title={title}>
      {query.isPending ? <Loading label="Loading the record…" /> : <LoadError error={query.error} onRetry={() => void query.refetch()} />}
    </Screen>
  );
}
