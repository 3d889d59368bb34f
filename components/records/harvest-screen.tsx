import { View } from 'react-native';
import { kgToLb, lbToKg } from '@/shared/domain/units';
import { harvestCreateSchema, RECORD_LIMITS, type HarvestCreateInput, type HarvestDto } from '@/shared/schemas/records';
import { useNow } from '@/components/layout/use-now';
import { useTheme } from '@/components/theme/use-theme';
import { BigButton } from '@/components/ui/big-button';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { Stepper } from '@/components/ui/stepper';
import { Text } from '@/components/ui/text';
import { RecordEditor } from './record-editor';
import { HiveRecordGate } from './hive-record-gate';
import type { EditTarget } from './use-edit-target';
import { FormGroup, NoteField, VisitTimeField } from './record-form';
import { useRecordForm, type TimedValues } from './use-record-form';
import { useUnits, type UnitSystem } from './use-units';

export interface HarvestValues extends TimedValues {
  supers: number;
  frames: number;
  /** In the units shown (`units`): kg or lb; null when not weighed. */
  weight: number | null;
  units: UnitSystem;
  /** Water content, %, from a refractometer; null when not read. */
  moisturePercent: number | null;
  note: string;
}

const WEIGHT_STEP: Record<UnitSystem, number> = { metric: 0.5, us: 1 };
const round2 = (x: number) => Math.round(x * 100) / 100;

export function harvestBody(v: HarvestValues, occurredAt: string): HarvestCreateInput {
  return {
    occurredAt,
    note: v.note.trim(),
    supers: v.supers,
    frames: v.frames,
    weightKg: v.weight === null ? null : v.units === 'metric' ? v.weight : round2(lbToKg(v.weight)),
    moisturePercent: v.moisturePercent,
  };
}

const unitOptions = [
  { value: 'metric' as const, label: 'kg' },
  { value: 'us' as const, label: 'lb' },
];

/** A saved harvest as the form holds it, to edit it: the weight in kg, as stored. */
export function harvestFromRecord(r: HarvestDto): HarvestValues {
  return {
    visitTime: 'now',
    occurredAt: r.occurredAt,
    supers: r.supers,
    frames: r.frames,
    weight: r.weightKg,
    units: 'metric',
    moisturePercent: r.moisturePercent,
    note: r.note,
  };
}

/** Harvest: /hives/[hiveId]/harvest. */
export function HarvestScreen() {
  return (
    <HiveRecordGate kind="harvest" title="Harvest">
      {(hive, target) => <HarvestForm key={target.formKey} target={target} hiveId={hive.id} hiveName={hive.name} />}
    </HiveRecordGate>
  );
}

function HarvestForm({ hiveId, hiveName, target }: { hiveId: string; hiveName: string; target: EditTarget<'harvest'> }) {
  const t = useTheme();
  const now = useNow();
  const [preferredUnits, setPreferredUnits] = useUnits();
  const form = useRecordForm({
    kind: 'harvest',
    ownerId: hiveId,
    initial: (): HarvestValues =>
      target.editing
        ? harvestFromRecord(target.editing)
        : ({ visitTime: 'now', occurredAt: null, supers: 1, frames: 0, weight: null, units: preferredUnits, moisturePercent: null, note: '' }),
    build: harvestBody,
    schema: harvestCreateSchema,
    edit: target.edit,
    onStale: target.onStale,
    leaveTo: { pathname: '/hives/[hiveId]', params: { hiveId } },
  });
  const { draft, set } = form;
  const v = draft.values;
  if (!v) return null;
  const wUnit = v.units === 'metric' ? 'kg' : 'lb';

  const left = (
    <>
      <FormGroup title="Taken">
        <Stepper field="supers" label="Supers taken" value={v.supers} min={0} max={50} decreaseLabel="One super fewer" increaseLabel="One super more" onChange={(supers) => set({ supers })} />
        <Stepper field="frames" label="Frames taken" hint="Frames taken on their own, besides whole supers." value={v.frames} min={0} max={500} decreaseLabel="One frame fewer" increaseLabel="One frame more" onChange={(frames) => set({ frames })} />
      </FormGroup>
      <FormGroup title="When">
        <VisitTimeField label="Taken" value={v.visitTime} now={now} fixedAt={v.occurredAt} onChange={(visitTime) => set({ visitTime, occurredAt: null })} />
      </FormGroup>
    </>
  );

  const right = (
    <>
      <FormGroup title="Weight and moisture">
        <ChoiceChips
          field="units"
          label="Weight in"
          options={unitOptions}
          value={v.units}
          onChange={(units) => {
            setPreferredUnits(units);
            set((x) => {
              if (x.weight === null || x.units === units) return { ...x, units };
              const kg = x.units === 'metric' ? x.weight : lbToKg(x.weight);
              const shown = units === 'metric' ? kg : kgToLb(kg);
              const step = WEIGHT_STEP[units];
              return { ...x, units, weight: Math.max(step, Math.round(shown / step) * step) };
            });
          }}
        />
        {v.weight === null ? (
          <View style={{ gap: t.space.xs }}>
            <Text variant="label">Weight of honey</Text>
            <BigButton testID="weight-add" variant="secondary" label="Add the weight" onPress={() => set({ weight: v.units === 'metric' ? 10 : 20 })} />
          </View>
        ) : (
          <Stepper
            field="weight"
            label="Weight of honey"
            unit={wUnit}
            value={v.weight}
            min={WEIGHT_STEP[v.units]}
            max={v.units === 'metric' ? 1000 : 2200}
            step={WEIGHT_STEP[v.units]}
            decreaseLabel={`Less, by ${WEIGHT_STEP[v.units]} ${wUnit}`}
            increaseLabel={`More, by ${WEIGHT_STEP[v.units]} ${wUnit}`}
            onChange={(weight) => set({ weight })}
          />
        )}
        {v.moisturePercent === null ? (
          <View style={{ gap: t.space.xs }}>
            <Text variant="label">Moisture (optional)</Text>
            <BigButton testID="moisture-add" variant="secondary" label="Add a refractometer reading" onPress={() => set({ moisturePercent: 18 })} />
          </View>
        ) : (
          <Stepper
            field="moisturePercent"
            label="Moisture"
            unit="%"
            hint="From a refractometer."
            value={v.moisturePercent}
            min={10}
            max={30}
            step={0.1}
            format={(x) => x.toFixed(1)}
            decreaseLabel="0.1 % drier"
            increaseLabel="0.1 % wetter"
            onChange={(moisturePercent) => set({ moisturePercent })}
          />
        )}
      </FormGroup>
      <FormGroup title="Note">
        <NoteField value={v.note} onChange={(note) => set({ note })} max={RECORD_LIMITS.noteChars} />
      </FormGroup>
    </>
  );

  return (
    <RecordEditor
      what="harvest"
      slug="harvest"
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
