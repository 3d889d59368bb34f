import { Link } from 'expo-router';
import { View } from 'react-native';
import type { ApiaryDto } from '@/shared/schemas/apiaries';
import { canIn } from '@/components/apiaries/membership';
import { useNow } from '@/components/layout/use-now';
import { useTheme } from '@/components/theme/use-theme';
import { BigButton } from '@/components/ui/big-button';

/** On an apiary: the Handover brief (owner, keeper, sitter) and People (owner, keeper), as the permission table allows. */
export function ApiaryPeopleLinks({ apiary }: { apiary: ApiaryDto }) {
  const t = useTheme();
  const now = useNow();
  const handover = canIn(apiary, 'handover:read', now);
  const people = canIn(apiary, 'members:read', now);
  if (!handover && !people) return null;
  return (
    <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: t.targetGap }}>
      {handover ? (
        <Link href={{ pathname: '/apiaries/[apiaryId]/handover', params: { apiaryId: apiary.id } }} asChild>
          <BigButton testID="open-handover" variant="secondary" label={apiary.myRole === 'sitter' ? 'Your handover brief' : 'Handover brief'} />
        </Link>
      ) : null}
      {people ? (
        <Link href={{ pathname: '/apiaries/[apiaryId]/members', params: { apiaryId: apiary.id } }} asChild>
          <BigButton testID="open-members" variant="secondary" label="People" />
        </Link>
      ) : null}
    </View>
  );
}
