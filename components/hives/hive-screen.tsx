import { Link, useLocalSearchParams } from 'expo-router';
import { View } from 'react-native';
import { useApiaryQuery } from '@/components/api/apiaries';
import { useHiveQuery } from '@/components/api/hives';
import { canIn } from '@/components/apiaries/membership';
import { useBreakpoints } from '@/components/layout/use-breakpoints';
import { useNow } from '@/components/layout/use-now';
import { useTheme } from '@/components/theme/use-theme';
import { BackLink } from '@/components/ui/back-link';
import { BigButton } from '@/components/ui/big-button';
import { LoadError, Loading } from '@/components/ui/query-state';
import { Screen } from '@/components/ui/screen';
import { Section } from '@/components/ui/section';
import { Text } from '@/components/ui/text';
import { BoxStack } from './box-stack';
import { boxesSummary } from './hive-labels';
import { HiveStatusBadge } from './hive-status-badge';
import { HiveQuickCheckButton, HiveRecordActions } from './hive-record-actions';
import { QueenSummary } from './queen-summary';
import { HiveStory } from './hive-story';
import { HivePhotos } from '@/components/photos/hive-photos';

/**
 * One hive: what it is (boxes, queen, status) and, beside it on a wide screen, its records.
 * The "hive-records" area is where the Hive story and the record buttons (Quick check, …) go.
 */
export function HiveScreen() {
  const { hiveId } = useLocalSearchParams<{ hiveId: string }>();
  const t = useTheme();
  const now = useNow();
  const { isWide } = useBreakpoints();
  const hive = useHiveQuery(hiveId);
  const apiary = useApiaryQuery(hive.data?.apiaryId);
  const mayEdit = canIn(apiary.data, 'hive:update', now);

  if (hive.isPending || hive.isError) {
    return (
      <Screen title="Hive">
        {hive.isPending ? <Loading label="Loading the hive…" /> : <LoadError error={hive.error} onRetry={() => void hive.refetch()} />}
      </Screen>
    );
  }
  const h = hive.data;

  const details = (
    <View style={{ gap: t.space.lg }}>
      <Section title="Boxes">
        <Text tone="muted">{boxesSummary(h.boxes)}</Text>
        <BoxStack boxes={h.boxes} />
      </Section>
      <Section title="Queen">
        <QueenSummary queen={h.queen} />
      </Section>
      {h.note ? (
        <Section title="Note">
          <Text>{h.note}</Text>
        </Section>
      ) : null}
      <HivePhotos hiveId={h.id} boxes={h.boxes} apiary={apiary.data} />
    </View>
  );

  const records = (
    <Section title="Hive story" testID="hive-records">
      {/* Record buttons (Quick check, feeding, treatment…) and the timeline are added here. */}
      <HiveRecordActions hiveId={h.id} apiary={apiary.data} />
      <HiveStory hiveId={h.id} />
    </Section>
  );

  return (
    <Screen title={h.name} testID="hive-screen" bottomBar={canIn(apiary.data, 'record:create:inspection', now) ? <HiveQuickCheckButton hiveId={h.id} apiary={apiary.data} /> : undefined}>
      <View style={{ gap: t.space.lg }}>
        <View style={{ gap: t.space.xs }}>
          <BackLink href={{ pathname: '/apiaries/[apiaryId]', params: { apiaryId: h.apiaryId } }} label={h.apiaryName} />
          <Text variant="display" testID="hive-title">
            {h.name}
          </Text>
          <View style={{ flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: t.space.sm }}>
            <HiveStatusBadge status={h.status} />
            <Text tone="muted">{`in ${h.apiaryName}`}</Text>
          </View>
          {mayEdit ? (
            <Link href={{ pathname: '/hives/[hiveId]/edit', params: { hiveId: h.id } }} asChild>
              <BigButton testID="hive-edit" variant="secondary" label="Edit hive" style={{ marginTop: t.space.xs }} />
            </Link>
          ) : null}
          <Link href={{ pathname: '/hives/[hiveId]/season', params: { hiveId: h.id } }} asChild>
            <BigButton testID="open-season-hive" variant="secondary" label="Season review" style={{ marginTop: t.space.xs }} />
          </Link>
        </View>
        {isWide ? (
          <View style={{ flexDirection: 'row', gap: t.space.xl, alignItems: 'flex-start' }}>
            <View style={{ flex: 5 }}>{details}</View>
            <View style={{ flex: 6 }}>{records}</View>
          </View>
        ) : (
          <>
            {details}
            {records}
          </>
        )}
      </View>
    </Screen>
  );
}
