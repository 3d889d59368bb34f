import { useMemo, useState, type ReactNode } from 'react';
import { View, type LayoutChangeEvent } from 'react-native';
import { useBreakpoints } from '@/components/layout/use-breakpoints';
import { useTheme } from '@/components/theme/use-theme';
import { BigButton } from '@/components/ui/big-button';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { Section } from '@/components/ui/section';
import { Text } from '@/components/ui/text';
import { SEASON_KIND_LABELS } from '@/shared/domain/season';
import type { SeasonDto, SeasonTotals } from '@/shared/schemas/season';
import { PRINT_WIDTH, PrintStyle, canPrint, printPage, usePrinting } from './print';
import { SeasonChart, dataMonths, marksOf } from './season-chart';
import { SeasonTable, shortDate } from './season-table';

export interface SeasonViewProps {
  data: SeasonDto;
  /** Seasons offered as chips, newest first. */
  seasons: number[];
  onSeason: (season: number) => void;
  /** Title block: back link and heading. */
  header: ReactNode;
  /** Extra buttons (downloads, sensor import). */
  actions?: ReactNode;
}

const kg = (v: number) => `${v.toLocaleString('en-GB', { maximumFractionDigits: 1 })} kg`;

function Totals({ totals }: { totals: SeasonTotals }) {
  const t = useTheme();
  const tiles: { key: string; label: string; value: string; sub?: string }[] = [
    { key: 'honey', label: 'Honey harvested', value: kg(totals.honeyHarvestedKg) },
    { key: 'sugar', label: 'Sugar fed in syrup', value: kg(totals.sugarFedKg), sub: 'from the syrup litres and ratio' },
    { key: 'treatments', label: 'Treatments', value: String(totals.treatments) },
    {
      key: 'brood',
      label: 'Peak brood',
      value: totals.peakBrood ? `${totals.peakBrood.frames} frames` : '—',
      sub: totals.peakBrood ? `${shortDate(totals.peakBrood.at)} · ${totals.peakBrood.hiveName}` : 'no Quick check yet',
    },
    { key: 'checks', label: 'Quick checks', value: String(totals.inspections) },
  ];
  return (
    <View testID="season-totals" style={{ flexDirection: 'row', flexWrap: 'wrap', gap: t.space.sm }}>
      {tiles.map((tile) => (
        <View
          key={tile.key}
          testID={`season-total-${tile.key}`}
          style={{
            flexGrow: 1,
            flexBasis: 150,
            padding: t.space.sm,
            borderRadius: t.radius.md,
            borderWidth: t.borderWidth.thin,
            borderColor: t.colours.line,
            backgroundColor: t.colours.surface,
            gap: 2,
          }}
        >
          <Text variant="small" tone="muted">
            {tile.label}
          </Text>
          <Text variant="title">{tile.value}</Text>
          {tile.sub ? (
            <Text variant="small" tone="muted">
              {tile.sub}
            </Text>
          ) : null}
        </View>
      ))}
    </View>
  );
}

/**
 * The Season review's body, for one hive or a whole apiary. From 1024 px the charts sit beside
 * the table of records; on phones everything stacks. Choosing a record (a tap or hover on the
 * charts, a row of the table, or Previous/Next) shows it and marks it on the charts.
 */
