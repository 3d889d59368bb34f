import { useLocalSearchParams } from 'expo-router';
import { QUEEN_EVENT_KINDS, type QueenEventKind } from '@/shared/domain/records';
import { queenEventCreateSchema, RECORD_LIMITS, type QueenEventCreateInput } from '@/shared/schemas/records';
import { useHiveQuery } from '@/components/api/hives';
import { useNow } from '@/components/layout/use-now';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { LoadError, Loading } from '@/components/ui/query-state';
import { Screen } from '@/components/ui/screen';
import { DraftRestored } from './draft-restored';
import { FormGroup, NoteField, RecordFormScreen, SaveBar, VisitTimeField } from './record-form';
import { optionsOf, QUEEN_EVENT_LABELS } from './record-labels';
import { useRecordForm, type TimedValues } from './use-record-form';

export interface QueenEventValues extends TimedValues {
  kind: QueenEventKind | null;
  note: string;
}

export function queenEventBody(v: QueenEventValues, occurredAt: string): QueenEventCreateInput {
  // An unanswered kind is left for the schema to name.
  return { occurredAt, note: v.note.trim(), kind: (v.kind ?? undefined) as QueenEventKind };
}

const kindOptions = optionsOf(QUEEN_EVENT_KINDS, QUEEN_EVENT_LABELS);

/** Queen event: /hives/[hiveId]/queen-event. */
export function QueenEventScreen() {
  const { hiveId } = useLocalSearchParams<{ hiveId: string }>();
  const hive = useHiveQuery(hiveId);
  if (hive.isPending || hive.isError) {
    return (
      <Screen title="Queen event">
        {hive.isPending ? <Loading label="Loading the hive…" /> : <LoadError error={hive.error} onRetry={() => void hive.refetch()} />}
      </Screen>
    );
  }
  return <QueenEventForm hiveId={hive.data.id} hiveName={hive.data.name} />;
}

function QueenEventForm({ hiveId, hiveName }: { hiveId: string; hiveName: string }) {
  const now = useNow();
  const form = useRecordForm({
    kind: 'queen-event',
    ownerId: hiveId,
    initial: (): QueenEventValues => ({ visitTime: 'now', occurredAt: null, kind: null, note: '' }),
    build: queenEventBody,
    schema: queenEventCreateSchema,
    leaveTo: { pathname: '/hives/[hiveId]', params: { hiveId } },
  });
  const { draft, set } = form;
  const v = draft.values;
  if (!v) return null;
  return (
    <RecordFormScreen
      title="Queen event"
      subject={hiveName}
      backHref={{ pathname: '/hives/[hiveId]', params: { hiveId } }}
      testID="queen-event-screen"
      intro={<DraftRestored draft={draft} testID="queen-event" />}
      left={
        <FormGroup title="What happened">
          <ChoiceChips field="kind" label="The queen was" hideLabel options={kindOptions} value={v.kind} onChange={(kind) => set({ kind })} />
        </FormGroup>
      }
      right={
        <>
          <FormGroup title="When">
            <VisitTimeField label="When" value={v.visitTime} now={now} fixedAt={v.occurredAt} onChange={(visitTime) => set({ visitTime, occurredAt: null })} />
          </FormGroup>
          <FormGroup title="Note">
            <NoteField value={v.note} onChange={(note) => set({ note })} max={RECORD_LIMITS.noteChars} />
          </FormGroup>
        </>
      }
      bottomBar={<SaveBar testID="queen-event-save" label="Save queen event" onSave={form.save} saving={form.saving} error={form.error} />}
    />
  );
}
