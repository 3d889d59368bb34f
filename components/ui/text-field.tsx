import { forwardRef, useState } from 'react';
import { TextInput, type TextInputProps } from 'react-native';
import { useTheme } from '@/components/theme/use-theme';
import { Field } from './field';

export interface TextFieldProps extends Omit<TextInputProps, 'style'> {
  label: string;
  hint?: string;
  error?: string;
  testID: string;
}

/**
 * A labelled text input, 64 px tall. Typing is the exception in Frameside (names, e-mail,
 * password, short notes); everything countable is a stepper or chips.
 */
export const TextField = forwardRef<TextInput, TextFieldProps>(function TextField(
  { label, hint, error, testID, onFocus, onBlur, ...rest },
  ref,
) {
  const t = useTheme();
  const [focused, setFocused] = useState(false);
  return (
    <Field label={label} hint={hint} error={error} errorTestID={`${testID}-error`}>
      <TextInput
        ref={ref}
        testID={testID}
        accessibilityLabel={label}
        aria-invalid={error ? true : undefined}
        placeholderTextColor={t.colours.inkMuted}
        {...rest}
        onFocus={(e) => {
          setFocused(true);
          onFocus?.(e);
        }}
        onBlur={(e) => {
          setFocused(false);
          onBlur?.(e);
        }}
        style={{
          minHeight: t.minTarget,
          fontFamily: t.fontFamily.regular,
          fontSize: t.fontSize.button,
          color: t.colours.ink,
          backgroundColor: t.colours.surface,
          borderRadius: t.radius.md,
          // Focus and error thicken the outline (a shape cue), error also turns it brick red.
          borderWidth: focused || error ? t.borderWidth.thick : t.borderWidth.thin,
          borderColor: error ? t.colours.red : focused ? t.colours.ink : t.colours.line,
          // The thicker outline eats into the padding so the text does not jump.
          paddingVertical: focused || error ? t.space.sm - 2 : t.space.sm,
          paddingHorizontal: focused || error ? t.space.md - 2 : t.space.md,
        }}
      />
    </Field>
  );
});
