import { useLocalSearchParams } from 'expo-router';
import { cautionsFor } from '@/shared/domain/cautions';
import { FORAGE_JUDGEMENTS, SYRUP_DISH, syrupDishVerdict, type ForageJudgement, type SyrupDishObservation } from '@/shared/domain/forage';
import { forageCheckCreateSchema, RECORD_LIMITS, type ForageCheckCreateInput, type ForageCheckDto } from '@/shared/schemas/records';
import { useApiaryQuery } from '@/components/api/apiaries';
import { useNow } from '@/components/layout/use-now';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { Notice } from '@/components/ui/notice';
import { LoadError, Loading } from '@/components/ui/query-state';
import { Screen } from '@/components/ui/screen';
import { Stepper } from '@/components/ui/stepper';
import { CautionList } from './caution-list';
import { RecordEditor } from './record-editor';
import { EditLoading } from './edit-loading';
import { useEditTarget, type EditTarget } from './use-edit-target';
import { FormGroup, NoteField, VisitTimeField } from './record-form';
import { FORAGE_JUDGEMENT_LABELS, optionsOf } from './record-labels';
import { useRecordForm, type TimedValues } from './use-record-form';

type Mode = 'dish' | 'judgement';
type DishResult = 'emptied' | 'found' | 'untouched';

export interface ForageCheckValues extends TimedValues {
  mode: Mode;
  dishResult: DishResult;
  minutesToEmpty: number;
  watchedMinutes: number;
  judgement: ForageJudgement | null;
  note: string;
}

/** Steps of 5 minutes: a dish is read against a watch, not a stopwatch. */
const MINUTE_STEP = 5;

function dishOf(v: ForageCheckValues): SyrupDishObservation {
  if (v.dishResult === 'emptied') return { minutesToEmpty: v.minutesToEmpty };
  return { watchedMinutes: v.watchedMinutes, untouched: v.dishResult === 'untouched' };
}

export function forageCheckBody(v: ForageCheckValues, occurredAt: string): ForageCheckCreateInput {
  const base = { occurredAt, note: v.note.trim() };
  if (v.mode === 'judgement') {
    return { ...base, minutesToEmpty: null, watchedMinutes: null, untouched: false, judgement: v.judgement };
  }
  const d = dishOf(v);
  // The dish's own verdict is worked out by the server from the same rule (syrupDishVerdict).
  return { ...base, minutesToEmpty: d.minutesToEmpty ?? null, watchedMinutes: d.watchedMinutes ?? null, untouched: d.untouched ?? false, judgement: null };
}

const modeOptions = [
  { value: 'dish' as const, label: 'Syrup dish test' },
  { value: 'judgement' as const, label: 'My own judgement' },
];
const resultOptions = [
  { value: 'emptied' as const, label: 'Emptied' },
  { value: 'found' as const, label: 'Found, not emptied' },
  { value: 'untouched' as const, label: 'Not touched' },
];
const judgementOptions = optionsOf(FORAGE_JUDGEMENTS, FORAGE_JUDGEMENT_LABELS);
const VERDICT_WORDS: Record<ForageJudgement, string> = {
  dearth: 'emptied within 30 minutes: foragers have little else to work.',
  some: 'found but not emptied quickly: some forage about.',
  flow: 'left alone: the bees have better forage.',
};

/** A saved Forage check as the form holds it, to edit it. */
export function forageCheckFromRecord(r: ForageCheckDto): ForageCheckValues {
  const dish = r.minutesToEmpty != null || r.watchedMinutes != null || r.untouched;
  return {
    visitTime: 'now',
    occurredAt: r.occurredAt,
    mode: dish ? 'dish' : 'judgement',
    dishResult: r.minutesToEmpty != null ? 'emptied' : r.untouched ? 'untouched' : 'found',
    minutesToEmpty: r.minutesToEmpty ?? 20,
    watchedMinutes: r.watchedMinutes ?? SYRUP_DISH.minimumWatchMinutes,
    judgement: dish ? null : r.judgement,
    note: r.note,
  };
}

