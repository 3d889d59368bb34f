import { useRouter } from 'expo-router';
import { useSignOutMutation } from '@/components/api/auth';
import { useTheme } from '@/components/theme/use-theme';
import { BigButton } from '@/components/ui/big-button';
import { SignOutIcon } from '@/components/ui/icons';

/**
 * Sign out. Kept away from the thumb-reach bottom bar on phones (it sits in the top bar):
 * signing out by accident at an out-apiary without signal would lock the keeper out.
 */
export function SignOutButton({ onError }: { onError: (message: string | null) => void }) {
  const t = useTheme();
  const router = useRouter();
  const signOut = useSignOutMutation();
  return (
    <BigButton
      testID="nav-sign-out"
      variant="secondary"
      label="Sign out"
      loadingLabel="Signing out…"
      loading={signOut.isPending}
      icon={(c) => <SignOutIcon colour={c} size={24} />}
      style={{ paddingHorizontal: t.space.md }}
      onPress={() => {
        onError(null);
        signOut.mutate(undefined, {
          onSuccess: () => router.replace('/sign-in'),
          onError: (err) => onError(err.message),
        });
      }}
    />
  );
}
