import { MITE_METHODS, miteLoad, type MiteLoad, type MiteMethod } from '@/shared/domain/mites';
import { miteCountCreateSchema, RECORD_LIMITS, type MiteCountCreateInput, type MiteCountDto } from '@/shared/schemas/records';
import { useNow } from '@/components/layout/use-now';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { Notice } from '@/components/ui/notice';
import { Stepper } from '@/components/ui/stepper';
import { Text } from '@/components/ui/text';
import { RecordEditor } from './record-editor';
import { HiveRecordGate } from './hive-record-gate';
import type { EditTarget } from './use-edit-target';
import { FormGroup, NoteField, VisitTimeField } from './record-form';
import { MITE_METHOD_LABELS, optionsOf } from './record-labels';
import { useRecordForm, type TimedValues } from './use-record-form';

export interface MiteCountValues extends TimedValues {
  method: MiteMethod;
  beesSampled: number;
  mites: number;
  days: number;
  note: string;
}

/** The sample steps in tens of bees: nobody counts a ½-cup sample bee by bee. */
const BEES_STEP = 10;

export function miteCountBody(v: MiteCountValues, occurredAt: string): MiteCountCreateInput {
  const board = v.method === 'sticky-board';
  return {
    occurredAt,
    note: v.note.trim(),
    method: v.method,
    beesSampled: board ? null : v.beesSampled,
    mites: v.mites,
    days: board ? v.days : null,
  };
}

/** The load for the draft, or null while it cannot be worked out (e.g. more mites than bees). */
export function draftLoad(v: MiteCountValues): MiteLoad | null {
  try {
    return v.method === 'sticky-board'
      ? miteLoad({ method: v.method, mites: v.mites, days: v.days })
      : miteLoad({ method: v.method, mites: v.mites, beesSampled: v.beesSampled });
  } catch {
    return null;
  }
}

const LEVEL_WORDS = { low: 'Low', watch: 'Watch', act: 'Act' } as const;
const methodOptions = optionsOf(MITE_METHODS, MITE_METHOD_LABELS);
const fmt = (x: number) => (Math.round(x * 10) / 10).toLocaleString(undefined, { maximumFractionDigits: 1 });

/** A saved mite count as the form holds it, to edit it. */
export function miteCountFromRecord(r: MiteCountDto): MiteCountValues {
  return {
    visitTime: 'now',
    occurredAt: r.occurredAt,
    method: r.method,
    beesSampled: r.beesSampled ?? RECORD_LIMITS.defaultBeesSampled,
    mites: r.mites,
    days: r.days ?? 3,
    note: r.note,
  };
}

/** Mite count: /hives/[hiveId]/mite-count. */
export function MiteCountScreen() {
  return (
    <HiveRecordGate kind="mite-count" title="Mite count">
      {(hive, target) => <MiteCountForm key={target.formKey} target={target} hiveId={hive.id} hiveName={hive.name} />}
    </HiveRecordGate>
  );
}

function MiteCountForm({ hiveId, hiveName, target }: { hiveId: string; hiveName: string; target: EditTarget<'mite-count'> }) {
  const now = useNow();
  const form = useRecordForm({
    kind: 'mite-count',
    ownerId: hiveId,
    initial: (): MiteCountValues =>
      target.editing
        ? miteCountFromRecord(target.editing)
        : ({
          visitTime: 'now',
          occurredAt: null,
          method: 'alcohol-wash',
          beesSampled: RECORD_LIMITS.defaultBeesSampled,
          mites: 0,
          days: 3,
          note: '',
          }),
    build: miteCountBody,
    schema: miteCountCreateSchema,
    edit: target.edit,
    onStale: target.onStale,
    leaveTo: { pathname: '/hives/[hiveId]', params: { hiveId } },
  });
  const { draft, set } = form;
  const v = draft.values;
  if (!v) return null;
  const board = v.method === 'sticky-board';
  const load = draftLoad(v);

  const result = load ? (
    <Notice tone={load.level === 'low' ? 'good' : load.level === 'act' ? 'warning' : 'info'} title={`${LEVEL_WORDS[load.level]}: ${board ? `${fmt(load.perDay ?? 0)} mites a day` : `${fmt(load.perHundredBees ?? 0)} mites per 100 bees`}`} testID="mite-load">
      {load.basis}
    </Notice>
  ) : (
    <Notice tone="warning" title="Check the counts" testID="mite-load">
      A sample cannot hold more mites than bees.
    </Notice>
  );

  const left = (
    <>
      <FormGroup title="Count">
        <ChoiceChips field="method" label="Method" options={methodOptions} value={v.method} onChange={(method) => set({ method })} />
        {board ? (
          <Stepper field="days" label="Days the board was in" value={v.days} min={1} max={RECORD_LIMITS.maxBoardDays} decreaseLabel="One day fewer" increaseLabel="One day more" onChange={(days) => set({ days })} />
        ) : (
          <Stepper
            field="beesSampled"
            label="Bees sampled"
            hint="About 300 bees fill ½ US cup."
            value={v.beesSampled}
            min={BEES_STEP}
            max={RECORD_LIMITS.maxBeesSampled}
            step={BEES_STEP}
            decreaseLabel="Ten bees fewer"
            increaseLabel="Ten bees more"
            onChange={(beesSampled) => set({ beesSampled })}
          />
        )}
        <Stepper field="mites" label="Mites counted" value={v.mites} min={0} max={RECORD_LIMITS.maxMites} decreaseLabel="One mite fewer" increaseLabel="One mite more" onChange={(mites) => set({ mites })} />
        {result}
      </FormGroup>
    </>
  );

  const right = (
    <>
      <FormGroup title="When">
        <VisitTimeField label="Counted" value={v.visitTime} now={now} fixedAt={v.occurredAt} onChange={(visitTime) => set({ visitTime, occurredAt: null })} />
      </FormGroup>
      <FormGroup title="Note">
        <NoteField value={v.note} onChange={(note) => set({ note })} max={RECORD_LIMITS.noteChars} />
      </FormGroup>
    </>
  );

  return (
    <RecordEditor
      what="mite count"
      slug="mite-count"
      subject={hiveName}
      backHref={{ pathname: '/hives/[hiveId]', params: { hiveId } }}
      target={target}
      draft={draft}
      form={form}
      intro={board ? <Text tone="muted">Natural mite fall on a board tracks the colony’s load loosely: confirm a high count with a wash.</Text> : null}
      left={left}
      right={right}
    />
  );
}
