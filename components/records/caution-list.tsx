import { View } from 'react-native';
import { CAUTIONS, type CautionId } from '@/shared/domain/cautions';
import { useTheme } from '@/components/theme/use-theme';
import { Notice } from '@/components/ui/notice';
import { Text } from '@/components/ui/text';

/** The cautions that apply to a draft, as warning boxes (`caution-<id>`), in the order given. */
export function CautionList({ ids }: { ids: readonly CautionId[] }) {
  const t = useTheme();
  if (ids.length === 0) return null;
  return (
    <View style={{ gap: t.space.sm }}>
      {ids.map((id) => {
        const c = CAUTIONS[id];
        return (
          <Notice key={id} tone="warning" title={c.title} testID={`caution-${id}`}>
            <View style={{ gap: t.space.xxs }}>
              {c.lines.map((line) => (
                <Text key={line}>{`• ${line}`}</Text>
              ))}
            </View>
          </Notice>
        );
      })}
    </View>
  );
}
