import { forwardRef, type ReactNode } from 'react';
import { Pressable, View, type PressableProps, type View as RNView } from 'react-native';
import { useTheme } from '@/components/theme/use-theme';
import { ChevronRightIcon } from './icons';
import { Text } from './text';

export interface ListRowProps extends Omit<PressableProps, 'children' | 'style'> {
  title: string;
  /** Lines under the title: counts, role, status. */
  lines?: ReactNode[];
  /** Something on the right before the chevron, e.g. a status badge. */
  aside?: ReactNode;
  testID?: string;
}

/**
 * A whole-width card that opens something: the full card is the target (at least 64 px tall),
 * not a small link inside it. Forwards its ref so `<Link asChild>` makes it a real link on the web.
 */
export const ListRow = forwardRef<RNView, ListRowProps>(function ListRow({ title, lines = [], aside, testID, ...rest }, ref) {
  const t = useTheme();
  return (
    <Pressable
      ref={ref}
      testID={testID}
      accessibilityRole="link"
      {...rest}
      style={({ pressed }) => ({
        minHeight: t.minTarget + 16,
        flexDirection: 'row',
        alignItems: 'center',
        gap: t.space.md,
        paddingVertical: t.space.md,
        paddingHorizontal: t.space.md,
        borderRadius: t.radius.lg,
        borderWidth: t.borderWidth.thin,
        borderColor: pressed ? t.colours.ink : t.colours.line,
        backgroundColor: pressed ? t.colours.sunk : t.colours.surface,
      })}
    >
      <View style={{ flex: 1, gap: t.space.xxs }}>
        <Text variant="heading">{title}</Text>
        {lines.map((line, i) =>
          typeof line === 'string' ? (
            <Text key={i} tone="muted">
              {line}
            </Text>
          ) : (
            <View key={i}>{line}</View>
          ),
        )}
      </View>
      {aside}
      <ChevronRightIcon colour={t.colours.ink} size={28} />
    </Pressable>
  );
});
