import { useLocalSearchParams } from 'expo-router';
import type { ReactNode } from 'react';
import type { HiveDto } from '@/shared/schemas/hives';
import type { RecordFormKind } from '@/shared/schemas/records';
import { useHiveQuery } from '@/components/api/hives';
import { LoadError, Loading } from '@/components/ui/query-state';
import { Screen } from '@/components/ui/screen';
import { EditLoading } from './edit-loading';
import { useEditTarget, type EditTarget } from './use-edit-target';

/**
 * The shell every hive record form shares: loads the hive (and, with `?recordId=…`, the record
 * to edit), shows the loading or error state, then renders the form.
 */
export function HiveRecordGate<K extends RecordFormKind>({
  kind,
  title,
  children,
}: {
  kind: K;
  title: string;
  children: (hive: HiveDto, target: EditTarget<K>) => ReactNode;
}) {
  const { hiveId } = useLocalSearchParams<{ hiveId: string }>();
  const hive = useHiveQuery(hiveId);
  const target = useEditTarget(kind);
  if (target.waiting) return <EditLoading title={title} query={target.query} />;
  if (hive.isPending || hive.isError) {
    return (
      <Screen title={title}>
        {hive.isPending ? <Loading label="Loading the hive…" /> : <LoadError error={hive.error} onRetry={() => void hive.refetch()} />}
      </Screen>
    );
  }
  return <>{children(hive.data, target)}</>;
}
