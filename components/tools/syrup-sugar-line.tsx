import { Text } from '@/components/ui/text';
import { mixSyrup } from '@/shared/domain/syrup';
import { kgToLb } from '@/shared/domain/units';
import { fmt } from './format';

/** "Took about 2.33 kg of sugar (5.13 lb) and 2.33 L of water": what a syrup feed used, through mixSyrup (CRC density, TRADE-REFERENCES §2a). */
export function SyrupSugarLine({ ratio, basis, litres, testID = 'syrup-sugar-line' }: { ratio: string; basis: 'weight' | 'volume'; litres: number; testID?: string }) {
  if ((ratio !== '1:1' && ratio !== '2:1') || !(litres > 0)) return null;
  const mix = mixSyrup({ ratio, basis, finishedVolumeL: litres });
  return (
    <Text tone="muted" testID={testID}>
      {`Took about ${fmt(mix.sugarKg)} kg of sugar (${fmt(kgToLb(mix.sugarKg))} lb) and ${fmt(mix.waterL)} L of water.`}
    </Text>
  );
}
