import { Pressable, View } from 'react-native';
import { useTheme } from '@/components/theme/use-theme';
import { MinusIcon, PlusIcon } from './icons';
import { Text } from './text';

export interface StepperLimits {
  min: number;
  max: number;
  /** 1 by default; 0.5 for half frames. */
  step?: number;
}

/** Decimals in a step (0.5 → 1, 0.25 → 2), so sums of steps are rounded, not 6.499999. */
function decimalsOf(step: number): number {
  const s = String(step);
  const dot = s.indexOf('.');
  return dot < 0 ? 0 : s.length - dot - 1;
}

/** One step up (+1) or down (−1) from `value`, snapped to the step grid and kept inside the limits. */
export function stepValue(value: number, direction: 1 | -1, { min, max, step = 1 }: StepperLimits): number {
  const snapped = Math.round((value - min) / step) * step + min;
  const next = Number((snapped + direction * step).toFixed(decimalsOf(step)));
  return Math.min(max, Math.max(min, next));
}

/** "6", "6½", "½": the written half reads better in glare than a decimal point. */
export function formatStepperValue(value: number): string {
  const whole = Math.trunc(value);
  const frac = Math.abs(value - whole);
  if (frac === 0) return String(value);
  if (frac === 0.5) return whole === 0 ? (value < 0 ? '−½' : '½') : `${whole}½`;
  return String(Number(value.toFixed(2)));
}

export interface StepperProps extends StepperLimits {
  /** Names the test ids: `stepper-<field>`, `-dec`, `-inc`, `-value`. */
  field: string;
  /** Written above the control and read with the value: "Frames of brood: 6". */
  label: string;
  value: number;
  onChange: (value: number) => void;
  /** Screen-reader names of the buttons in the trade's words, e.g. "Fewer frames of brood". */
  decreaseLabel?: string;
  increaseLabel?: string;
  /** Written after the value, e.g. "kg"; also read out. */
  unit?: string;
  /** Overrides how the value is written (and read) — e.g. a year is written plainly. */
  format?: (value: number) => string;
  hint?: string;
  disabled?: boolean;
}

/**
 * − value +, for every count a keeper enters with gloves on. The buttons are 64 px squares
 * 12 px from the value, are disabled at the limits (so a tap at 0 visibly does nothing), and
 * the value is announced politely when it changes.
 */
export function Stepper({
  field,
  label,
  value,
  onChange,
  min,
  max,
  step = 1,
  decreaseLabel,
  increaseLabel,
  unit,
  format = formatStepperValue,
  hint,
  disabled,
}: StepperProps) {
  const t = useTheme();
  const atMin = value <= min;
  const atMax = value >= max;
  const written = format(value);
  // Read the plain number ("6.5"): screen readers say "½" inconsistently.
  const spoken = `${format === formatStepperValue ? String(value) : written}${unit ? ` ${unit}` : ''}`;

  const button = (direction: 1 | -1) => {
    const blocked = Boolean(disabled) || (direction < 0 ? atMin : atMax);
    const name = direction < 0 ? (decreaseLabel ?? `Decrease ${label}`) : (increaseLabel ?? `Increase ${label}`);
    return (
      <Pressable
        testID={`stepper-${field}-${direction < 0 ? 'dec' : 'inc'}`}
        accessibilityRole="button"
        accessibilityLabel={name}
        accessibilityState={{ disabled: blocked }}
        disabled={blocked}
        onPress={() => {
          if (!blocked) onChange(stepValue(value, direction, { min, max, step }));
        }}
        style={({ pressed }) => ({
          width: t.minTarget + 8,
          height: t.minTarget + 8,
          borderRadius: t.radius.md,
          borderWidth: t.borderWidth.thin,
          alignItems: 'center',
          justifyContent: 'center',
          borderColor: blocked ? t.colours.line : t.colours.ink,
          backgroundColor: blocked ? t.colours.sunk : pressed ? t.colours.inkPressed : t.colours.ink,
          // Blocked buttons also lose their fill, so "at the limit" is a shape change, not a shade.
          borderStyle: blocked ? 'dashed' : 'solid',
        })}
      >
        {direction < 0 ? (
          <MinusIcon colour={blocked ? t.colours.inkMuted : t.colours.onInk} size={32} />
        ) : (
          <PlusIcon colour={blocked ? t.colours.inkMuted : t.colours.onInk} size={32} />
        )}
      </Pressable>
    );
  };

  return (
    <View testID={`stepper-${field}`} role="group" aria-label={`${label}: ${spoken}`} style={{ gap: t.space.xs }}>
      <Text variant="label">{label}</Text>
      {hint ? <Text variant="small" tone="muted">{hint}</Text> : null}
      <View style={{ flexDirection: 'row', alignItems: 'center', gap: t.targetGap }}>
        {button(-1)}
        <View
          style={{
            minWidth: 96,
            minHeight: t.minTarget + 8,
            paddingHorizontal: t.space.sm,
            alignItems: 'center',
            justifyContent: 'center',
            borderRadius: t.radius.md,
            backgroundColor: t.colours.surface,
            borderWidth: t.borderWidth.thin,
            borderColor: t.colours.line,
          }}
        >
          <Text testID={`stepper-${field}-value`} variant="display" accessibilityRole="text" aria-live="polite">
            {written}
            {unit ? <Text variant="body" tone="muted">{` ${unit}`}</Text> : null}
          </Text>
        </View>
        {button(1)}
      </View>
    </View>
  );
}
