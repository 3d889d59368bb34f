import { useLocalSearchParams } from 'expo-router';
import { useMemo, useState } from 'react';
import { View } from 'react-native';
import { cautionsFor } from '@/shared/domain/cautions';
import { frameCapacity, type Box } from '@/shared/domain/hives';
import {
  BROOD_PATTERNS,
  DISEASE_SIGNS,
  QUEEN_CELL_KINDS,
  QUEEN_STATUSES,
  SPACE_ACTIONS,
  WEATHER,
  type BroodPattern,
  type DiseaseSign,
  type QueenCellKind,
  type QueenStatus,
  type SpaceAction,
  type Weather,
} from '@/shared/domain/records';
import { inspectionCreateSchema, RECORD_LIMITS, type InspectionCreateInput, type InspectionDto } from '@/shared/schemas/records';
import { useHiveQuery } from '@/components/api/hives';
import { useHiveRecordsQuery, useRecordQuery } from '@/components/api/records';
import { useNow } from '@/components/layout/use-now';
import { useTheme } from '@/components/theme/use-theme';
import { BigButton } from '@/components/ui/big-button';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { Notice } from '@/components/ui/notice';
import { LoadError, Loading } from '@/components/ui/query-state';
import { Screen } from '@/components/ui/screen';
import { Stepper } from '@/components/ui/stepper';
import { Text } from '@/components/ui/text';
import { PhotoPicker } from '@/components/photos/photo-picker';
import { sendCheckPhotos } from '@/components/photos/upload-queue';
import { StoresLine } from '@/components/tools/stores-line';
import { CautionList } from './caution-list';
import { DraftRestored } from './draft-restored';
import { FormGroup, NoteField, RecordFormScreen, SaveBar, VisitTimeField } from './record-form';
import {
  BROOD_PATTERN_LABELS,
  DISEASE_SIGN_LABELS,
  optionsOf,
  QUEEN_CELL_KIND_LABELS,
  QUEEN_STATUS_LABELS,
  SPACE_ACTION_LABELS,
  TEMPERAMENT_LABELS,
  WEATHER_LABELS,
} from './record-labels';
import { useRecordForm } from './use-record-form';
import { draftStorageKey } from './use-record-draft';
import { shortDateOfInstant, type VisitTime } from './when';

type CellCounts = Record<QueenCellKind, { open: number; capped: number }>;

/** The Quick check as the form holds it (and as the draft is kept on the device). */
export interface QuickCheckValues {
  visitTime: VisitTime;
  /** Fixed at the first Save press, so a retry sends the very same request. */
  occurredAt: string | null;
  framesBrood: number;
  framesBees: number;
  honeyFrames: number;
  pollenFrames: number;
  queenStatus: QueenStatus | null;
  eggsSeen: boolean;
  youngLarvaeSeen: boolean;
  cellsSeen: boolean;
  cells: CellCounts;
  broodPattern: BroodPattern | null;
  temperament: number | null;
  diseaseSigns: DiseaseSign[];
  spaceActions: SpaceAction[];
  weather: Weather | null;
  airTempC: number | null;
  note: string;
  /** The check this one started from ("Same as last time — 12 May"). */
  basedOn: { id: string; occurredAt: string } | null;
}

const noCells = (): CellCounts => ({ swarm: { open: 0, capped: 0 }, supersedure: { open: 0, capped: 0 }, emergency: { open: 0, capped: 0 } });

/**
 * Where a new check starts: the colony's state from the previous check (frames, queen, brood
 * pattern, temperament), so a standard visit only changes what changed. What belongs to one
 * visit — cells, signs, actions, weather, the note — starts empty: carrying a sign forward
 * would record what nobody saw.
 */
export function quickCheckStart(previous: InspectionDto | undefined): QuickCheckValues {
  return {
    visitTime: 'now',
    occurredAt: null,
    framesBrood: previous?.framesBrood ?? 0,
    framesBees: previous?.framesBees ?? 0,
    honeyFrames: previous?.honeyFrames ?? 0,
    pollenFrames: previous?.pollenFrames ?? 0,
    queenStatus: previous?.queenStatus ?? null,
    eggsSeen: previous?.eggsSeen ?? false,
    youngLarvaeSeen: previous?.youngLarvaeSeen ?? false,
    cellsSeen: false,
    cells: noCells(),
    broodPattern: previous?.broodPattern ?? null,
    temperament: previous?.temperament ?? null,
    diseaseSigns: [],
    spaceActions: [],
    weather: null,
    airTempC: null,
    note: '',
    basedOn: previous ? { id: previous.id, occurredAt: previous.occurredAt } : null,
  };
}

