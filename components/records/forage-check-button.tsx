import { Link } from 'expo-router';
import type { ApiaryDto } from '@/shared/schemas/apiaries';
import { canIn } from '@/components/apiaries/membership';
import { useNow } from '@/components/layout/use-now';
import { BigButton } from '@/components/ui/big-button';

/** "Forage check" on the apiary page: one tap to the site's Forage check; hidden for those who may not record one. */
export function ForageCheckButton({ apiary }: { apiary: ApiaryDto }) {
  const now = useNow();
  if (!canIn(apiary, 'record:create:forage-check', now)) return null;
  return (
    <Link href={{ pathname: '/apiaries/[apiaryId]/forage-check', params: { apiaryId: apiary.id } }} asChild>
      <BigButton testID="record-forage-check" variant="secondary" label="Forage check" />
    </Link>
  );
}
