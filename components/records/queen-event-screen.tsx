import { QUEEN_EVENT_KINDS, type QueenEventKind } from '@/shared/domain/records';
import { queenEventCreateSchema, RECORD_LIMITS, type QueenEventCreateInput, type QueenEventDto } from '@/shared/schemas/records';
import { useNow } from '@/components/layout/use-now';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { RecordEditor } from './record-editor';
import { HiveRecordGate } from './hive-record-gate';
import type { EditTarget } from './use-edit-target';
import { FormGroup, NoteField, VisitTimeField } from './record-form';
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

/** A saved queen event as the form holds it, to edit it. */
export function queenEventFromRecord(r: QueenEventDto): QueenEventValues {
  return { visitTime: 'now', occurredAt: r.occurredAt, kind: r.kind, note: r.note };
}

/** Queen event: /hives/[hiveId]/queen-event. */
export function QueenEventScreen() {
  return (
    <HiveRecordGate kind="queen-event" title="Queen event">
      {(hive, target) => <QueenEventForm key={target.formKey} target={target} hiveId={hive.id} hiveName={hive.name} />}
    </HiveRecordGate>
  );
}

function QueenEventForm({ hiveId, hiveName, target }: { hiveId: string; hiveName: string; target: EditTarget<'queen-event'> }) {
  const now = useNow();
  const form = useRecordForm({
    kind: 'queen-event',
    ownerId: hiveId,
    initial: (): QueenEventValues =>
      target.editing
        ? queenEventFromRecord(target.editing)
        : ({ visitTime: 'now', occurredAt: null, kind: null, note: '' }),
    build: queenEventBody,
    schema: queenEventCreateSchema,
    edit: target.edit,
    onStale: target.onStale,
    leaveTo: { pathname: '/hives/[hiveId]', params: { hiveId } },
  });
  const { draft, set } = form;
  const v = draft.values;
  if (!v) return null;
  return (
    <RecordEditor
      what="queen event"
      slug="queen-event"
      subject={hiveName}
      backHref={{ pathname: '/hives/[hiveId]', params: { hiveId } }}
      target={target}
      draft={draft}
      form={form}
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
    />
  );
}
