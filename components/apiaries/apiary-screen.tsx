import { Link, useLocalSearchParams } from 'expo-router';
import { View } from 'react-native';
import { useApiaryQuery } from '@/components/api/apiaries';
import { useHivesQuery } from '@/components/api/hives';
import { boxesSummary } from '@/components/hives/hive-labels';
import { HiveStatusBadge } from '@/components/hives/hive-status-badge';
import { useBreakpoints } from '@/components/layout/use-breakpoints';
import { useNow } from '@/components/layout/use-now';
import { useTheme } from '@/components/theme/use-theme';
import { BackLink } from '@/components/ui/back-link';
import { BigButton } from '@/components/ui/big-button';
import { PlusIcon } from '@/components/ui/icons';
import { ListRow } from '@/components/ui/list-row';
import { LoadError, Loading } from '@/components/ui/query-state';
import { Screen } from '@/components/ui/screen';
import { Text } from '@/components/ui/text';
import { ForageCheckButton } from '@/components/records/forage-check-button';
import { ApiaryPeopleLinks } from '@/components/people/apiary-people-links';
import { accessLine, canIn, hiveCountLine } from './membership';

/** One apiary's hives. Writers (owner, keeper) get "Add hive" at the bottom. */
export function ApiaryScreen() {
  const { apiaryId } = useLocalSearchParams<{ apiaryId: string }>();
  const t = useTheme();
  const now = useNow();
  const { gtCompact } = useBreakpoints();
  const apiary = useApiaryQuery(apiaryId);
  const hives = useHivesQuery(apiaryId);
  const mayAdd = canIn(apiary.data, 'hive:create', now);

  return (
    <Screen
      title={apiary.data?.name ?? 'Apiary'}
      testID="apiary-screen"
      bottomBar={
        mayAdd ? (
          <Link href={{ pathname: '/apiaries/[apiaryId]/hives/new', params: { apiaryId } }} asChild>
            <BigButton testID="add-hive" label="Add hive" fullWidth icon={(c) => <PlusIcon colour={c} size={26} />} />
          </Link>
        ) : undefined
      }
    >
      <View style={{ gap: t.space.lg }}>
        <BackLink href="/apiaries" label="Apiaries" />
        {apiary.isPending ? (
          <Loading label="Loading the apiary…" />
        ) : apiary.isError ? (
          <LoadError error={apiary.error} onRetry={() => void apiary.refetch()} />
        ) : (
          <View style={{ gap: t.space.xs }}>
            <Text variant="display" testID="apiary-title">
              {apiary.data.name}
            </Text>
            <Text tone="muted">
              {hiveCountLine(apiary.data.hiveCount)} · You: {accessLine(apiary.data, now)}
            </Text>
            <ForageCheckButton apiary={apiary.data} />
            <ApiaryPeopleLinks apiary={apiary.data} />
            <Link href={{ pathname: '/apiaries/[apiaryId]/season', params: { apiaryId: apiary.data.id } }} asChild>
              <BigButton testID="open-season-apiary" variant="secondary" label="Season review" />
            </Link>
          </View>
        )}

        {hives.isPending ? (
          apiary.isError ? null : <Loading label="Loading hives…" />
        ) : hives.isError ? (
          <LoadError error={hives.error} onRetry={() => void hives.refetch()} />
        ) : hives.data.length === 0 ? (
          <Text tone="muted">{mayAdd ? 'No hives here yet. Add the first one below.' : 'No hives here yet.'}</Text>
        ) : (
          <View style={{ flexDirection: gtCompact ? 'row' : 'column', flexWrap: 'wrap', gap: t.targetGap }}>
            {hives.data.map((h) => (
              <View key={h.id} style={gtCompact ? { flexBasis: '48%', flexGrow: 1 } : undefined}>
                <Link href={{ pathname: '/hives/[hiveId]', params: { hiveId: h.id } }} asChild>
                  <ListRow
                    testID={`hive-${h.id}`}
                    title={h.name}
                    lines={[<HiveStatusBadge key="s" status={h.status} />, boxesSummary(h.boxes)]}
                  />
                </Link>
              </View>
            ))}
          </View>
        )}
      </View>
    </Screen>
  );
}
