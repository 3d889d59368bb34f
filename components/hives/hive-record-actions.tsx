import { Link, type Href } from 'expo-router';
import { View } from 'react-native';
import type { ApiaryDto } from '@/shared/schemas/apiaries';
import type { RecordKind } from '@/shared/domain/access';
import { canIn } from '@/components/apiaries/membership';
import { useBreakpoints } from '@/components/layout/use-breakpoints';
import { useNow } from '@/components/layout/use-now';
import { useTheme } from '@/components/theme/use-theme';
import { BigButton } from '@/components/ui/big-button';
import { PlusIcon } from '@/components/ui/icons';

interface RecordAction {
  kind: RecordKind;
  /** Route segment under /hives/[hiveId]/ */
  segment: string;
  label: string;
}

/** The hive's records other than the Quick check, in the order a season usually needs them. */
const OTHER_RECORDS: readonly RecordAction[] = [
  { kind: 'feeding', segment: 'feeding', label: 'Feeding' },
  { kind: 'mite-count', segment: 'mite-count', label: 'Mite count' },
  { kind: 'treatment', segment: 'treatment', label: 'Treatment' },
  { kind: 'harvest', segment: 'harvest', label: 'Harvest' },
  { kind: 'queen-event', segment: 'queen-event', label: 'Queen event' },
  { kind: 'colony-event', segment: 'colony-event', label: 'Colony event' },
];

const recordHref = (hiveId: string, segment: string) => `/hives/${encodeURIComponent(hiveId)}/${segment}` as Href;

/**
 * The Quick check button, for the hive page's bottom bar: the most frequent record sits where a
 * gloved thumb rests, without scrolling past the boxes and the queen. Null when the signed-in
 * person may not record a check.
 */
export function HiveQuickCheckButton({ hiveId, apiary }: { hiveId: string; apiary: ApiaryDto | undefined }) {
  const now = useNow();
  if (!canIn(apiary, 'record:create:inspection', now)) return null;
  return (
    <Link href={recordHref(hiveId, 'check')} asChild>
      <BigButton testID="record-quick-check" label="Quick check" fullWidth icon={(c) => <PlusIcon colour={c} size={26} />} />
    </Link>
  );
}

/**
 * One tap to every other record form of a hive, two to a row on phones. Only the records the
 * signed-in person may create are offered (a sitter sees Feeding only; the Quick check is in the
 * bottom bar).
 */
export function HiveRecordActions({ hiveId, apiary }: { hiveId: string; apiary: ApiaryDto | undefined }) {
  const t = useTheme();
  const now = useNow();
  const { isCompact } = useBreakpoints();
  const others = OTHER_RECORDS.filter((r) => canIn(apiary, `record:create:${r.kind}`, now));
  if (others.length === 0) return null;

  return (
    <View testID="hive-record-actions" style={{ flexDirection: 'row', flexWrap: 'wrap', gap: t.targetGap }}>
      {others.map((r) => (
        <View key={r.kind} style={{ flexBasis: isCompact ? '45%' : '30%', flexGrow: 1 }}>
          <Link href={recordHref(hiveId, r.segment)} asChild>
            <BigButton testID={`record-${r.kind}`} variant="secondary" label={r.label} fullWidth />
          </Link>
        </View>
      ))}
    </View>
  );
}
