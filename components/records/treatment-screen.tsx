import { cautionsFor } from '@/shared/domain/cautions';
import type { IsoDate } from '@/shared/domain/dates';
import { TREATMENT_ACTIVE_INGREDIENTS, TREATMENT_METHODS, type TreatmentActiveIngredient, type TreatmentMethod } from '@/shared/domain/records';
import { RECORD_LIMITS, treatmentCreateSchema, type TreatmentCreateInput, type TreatmentDto } from '@/shared/schemas/records';
import { useNow } from '@/components/layout/use-now';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';
import { CautionList } from './caution-list';
import { RecordEditor } from './record-editor';
import { HiveRecordGate } from './hive-record-gate';
import type { EditTarget } from './use-edit-target';
import { DateField, FormGroup, NoteField } from './record-form';
import { ACTIVE_INGREDIENT_LABELS, optionsOf, TREATMENT_METHOD_LABELS } from './record-labels';
import { useRecordForm, type TimedValues } from './use-record-form';
import { localIsoDate } from './when';

export interface TreatmentValues extends TimedValues {
  activeIngredient: TreatmentActiveIngredient | null;
  method: TreatmentMethod | null;
  productName: string;
  dose: string;
  batch: string;
  startDate: IsoDate;
  plannedEndDate: IsoDate | null;
  actualEndDate: IsoDate | null;
  supersOff: boolean;
  withdrawalUntil: IsoDate | null;
  appliedBy: string;
  note: string;
}

/**
 * The record's instant: the fixed save instant when the treatment starts today, otherwise noon
 * (local) of the start day, so the Hive story places it on the day it began.
 */
function treatmentInstant(startDate: IsoDate, occurredAt: string): string {
  if (localIsoDate(new Date(occurredAt)) === startDate) return occurredAt;
  const [y, m, d] = startDate.split('-').map(Number);
  return new Date(y, m - 1, d, 12).toISOString();
}

export function treatmentBody(v: TreatmentValues, occurredAt: string): TreatmentCreateInput {
  return {
    occurredAt: treatmentInstant(v.startDate, occurredAt),
    note: v.note.trim(),
    // Unanswered choices are left for the schema to name.
    activeIngredient: (v.activeIngredient ?? undefined) as TreatmentActiveIngredient,
    method: (v.method ?? undefined) as TreatmentMethod,
    productName: v.productName.trim(),
    dose: v.dose.trim(),
    batch: v.batch.trim(),
    startDate: v.startDate,
    plannedEndDate: v.plannedEndDate,
    actualEndDate: v.actualEndDate,
    supersOff: v.supersOff,
    withdrawalUntil: v.withdrawalUntil,
    appliedBy: v.appliedBy.trim(),
  };
}

const ingredientOptions = optionsOf(TREATMENT_ACTIVE_INGREDIENTS, ACTIVE_INGREDIENT_LABELS);
const methodOptions = optionsOf(TREATMENT_METHODS, TREATMENT_METHOD_LABELS);
const supersOptions = [
  { value: 'off' as const, label: 'Supers off' },
  { value: 'on' as const, label: 'Supers on' },
];

/** A saved treatment as the form holds it, to edit it. */
export function treatmentFromRecord(r: TreatmentDto): TreatmentValues {
  return {
    visitTime: 'now',
    occurredAt: r.occurredAt,
    activeIngredient: r.activeIngredient,
    method: r.method,
    productName: r.productName,
    dose: r.dose,
    batch: r.batch,
    startDate: r.startDate,
    plannedEndDate: r.plannedEndDate,
    actualEndDate: r.actualEndDate,
    supersOff: r.supersOff,
    withdrawalUntil: r.withdrawalUntil,
    appliedBy: r.appliedBy,
    note: r.note,
  };
}

/** Treatment: /hives/[hiveId]/treatment. */
export function TreatmentScreen() {
  return (
    <HiveRecordGate kind="treatment" title="Treatment">
      {(hive, target) => <TreatmentForm key={target.formKey} target={target} hiveId={hive.id} hiveName={hive.name} />}
    </HiveRecordGate>
  );
}

