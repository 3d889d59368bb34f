import { Link, type Href } from 'expo-router';
import { forwardRef } from 'react';
import { Pressable, type PressableProps, type View } from 'react-native';
import { useTheme } from '@/components/theme/use-theme';
import { ChevronLeftIcon } from './icons';
import { Text } from './text';

/** Its own component so `<Link asChild>` does not drop the Pressable's style function. */
const BackTarget = forwardRef<View, Omit<PressableProps, 'children' | 'style'> & { label: string }>(function BackTarget(
  { label, ...rest },
  ref,
) {
  const t = useTheme();
  return (
    <Pressable
      ref={ref}
      accessibilityRole="link"
      accessibilityLabel={`Back to ${label}`}
      {...rest}
      style={({ pressed }) => ({
        minHeight: t.minTarget,
        minWidth: t.minTarget,
        alignSelf: 'flex-start',
        flexDirection: 'row',
        alignItems: 'center',
        gap: t.space.xxs,
        paddingRight: t.space.md,
        paddingLeft: t.space.xxs,
        marginLeft: -t.space.xxs,
        borderRadius: t.radius.md,
        backgroundColor: pressed ? t.colours.sunk : 'transparent',
      })}
    >
      <ChevronLeftIcon colour={t.colours.ink} size={28} />
      <Text variant="label" style={{ textDecorationLine: 'underline' }}>
        {label}
      </Text>
    </Pressable>
  );
});

/**
 * "‹ Orchard Row": the way up from a screen, naming where it leads. Screens have no native
 * header, so this is their back control — a full 64 px target, not a small arrow.
 */
export function BackLink({ href, label, testID }: { href: Href; label: string; testID?: string }) {
  return (
    <Link href={href} asChild>
      <BackTarget label={label} testID={testID} />
    </Link>
  );
}
