import { Text } from '@/components/ui/text';
import type { Box } from '@/shared/domain/hives';
import { honeyFrameSize, storesFromHoneyFrames } from '@/shared/domain/stores';
import { kgToLb } from '@/shared/domain/units';
import { fmt } from './format';

/** "About 12.6 kg of honey (10.8–14.4 kg) on 4 deep frames": a check's stores estimate (TRADE-REFERENCES §6 frame weights). */
export function StoresLine({ honeyFrames, boxes, testID = 'stores-line' }: { honeyFrames: number; boxes: readonly Box[]; testID?: string }) {
  if (!(honeyFrames > 0)) return null;
  const est = storesFromHoneyFrames(honeyFrames, boxes);
  return (
    <Text tone="muted" testID={testID}>
      {`Stores: about ${fmt(est.kg)} kg of honey (${fmt(est.lowKg)}–${fmt(est.highKg)} kg, ${fmt(kgToLb(est.kg))} lb), counted as ${honeyFrameSize(boxes)} frames.`}
    </Text>
  );
}
