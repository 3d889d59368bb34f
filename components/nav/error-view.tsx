import type { ErrorBoundaryProps } from 'expo-router';
import { View } from 'react-native';
import { useTheme } from '@/components/theme/use-theme';
import { BigButton } from '@/components/ui/big-button';
import { Notice } from '@/components/ui/notice';
import { Screen } from '@/components/ui/screen';
import { Text } from '@/components/ui/text';

/** What a crashed screen shows: plain words, the error's message, and a retry at the bottom. */
export function ErrorView({ error, retry }: ErrorBoundaryProps) {
  const t = useTheme();
  return (
    <Screen title="Something went wrong" width="form" bottomBar={<BigButton testID="error-retry" label="Try again" fullWidth onPress={() => void retry()} />}>
      <View style={{ gap: t.space.md }}>
        <Text variant="display">Something went wrong</Text>
        <Text>Frameside hit a problem showing this screen. Your saved records are safe.</Text>
        <Notice tone="warning">{error.message}</Notice>
      </View>
    </Screen>
  );
}