/** A stored check as the form holds it, to edit it: every field, its own visit time. */
export function quickCheckFromRecord(r: InspectionDto): QuickCheckValues {
  const cells = noCells();
  for (const c of r.queenCells) cells[c.kind][c.capped ? 'capped' : 'open'] += c.count;
  return {
    visitTime: 'now',
    occurredAt: r.occurredAt,
    framesBrood: r.framesBrood,
    framesBees: r.framesBees,
    honeyFrames: r.honeyFrames,
    pollenFrames: r.pollenFrames,
    queenStatus: r.queenStatus,
    eggsSeen: r.eggsSeen,
    youngLarvaeSeen: r.youngLarvaeSeen,
    cellsSeen: r.queenCells.length > 0,
    cells,
    broodPattern: r.broodPattern,
    temperament: r.temperament,
    diseaseSigns: [...r.diseaseSigns],
    spaceActions: [...r.spaceActions],
    weather: r.weather,
    airTempC: r.airTempC,
    note: r.note,
    basedOn: null,
  };
}

/** The request body for a draft; `occurredAt` must already be fixed. */
export function quickCheckBody(v: QuickCheckValues, occurredAt: string): InspectionCreateInput {
  const queenCells = v.cellsSeen
    ? QUEEN_CELL_KINDS.flatMap((kind) => [
        ...(v.cells[kind].open > 0 ? [{ kind, count: v.cells[kind].open, capped: false }] : []),
        ...(v.cells[kind].capped > 0 ? [{ kind, count: v.cells[kind].capped, capped: true }] : []),
      ])
    : [];
  return {
    occurredAt,
    note: v.note.trim(),
    framesBrood: v.framesBrood,
    framesBees: v.framesBees,
    honeyFrames: v.honeyFrames,
    pollenFrames: v.pollenFrames,
    // An unanswered queen status is left for the schema to name ("Choose the queen status").
    queenStatus: (v.queenStatus ?? undefined) as QueenStatus,
    eggsSeen: v.eggsSeen,
    youngLarvaeSeen: v.youngLarvaeSeen,
    queenCells,
    broodPattern: v.broodPattern,
    temperament: v.temperament,
    diseaseSigns: v.diseaseSigns,
    spaceActions: v.spaceActions,
    weather: v.weather,
    airTempC: v.airTempC,
  };
}

/**
 * What the queen-status chip implies for the "seen" marks, and the reverse: choosing "eggs seen"
 * marks eggs, "young larvae only" marks larvae and clears eggs, "no eggs" clears both; marking
 * eggs while the status says otherwise moves the status to "eggs seen". The record never
 * contradicts itself, and the keeper never has to tap twice for one fact.
 */
function withQueenStatus(v: QuickCheckValues, status: QueenStatus): QuickCheckValues {
  switch (status) {
    case 'eggs-seen':
      return { ...v, queenStatus: status, eggsSeen: true };
    case 'young-larvae-only':
      return { ...v, queenStatus: status, eggsSeen: false, youngLarvaeSeen: true };
    case 'no-eggs-or-brood':
      return { ...v, queenStatus: status, eggsSeen: false, youngLarvaeSeen: false };
    default:
      return { ...v, queenStatus: status };
  }
}

type BroodSeen = 'eggs' | 'young-larvae';

function withBroodSeen(v: QuickCheckValues, seen: BroodSeen[]): QuickCheckValues {
  const eggsSeen = seen.includes('eggs');
  const youngLarvaeSeen = seen.includes('young-larvae');
  let queenStatus = v.queenStatus;
  if (eggsSeen && (queenStatus === 'young-larvae-only' || queenStatus === 'no-eggs-or-brood' || queenStatus === null)) queenStatus = 'eggs-seen';
  else if (!eggsSeen && youngLarvaeSeen && (queenStatus === 'no-eggs-or-brood' || queenStatus === 'eggs-seen' || queenStatus === null)) {
    queenStatus = 'young-larvae-only';
  } else if (!eggsSeen && queenStatus === 'eggs-seen') queenStatus = youngLarvaeSeen ? 'young-larvae-only' : 'no-eggs-or-brood';
  return { ...v, eggsSeen, youngLarvaeSeen, queenStatus };
}

