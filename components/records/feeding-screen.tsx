import { cautionsFor } from '@/shared/domain/cautions';
import { FEEDER_TYPES, FEEDING_KINDS, SYRUP_BASES, SYRUP_RATIOS, type FeederType, type FeedingKind, type SyrupBasis, type SyrupRatio } from '@/shared/domain/records';
import { gallonsToLitres, kgToLb, lbToKg, litresToGallons } from '@/shared/domain/units';
import { feedingCreateSchema, RECORD_LIMITS, type FeedingCreateInput, type FeedingDto } from '@/shared/schemas/records';
import { useNow } from '@/components/layout/use-now';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { Stepper } from '@/components/ui/stepper';
import { Text } from '@/components/ui/text';
import { SyrupSugarLine } from '@/components/tools/syrup-sugar-line';
import { CautionList } from './caution-list';
import { FormGroup, NoteField, VisitTimeField } from './record-form';
import { FEEDER_TYPE_LABELS, FEEDING_KIND_LABELS, optionsOf, SYRUP_BASIS_LABELS, SYRUP_RATIO_LABELS } from './record-labels';
import { RecordEditor } from './record-editor';
import { HiveRecordGate } from './hive-record-gate';
import type { EditTarget } from './use-edit-target';
import { useRecordForm, type TimedValues } from './use-record-form';
import { useUnits, type UnitSystem } from './use-units';

/** Syrup is measured by volume (L or US gal), solid feed by weight (kg or lb). */
type Measure = 'volume' | 'weight';

export interface FeedingValues extends TimedValues {
  kind: FeedingKind;
  ratio: SyrupRatio;
  basis: SyrupBasis;
  /** In the units shown when it was entered (`units`): L or US gal for syrup, kg or lb otherwise. */
  amount: number;
  units: UnitSystem;
  feederType: FeederType | null;
  note: string;
}

const measureOf = (kind: FeedingKind): Measure => (kind === 'syrup' ? 'volume' : 'weight');

/** Stepper steps in the shown unit: ½ L, ¼ US gal (≈ 0.95 L), ½ kg, 1 lb (≈ 0.45 kg). Frameside's own choice. */
const STEP: Record<Measure, Record<UnitSystem, number>> = {
  volume: { metric: 0.5, us: 0.25 },
  weight: { metric: 0.5, us: 1 },
};

const UNIT_WORD: Record<Measure, Record<UnitSystem, string>> = {
  volume: { metric: 'L', us: 'US gal' },
  weight: { metric: 'kg', us: 'lb' },
};

/** Starting amounts: a 4 L (≈ 1 US gal) feeder of syrup, a 1 kg (2 lb) block of fondant or patty. */
const DEFAULT_AMOUNT: Record<Measure, Record<UnitSystem, number>> = {
  volume: { metric: 4, us: 1 },
  weight: { metric: 1, us: 2 },
};

const snap = (x: number, step: number) => Math.max(step, Math.round(x / step) * step);
const round2 = (x: number) => Math.round(x * 100) / 100;

/** The amount in SI (L or kg), as stored. */
export function amountInSi(amount: number, measure: Measure, units: UnitSystem): number {
  if (units === 'metric') return amount;
  return round2(measure === 'volume' ? gallonsToLitres(amount) : lbToKg(amount));
}

/** The same amount in the other units, snapped to that unit's step. */
function convertAmount(amount: number, measure: Measure, from: UnitSystem, to: UnitSystem): number {
  if (from === to) return amount;
  const si = amountInSi(amount, measure, from);
  const shown = to === 'metric' ? si : measure === 'volume' ? litresToGallons(si) : kgToLb(si);
  return snap(shown, STEP[measure][to]);
}

function maxAmount(measure: Measure, units: UnitSystem): number {
  const siMax = measure === 'volume' ? RECORD_LIMITS.maxAmountL : RECORD_LIMITS.maxAmountKg;
  const shown = units === 'metric' ? siMax : measure === 'volume' ? litresToGallons(siMax) : kgToLb(siMax);
  const step = STEP[measure][units];
  return Math.floor(shown / step) * step;
}

export function feedingBody(v: FeedingValues, occurredAt: string): FeedingCreateInput {
  const measure = measureOf(v.kind);
  const si = amountInSi(v.amount, measure, v.units);
  const syrup = v.kind === 'syrup';
  return {
    occurredAt,
    note: v.note.trim(),
    kind: v.kind,
    ratio: syrup ? v.ratio : null,
    basis: syrup ? v.basis : null,
    amountL: measure === 'volume' ? si : null,
    amountKg: measure === 'weight' ? si : null,
    feederType: v.feederType,
  };
}

const kindOptions = optionsOf(FEEDING_KINDS, FEEDING_KIND_LABELS);
const ratioOptions = optionsOf(SYRUP_RATIOS, SYRUP_RATIO_LABELS);
const basisOptions = optionsOf(SYRUP_BASES, SYRUP_BASIS_LABELS);
const feederOptions = optionsOf(FEEDER_TYPES, FEEDER_TYPE_LABELS);
const unitOptions = [
  { value: 'metric' as const, label: 'Litres and kg' },
  { value: 'us' as const, label: 'US gallons and lb' },
];

