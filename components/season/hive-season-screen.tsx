import { Link, useLocalSearchParams } from 'expo-router';
import { useState } from 'react';
import { View } from 'react-native';
import { useApiaryQuery } from '@/components/api/apiaries';
import { useHiveSeasonQuery } from '@/components/api/season';
import { canIn } from '@/components/apiaries/membership';
import { useNow } from '@/components/layout/use-now';
import { useTheme } from '@/components/theme/use-theme';
import { BackLink } from '@/components/ui/back-link';
import { BigButton } from '@/components/ui/big-button';
import { LoadError, Loading } from '@/components/ui/query-state';
import { Screen } from '@/components/ui/screen';
import { Text } from '@/components/ui/text';
import { seasonOf } from '@/shared/domain/season';
import type { Hemisphere } from '@/shared/domain/hives';
import { SeasonView, recentSeasons } from './season-view';

/** /hives/[hiveId]/season: one hive's season on a wide screen, printable. */
export function HiveSeasonScreen() {
  const { hiveId } = useLocalSearchParams<{ hiveId: string }>();
  const t = useTheme();
  const now = useNow();
  const [season, setSeason] = useState<number | null>(null);
  const q = useHiveSeasonQuery(hiveId, season);
  const apiary = useApiaryQuery(q.data?.apiary.id);

  if (q.isPending || q.isError) {
    return (
      <Screen title="Season review">
        {q.isPending ? <Loading label="Loading the season…" /> : <LoadError error={q.error} onRetry={() => void q.refetch()} />}
      </Screen>
    );
  }
  const d = q.data;
  const hive = d.hives[0];
  const current = seasonOf(now, d.apiary.hemisphere as Hemisphere);
  const mayImport = canIn(apiary.data, 'record:create:sensor', now);

  return (
    <Screen title={`${hive?.name ?? 'Hive'} · Season review ${d.season}`} testID="season-screen">
      <SeasonView
        data={d}
        seasons={recentSeasons(current)}
        onSeason={setSeason}
        header={
          <View style={{ gap: t.space.xs }}>
            <BackLink testID="season-back" href={{ pathname: '/hives/[hiveId]', params: { hiveId: hiveId ?? '' } }} label={hive?.name ?? 'Hive'} />
            <Text variant="display" testID="season-title">{`${hive?.name ?? 'Hive'} · Season review ${d.season}`}</Text>
            {hive && !hive.sensors ? <Text tone="muted">No hive-scale or temperature log for this season.</Text> : null}
          </View>
        }
        actions={
          mayImport ? (
            <Link href={{ pathname: '/hives/[hiveId]/sensor-import', params: { hiveId: hiveId ?? '' } }} asChild>
              <BigButton testID="open-sensor-import" variant="secondary" label="Import sensor log" />
            </Link>
          ) : null
        }
      />
    </Screen>
  );
}