const queenStatusOptions = optionsOf(QUEEN_STATUSES, QUEEN_STATUS_LABELS);
const broodSeenOptions = [
  { value: 'eggs' as const, label: 'Eggs' },
  { value: 'young-larvae' as const, label: 'Young larvae' },
];
const broodPatternOptions = optionsOf(BROOD_PATTERNS, BROOD_PATTERN_LABELS);
const temperamentOptions = (['1', '2', '3', '4', '5'] as const).map((value) => ({ value, label: TEMPERAMENT_LABELS[value] }));
const diseaseOptions = optionsOf(DISEASE_SIGNS, DISEASE_SIGN_LABELS);
const spaceOptions = optionsOf(SPACE_ACTIONS, SPACE_ACTION_LABELS);
const weatherOptions = optionsOf(WEATHER, WEATHER_LABELS);
const cellsSeenOptions = [
  { value: 'none' as const, label: 'None seen' },
  { value: 'seen' as const, label: 'Queen cells seen' },
];

/** The Quick check: /hives/[hiveId]/check, or /hives/[hiveId]/check?recordId=… to edit a saved one. */
export function QuickCheckScreen() {
  const { hiveId, recordId } = useLocalSearchParams<{ hiveId: string; recordId?: string }>();
  const hive = useHiveQuery(hiveId);
  const previous = useHiveRecordsQuery(recordId ? undefined : hiveId, 'inspection');
  const record = useRecordQuery('inspection', recordId);
  const [stale, setStale] = useState(false);

  if (recordId && (record.isPending || record.isError)) {
    return (
      <Screen title="Quick check">
        {record.isPending ? <Loading label="Loading the check…" /> : <LoadError error={record.error} onRetry={() => void record.refetch()} />}
      </Screen>
    );
  }
  if (hive.isPending || hive.isError) {
    return (
      <Screen title="Quick check">
        {hive.isPending ? <Loading label="Loading the hive…" /> : <LoadError error={hive.error} onRetry={() => void hive.refetch()} />}
      </Screen>
    );
  }
  const editing = recordId && record.data ? record.data : null;
  return (
    <QuickCheckForm
      // A stale edit brings the current version; the form starts again from it.
      key={editing ? `edit-${editing.version}` : 'new'}
      editing={editing}
      stale={stale}
      onStale={() => setStale(true)}
      hiveId={hive.data.id}
      hiveName={hive.data.name}
      capacity={frameCapacity(hive.data.boxes)}
      boxes={hive.data.boxes}
      // A failed list read only loses the pre-fill; the keeper can still record.
      previousReady={!previous.isPending}
      previousFailed={previous.isError}
      previous={previous.data?.[0]}
    />
  );
}

interface QuickCheckFormProps {
  hiveId: string;
  hiveName: string;
  capacity: number;
  boxes: readonly Box[];
  previousReady: boolean;
  previous: InspectionDto | undefined;
  /** The previous check could not be loaded (no signal): the form starts from 0 and says why. */
  previousFailed: boolean;
  /** The saved check being edited, or null for a new one. */
  editing: InspectionDto | null;
  /** True after a save found that someone else had changed the check first. */
  stale: boolean;
  onStale: () => void;
}