/** Forage check: /apiaries/[apiaryId]/forage-check. */
export function ForageCheckScreen() {
  const { apiaryId } = useLocalSearchParams<{ apiaryId: string }>();
  const apiary = useApiaryQuery(apiaryId);
  const target = useEditTarget('forage-check');
  if (target.waiting) return <EditLoading title="Forage check" query={target.query} />;
  if (apiary.isPending || apiary.isError) {
    return (
      <Screen title="Forage check">
        {apiary.isPending ? <Loading label="Loading the apiary…" /> : <LoadError error={apiary.error} onRetry={() => void apiary.refetch()} />}
      </Screen>
    );
  }
  return <ForageCheckForm key={target.formKey} target={target} apiaryId={apiary.data.id} apiaryName={apiary.data.name} />;
}

function ForageCheckForm({ apiaryId, apiaryName, target }: { apiaryId: string; apiaryName: string; target: EditTarget<'forage-check'> }) {
  const now = useNow();
  const form = useRecordForm({
    kind: 'forage-check',
    ownerId: apiaryId,
    initial: (): ForageCheckValues =>
      target.editing
        ? forageCheckFromRecord(target.editing)
        : ({
          visitTime: 'now',
          occurredAt: null,
          mode: 'dish',
          dishResult: 'emptied',
          minutesToEmpty: 20,
          watchedMinutes: SYRUP_DISH.minimumWatchMinutes,
          judgement: null,
          note: '',
          }),
    build: forageCheckBody,
    schema: forageCheckCreateSchema,
    edit: target.edit,
    onStale: target.onStale,
    leaveTo: { pathname: '/apiaries/[apiaryId]', params: { apiaryId } },
  });
  const { draft, set } = form;
  const v = draft.values;
  if (!v) return null;

  let verdict: ForageJudgement | null = null;
  if (v.mode === 'dish') {
    try {
      verdict = syrupDishVerdict(dishOf(v));
    } catch {
      verdict = null;
    }
  }
  const cautions = cautionsFor('forage-check', v.mode === 'dish' ? { ...dishOf(v) } : { judgement: v.judgement });

  const left = (
    <FormGroup title="How you judged it">
      <ChoiceChips field="mode" label="Method" hideLabel options={modeOptions} value={v.mode} onChange={(mode) => set({ mode })} />
      {v.mode === 'dish' ? (
        <>
          <ChoiceChips field="dishResult" label="The dish was" options={resultOptions} value={v.dishResult} onChange={(dishResult) => set({ dishResult })} />
          {v.dishResult === 'emptied' ? (
            <Stepper
              field="minutesToEmpty"
              label="Minutes until it was empty"
              unit="min"
              value={v.minutesToEmpty}
              min={0}
              max={600}
              step={MINUTE_STEP}
              decreaseLabel="Five minutes less"
              increaseLabel="Five minutes more"
              onChange={(minutesToEmpty) => set({ minutesToEmpty })}
            />
          ) : (
            <Stepper
              field="watchedMinutes"
              label="Minutes watched"
              unit="min"
              hint={`Watch at least ${SYRUP_DISH.minimumWatchMinutes} minutes.`}
              value={v.watchedMinutes}
              min={SYRUP_DISH.minimumWatchMinutes}
              max={600}
              step={MINUTE_STEP}
              decreaseLabel="Five minutes less"
              increaseLabel="Five minutes more"
              onChange={(watchedMinutes) => set({ watchedMinutes })}
            />
          )}
          {verdict ? (
            <Notice tone={verdict === 'dearth' ? 'warning' : 'info'} title={`Reading: ${FORAGE_JUDGEMENT_LABELS[verdict]}`} testID="forage-verdict">
              {`The dish was ${VERDICT_WORDS[verdict]}`}
            </Notice>
          ) : null}
        </>
      ) : (
        <ChoiceChips field="judgement" label="Forage now" options={judgementOptions} value={v.judgement} onChange={(judgement) => set({ judgement })} />
      )}
      <CautionList ids={cautions} />
    </FormGroup>
  );

  const right = (
    <>
      <FormGroup title="When">
        <VisitTimeField label="Checked" value={v.visitTime} now={now} fixedAt={v.occurredAt} onChange={(visitTime) => set({ visitTime, occurredAt: null })} />
      </FormGroup>
      <FormGroup title="Note">
        <NoteField value={v.note} onChange={(note) => set({ note })} max={RECORD_LIMITS.noteChars} />
      </FormGroup>
    </>
  );

  return (
    <RecordEditor
      what="forage check"
      slug="forage-check"
      subject={apiaryName}
      backHref={{ pathname: '/apiaries/[apiaryId]', params: { apiaryId } }}
      target={target}
      draft={draft}
      form={form}
      left={left}
      right={right}
    />
  );
}
