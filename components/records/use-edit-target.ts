import { useLocalSearchParams } from 'expo-router';
import { useState } from 'react';
import type { RecordDto, RecordFormKind } from '@/shared/schemas/records';
import { useRecordQuery } from '@/components/api/records';

/**
 * A form opened with `?recordId=…` edits that record. Gives the record (once loaded), a key that
 * changes with its version (so the form starts again from a newer version after a stale save),
 * and the stale flag the form's notice reads.
 */
export function useEditTarget<K extends RecordFormKind>(kind: K) {
  const { recordId } = useLocalSearchParams<{ recordId?: string }>();
  const record = useRecordQuery(kind, recordId);
  const [stale, setStale] = useState(false);
  const editing = recordId && record.data ? (record.data as RecordDto<K>) : null;
  return {
    recordId,
    /** Still loading (or failed) the record to edit: show the query state instead of the form. */
    waiting: Boolean(recordId) && (record.isPending || record.isError),
    query: record,
    editing,
    formKey: editing ? `edit-${editing.version}` : 'new',
    stale,
    onStale: () => setStale(true),
    edit: editing ? { recordId: editing.id, version: editing.version } : null,
  };
}

export type EditTarget<K extends RecordFormKind> = ReturnType<typeof useEditTarget<K>>;
