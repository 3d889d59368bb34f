import type { ReactNode } from 'react';
import { View } from 'react-native';
import { useTheme } from '@/components/theme/use-theme';
import { FrameMark } from '@/components/ui/icons';
import { Screen } from '@/components/ui/screen';
import { Text } from '@/components/ui/text';

/** The signed-out pages' frame: the mark, the screen's heading, the form, actions at the bottom. */
export function AuthFrame({ title, heading, children, bottomBar }: { title: string; heading: string; children: ReactNode; bottomBar: ReactNode }) {
  const t = useTheme();
  return (
    <Screen title={title} width="form" bottomBar={bottomBar}>
      <View style={{ gap: t.space.lg }}>
        <View style={{ flexDirection: 'row', alignItems: 'center', gap: t.space.sm }}>
          <FrameMark colour={t.colours.ink} size={44} />
          <Text variant="title" accessibilityRole="text">
            Frameside
          </Text>
        </View>
        <Text variant="display">{heading}</Text>
        {children}
      </View>
    </Screen>
  );
}
