import { Link } from 'expo-router';
import { forwardRef } from 'react';
import { Pressable, View, type PressableProps, type View as RNView } from 'react-native';
import { useTheme } from '@/components/theme/use-theme';
import { Text } from '@/components/ui/text';
import type { NavItem } from './nav-items';

interface NavTargetProps extends Omit<PressableProps, 'children' | 'style'> {
  item: NavItem;
  active: boolean;
  layout: 'bar' | 'rail';
}

/**
 * The pressable part. A component of its own because `<Link asChild>` merges its style into the
 * child's, which drops a Pressable's style function; behind a component boundary it stays intact.
 */
const NavTarget = forwardRef<RNView, NavTargetProps>(function NavTarget({ item, active, layout, ...rest }, ref) {
  const t = useTheme();
  const fg = active ? t.colours.onInk : t.colours.ink;
  const { Icon } = item;
  return (
    <Pressable
      ref={ref}
      testID={`nav-${item.key}`}
      accessibilityRole="link"
      accessibilityLabel={item.label}
      accessibilityState={{ selected: active }}
      aria-current={active ? 'page' : undefined}
      {...rest}
      style={({ pressed }) => ({
        flex: layout === 'bar' ? 1 : undefined,
        minHeight: t.minTarget,
        minWidth: t.minTarget,
        flexDirection: layout === 'bar' ? 'column' : 'row',
        alignItems: 'center',
        justifyContent: layout === 'bar' ? 'center' : 'flex-start',
        gap: layout === 'bar' ? 2 : t.space.sm,
        paddingHorizontal: layout === 'bar' ? t.space.xxs : t.space.md,
        paddingVertical: t.space.xxs,
        borderRadius: t.radius.md,
        backgroundColor: active ? (pressed ? t.colours.inkPressed : t.colours.ink) : pressed ? t.colours.sunk : 'transparent',
      })}
    >
      <Icon colour={fg} size={layout === 'bar' ? 28 : 30} />
      <Text variant={layout === 'bar' ? 'small' : 'label'} style={{ color: fg, fontFamily: active ? t.fontFamily.bold : t.fontFamily.regular }}>
        {item.label}
      </Text>
      {active ? (
        // The position bar: a non-colour cue that survives greyscale and glare.
        <View
          style={
            layout === 'bar'
              ? { position: 'absolute', top: -10, left: '25%', right: '25%', height: 4, borderRadius: 2, backgroundColor: t.colours.ink }
              : { position: 'absolute', left: -10, top: 12, bottom: 12, width: 4, borderRadius: 2, backgroundColor: t.colours.ink }
          }
        />
      ) : null}
    </Pressable>
  );
});

/**
 * One destination in the bottom bar or the side rail. The current one is inverted and carries a
 * bar above (bottom bar) or beside (rail) it, and is marked aria-current for screen readers.
 */
export function NavLink({ item, active, layout }: { item: NavItem; active: boolean; layout: 'bar' | 'rail' }) {
  return (
    <Link href={item.href} asChild>
      <NavTarget item={item} active={active} layout={layout} />
    </Link>
  );
}
