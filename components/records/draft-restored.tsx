import { View } from 'react-native';
import { useTheme } from '@/components/theme/use-theme';
import { BigButton } from '@/components/ui/big-button';
import { Notice } from '@/components/ui/notice';
import { Text } from '@/components/ui/text';
import type { RecordDraft } from './use-record-draft';
import { dayAndTime } from './when';

/** "Draft kept from Tue 1 Dec, 10:42" with a way to start again (`<testID>-restored`, `<testID>-discard`). */
export function DraftRestored({ draft, testID }: { draft: Pick<RecordDraft<object>, 'restoredAt' | 'reset'>; testID: string }) {
  const t = useTheme();
  if (!draft.restoredAt) return null;
  return (
    <Notice tone="good" title={`Draft kept from ${dayAndTime(draft.restoredAt)}`} testID={`${testID}-restored`}>
      <View style={{ gap: t.space.sm }}>
        <Text>Not saved yet: it is just as you left it.</Text>
        <BigButton testID={`${testID}-discard`} variant="secondary" label="Start again" onPress={() => draft.reset()} />
      </View>
    </Notice>
  );
}
