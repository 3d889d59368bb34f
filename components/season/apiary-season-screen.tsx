import { useLocalSearchParams } from 'expo-router';
import { useState } from 'react';
import { View } from 'react-native';
import { useApiaryQuery } from '@/components/api/apiaries';
import { recordsCsvUrl, treatmentsCsvUrl, useApiarySeasonQuery } from '@/components/api/season';
import { canIn } from '@/components/apiaries/membership';
import { useNow } from '@/components/layout/use-now';
import { useTheme } from '@/components/theme/use-theme';
import { BackLink } from '@/components/ui/back-link';
import { BigButton } from '@/components/ui/big-button';
import { LoadError, Loading } from '@/components/ui/query-state';
import { Screen } from '@/components/ui/screen';
import { Text } from '@/components/ui/text';
import type { Hemisphere } from '@/shared/domain/hives';
import { seasonOf } from '@/shared/domain/season';
import { canPrint, download } from './print';
import { SeasonView, recentSeasons } from './season-view';

/** /apiaries/[apiaryId]/season: every hive of a site side by side, the records, the CSV exports. */
export function ApiarySeasonScreen() {
  const { apiaryId } = useLocalSearchParams<{ apiaryId: string }>();
  const t = useTheme();
  const now = useNow();
  const [season, setSeason] = useState<number | null>(null);
  const q = useApiarySeasonQuery(apiaryId, season);
  const apiary = useApiaryQuery(apiaryId);

  if (q.isPending || q.isError) {
    return (
      <Screen title="Season review">
        {q.isPending ? <Loading label="Loading the season…" /> : <LoadError error={q.error} onRetry={() => void q.refetch()} />}
      </Screen>
    );
  }
  const d = q.data;
  const current = seasonOf(now, d.apiary.hemisphere as Hemisphere);
  // Downloads are links a browser saves; the medicine record is for those who keep it.
  const mayExport = canPrint && canIn(apiary.data, 'export:read', now);

  return (
    <Screen title={`${d.apiary.name} · Season review ${d.season}`} testID="season-screen">
      <SeasonView
        data={d}
        seasons={recentSeasons(current)}
        onSeason={setSeason}
        header={
          <View style={{ gap: t.space.xs }}>
            <BackLink testID="season-back" href={{ pathname: '/apiaries/[apiaryId]', params: { apiaryId: apiaryId ?? '' } }} label={d.apiary.name} />
            <Text variant="display" testID="season-title">{`${d.apiary.name} · Season review ${d.season}`}</Text>
          </View>
        }
        actions={
          mayExport ? (
            <>
              <BigButton testID="download-treatments-csv" variant="secondary" label="Medicine record (CSV)" onPress={() => download(treatmentsCsvUrl(d.apiary.id, d.season))} />
              <BigButton testID="download-records-csv" variant="secondary" label="All records (CSV)" onPress={() => download(recordsCsvUrl(d.apiary.id, d.season))} />
            </>
          ) : null
        }
      />
    </Screen>
  );
}
