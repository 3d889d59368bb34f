import type { ReactNode } from 'react';
import { View } from 'react-native';
import { useTheme } from '@/components/theme/use-theme';
import { CheckIcon, WarningIcon } from './icons';
import { Text } from './text';

export type NoticeTone = 'info' | 'good' | 'warning';

export interface NoticeProps {
  tone?: NoticeTone;
  title?: string;
  children?: ReactNode;
  testID?: string;
}

/**
 * A boxed message. Warnings carry a warning sign and a red rule, "good" a check mark: the icon
 * and the words say it, the tint only supports them. Warnings are announced as alerts.
 */
export function Notice({ tone = 'info', title, children, testID }: NoticeProps) {
  const t = useTheme();
  const c = t.colours;
  const look = {
    info: { bg: c.surface, rule: c.line, icon: null },
    good: { bg: c.greenTint, rule: c.green, icon: <CheckIcon colour={c.green} /> },
    warning: { bg: c.redTint, rule: c.red, icon: <WarningIcon colour={c.red} size={24} /> },
  }[tone];
  return (
    <View
      testID={testID}
      accessibilityRole={tone === 'warning' ? 'alert' : undefined}
      style={{
        flexDirection: 'row',
        gap: t.space.sm,
        padding: t.space.md,
        borderRadius: t.radius.md,
        backgroundColor: look.bg,
        borderWidth: t.borderWidth.thin,
        borderColor: look.rule,
        borderLeftWidth: 8,
      }}
    >
      {look.icon ? <View style={{ paddingTop: 2 }}>{look.icon}</View> : null}
      <View style={{ flex: 1, gap: t.space.xxs }}>
        {title ? <Text variant="bodyStrong">{title}</Text> : null}
        {typeof children === 'string' ? <Text>{children}</Text> : children}
      </View>
    </View>
  );
}
