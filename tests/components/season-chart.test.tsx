/**
 * The Season review chart draws one mark per record of a small fixed series (invented test data),
 * plus the published reference lines: the 3 mites per 100 bees threshold (TRADE-REFERENCES §3,
 * USDA-ARS / UF) and the 33–36 °C brood-nest band (§8, Kleinhenz et al. 2003).
 */
import { fireEvent, render, screen } from '@testing-library/react-native';
import { SeasonChart, marksOf, nearestMark } from '@/components/season/season-chart';
import { arrangeRecords } from '@/components/season/season-table';
import type { HiveSeason, SeasonReferences } from '@/shared/schemas/season';

const references: SeasonReferences = {
  miteThresholdPerHundred: 3,
  miteThresholdSource: 'USDA-ARS / UF',
  broodNestLowC: 33,
  broodNestHighC: 36,
  broodNestSource: 'Kleinhenz et al. 2003',
  weightDaySource: 'daily change at midnight UTC',
};

const hive: HiveSeason = {
  id: 'h1',
  name: 'Test hive',
  honeyFrameSize: 'deep',
  inspections: [
    { id: 'i1', at: '2025-04-10T10:00:00Z', framesBrood: 3, framesBees: 6, honeyFrames: 2, storesKg: 6.3 },
    { id: 'i2', at: '2025-05-10T10:00:00Z', framesBrood: 6, framesBees: 9, honeyFrames: 3, storesKg: 9.45 },
    { id: 'i3', at: '2025-06-10T10:00:00Z', framesBrood: 8, framesBees: 12, honeyFrames: 4, storesKg: 12.6 },
  ],
  feedings: [
    { id: 'f1', at: '2025-04-01T18:00:00Z', kind: 'syrup', sugarKg: 2 },
    { id: 'f2', at: '2025-09-15T18:00:00Z', kind: 'syrup', sugarKg: 4 },
  ],
  treatments: [{ id: 't1', activeIngredient: 'formic-acid', productName: '', start: '2025-08-20T00:00:00Z', end: '2025-09-03T00:00:00Z', ended: true }],
  miteCounts: [
    { id: 'm1', at: '2025-07-01T10:00:00Z', method: 'alcohol-wash', perHundredBees: 1.5, perDay: null, level: 'low' },
    { id: 'm2', at: '2025-08-15T10:00:00Z', method: 'alcohol-wash', perHundredBees: 4, perDay: null, level: 'act' },
  ],
  harvests: [{ id: 'hv1', at: '2025-07-10T10:00:00Z', weightKg: 12 }],
  sensors: {
    bucketMinutes: 60,
    readings: 4,
    points: [
      { t: '2025-06-01T00:00:00Z', temperatureC: 34.5, weightKg: 50, n: 1 },
      { t: '2025-06-02T00:00:00Z', temperatureC: 34.8, weightKg: 50.5, n: 1 },
      { t: '2025-06-03T00:00:00Z', temperatureC: 34.6, weightKg: 50.55, n: 1 },
      { t: '2025-06-04T00:00:00Z', temperatureC: 34.7, weightKg: 50.2, n: 1 },
    ],
    weightDays: [
      { date: '2025-06-01', deltaKg: 0.5, trend: 'gaining' },
      { date: '2025-06-02', deltaKg: 0.05, trend: 'flat' },
      { date: '2025-06-03', deltaKg: -0.35, trend: 'losing' },
    ],
  },
  totals: { honeyHarvestedKg: 12, sugarFedKg: 6, treatments: 1, peakBrood: { frames: 8, at: '2025-06-10T10:00:00Z', hiveName: 'Test hive' }, inspections: 3 },
};

const props = { hive, from: '2025-01-01T00:00:00.000Z', to: '2026-01-01T00:00:00.000Z', references, width: 900 };

