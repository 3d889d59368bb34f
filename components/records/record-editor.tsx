import type { Href } from 'expo-router';
import type { ReactNode } from 'react';
import type { RecordDto } from '@/shared/schemas/records';
import { DraftRestored } from './draft-restored';
import { EditingNotice } from './editing-notice';
import { RecordFormScreen, SaveBar } from './record-form';
import type { RecordDraft } from './use-record-draft';

export interface RecordEditorProps {
  /** The record's name in a sentence, e.g. "mite count": the title is "Mite count" or "Edit mite count". */
  what: string;
  /** The kind's URL slug, e.g. "mite-count": the testID root of the screen, its notices and its save button. */
  slug: string;
  subject: string;
  backHref: Href;
  target: { editing: RecordDto | null; stale: boolean };
  draft: Pick<RecordDraft<object>, 'restoredAt' | 'reset'>;
  form: { save: () => void; saving: boolean; error: unknown };
  /** Lines of the form's own under the editing and restored-draft notices. */
  intro?: ReactNode;
  left: ReactNode;
  right?: ReactNode;
}

const capitalised = (s: string) => s.charAt(0).toUpperCase() + s.slice(1);

/**
 * The frame every record form but the Quick check shares: title for a new record or an edit,
 * the editing and restored-draft notices, and the save bar.
 */
export function RecordEditor({ what, slug, subject, backHref, target, draft, form, intro, left, right }: RecordEditorProps) {
  const editing = target.editing;
  return (
    <RecordFormScreen
      title={editing ? `Edit ${what}` : capitalised(what)}
      subject={subject}
      backHref={backHref}
      testID={`${slug}-screen`}
      intro={
        <>
          {editing ? <EditingNotice record={editing} stale={target.stale} what={what} testID={slug} /> : null}
          <DraftRestored draft={draft} testID={slug} />
          {intro}
        </>
      }
      left={left}
      right={right}
      bottomBar={<SaveBar testID={`${slug}-save`} label={editing ? 'Save changes' : `Save ${what}`} onSave={form.save} saving={form.saving} error={form.error} />}
    />
  );
}
