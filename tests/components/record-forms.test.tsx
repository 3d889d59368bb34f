/**
 * The record forms' building blocks without a server: the draft kept on the device, the date and
 * visit-time fields, and the pure rules of the Quick check and feeding
 * forms (pre-fill, queen cells, units), checked against the shared zod schemas. The chips'
 * aria-checked on the web is checked in the browser (tests/e2e/quick-check.test.ts, (c)).
 */
import { act, fireEvent, render, screen } from '@testing-library/react-native';
import { useState } from 'react';
import { Pressable, Text } from 'react-native';
import { inspectionCreateSchema, feedingCreateSchema, type InspectionDto } from '@/shared/schemas/records';
import { DateField, VisitTimeField, NoteField } from '@/components/records/record-form';
import { draftStorageKey, useRecordDraft } from '@/components/records/use-record-draft';
import { readLocal, removeLocal } from '@/components/records/local-store';
import { quickCheckBody, quickCheckStart } from '@/components/records/quick-check-screen';
import { amountInSi, feedingBody } from '@/components/records/feeding-screen';
import { dateFromToday } from '@/components/records/when';

jest.mock('expo-router', () => ({
  useLocalSearchParams: () => ({}),
  useRouter: () => ({ back: jest.fn(), replace: jest.fn(), canGoBack: () => false }),
  Link: ({ children }: { children: unknown }) => children,
}));

function DraftHarness({ storageKey, onKey }: { storageKey: string; onKey?: (k: string) => void }) {
  const draft = useRecordDraft<{ count: number }>(storageKey, true, () => ({ count: 0 }));
  onKey?.(draft.idempotencyKey);
  if (!draft.values) return null;
  return (
    <>
      <Text testID="count">{String(draft.values.count)}</Text>
      <Text testID="restored">{draft.restoredAt ? 'restored' : 'fresh'}</Text>
      <Pressable testID="inc" onPress={() => draft.update((v) => ({ count: v.count + 1 }))} />
      <Pressable testID="clear" onPress={() => draft.clear()} />
    </>
  );
}

describe('useRecordDraft', () => {
  const key = draftStorageKey('inspection', 'hive-1');
  afterEach(() => removeLocal(key));

  it('writes every change to the device and opens on it again, with the same Idempotency-Key', () => {
    const keys: string[] = [];
    const first = render(<DraftHarness storageKey={key} onKey={(k) => keys.push(k)} />);
    expect(screen.getByTestId('restored')).toHaveTextContent('fresh');
    fireEvent.press(screen.getByTestId('inc'));
    fireEvent.press(screen.getByTestId('inc'));
    expect(JSON.parse(readLocal(key) ?? '{}').values).toEqual({ count: 2 });
    first.unmount();

    render(<DraftHarness storageKey={key} onKey={(k) => keys.push(k)} />);
    expect(screen.getByTestId('count')).toHaveTextContent('2');
    expect(screen.getByTestId('restored')).toHaveTextContent('restored');
    expect(new Set(keys).size).toBe(1);
    expect(keys[0]).toMatch(/^[0-9a-f]{8}-[0-9a-f]{4}-4[0-9a-f]{3}-[89ab][0-9a-f]{3}-[0-9a-f]{12}$/);
  });

  it('forgets the draft once cleared (after a save)', () => {
    const first = render(<DraftHarness storageKey={key} />);
    fireEvent.press(screen.getByTestId('inc'));
    fireEvent.press(screen.getByTestId('clear'));
    expect(readLocal(key)).toBeNull();
    first.unmount();
    render(<DraftHarness storageKey={key} />);
    expect(screen.getByTestId('count')).toHaveTextContent('0');
    expect(screen.getByTestId('restored')).toHaveTextContent('fresh');
  });
});

function DateHarness({ optional }: { optional?: boolean }) {
  const now = new Date(2026, 4, 12, 10);
  const [value, setValue] = useState<string | null>(optional ? null : dateFromToday(0, now));
  return (
    <>
      <DateField field="start" label="Start" value={value} onChange={setValue} now={now} minDays={-2} maxDays={1} optional={optional} />
      <Text testID="date">{String(value)}</Text>
    </>
  );
}

describe('DateField', () => {
  it('moves a day at a time from today, inside its limits, with no keyboard', () => {
    render(<DateHarness />);
    expect(screen.getByTestId('stepper-start-value')).toHaveTextContent('12 May');
    expect(screen.getByText('Start: today')).toBeOnTheScreen();
    fireEvent.press(screen.getByRole('button', { name: 'Start one day earlier' }));
    expect(screen.getByTestId('date')).toHaveTextContent('2026-05-11');
    expect(screen.getByText('Start: yesterday')).toBeOnTheScreen();
    fireEvent.press(screen.getByRole('button', { name: 'Start one day earlier' }));
    fireEvent.press(screen.getByRole('button', { name: 'Start one day earlier' }));
    // −2 days is the limit.
    expect(screen.getByTestId('date')).toHaveTextContent('2026-05-10');
    expect(screen.getByRole('button', { name: 'Start one day earlier' })).toBeDisabled();
  });

  it('starts an optional date unset behind a button, and can clear it again', () => {
    render(<DateHarness optional />);
    expect(screen.getByTestId('date')).toHaveTextContent('null');
    fireEvent.press(screen.getByTestId('date-start-set'));
    expect(screen.getByTestId('date')).toHaveTextContent('2026-05-12');
    fireEvent.press(screen.getByTestId('date-start-clear'));
    expect(screen.getByTestId('date')).toHaveTextContent('null');
  });
});