describe('SeasonChart', () => {
  it('draws a mark for every record and the reference band and threshold', () => {
    render(<SeasonChart {...props} />);
    expect(screen.getAllByTestId('season-brood-point')).toHaveLength(3);
    expect(screen.getAllByTestId('season-bees-point')).toHaveLength(3);
    expect(screen.getAllByTestId('season-stores-point')).toHaveLength(3);
    expect(screen.getAllByTestId('season-feeding-marker')).toHaveLength(2);
    expect(screen.getAllByTestId('season-harvest-marker')).toHaveLength(1);
    expect(screen.getAllByTestId('season-mite-point')).toHaveLength(2);
    expect(screen.getAllByTestId('season-treatment-span')).toHaveLength(1);
    // One tick per Quick check on each of the five panels (frames, stores, mites, temperature, weight).
    expect(screen.getAllByTestId(/^season-panel-/)).toHaveLength(5);
    expect(screen.getAllByTestId('season-inspection-tick')).toHaveLength(3 * 5);
    expect(screen.getByTestId('season-mite-threshold')).toBeTruthy();
    expect(screen.getByTestId('season-brood-nest-band')).toBeTruthy();
    expect(screen.getByTestId('season-temperature-trace')).toBeTruthy();
    expect(screen.getByTestId('season-weight-trace')).toBeTruthy();
    expect(screen.getAllByTestId('season-weight-day-gaining')).toHaveLength(1);
    expect(screen.getAllByTestId('season-weight-day-flat')).toHaveLength(1);
    expect(screen.getAllByTestId('season-weight-day-losing')).toHaveLength(1);
    // The legend names the sources of the reference values.
    expect(screen.getByText(/at or above 3 per 100 bees, treat \(USDA-ARS \/ UF\)/)).toBeTruthy();
    expect(screen.getByText(/brood nest 33–36 °C \(Kleinhenz et al\. 2003\)/)).toBeTruthy();
  });

  it('draws only frames and mites in the compact (apiary) form, and no sensor panels without a logger', () => {
    render(<SeasonChart {...props} hive={{ ...hive, sensors: null }} compact />);
    expect(screen.getAllByTestId(/^season-panel-/)).toHaveLength(2);
    expect(screen.queryByTestId('season-feeding-marker')).toBeNull();
    expect(screen.queryByTestId('season-brood-nest-band')).toBeNull();
    expect(screen.getAllByTestId('season-inspection-tick')).toHaveLength(3 * 2);
  });

  it('selects the record nearest to a tap and draws the selection rule', () => {
    const onSelect = jest.fn();
    const { rerender } = render(<SeasonChart {...props} onSelect={onSelect} />);
    // The axis spans the months with records, April to September: x = 414 of 48–884 falls near
    // 20 June, and the nearest record is the Quick check of 10 June.
    // The target is hidden from screen readers (they get the table and the Previous/Next buttons).
    fireEvent(screen.getByTestId('season-chart-target-h1', { includeHiddenElements: true }), 'responderGrant', { nativeEvent: { locationX: 414 } });
    expect(onSelect).toHaveBeenCalledWith('i3');
    rerender(<SeasonChart {...props} onSelect={onSelect} selectedId="i3" selectedLabel="10 Jun · Quick check" />);
    expect(screen.getAllByTestId('season-selection-rule')).toHaveLength(5);
    expect(screen.getAllByTestId('season-selection-label')).toHaveLength(1);
  });

  it('orders the marks in time and finds the nearest', () => {
    const marks = marksOf(hive);
    expect(marks.map((m) => m.id)).toEqual(['f1', 'i1', 'i2', 'i3', 'm1', 'hv1', 'm2', 't1', 'f2']);
    expect(nearestMark(marks, Date.parse('2025-07-08T00:00:00Z'))?.id).toBe('hv1');
    expect(nearestMark([], 0)).toBeNull();
  });
});

describe('the season table', () => {
  const rec = (id: string, kind: 'inspection' | 'feeding' | 'harvest', at: string, hiveId: string, hiveName: string) => ({ id, kind, at, hiveId, hiveName, summary: '', recordedBy: '', note: '' });
  const rows = [
    rec('a', 'inspection', '2025-05-01T10:00:00Z', 'h2', 'Bramble'),
    rec('b', 'feeding', '2025-04-01T10:00:00Z', 'h1', 'Ash'),
    rec('c', 'harvest', '2025-07-01T10:00:00Z', 'h1', 'Ash'),
    rec('d', 'inspection', '2025-03-01T10:00:00Z', 'h1', 'Ash'),
  ];

  it.each([
    ['newest', ['c', 'a', 'b', 'd']],
    ['oldest', ['d', 'b', 'a', 'c']],
    ['kind', ['b', 'c', 'd', 'a']],
    ['hive', ['d', 'b', 'c', 'a']],
  ] as const)('sorts %s first', (sort, ids) => {
    expect(arrangeRecords(rows, sort, [], []).map((r) => r.id)).toEqual(ids);
  });

  it('filters by kind and by hive (none chosen: all)', () => {
    expect(arrangeRecords(rows, 'oldest', ['inspection'], []).map((r) => r.id)).toEqual(['d', 'a']);
    expect(arrangeRecords(rows, 'oldest', ['inspection'], ['h2']).map((r) => r.id)).toEqual(['a']);
    expect(arrangeRecords(rows, 'oldest', [], [])).toHaveLength(4);
  });
});
