import { Stack } from 'expo-router';
import { useTheme } from '@/components/theme/use-theme';

/** Native: a real stack, with the platform's transitions and back gesture; headers are our own. */
export function RouteStack() {
  const t = useTheme();
  return <Stack screenOptions={{ headerShown: false, contentStyle: { backgroundColor: t.colours.bg } }} />;
}
