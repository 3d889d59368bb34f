import { Link } from 'expo-router';
import { View } from 'react-native';
import { useTheme } from '@/components/theme/use-theme';
import { ListRow } from '@/components/ui/list-row';
import { Screen } from '@/components/ui/screen';
import { Text } from '@/components/ui/text';

/** The calculators, each also used inside the forms. */
const TOOLS = [
  { key: 'syrup-mixer', href: '/tools/syrup', name: 'Syrup mixer', about: 'Sugar and water for 1:1 or 2:1 syrup, by weight or volume, for your feeders.' },
  { key: 'brood-calendar', href: '/tools/brood', name: 'Brood calendar', about: 'What emerges when, from an egg or a capped cell; when a new queen should lay.' },
  { key: 'stores-estimate', href: '/tools/stores', name: 'Stores estimate', about: 'Winter stores frame by frame, and the feed to make up the shortfall.' },
] as const;

export function ToolsScreen() {
  const t = useTheme();
  return (
    <Screen title="Tools" testID="tools-screen">
      <View style={{ gap: t.space.lg }}>
        <Text variant="display">Tools</Text>
        <View style={{ gap: t.targetGap }}>
          {TOOLS.map((tool) => (
            <Link key={tool.key} href={tool.href} asChild>
              <ListRow testID={`tool-${tool.key}`} title={tool.name} lines={[tool.about]} />
            </Link>
          ))}
        </View>
      </View>
    </Screen>
  );
}
