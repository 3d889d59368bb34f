import { Link } from 'expo-router';
import { View } from 'react-native';
import { useTheme } from '@/components/theme/use-theme';
import { BigButton } from '@/components/ui/big-button';
import { Screen } from '@/components/ui/screen';
import { Text } from '@/components/ui/text';

export function NotFoundScreen() {
  const t = useTheme();
  return (
    <Screen
      title="Not found"
      width="form"
      bottomBar={
        <Link href="/" replace asChild>
          <BigButton testID="not-found-home" label="Go to the Due list" fullWidth />
        </Link>
      }
    >
      <View style={{ gap: t.space.md }}>
        <Text variant="display">Nothing here</Text>
        <Text>This page does not exist, or the link is out of date.</Text>
      </View>
    </Screen>
  );
}