function TreatmentForm({ hiveId, hiveName, target }: { hiveId: string; hiveName: string; target: EditTarget<'treatment'> }) {
  const now = useNow();
  const form = useRecordForm({
    kind: 'treatment',
    ownerId: hiveId,
    initial: (): TreatmentValues =>
      target.editing
        ? treatmentFromRecord(target.editing)
        : ({
          visitTime: 'now',
          occurredAt: null,
          activeIngredient: null,
          method: null,
          productName: '',
          dose: '',
          batch: '',
          startDate: localIsoDate(new Date()),
          plannedEndDate: null,
          actualEndDate: null,
          supersOff: true,
          withdrawalUntil: null,
          appliedBy: '',
          note: '',
          }),
    build: treatmentBody,
    schema: treatmentCreateSchema,
    edit: target.edit,
    onStale: target.onStale,
    leaveTo: { pathname: '/hives/[hiveId]', params: { hiveId } },
  });
  const { draft, set } = form;
  const v = draft.values;
  if (!v) return null;
  const cautions = cautionsFor('treatment', { activeIngredient: v.activeIngredient, method: v.method, supersOff: v.supersOff });

  const left = (
    <>
      <FormGroup title="Product">
        <ChoiceChips field="activeIngredient" label="Active ingredient" options={ingredientOptions} value={v.activeIngredient} onChange={(activeIngredient) => set({ activeIngredient })} />
        <ChoiceChips field="method" label="Method" options={methodOptions} value={v.method} onChange={(method) => set({ method })} />
        <CautionList ids={cautions} />
        <TextField testID="treatment-productName" label="Product name (optional)" value={v.productName} onChangeText={(productName) => set({ productName })} maxLength={120} />
        <TextField
          testID="treatment-dose"
          label="Dose, as written on the label"
          hint="Frameside records the dose; the label sets it."
          value={v.dose}
          onChangeText={(dose) => set({ dose })}
          maxLength={200}
        />
        <TextField testID="treatment-batch" label="Batch or lot number" hint="From the pack." value={v.batch} onChangeText={(batch) => set({ batch })} maxLength={60} autoCapitalize="characters" />
        <TextField testID="treatment-appliedBy" label="Applied by (optional)" value={v.appliedBy} onChangeText={(appliedBy) => set({ appliedBy })} maxLength={80} />
      </FormGroup>
    </>
  );

  const right = (
    <>
      <FormGroup title="Dates">
        <DateField field="startDate" label="Start" value={v.startDate} onChange={(d) => set({ startDate: d ?? v.startDate, occurredAt: null })} now={now} minDays={-60} maxDays={1} />
        <DateField
          field="plannedEndDate"
          label="Planned end"
          optional
          startFrom={v.startDate}
          value={v.plannedEndDate}
          onChange={(plannedEndDate) => set({ plannedEndDate })}
          now={now}
          minDays={-60}
          maxDays={120}
          hint="From the label."
        />
        <DateField
          field="actualEndDate"
          label="Actual end"
          optional
          startFrom={localIsoDate(now) < v.startDate ? v.startDate : localIsoDate(now)}
          value={v.actualEndDate}
          onChange={(actualEndDate) => set({ actualEndDate })}
          now={now}
          minDays={-60}
          maxDays={1}
        />
      </FormGroup>
      <FormGroup title="Honey supers">
        <ChoiceChips field="supersOff" label="During the treatment" options={supersOptions} value={v.supersOff ? 'off' : 'on'} onChange={(s) => set({ supersOff: s === 'off' })} />
        <DateField
          field="withdrawalUntil"
          label="Withdrawal until"
          optional
          startFrom={v.plannedEndDate ?? v.startDate}
          value={v.withdrawalUntil}
          onChange={(withdrawalUntil) => set({ withdrawalUntil })}
          now={now}
          minDays={-60}
          maxDays={365}
          hint="The day supers for harvest may go back on, from the label."
        />
      </FormGroup>
      <FormGroup title="Note">
        <NoteField value={v.note} onChange={(note) => set({ note })} max={RECORD_LIMITS.noteChars} />
      </FormGroup>
    </>
  );

  return (
    <RecordEditor
      what="treatment"
      slug="treatment"
      subject={hiveName}
      backHref={{ pathname: '/hives/[hiveId]', params: { hiveId } }}
      target={target}
      draft={draft}
      form={form}
      intro={
        <Notice tone="info" title="The label governs" testID="treatment-label-notice">
          Frameside records what you gave; the product label (and your local rules) set the dose, timing, method and whether supers may stay on.
        </Notice>
      }
      left={left}
      right={right}
    />
  );
}
