import { View } from 'react-native';
import { COLONY_EVENT_KINDS, type ColonyEventKind } from '@/shared/domain/records';
import { colonyEventCreateSchema, RECORD_LIMITS, type ColonyEventCreateInput, type ColonyEventDto } from '@/shared/schemas/records';
import { useHiveQuery, useHivesQuery } from '@/components/api/hives';
import { useNow } from '@/components/layout/use-now';
import { useTheme } from '@/components/theme/use-theme';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { Text } from '@/components/ui/text';
import { RecordEditor } from './record-editor';
import { HiveRecordGate } from './hive-record-gate';
import type { EditTarget } from './use-edit-target';
import { FormGroup, NoteField, VisitTimeField } from './record-form';
import { COLONY_EVENT_LABELS, optionsOf } from './record-labels';
import { useRecordForm, type TimedValues } from './use-record-form';

export interface ColonyEventValues extends TimedValues {
  kind: ColonyEventKind | null;
  /** The other hive of a split or combine; 'none' when it is not in Frameside. */
  otherHiveId: string | null;
  note: string;
}

/** Events that involve a second colony. */
const WITH_OTHER: readonly ColonyEventKind[] = ['split-from', 'split-to', 'combined'];

export function colonyEventBody(v: ColonyEventValues, occurredAt: string): ColonyEventCreateInput {
  const other = v.kind && WITH_OTHER.includes(v.kind) && v.otherHiveId && v.otherHiveId !== 'none' ? v.otherHiveId : null;
  // An unanswered kind is left for the schema to name.
  return { occurredAt, note: v.note.trim(), kind: (v.kind ?? undefined) as ColonyEventKind, otherHiveId: other };
}

const kindOptions = optionsOf(COLONY_EVENT_KINDS, COLONY_EVENT_LABELS);
const OTHER_QUESTION: Partial<Record<ColonyEventKind, string>> = {
  'split-from': 'Split from which hive?',
  'split-to': 'Split into which hive?',
  combined: 'Combined with which hive?',
};

/** A saved colony event as the form holds it, to edit it. */
export function colonyEventFromRecord(r: ColonyEventDto): ColonyEventValues {
  return { visitTime: 'now', occurredAt: r.occurredAt, kind: r.kind, otherHiveId: r.otherHiveId ?? (WITH_OTHER.includes(r.kind) ? 'none' : null), note: r.note };
}

/** Colony event: /hives/[hiveId]/colony-event. */
export function ColonyEventScreen() {
  return (
    <HiveRecordGate kind="colony-event" title="Colony event">
      {(hive, target) => <ColonyEventForm key={target.formKey} target={target} hiveId={hive.id} hiveName={hive.name} apiaryId={hive.apiaryId} />}
    </HiveRecordGate>
  );
}

function ColonyEventForm({ hiveId, hiveName, apiaryId, target }: { hiveId: string; hiveName: string; apiaryId: string; target: EditTarget<'colony-event'> }) {
  const t = useTheme();
  const now = useNow();
  const hives = useHivesQuery(apiaryId);
  const form = useRecordForm({
    kind: 'colony-event',
    ownerId: hiveId,
    initial: (): ColonyEventValues =>
      target.editing
        ? colonyEventFromRecord(target.editing)
        : ({ visitTime: 'now', occurredAt: null, kind: null, otherHiveId: null, note: '' }),
    build: colonyEventBody,
    schema: colonyEventCreateSchema,
    edit: target.edit,
    onStale: target.onStale,
    leaveTo: { pathname: '/hives/[hiveId]', params: { hiveId } },
  });
  const { draft, set } = form;
  const v = draft.values;
  if (!v) return null;
  const question = v.kind ? OTHER_QUESTION[v.kind] : undefined;
  const otherOptions = [
    ...(hives.data ?? []).filter((h) => h.id !== hiveId).map((h) => ({ value: h.id, label: h.name })),
    { value: 'none', label: 'Not in Frameside' },
  ];

  return (
    <RecordEditor
      what="colony event"
      slug="colony-event"
      subject={hiveName}
      backHref={{ pathname: '/hives/[hiveId]', params: { hiveId } }}
      target={target}
      draft={draft}
      form={form}
      left={
        <FormGroup title="What happened">
          <ChoiceChips field="kind" label="The colony" hideLabel options={kindOptions} value={v.kind} onChange={(kind) => set({ kind })} />
          {question ? (
            <View style={{ gap: t.space.xs }}>
              <ChoiceChips field="otherHiveId" label={question} options={otherOptions} value={v.otherHiveId} onChange={(otherHiveId) => set({ otherHiveId })} />
              {hives.isPending ? <Text tone="muted">Loading this apiary’s hives…</Text> : null}
            </View>
          ) : null}
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