export function SeasonView({ data, seasons, onSeason, header, actions }: SeasonViewProps) {
  const t = useTheme();
  const { isWide, isCompact: isCompactWidth } = useBreakpoints();
  const printing = usePrinting();
  const [chartWidth, setChartWidth] = useState(0);
  const [selectedId, setSelectedId] = useState<string | null>(null);
  const wide = isWide && !printing;
  const onLayout = (e: LayoutChangeEvent) => setChartWidth(Math.floor(e.nativeEvent.layout.width));
  const width = printing ? PRINT_WIDTH : chartWidth;

  // Records in time order, for Previous/Next.
  const ordered = useMemo(() => [...data.records].sort((a, b) => a.at.localeCompare(b.at)), [data.records]);
  const selected = ordered.find((r) => r.id === selectedId) ?? null;
  const step = (d: number) => {
    if (ordered.length === 0) return;
    const i = selected ? ordered.indexOf(selected) : d > 0 ? -1 : ordered.length;
    const next = ordered[Math.min(ordered.length - 1, Math.max(0, i + d))];
    setSelectedId(next.id);
  };

  // Small multiples share one time axis: the months any hive has something in.
  const domain = useMemo((): [number, number] | undefined => {
    if (data.scope !== 'apiary' || data.hives.length === 0) return undefined;
    const spans = data.hives.map((h) => dataMonths(h, marksOf(h), data.from, data.to));
    return [Math.min(...spans.map((s) => s[0])), Math.max(...spans.map((s) => s[1]))];
  }, [data]);

  const charts =
    data.hives.length === 0 ? (
      <Text>There are no hives here yet.</Text>
    ) : (
      <View onLayout={onLayout} style={{ gap: t.space.lg }} testID="season-charts">
        {width > 0
          ? data.hives.map((h, i) => (
              <View key={h.id} testID={`season-hive-${h.id}`} style={{ gap: t.space.xs }}>
                {data.scope === 'apiary' ? <Text variant="heading">{h.name}</Text> : null}
                <SeasonChart
                  hive={h}
                  from={data.from}
                  to={data.to}
                  references={data.references}
                  width={width}
                  selectedId={selectedId}
                  onSelect={setSelectedId}
                  compact={data.scope === 'apiary'}
                  domain={domain}
                  legend={data.scope !== 'apiary' || i === data.hives.length - 1}
                  selectedLabel={selected && selected.hiveId === h.id ? `${shortDate(selected.at)} · ${SEASON_KIND_LABELS[selected.kind]}` : undefined}
                />
              </View>
            ))
          : null}
      </View>
    );

  const selection = (
    <View
      testID="season-selection"
      style={{
        gap: t.space.sm,
        padding: t.space.md,
        borderRadius: t.radius.md,
        borderWidth: t.borderWidth.thick,
        borderColor: selected ? t.colours.ink : t.colours.line,
        backgroundColor: t.colours.surface,
      }}
    >
      {selected ? (
        <View style={{ gap: t.space.xxs }} testID="season-selected-record">
          <Text variant="label">{`${shortDate(selected.at)} · ${SEASON_KIND_LABELS[selected.kind]}${data.scope === 'apiary' ? ` · ${selected.hiveName}` : ''}`}</Text>
          <Text>{selected.summary}</Text>
          {selected.note ? <Text tone="muted">{`Note: ${selected.note}`}</Text> : null}
          <Text variant="small" tone="muted">{`Recorded by ${selected.recordedBy || 'someone no longer here'}`}</Text>
        </View>
      ) : (
        <Text tone="muted">Tap or point at the charts, or choose a row, to see a record here.</Text>
      )}
      <View style={{ flexDirection: 'row', gap: t.targetGap }}>
        <BigButton testID="season-prev" variant="secondary" label="‹ Previous" onPress={() => step(-1)} disabled={ordered.length === 0} style={{ flex: 1 }} />
        <BigButton testID="season-next" variant="secondary" label="Next ›" onPress={() => step(1)} disabled={ordered.length === 0} style={{ flex: 1 }} />
      </View>
    </View>
  );

  const table = (
    <Section title="Records of the season">
      <SeasonTable
        records={data.records}
        showHive={data.scope === 'apiary'}
        hives={data.hives.map((h) => ({ id: h.id, name: h.name }))}
        selectedId={selectedId}
        onSelect={setSelectedId}
        printing={printing}
        rowLayout={!wide && !isCompactWidth}
      />
    </Section>
  );

  return (
    <View style={{ gap: t.space.lg }}>
      <PrintStyle />
      {header}
      <View testID="season-controls" style={{ gap: t.space.md }}>
        <ChoiceChips field="season-year" label="Season" options={seasons.map((s) => ({ value: String(s), label: String(s) }))} value={String(data.season)} onChange={(v) => onSeason(Number(v))} />
        <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: t.targetGap }}>
          {canPrint ? <BigButton testID="season-print" variant="secondary" label="Print" onPress={printPage} /> : null}
          {actions}
        </View>
      </View>
      <Text tone="muted" testID="season-range">
        {`${shortDate(data.from)} ${new Date(data.from).getUTCFullYear()} to ${shortDate(new Date(Date.parse(data.to) - 1).toISOString())} ${new Date(Date.parse(data.to) - 1).getUTCFullYear()} · ${data.apiary.name}`}
      </Text>
      <Totals totals={data.totals} />
      {wide ? (
        <View testID="season-columns" style={{ flexDirection: 'row', gap: t.space.xl, alignItems: 'flex-start' }}>
          <View style={{ flex: 3, minWidth: 0 }}>{charts}</View>
          <View style={{ flex: 2, minWidth: 0, gap: t.space.lg }}>
            {selection}
            {table}
          </View>
        </View>
      ) : (
        <View testID="season-columns" style={{ gap: t.space.lg }}>
          {charts}
          {printing ? null : selection}
          {table}
        </View>
      )}
    </View>
  );
}

/** The seasons offered: this one and the two before it. */
export function recentSeasons(current: number): number[] {
  return [current, current - 1, current - 2];
}
