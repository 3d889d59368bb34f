import { View } from 'react-native';
import type { QueenDto } from '@/shared/schemas/hives';
import { useTheme } from '@/components/theme/use-theme';
import { Detail } from '@/components/ui/section';
import { Text } from '@/components/ui/text';
import { MARK_COLOUR_LABELS, QUEEN_ORIGIN_LABELS, QUEEN_STATUS_LABELS } from './hive-labels';

/** The marking paint as a patch beside its written name (same square patch as the form's chips). */
export function MarkColour({ colour }: { colour: QueenDto['markColour'] }) {
  const t = useTheme();
  return (
    <View style={{ flexDirection: 'row', alignItems: 'center', gap: t.space.xs }}>
      {colour !== 'unmarked' ? (
        <View
          style={{
            width: 20,
            height: 20,
            borderRadius: t.radius.sm,
            backgroundColor: t.markSwatch[colour],
            borderWidth: t.borderWidth.thin,
            borderColor: t.colours.ink,
          }}
        />
      ) : null}
      <Text variant="bodyStrong">{MARK_COLOUR_LABELS[colour]}</Text>
    </View>
  );
}

export function QueenSummary({ queen }: { queen: QueenDto | null }) {
  const t = useTheme();
  if (!queen) return <Text tone="muted">No queen recorded.</Text>;
  return (
    <View style={{ gap: t.space.xs }}>
      <Detail label="Status" value={QUEEN_STATUS_LABELS[queen.status]} />
      <Detail label="Origin" value={QUEEN_ORIGIN_LABELS[queen.origin]} />
      <Detail label="Year" value={queen.year === null ? 'Not known' : String(queen.year)} />
      <Detail label="Marking" value={<MarkColour colour={queen.markColour} />} />
      <Detail label="Clipped" value={queen.clipped ? 'Yes' : 'No'} />
    </View>
  );
}
