import { useMemo, useState } from 'react';
import { Pressable, View } from 'react-native';
import { useTheme } from '@/components/theme/use-theme';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { Text } from '@/components/ui/text';
import { SEASON_KIND_LABELS } from '@/shared/domain/season';
import type { SeasonRecord, SeasonRecordKind } from '@/shared/schemas/season';

export const SORTS = ['newest', 'oldest', 'kind', 'hive'] as const;
export type SeasonSort = (typeof SORTS)[number];

const SORT_LABELS: Record<SeasonSort, string> = { newest: 'Newest first', oldest: 'Oldest first', kind: 'By kind', hive: 'By hive' };

export const shortDate = (iso: string) =>
  new Date(iso).toLocaleDateString('en-GB', { day: 'numeric', month: 'short', timeZone: 'UTC' });

/** Sorted and filtered rows: the pure part of the table, tested on its own. */
export function arrangeRecords(records: readonly SeasonRecord[], sort: SeasonSort, kinds: readonly SeasonRecordKind[], hives: readonly string[]): SeasonRecord[] {
  const rows = records.filter((r) => (kinds.length === 0 || kinds.includes(r.kind)) && (hives.length === 0 || hives.includes(r.hiveId)));
  const byTime = (a: SeasonRecord, b: SeasonRecord) => a.at.localeCompare(b.at);
  return [...rows].sort((a, b) => {
    switch (sort) {
      case 'oldest':
        return byTime(a, b);
      case 'kind':
        return SEASON_KIND_LABELS[a.kind].localeCompare(SEASON_KIND_LABELS[b.kind]) || byTime(a, b);
      case 'hive':
        return a.hiveName.localeCompare(b.hiveName) || byTime(a, b);
      case 'newest':
      default:
        return byTime(b, a);
    }
  });
}

export interface SeasonTableProps {
  records: readonly SeasonRecord[];
  /** Apiary reviews add the hive column and filter. */
  showHive: boolean;
  hives: readonly { id: string; name: string }[];
  selectedId: string | null;
  onSelect: (id: string) => void;
  /** Printing: every row, no controls. */
  printing?: boolean;
  /** Each row on one line (date, record, details, who) when the table has the page's width; stacked in a side column or on a phone. */
  rowLayout?: boolean;
}

/**
 * The season's records: sorted and filtered with chips (no typing), each row a full-width
 * target that selects the record on the charts. The chosen row has a thick outline and says so.
 */
export function SeasonTable({ records, showHive, hives, selectedId, onSelect, printing, rowLayout = false }: SeasonTableProps) {
  const t = useTheme();
  const inRow = rowLayout || Boolean(printing);
  const [sort, setSort] = useState<SeasonSort>('oldest');
  const [kinds, setKinds] = useState<SeasonRecordKind[]>([]);
  const [hiveFilter, setHiveFilter] = useState<string[]>([]);
  const present = useMemo(() => (Object.keys(SEASON_KIND_LABELS) as SeasonRecordKind[]).filter((k) => records.some((r) => r.kind === k)), [records]);
  const rows = arrangeRecords(records, printing ? 'oldest' : sort, printing ? [] : kinds, printing ? [] : hiveFilter);
  const sorts = SORTS.filter((s) => showHive || s !== 'hive');

  return (
    <View style={{ gap: t.space.md }} testID="season-table">
      {printing ? null : (
        <View style={{ gap: t.space.md }} testID="season-table-controls">
          <ChoiceChips field="season-sort" label="Order" options={sorts.map((s) => ({ value: s, label: SORT_LABELS[s] }))} value={sort} onChange={setSort} />
          {present.length > 1 ? (
            <ChoiceChips
              field="season-kind"
              label="Show only"
              hint="None chosen: every kind."
              multiple
              options={present.map((k) => ({ value: k, label: SEASON_KIND_LABELS[k] }))}
              value={kinds}
              onChange={setKinds}
            />
          ) : null}
          {showHive && hives.length > 1 ? (
            <ChoiceChips field="season-hive" label="Hives" hint="None chosen: every hive." multiple options={hives.map((h) => ({ value: h.id, label: h.name }))} value={hiveFilter} onChange={setHiveFilter} />
          ) : null}
        </View>
      )}
      <Text tone="muted" testID="season-table-count">
        {rows.length === records.length ? `${rows.length} record${rows.length === 1 ? '' : 's'}` : `${rows.length} of ${records.length} records`}
      </Text>
      {rows.length === 0 ? <Text>No records in this season{kinds.length || hiveFilter.length ? ' with these choices' : ''}.</Text> : null}
      <View style={{ gap: t.space.xs }}>
        {rows.map((r) => {
          const selected = r.id === selectedId;
          return (
            <Pressable
              key={r.id}
              testID="season-table-row"
              accessibilityRole="button"
              accessibilityState={{ selected }}
              accessibilityLabel={`${shortDate(r.at)}, ${SEASON_KIND_LABELS[r.kind]}${showHive ? `, ${r.hiveName}` : ''}: ${r.summary}`}
              onPress={() => onSelect(r.id)}
              style={({ pressed }) => ({
                minHeight: t.minTarget,
                flexDirection: inRow ? 'row' : 'column',
                alignItems: inRow ? 'center' : 'flex-start',
                gap: inRow ? t.space.md : t.space.xxs,
                paddingVertical: t.space.xs,
                paddingHorizontal: t.space.sm,
                borderRadius: t.radius.md,
                borderWidth: selected ? t.borderWidth.thick : t.borderWidth.thin,
                borderColor: selected ? t.colours.ink : t.colours.line,
                backgroundColor: pressed ? t.colours.sunk : t.colours.surface,
              })}
            >
              <View style={{ flexDirection: 'row', gap: t.space.sm, minWidth: inRow ? 190 : undefined, flexWrap: 'wrap' }}>
                <Text variant="bodyStrong">{shortDate(r.at)}</Text>
                <Text>{SEASON_KIND_LABELS[r.kind]}</Text>
                {showHive ? <Text tone="muted">{r.hiveName}</Text> : null}
              </View>
              <View style={{ flex: inRow ? 1 : undefined, gap: 2 }}>
                <Text>{r.summary}</Text>
                {r.note ? <Text variant="small" tone="muted">{`Note: ${r.note}`}</Text> : null}
              </View>
              <Text variant="small" tone="muted">
                {selected ? `Selected · ${r.recordedBy}` : r.recordedBy}
              </Text>
            </Pressable>
          );
        })}
      </View>
    </View>
  );
}
