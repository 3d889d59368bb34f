import type { RecordDto } from '@/shared/schemas/records';
import { Notice } from '@/components/ui/notice';
import { shortDateOfInstant } from './when';

/** At the top of a form opened on a saved record: what is being edited, or that someone saved first (`<testID>-editing`). */
export function EditingNotice({ record, stale, what, testID }: { record: RecordDto; stale: boolean; what: string; testID: string }) {
  return (
    <Notice tone={stale ? 'warning' : 'info'} title={stale ? `Someone else saved this ${what} first` : `Editing the ${what} of ${shortDateOfInstant(record.occurredAt)}`} testID={`${testID}-editing`}>
      {stale
        ? `It now shows their version (saved by ${record.updatedBy?.name ?? record.createdBy.name}). Make your change again and save.`
        : `Recorded by ${record.createdBy.name}. Saving changes this ${what}; it does not add a new one.`}
    </Notice>
  );
}
