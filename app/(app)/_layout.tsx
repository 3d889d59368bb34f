import { Redirect, usePathname } from 'expo-router';
import { useMeQuery } from '@/components/api/auth';
import { AppShell } from '@/components/nav/app-shell';
import { RouteStack } from '@/components/nav/route-stack';
import { LoadError, Loading } from '@/components/ui/query-state';
import { Screen } from '@/components/ui/screen';

/** The signed-in part of the app: GET /api/me answering 401 sends the keeper to sign in. */
export default function SignedInLayout() {
  const me = useMeQuery();
  const pathname = usePathname();
  if (me.isPending) {
    return (
      <Screen title="Frameside">
        <Loading />
      </Screen>
    );
  }
  if (me.isError) {
    return (
      <Screen title="Frameside">
        <LoadError error={me.error} onRetry={() => void me.refetch()} />
      </Screen>
    );
  }
  // Remember where the keeper was going (a shared hive link), to return there once signed in.
  if (!me.data) return <Redirect href={pathname === '/' ? '/sign-in' : { pathname: '/sign-in', params: { next: pathname } }} />;
  return (
    <AppShell>
      <RouteStack />
    </AppShell>
  );
}