describe('VisitTimeField and NoteField', () => {
  it('writes out the visit time each chip stands for', () => {
    function H() {
      const [v, setV] = useState<'now' | 'hour-ago' | 'earlier-today' | 'yesterday'>('now');
      return <VisitTimeField value={v} onChange={setV} now={new Date(2026, 4, 12, 14, 5)} />;
    }
    render(<H />);
    expect(screen.getByTestId('visit-time-text')).toHaveTextContent('Tue 12 May, 14:05');
    fireEvent.press(screen.getByRole('radio', { name: '1 h ago' }));
    expect(screen.getByTestId('visit-time-text')).toHaveTextContent('Tue 12 May, 13:05');
    fireEvent.press(screen.getByRole('radio', { name: 'Yesterday' }));
    expect(screen.getByTestId('visit-time-text')).toHaveTextContent('Mon 11 May, 14:05');
  });

  it('keeps the note folded away until asked for', () => {
    render(<NoteField value="" onChange={() => {}} />);
    expect(screen.queryByTestId('note')).toBeNull();
    act(() => fireEvent.press(screen.getByTestId('note-open')));
    expect(screen.getByTestId('note')).toBeOnTheScreen();
  });
});

const previous = {
  id: '00000000-0000-4000-8000-000000000001',
  occurredAt: '2026-05-12T09:00:00.000Z',
  framesBrood: 5,
  framesBees: 8,
  honeyFrames: 2,
  pollenFrames: 1,
  queenStatus: 'queen-seen',
  eggsSeen: true,
  youngLarvaeSeen: true,
  queenCells: [{ kind: 'swarm', count: 2, capped: true }],
  broodPattern: 'solid',
  temperament: 2,
  diseaseSigns: ['chalkbrood'],
  spaceActions: ['super-added'],
  weather: 'sunny',
  airTempC: 21,
} as unknown as InspectionDto;

describe('Quick check pre-fill', () => {
  it('starts from the previous check’s colony state, and leaves one-visit facts empty', () => {
    const v = quickCheckStart(previous);
    expect(v).toMatchObject({ framesBrood: 5, framesBees: 8, honeyFrames: 2, pollenFrames: 1, queenStatus: 'queen-seen', broodPattern: 'solid', temperament: 2 });
    expect(v).toMatchObject({ cellsSeen: false, diseaseSigns: [], spaceActions: [], weather: null, airTempC: null, note: '' });
    expect(v.basedOn).toEqual({ id: previous.id, occurredAt: previous.occurredAt });
  });

  it('builds a body the shared schema accepts, and one it refuses without a queen status', () => {
    const at = new Date().toISOString();
    expect(inspectionCreateSchema.safeParse(quickCheckBody(quickCheckStart(previous), at)).success).toBe(true);
    const first = inspectionCreateSchema.safeParse(quickCheckBody(quickCheckStart(undefined), at));
    expect(first.success).toBe(false);
    expect(first.error?.issues.map((i) => i.path[0])).toContain('queenStatus');
  });

  it('writes queen cells by kind, open and capped apart', () => {
    const v = { ...quickCheckStart(previous), cellsSeen: true, cells: { swarm: { open: 1, capped: 3 }, supersedure: { open: 0, capped: 0 }, emergency: { open: 0, capped: 1 } } };
    expect(quickCheckBody(v, new Date().toISOString()).queenCells).toEqual([
      { kind: 'swarm', count: 1, capped: false },
      { kind: 'swarm', count: 3, capped: true },
      { kind: 'emergency', count: 1, capped: true },
    ]);
  });
});

describe('Feeding amounts', () => {
  // 1 US gallon = 3.785411784 L and 1 lb = 0.45359237 kg, exact by definition (TRADE-REFERENCES §2b).
  it.each([
    [1, 'volume', 'us', 3.79],
    [4, 'volume', 'metric', 4],
    [2, 'weight', 'us', 0.91],
    [1.5, 'weight', 'metric', 1.5],
  ] as const)('%s in %s (%s) is stored as %s', (amount, measure, units, si) => {
    expect(amountInSi(amount, measure, units)).toBeCloseTo(si, 2);
  });

  it('sends syrup in litres with its ratio and basis, fondant in kg without them; both pass the shared schema', () => {
    const at = new Date().toISOString();
    const syrup = feedingBody({ visitTime: 'now', occurredAt: at, kind: 'syrup', ratio: '2:1', basis: 'weight', amount: 1, units: 'us', feederType: 'top-feeder', note: '' }, at);
    expect(syrup).toMatchObject({ kind: 'syrup', ratio: '2:1', basis: 'weight', amountL: 3.79, amountKg: null });
    expect(feedingCreateSchema.safeParse(syrup).success).toBe(true);
    const fondant = feedingBody({ visitTime: 'now', occurredAt: at, kind: 'fondant', ratio: '2:1', basis: 'weight', amount: 2, units: 'metric', feederType: null, note: '' }, at);
    expect(fondant).toMatchObject({ kind: 'fondant', ratio: null, basis: null, amountL: null, amountKg: 2 });
    expect(feedingCreateSchema.safeParse(fondant).success).toBe(true);
  });
});
