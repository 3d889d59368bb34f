import { ActivityIndicator, View } from 'react-native';
import { ApiError } from '@/components/api/client';
import { useTheme } from '@/components/theme/use-theme';
import { BigButton } from './big-button';
import { Notice } from './notice';
import { Text } from './text';

/** A spinner with words, so a slow out-apiary connection reads as "waiting", not "empty". */
export function Loading({ label = 'Loading…' }: { label?: string }) {
  const t = useTheme();
  return (
    <View accessibilityRole="progressbar" accessibilityLabel={label} style={{ flexDirection: 'row', gap: t.space.sm, alignItems: 'center', paddingVertical: t.space.lg }}>
      <ActivityIndicator color={t.colours.ink} size="large" />
      <Text tone="muted">{label}</Text>
    </View>
  );
}

/** The server's message (or the network's), with a retry for errors that may pass. */
export function LoadError({ error, onRetry, testID }: { error: unknown; onRetry?: () => void; testID?: string }) {
  const t = useTheme();
  const message = error instanceof ApiError ? error.message : 'Something went wrong loading this.';
  const retryable = !(error instanceof ApiError) || error.status === 0 || error.status >= 500;
  return (
    <View style={{ gap: t.space.md }}>
      <Notice tone="warning" testID={testID}>
        {message}
      </Notice>
      {onRetry && retryable ? <BigButton label="Try again" variant="secondary" onPress={onRetry} /> : null}
    </View>
  );
}
