import { View } from 'react-native';
import type { HiveStatus } from '@/shared/domain/hives';
import { useTheme } from '@/components/theme/use-theme';
import { CheckIcon, CrossIcon } from '@/components/ui/icons';
import { Text } from '@/components/ui/text';
import { HIVE_STATUS_LABELS } from './hive-labels';

/** The status written out, with a mark: a tick for active, a cross for a dead-out, none otherwise. */
export function HiveStatusBadge({ status }: { status: HiveStatus }) {
  const t = useTheme();
  const look =
    status === 'active'
      ? { bg: t.colours.greenTint, fg: t.colours.green, icon: <CheckIcon colour={t.colours.green} size={20} /> }
      : status === 'dead-out'
        ? { bg: t.colours.redTint, fg: t.colours.red, icon: <CrossIcon colour={t.colours.red} size={18} /> }
        : { bg: t.colours.sunk, fg: t.colours.ink, icon: null };
  return (
    <View
      style={{
        flexDirection: 'row',
        alignItems: 'center',
        gap: t.space.xxs,
        alignSelf: 'flex-start',
        paddingHorizontal: t.space.xs,
        paddingVertical: 2,
        borderRadius: t.radius.sm,
        backgroundColor: look.bg,
        borderWidth: 1,
        borderColor: look.fg,
      }}
    >
      {look.icon}
      <Text variant="label" style={{ color: look.fg }}>
        {HIVE_STATUS_LABELS[status]}
      </Text>
    </View>
  );
}
