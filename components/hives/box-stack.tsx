import { View } from 'react-native';
import type { Box } from '@/shared/domain/hives';
import { useTheme } from '@/components/theme/use-theme';
import { Text } from '@/components/ui/text';
import { FRAME_SIZE_LABELS } from './hive-labels';

/** Box height in the drawing, by frame size, so a deep box looks deeper than a super. */
const HEIGHT = { deep: 64, medium: 52, shallow: 44 } as const;

/**
 * The hive's boxes drawn as they stand: the top box first, box 1 on the floor. Each box is
 * written out ("Box 1 · Deep · 10 frames"), so the drawing is never the only record.
 */
export function BoxStack({ boxes }: { boxes: readonly Box[] }) {
  const t = useTheme();
  return (
    <View style={{ gap: 0, maxWidth: 420 }} accessibilityRole="list">
      {boxes
        .map((box, i) => ({ box, n: i + 1 }))
        .reverse()
        .map(({ box, n }) => (
          <View
            key={n}
            accessibilityRole="text"
            style={{
              minHeight: HEIGHT[box.size],
              justifyContent: 'center',
              paddingHorizontal: t.space.md,
              borderWidth: t.borderWidth.thin,
              borderColor: t.colours.ink,
              marginTop: n === boxes.length ? 0 : -t.borderWidth.thin,
              backgroundColor: t.colours.bg,
            }}
          >
            <Text>
              <Text variant="bodyStrong">{`Box ${n}`}</Text>
              {` · ${FRAME_SIZE_LABELS[box.size]} · ${box.frames} ${box.frames === 1 ? 'frame' : 'frames'}`}
              {n === 1 ? ' · bottom' : ''}
            </Text>
          </View>
        ))}
      {/* The stand: a visual floor under box 1. */}
      <View style={{ height: 8, marginHorizontal: t.space.md, backgroundColor: t.colours.ink, borderBottomLeftRadius: 2, borderBottomRightRadius: 2 }} />
    </View>
  );
}
