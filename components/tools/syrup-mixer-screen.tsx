import { useState } from 'react';
import { View } from 'react-native';
import { useTheme } from '@/components/theme/use-theme';
import { BackLink } from '@/components/ui/back-link';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { Notice } from '@/components/ui/notice';
import { Screen } from '@/components/ui/screen';
import { Detail, Section } from '@/components/ui/section';
import { Stepper } from '@/components/ui/stepper';
import { Text } from '@/components/ui/text';
import { mixSyrup } from '@/shared/domain/syrup';
import { gallonsToLitres, kgToLb, litresToCups, litresToGallons, sugarKgToCups } from '@/shared/domain/units';
import { fmt } from './format';

type Ratio = '1:1' | '2:1';
type Basis = 'weight' | 'volume';
type AmountUnit = 'gal' | 'L' | 'feeders';
type FeederSize = '1gal' | '2L' | '4L';

const FEEDER_LITRES: Readonly<Record<FeederSize, number>> = { '1gal': gallonsToLitres(1), '2L': 2, '4L': 4 };
const FEEDER_LABELS: Readonly<Record<FeederSize, string>> = { '1gal': '1 US gal', '2L': '2 L', '4L': '4 L' };

/**
 * Syrup mixer: choose the ratio, how it is measured and how much syrup is wanted (gallons,
 * litres or a number of feeders); it shows the sugar and water to mix, in both unit systems.
 * Density: CRC Handbook sucrose table at 20 °C (TRADE-REFERENCES §2a), through mixSyrup.
 */
export function SyrupMixerScreen() {
  const t = useTheme();
  const [ratio, setRatio] = useState<Ratio>('1:1');
  const [basis, setBasis] = useState<Basis>('weight');
  const [unit, setUnit] = useState<AmountUnit>('gal');
  const [gallons, setGallons] = useState(1);
  const [litres, setLitres] = useState(4);
  const [feeders, setFeeders] = useState(4);
  const [feederSize, setFeederSize] = useState<FeederSize>('1gal');

  const volumeL = unit === 'gal' ? gallonsToLitres(gallons) : unit === 'L' ? litres : feeders * FEEDER_LITRES[feederSize];
  const mix = mixSyrup({ ratio, basis, finishedVolumeL: volumeL });

  return (
    <Screen title="Syrup mixer" testID="syrup-mixer-screen" bottomBar={<SyrupResult mix={mix} />}>
      <View style={{ gap: t.space.lg }}>
        <View style={{ gap: t.space.xs }}>
          <BackLink href="/tools" label="Tools" />
          <Text variant="display">Syrup mixer</Text>
          <Text tone="muted">How much sugar and water make the syrup you want.</Text>
        </View>

        <ChoiceChips<Ratio>
          field="syrup-ratio"
          label="Ratio (sugar : water)"
          options={[
            { value: '1:1', label: '1:1 (spring, build-up)' },
            { value: '2:1', label: '2:1 (autumn stores)' },
          ]}
          value={ratio}
          onChange={setRatio}
        />
        <ChoiceChips<Basis>
          field="syrup-basis"
          label="Measured by"
          options={[
            { value: 'weight', label: 'Weight (kg or lb)' },
            { value: 'volume', label: 'Volume (cups, jugs)' },
          ]}
          value={basis}
          onChange={setBasis}
        />
        <ChoiceChips<AmountUnit>
          field="syrup-unit"
          label="How much syrup"
          options={[
            { value: 'gal', label: 'US gallons' },
            { value: 'L', label: 'Litres' },
            { value: 'feeders', label: 'Feeders' },
          ]}
          value={unit}
          onChange={setUnit}
        />
        {unit === 'gal' ? (
          <Stepper field="syrup-gallons" label="US gallons of syrup" value={gallons} onChange={setGallons} min={0.5} max={50} step={0.5} unit="gal" />
        ) : unit === 'L' ? (
          <Stepper field="syrup-litres" label="Litres of syrup" value={litres} onChange={setLitres} min={0.5} max={200} step={0.5} unit="L" />
        ) : (
          <View style={{ gap: t.space.md }}>
            <Stepper field="syrup-feeders" label="Feeders to fill" value={feeders} onChange={setFeeders} min={1} max={60} />
            <ChoiceChips<FeederSize>
              field="syrup-feeder-size"
              label="Each feeder holds"
              options={(Object.keys(FEEDER_LABELS) as FeederSize[]).map((k) => ({ value: k, label: FEEDER_LABELS[k] }))}
              value={feederSize}
              onChange={setFeederSize}
            />
          </View>
        )}

        <Section title="What it makes" testID="syrup-result">
          <Detail label="Makes" value={`${fmt(mix.finishedVolumeL)} L (${fmt(litresToGallons(mix.finishedVolumeL))} US gal), ${fmt(mix.finishedMassKg)} kg`} testID="syrup-makes" />
          <Detail label="Sugar by cup" value={`about ${fmt(sugarKgToCups(mix.sugarKg))} level cups`} />
          <Detail label="Strength" value={`${fmt(mix.sucrosePercentWw)} % sugar by weight`} />
        </Section>
        {ratio === '2:1' ? (
          <Notice title="2:1 is close to saturation">
            At 20 °C sugar dissolves only up to about 67 % by weight, so 2:1 syrup can crystallise when it cools. Warm water helps it dissolve; do not boil it.
          </Notice>
        ) : null}
        <Notice tone="warning" title="Robbing">
          Feed inside the hive, and in the evening if robbing is likely. Wipe up spilled syrup.
        </Notice>
        <Text variant="small" tone="muted">
          Sources: sucrose density at 20 °C from the CRC Handbook (interpolated); by volume, a level US cup of granulated sugar weighs about 200 g (USDA); 1:1 in spring and 2:1 in autumn is common practice (USDA, Moeller 1977); evening feeding against robbing (USDA Farmers’ Bulletin, Phillips 1919).
        </Text>
      </View>
    </Screen>
  );
}

/** Pinned above the nav, so the answer stays in sight while the steppers change it. */
function SyrupResult({ mix }: { mix: ReturnType<typeof mixSyrup> }) {
  const t = useTheme();
  return (
    <View style={{ gap: t.space.xxs }} accessibilityLiveRegion="polite" aria-live="polite">
      <Text variant="heading" testID="syrup-sugar">
        <Text variant="heading" testID="syrup-sugar-kg">{`${fmt(mix.sugarKg)} kg`}</Text>
        {` sugar (${fmt(kgToLb(mix.sugarKg))} lb)`}
      </Text>
      <Text variant="heading" testID="syrup-water">
        {'+ '}
        <Text variant="heading" testID="syrup-water-l">{`${fmt(mix.waterL)} L`}</Text>
        {` water (${fmt(litresToCups(mix.waterL))} cups)`}
      </Text>
    </View>
  );
}
