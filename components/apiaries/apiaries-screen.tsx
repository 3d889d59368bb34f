import { Link } from 'expo-router';
import { View } from 'react-native';
import { useApiariesQuery } from '@/components/api/apiaries';
import { useBreakpoints } from '@/components/layout/use-breakpoints';
import { useNow } from '@/components/layout/use-now';
import { useTheme } from '@/components/theme/use-theme';
import { ListRow } from '@/components/ui/list-row';
import { LoadError, Loading } from '@/components/ui/query-state';
import { Screen } from '@/components/ui/screen';
import { Text } from '@/components/ui/text';
import { accessLine, hiveCountLine } from './membership';

/** Every apiary the keeper can see: name, hive count, their role and, for a sitter, days left. */
export function ApiariesScreen() {
  const t = useTheme();
  const now = useNow();
  const { gtCompact } = useBreakpoints();
  const apiaries = useApiariesQuery();

  return (
    <Screen title="Apiaries" testID="apiaries-screen">
      <View style={{ gap: t.space.lg }}>
        <Text variant="display">Apiaries</Text>
        {apiaries.isPending ? (
          <Loading label="Loading apiaries…" />
        ) : apiaries.isError ? (
          <LoadError error={apiaries.error} onRetry={() => void apiaries.refetch()} />
        ) : apiaries.data.length === 0 ? (
          <Text tone="muted">No apiaries yet. When you create one or someone invites you, it appears here.</Text>
        ) : (
          // Two columns of cards once there is room; one column on phones.
          <View style={{ flexDirection: gtCompact ? 'row' : 'column', flexWrap: 'wrap', gap: t.targetGap }}>
            {apiaries.data.map((a) => (
              <View key={a.id} style={gtCompact ? { flexBasis: '48%', flexGrow: 1 } : undefined}>
                <Link href={{ pathname: '/apiaries/[apiaryId]', params: { apiaryId: a.id } }} asChild>
                  <ListRow
                    testID={`apiary-${a.id}`}
                    title={a.name}
                    lines={[hiveCountLine(a.hiveCount), `You: ${accessLine(a, now)}`]}
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
