import type { ReactNode } from 'react';
import { View } from 'react-native';
import { useTheme } from '@/components/theme/use-theme';
import { WarningIcon } from './icons';
import { Text } from './text';

export interface FieldProps {
  label: string;
  hint?: string;
  /** Shown beside the field with a warning sign; pass it only once the field was touched. */
  error?: string;
  /** The error line's test id; `<testID>-error` by convention. */
  errorTestID?: string;
  children: ReactNode;
}

/** A label above, the control, then a hint or an error: the layout every form field shares. */
export function Field({ label, hint, error, errorTestID, children }: FieldProps) {
  const t = useTheme();
  return (
    <View style={{ gap: t.space.xs }}>
      <Text variant="label">{label}</Text>
      {hint ? <Text variant="small" tone="muted">{hint}</Text> : null}
      {children}
      {error ? <FieldError message={error} testID={errorTestID} /> : null}
    </View>
  );
}

/** An error line: brick red, bold, with a warning sign so it does not rely on colour. */
export function FieldError({ message, testID }: { message: string; testID?: string }) {
  const t = useTheme();
  return (
    <View style={{ flexDirection: 'row', gap: t.space.xs, alignItems: 'flex-start' }}>
      <View style={{ paddingTop: 2 }}>
        <WarningIcon colour={t.colours.red} />
      </View>
      <Text testID={testID} variant="bodyStrong" tone="warning" accessibilityRole="alert" style={{ flexShrink: 1 }}>
        {message}
      </Text>
    </View>
  );
}