function QuickCheckForm({ hiveId, hiveName, capacity, boxes, previousReady, previous, previousFailed, editing, stale, onStale }: QuickCheckFormProps) {
  const t = useTheme();
  const now = useNow();
  const form = useRecordForm({
    kind: 'inspection',
    ownerId: hiveId,
    ready: editing ? true : previousReady,
    initial: () => (editing ? quickCheckFromRecord(editing) : quickCheckStart(previous)),
    edit: editing ? { recordId: editing.id, version: editing.version } : null,
    onStale,
    build: quickCheckBody,
    schema: inspectionCreateSchema,
    extraCheck: (x) =>
      Math.max(x.framesBrood, x.framesBees, x.honeyFrames, x.pollenFrames) > capacity ? `This hive’s boxes hold ${capacity} frames; lower the frame counts.` : null,
    leaveTo: { pathname: '/hives/[hiveId]', params: { hiveId } },
    // The check's photos waited with the draft; now that the check has an id they can go.
    onSaved: (record) => {
      if (!editing) void sendCheckPhotos(draftStorageKey('inspection', hiveId), record.id);
    },
  });
  const { draft, set } = form;
  const v = draft.values;

  const cautions = useMemo(() => (v ? cautionsFor('inspection', { diseaseSigns: v.diseaseSigns, temperament: v.temperament }) : []), [v]);

  if (!v) {
    return (
      <Screen title="Quick check">
        <Loading label="Opening the last check…" />
      </Screen>
    );
  }
  const change = (fn: (x: QuickCheckValues) => QuickCheckValues) => set(fn);

  const frameStepper = (field: 'framesBrood' | 'framesBees' | 'honeyFrames' | 'pollenFrames', label: string, fewer: string, more: string) => (
    <Stepper
      field={field}
      label={label}
      value={v[field]}
      min={0}
      max={capacity}
      step={0.5}
      decreaseLabel={fewer}
      increaseLabel={more}
      onChange={(n) => set({ [field]: n } as Partial<QuickCheckValues>)}
    />
  );

  const basis = editing ? (
    <Notice tone={stale ? 'warning' : 'info'} title={stale ? 'Someone else saved this check first' : `Editing the check of ${shortDateOfInstant(editing.occurredAt)}`} testID="quick-check-editing">
      {stale
        ? `It now shows their version (saved by ${editing.updatedBy?.name ?? editing.createdBy.name}). Make your change again and save.`
        : `Recorded by ${editing.createdBy.name}. Saving changes this check; it does not add a new one.`}
    </Notice>
  ) : v.basedOn ? (
    <Notice tone="info" title={`Same as last time — ${shortDateOfInstant(v.basedOn.occurredAt)}`} testID="quick-check-basis">
      Frames, queen, brood pattern and temperament start from that check: change what changed. Cells, signs, actions and weather start empty.
    </Notice>
  ) : previousFailed ? (
    <Notice tone="info" title="The last check could not be loaded" testID="quick-check-basis">
      No connection to fetch it: every count starts at 0. The check is kept on this device until it is saved.
    </Notice>
  ) : (
    <Notice tone="info" title="First check of this hive" testID="quick-check-basis">
      Nothing to start from yet: every count starts at 0.
    </Notice>
  );

  const restored = <DraftRestored draft={draft} testID="quick-check" />;

  const left = (
    <>
      <FormGroup title="Frames">
        <Text tone="muted">{`In half frames, up to the ${capacity} frames this hive’s boxes hold.`}</Text>
        {frameStepper('framesBrood', 'Frames of brood', 'One half frame less brood', 'One half frame more brood')}
        {frameStepper('framesBees', 'Frames covered with bees', 'One half frame fewer bees', 'One half frame more bees')}
        {frameStepper('honeyFrames', 'Honey frames', 'One half frame less honey', 'One half frame more honey')}
        <StoresLine honeyFrames={v.honeyFrames} boxes={boxes} testID="quick-check-stores" />
        {frameStepper('pollenFrames', 'Pollen frames', 'One half frame less pollen', 'One half frame more pollen')}
      </FormGroup>
      <FormGroup title="Queen and brood">
        <ChoiceChips field="queenStatus" label="Queen status" options={queenStatusOptions} value={v.queenStatus} onChange={(s) => change((x) => withQueenStatus(x, s))} />
        <ChoiceChips
          field="broodSeen"
          label="Eggs and young larvae seen"
          multiple
          options={broodSeenOptions}
          value={[...(v.eggsSeen ? (['eggs'] as const) : []), ...(v.youngLarvaeSeen ? (['young-larvae'] as const) : [])]}
          onChange={(seen) => change((x) => withBroodSeen(x, seen))}
        />
        <ChoiceChips field="broodPattern" label="Brood pattern" options={broodPatternOptions} value={v.broodPattern} onChange={(broodPattern) => set({ broodPattern })} />
        <ChoiceChips
          field="temperament"
          label="Temperament"
          hint="1 calm … 5 very defensive"
          options={temperamentOptions}
          value={v.temperament === null ? null : (String(v.temperament) as '1' | '2' | '3' | '4' | '5')}
          onChange={(s) => set({ temperament: Number(s) })}
        />
      </FormGroup>
      <FormGroup title="Queen cells">
        <ChoiceChips field="queenCells" label="Queen cells" hideLabel options={cellsSeenOptions} value={v.cellsSeen ? 'seen' : 'none'} onChange={(s) => set({ cellsSeen: s === 'seen' })} />
        {v.cellsSeen
          ? QUEEN_CELL_KINDS.map((kind) => (
              <View key={kind} style={{ gap: t.space.sm }}>
                <Text variant="heading">{QUEEN_CELL_KIND_LABELS[kind]}</Text>
                {(['open', 'capped'] as const).map((state) => (
                  <Stepper
                    key={state}
                    field={`cells-${kind}-${state}`}
                    label={state === 'open' ? 'Open' : 'Capped'}
                    value={v.cells[kind][state]}
                    min={0}
                    max={RECORD_LIMITS.maxQueenCells}
                    decreaseLabel={`One ${state} ${kind} cell fewer`}
                    increaseLabel={`One ${state} ${kind} cell more`}
                    onChange={(n) => change((x) => ({ ...x, cells: { ...x.cells, [kind]: { ...x.cells[kind], [state]: n } } }))}
                  />
                ))}
              </View>
            ))
          : null}
      </FormGroup>
    </>
  );

  const right = (
    <>
      <FormGroup title="Disease and pests">
        <ChoiceChips<DiseaseSign> field="diseaseSigns" label="Signs seen" multiple options={diseaseOptions} value={v.diseaseSigns} onChange={(diseaseSigns) => set({ diseaseSigns })} />
        <CautionList ids={cautions} />
      </FormGroup>
      <FormGroup title="Space and feeders">
        <ChoiceChips<SpaceAction> field="spaceActions" label="What you did" multiple options={spaceOptions} value={v.spaceActions} onChange={(spaceActions) => set({ spaceActions })} />
      </FormGroup>
      <FormGroup title="Visit and weather">
        <VisitTimeField value={v.visitTime} now={now} fixedAt={v.occurredAt} onChange={(visitTime) => set({ visitTime, occurredAt: null })} />
        <ChoiceChips field="weather" label="Weather" options={weatherOptions} value={v.weather} onChange={(weather) => set({ weather })} />
        {v.airTempC === null ? (
          <View style={{ gap: t.space.xs }}>
            <Text variant="label">Air temperature</Text>
            <BigButton testID="airTempC-add" variant="secondary" label="Add air temperature" onPress={() => set({ airTempC: 18 })} />
          </View>
        ) : (
          <Stepper
            field="airTempC"
            label="Air temperature"
            unit="°C"
            value={v.airTempC}
            min={RECORD_LIMITS.minAirTempC}
            max={RECORD_LIMITS.maxAirTempC}
            decreaseLabel="One degree cooler"
            increaseLabel="One degree warmer"
            onChange={(airTempC) => set({ airTempC })}
          />
        )}
      </FormGroup>
      {editing ? null : (
        <FormGroup title="Frame photos">
          <PhotoPicker hiveId={hiveId} boxes={boxes} draftKey={draftStorageKey('inspection', hiveId)} sendWith="check" testID="check-photo-picker" />
        </FormGroup>
      )}
      <FormGroup title="Note">
        <NoteField value={v.note} onChange={(note) => set({ note })} max={RECORD_LIMITS.noteChars} />
      </FormGroup>
    </>
  );

  return (
    <RecordFormScreen
      title={editing ? 'Edit check' : 'Quick check'}
      subject={hiveName}
      backHref={{ pathname: '/hives/[hiveId]', params: { hiveId } }}
      testID="quick-check-screen"
      intro={
        <View style={{ gap: t.space.sm }}>
          {restored}
          {basis}
        </View>
      }
      left={left}
      right={right}
      bottomBar={<SaveBar testID="quick-check-save" label={editing ? 'Save changes' : 'Save check'} onSave={form.save} saving={form.saving} error={form.error} />}
    />
  );
}
