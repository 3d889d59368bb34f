import type { ReactNode } from 'react';
import { View } from 'react-native';
import { useTheme } from '@/components/theme/use-theme';
import { Text } from './text';

/** A titled card: the unit screens are built from, and what the two panes on a wide screen hold. */
export function Section({ title, children, testID, aside }: { title: string; children: ReactNode; testID?: string; aside?: ReactNode }) {
  const t = useTheme();
  return (
    <View
      testID={testID}
      style={{
        gap: t.space.md,
        padding: t.space.md,
        borderRadius: t.radius.lg,
        borderWidth: t.borderWidth.thin,
        borderColor: t.colours.line,
        backgroundColor: t.colours.surface,
      }}
    >
      <View style={{ flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: t.space.sm, flexWrap: 'wrap' }}>
        <Text variant="heading">{title}</Text>
        {aside}
      </View>
      {children}
    </View>
  );
}

/** A label and its value on one line (wrapping on narrow phones). */
export function Detail({ label, value, testID }: { label: string; value: ReactNode; testID?: string }) {
  const t = useTheme();
  return (
    <View style={{ flexDirection: 'row', flexWrap: 'wrap', columnGap: t.space.sm, alignItems: 'center' }}>
      <Text tone="muted" style={{ minWidth: 120 }}>
        {label}
      </Text>
      {typeof value === 'string' ? (
        <Text variant="bodyStrong" testID={testID}>
          {value}
        </Text>
      ) : (
        <View testID={testID}>{value}</View>
      )}
    </View>
  );
}