/** A saved feeding as the form holds it, to edit it: the amount shown in metric units, as stored. */
export function feedingFromRecord(r: FeedingDto): FeedingValues {
  return {
    visitTime: 'now',
    occurredAt: r.occurredAt,
    kind: r.kind,
    ratio: r.ratio ?? '1:1',
    basis: r.basis ?? 'weight',
    amount: (measureOf(r.kind) === 'volume' ? r.amountL : r.amountKg) ?? DEFAULT_AMOUNT[measureOf(r.kind)].metric,
    units: 'metric',
    feederType: r.feederType,
    note: r.note,
  };
}

/** Feeding: /hives/[hiveId]/feeding. */
export function FeedingScreen() {
  return (
    <HiveRecordGate kind="feeding" title="Feeding">
      {(hive, target) => <FeedingForm key={target.formKey} target={target} hiveId={hive.id} hiveName={hive.name} />}
    </HiveRecordGate>
  );
}

function FeedingForm({ hiveId, hiveName, target }: { hiveId: string; hiveName: string; target: EditTarget<'feeding'> }) {
  const now = useNow();
  const [preferredUnits, setPreferredUnits] = useUnits();
  const form = useRecordForm({
    kind: 'feeding',
    ownerId: hiveId,
    initial: (): FeedingValues =>
      target.editing
        ? feedingFromRecord(target.editing)
        : ({
          visitTime: 'now',
          occurredAt: null,
          kind: 'syrup',
          ratio: '1:1',
          basis: 'weight',
          amount: DEFAULT_AMOUNT.volume[preferredUnits],
          units: preferredUnits,
          feederType: null,
          note: '',
          }),
    build: feedingBody,
    schema: feedingCreateSchema,
    edit: target.edit,
    onStale: target.onStale,
    leaveTo: { pathname: '/hives/[hiveId]', params: { hiveId } },
  });
  const { draft, set } = form;
  const v = draft.values;
  if (!v) return null;
  const measure = measureOf(v.kind);
  const unit = UNIT_WORD[measure][v.units];
  const si = amountInSi(v.amount, measure, v.units);

  const left = (
    <>
      <FormGroup title="What was fed">
        <ChoiceChips
          field="kind"
          label="Feed"
          options={kindOptions}
          value={v.kind}
          onChange={(kind) =>
            set((x) => {
              const m = measureOf(kind);
              return m === measureOf(x.kind) ? { ...x, kind } : { ...x, kind, amount: DEFAULT_AMOUNT[m][x.units] };
            })
          }
        />
        {v.kind === 'syrup' ? (
          <>
            <ChoiceChips field="ratio" label="Sugar to water" options={ratioOptions} value={v.ratio} onChange={(ratio) => set({ ratio })} />
            <ChoiceChips field="basis" label="Mixed" options={basisOptions} value={v.basis} onChange={(basis) => set({ basis })} />
          </>
        ) : null}
      </FormGroup>
      <FormGroup title="How much">
        <ChoiceChips
          field="units"
          label="Units"
          options={unitOptions}
          value={v.units}
          onChange={(units) => {
            setPreferredUnits(units);
            set((x) => ({ ...x, units, amount: convertAmount(x.amount, measureOf(x.kind), x.units, units) }));
          }}
        />
        <Stepper
          field="amount"
          label={measure === 'volume' ? 'Syrup given' : 'Feed given'}
          unit={unit}
          value={v.amount}
          min={STEP[measure][v.units]}
          max={maxAmount(measure, v.units)}
          step={STEP[measure][v.units]}
          decreaseLabel={`Less, by ${STEP[measure][v.units]} ${unit}`}
          increaseLabel={`More, by ${STEP[measure][v.units]} ${unit}`}
          onChange={(amount) => set({ amount })}
        />
        {v.kind === 'syrup' ? <SyrupSugarLine ratio={v.ratio} basis={v.basis} litres={si} testID="feeding-sugar" /> : null}
        {v.units === 'us' ? (
          <Text tone="muted" testID="feeding-stored-amount">{`Stored as ${si} ${measure === 'volume' ? 'L' : 'kg'}.`}</Text>
        ) : null}
      </FormGroup>
    </>
  );

  const right = (
    <>
      <FormGroup title="Feeder">
        <ChoiceChips field="feederType" label="Feeder" hideLabel options={feederOptions} value={v.feederType} onChange={(feederType) => set({ feederType })} />
        <CautionList ids={cautionsFor('feeding', { feederType: v.feederType })} />
      </FormGroup>
      <FormGroup title="When">
        <VisitTimeField label="Fed" value={v.visitTime} now={now} fixedAt={v.occurredAt} onChange={(visitTime) => set({ visitTime, occurredAt: null })} />
      </FormGroup>
      <FormGroup title="Note">
        <NoteField value={v.note} onChange={(note) => set({ note })} max={RECORD_LIMITS.noteChars} />
      </FormGroup>
    </>
  );

  return (
    <RecordEditor
      what="feeding"
      slug="feeding"
      subject={hiveName}
      backHref={{ pathname: '/hives/[hiveId]', params: { hiveId } }}
      target={target}
      draft={draft}
      form={form}
      left={left}
      right={right}
    />
  );
}
