import { Pressable, View } from 'react-native';
import { useTheme } from '@/components/theme/use-theme';
import { CheckIcon } from './icons';
import { Text } from './text';

export interface ChipOption<T extends string> {
  value: T;
  /** Always written on the chip; also its accessible name. */
  label: string;
  /** A colour patch drawn before the label (queen marking paint); never the only cue. */
  swatch?: string;
}

interface ChipsBase<T extends string> {
  /** Names the test ids: `chips-<field>` on the group, `chips-<field>-<value>` on each chip. */
  field: string;
  /** The question the chips answer, written above them and naming the group. */
  label: string;
  options: readonly ChipOption<T>[];
  hint?: string;
  disabled?: boolean;
  /** Hide the written group label when a surrounding heading already says it. */
  hideLabel?: boolean;
}

// `NoInfer`: the options alone decide T, so `onChange` receives the options' own union
// (e.g. FrameSize[]), not a widened string[] inferred from a state variable.
export interface SingleChipsProps<T extends string> extends ChipsBase<T> {
  multiple?: false;
  value: NoInfer<T> | null;
  onChange: (value: NoInfer<T>) => void;
}

export interface MultiChipsProps<T extends string> extends ChipsBase<T> {
  multiple: true;
  value: readonly NoInfer<T>[];
  onChange: (value: NoInfer<T>[]) => void;
}

export type ChoiceChipsProps<T extends string> = SingleChipsProps<T> | MultiChipsProps<T>;

/**
 * Choice chips instead of a keyboard or a dropdown. Single choice behaves as a radio group
 * (tapping the chosen chip again keeps it), multiple choice as checkboxes. A chosen chip is
 * inverted, has a thick outline and a check mark; an unchosen one shows an empty ring (single)
 * or box (multiple) — shape tells the state, not colour alone.
 */
export function ChoiceChips<T extends string>(props: MultiChipsProps<T>): React.JSX.Element;
export function ChoiceChips<T extends string>(props: SingleChipsProps<T>): React.JSX.Element;
export function ChoiceChips<T extends string>(props: ChoiceChipsProps<T>): React.JSX.Element {
  const { field, label, options, hint, disabled, hideLabel } = props;
  const t = useTheme();
  const isSelected = (v: T) => (props.multiple ? props.value.includes(v) : props.value === v);

  const choose = (v: T) => {
    if (disabled) return;
    if (props.multiple) {
      const next = props.value.includes(v) ? props.value.filter((x) => x !== v) : [...props.value, v];
      // Keep the options' order, not the tapping order, so saved lists are stable.
      props.onChange(options.map((o) => o.value).filter((x) => next.includes(x)));
    } else if (props.value !== v) {
      props.onChange(v);
    }
  };

  // Thick outline for the chosen chip; padding shrinks by the same amount so nothing reflows.
  const extraBorder = t.borderWidth.thick - t.borderWidth.thin;

  return (
    <View
      testID={`chips-${field}`}
      role={props.multiple ? 'group' : 'radiogroup'}
      aria-label={label}
      style={{ gap: t.space.xs }}
    >
      {hideLabel ? null : <Text variant="label">{label}</Text>}
      {hint ? <Text variant="small" tone="muted">{hint}</Text> : null}
      <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: t.targetGap }}>
        {options.map((o) => {
          const selected = isSelected(o.value);
          const fg = selected ? t.colours.onInk : t.colours.ink;
          return (
            <Pressable
              key={o.value}
              testID={`chips-${field}-${o.value}`}
              accessibilityRole={props.multiple ? 'checkbox' : 'radio'}
              accessibilityLabel={o.label}
              accessibilityState={{ checked: selected, selected, disabled: Boolean(disabled) }}
              // react-native-web drops accessibilityState.checked: say it in ARIA so the web reads it too.
              aria-checked={selected}
              disabled={disabled}
              onPress={() => choose(o.value)}
              style={({ pressed }) => ({
                minHeight: t.minTarget,
                minWidth: t.minTarget,
                paddingVertical: t.space.xs - (selected ? extraBorder : 0),
                paddingLeft: t.space.sm - (selected ? extraBorder : 0),
                paddingRight: t.space.md - (selected ? extraBorder : 0),
                flexDirection: 'row',
                alignItems: 'center',
                gap: t.space.xs,
                borderRadius: t.radius.md,
                borderWidth: selected ? t.borderWidth.thick : t.borderWidth.thin,
                borderColor: selected ? t.colours.ink : t.colours.line,
                backgroundColor: selected
                  ? pressed
                    ? t.colours.inkPressed
                    : t.colours.ink
                  : pressed
                    ? t.colours.sunk
                    : t.colours.surface,
                opacity: disabled ? 0.6 : 1,
              })}
            >
              <View
                style={{
                  width: 28,
                  height: 28,
                  borderRadius: props.multiple ? t.radius.sm : t.radius.pill,
                  borderWidth: selected ? 0 : t.borderWidth.thin,
                  borderColor: t.colours.line,
                  alignItems: 'center',
                  justifyContent: 'center',
                }}
              >
                {selected ? <CheckIcon colour={fg} size={26} /> : null}
              </View>
              {o.swatch ? (
                <View
                  style={{
                    // Square, so it is not mistaken for the round "unchosen" ring beside it.
                    width: 24,
                    height: 24,
                    borderRadius: t.radius.sm,
                    backgroundColor: o.swatch,
                    borderWidth: t.borderWidth.thin,
                    borderColor: selected ? t.colours.onInk : t.colours.ink,
                  }}
                />
              ) : null}
              <Text variant="label" style={{ color: fg }}>
                {o.label}
              </Text>
            </Pressable>
          );
        })}
      </View>
    </View>
  );
}
