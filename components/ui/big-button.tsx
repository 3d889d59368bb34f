import { forwardRef, type ReactNode } from 'react';
import { ActivityIndicator, Pressable, View, type PressableProps, type StyleProp, type View as RNView, type ViewStyle } from 'react-native';
import { useTheme } from '@/components/theme/use-theme';
import type { Tokens } from '@/components/theme/tokens';
import { Text } from './text';

export type BigButtonVariant = 'primary' | 'secondary' | 'danger';

export interface BigButtonProps extends Omit<PressableProps, 'children' | 'style'> {
  label: string;
  variant?: BigButtonVariant;
  /** Stretch to the container's width (the default inside bottom action bars). */
  fullWidth?: boolean;
  /** Shows a spinner, keeps the label readable, and ignores presses. */
  loading?: boolean;
  /** Written instead of `label` while loading, e.g. "Saving…". */
  loadingLabel?: string;
  /** An icon drawn before the label; receives the label colour. */
  icon?: (colour: string) => ReactNode;
  style?: StyleProp<ViewStyle>;
  testID?: string;
}

function colours(t: Tokens, variant: BigButtonVariant, pressed: boolean) {
  const c = t.colours;
  switch (variant) {
    case 'danger':
      return { bg: pressed ? c.redPressed : c.red, fg: c.onInk, border: pressed ? c.redPressed : c.red };
    case 'secondary':
      return { bg: pressed ? c.sunk : c.surface, fg: c.ink, border: c.ink };
    case 'primary':
    default:
      return { bg: pressed ? c.inkPressed : c.ink, fg: c.onInk, border: pressed ? c.inkPressed : c.ink };
  }
}

/**
 * The one button: at least 64 px tall (gloves), a written label always, a pressed state that
 * changes both shade and depth so it reads in glare. Keyboard focus is drawn by the global
 * :focus-visible ring (components/theme/focus-ring.web.ts).
 *
 * Forwards a ref and unknown props so `<Link asChild>` can turn it into a real link on the web.
 */
export const BigButton = forwardRef<RNView, BigButtonProps>(function BigButton(
  { label, variant = 'primary', fullWidth, loading, loadingLabel, icon, disabled, style, testID, ...rest },
  ref,
) {
  const t = useTheme();
  const inactive = Boolean(disabled || loading);
  return (
    <Pressable
      ref={ref}
      accessibilityRole="button"
      accessibilityLabel={loading && loadingLabel ? loadingLabel : label}
      accessibilityState={{ disabled: inactive, busy: Boolean(loading) }}
      disabled={inactive}
      testID={testID}
      {...rest}
      style={({ pressed }) => {
        const k = colours(t, variant, pressed);
        const dimmed = disabled && !loading;
        return [
          {
            minHeight: t.minTarget,
            minWidth: t.minTarget,
            paddingHorizontal: t.space.lg,
            paddingVertical: t.space.sm,
            borderRadius: t.radius.md,
            borderWidth: t.borderWidth.thin,
            borderColor: dimmed ? t.colours.line : k.border,
            backgroundColor: dimmed ? t.colours.sunk : k.bg,
            flexDirection: 'row',
            alignItems: 'center',
            justifyContent: 'center',
            gap: t.space.sm,
            alignSelf: fullWidth ? 'stretch' : 'flex-start',
            // Pressed sinks by 2 px: a depth cue that survives glare and colour blindness.
            transform: [{ translateY: pressed ? 2 : 0 }],
          } satisfies ViewStyle,
          style,
        ];
      }}
    >
      {({ pressed }) => {
        const k = colours(t, variant, pressed);
        const fg = disabled && !loading ? t.colours.inkMuted : k.fg;
        return (
          <View style={{ flexDirection: 'row', alignItems: 'center', gap: t.space.sm }}>
            {loading ? <ActivityIndicator color={fg} /> : icon ? icon(fg) : null}
            <Text variant="button" style={{ color: fg, textAlign: 'center' }}>
              {loading && loadingLabel ? loadingLabel : label}
            </Text>
          </View>
        );
      }}
    </Pressable>
  );
});
