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
import type { FrameSize } from '@/shared/domain/hives';
import { estimateStores, feedPlan } from '@/shared/domain/stores';
import { kgToLb, litresToGallons } from '@/shared/domain/units';
import { fmt } from './format';

/**
 * Stores estimate and feed plan: count the frames of honey by size (half frames allowed) and set
 * the winter target; it shows the honey on the frames, the shortfall and the syrup to make it up.
 */
export function StoresEstimateScreen() {
  const t = useTheme();
  const [frames, setFrames] = useState<Record<FrameSize, number>>({ deep: 4, medium: 0, shallow: 0 });
  const [target, setTarget] = useState(20);
  const [ratio, setRatio] = useState<'2:1' | '1:1'>('2:1');
  const list = (Object.keys(frames) as FrameSize[]).flatMap((size) => {
    const n = frames[size];
    const whole = Math.floor(n);
    const out = Array.from({ length: whole }, () => ({ size, fullness: 1 }));
    if (n > whole) out.push({ size, fullness: n - whole });
    return out;
  });
  const est = estimateStores({ frames: list });
  const plan = feedPlan({ storesKg: est.kg, targetKg: target, ratio });
  const set = (size: FrameSize) => (v: number) => setFrames((f) => ({ ...f, [size]: v }));

  return (
    <Screen
      title="Stores estimate"
      testID="stores-estimate-screen"
      bottomBar={
        <View accessibilityLiveRegion="polite" aria-live="polite">
          <Text variant="heading" testID="stores-kg">{`About ${fmt(est.kg)} kg of honey`}</Text>
          <Text testID="stores-summary">
            {plan.shortfallKg > 0 ? `Short by ${fmt(plan.shortfallKg)} kg: feed ${fmt(plan.syrupL)} L of ${ratio} syrup` : `Meets the ${target} kg target`}
          </Text>
        </View>
      }
    >
      <View style={{ gap: t.space.lg }}>
        <View style={{ gap: t.space.xs }}>
          <BackLink href="/tools" label="Tools" />
          <Text variant="display">Stores estimate</Text>
          <Text tone="muted">Honey on the frames, and the feed to reach the winter target.</Text>
        </View>
        <Section title="Stores and feed" testID="stores-result">
          <Detail label="Range" value={`${fmt(est.lowKg)}–${fmt(est.highKg)} kg (${fmt(kgToLb(est.lowKg))}–${fmt(kgToLb(est.highKg))} lb)`} />
          {plan.shortfallKg > 0 ? (
            <>
              <Detail label="Short by" value={`${fmt(plan.shortfallKg)} kg`} testID="stores-shortfall" />
              <Detail label={`Feed ${ratio} syrup`} value={`${fmt(plan.syrupL)} L (${fmt(litresToGallons(plan.syrupL))} US gal)`} testID="stores-syrup" />
              <Detail label="Made from" value={`${fmt(plan.sugarKg)} kg sugar (${fmt(kgToLb(plan.sugarKg))} lb) and ${fmt(plan.waterL)} L water`} testID="stores-sugar" />
            </>
          ) : (
            <Notice tone="good" title="Enough for the target" testID="stores-enough">
              {`The frames hold about the ${target} kg target or more.`}
            </Notice>
          )}
        </Section>
        <Stepper field="stores-deep" label="Deep frames of honey" value={frames.deep} onChange={set('deep')} min={0} max={40} step={0.5} hint="Count a half-full frame as ½." />
        <Stepper field="stores-medium" label="Medium frames of honey" value={frames.medium} onChange={set('medium')} min={0} max={40} step={0.5} />
        <Stepper field="stores-shallow" label="Shallow frames of honey" value={frames.shallow} onChange={set('shallow')} min={0} max={40} step={0.5} />
        <Stepper field="stores-target" label="Winter target" value={target} onChange={setTarget} min={5} max={60} unit="kg" hint="Set per apiary: about 20 kg is common UK advice; 40 kg for the northern US." />
        <ChoiceChips<'2:1' | '1:1'>
          field="stores-ratio"
          label="Feed as"
          options={[
            { value: '2:1', label: '2:1 syrup (autumn)' },
            { value: '1:1', label: '1:1 syrup' },
          ]}
          value={ratio}
          onChange={setRatio}
        />
        <Notice tone="warning" title="Feed before it turns cold">
          Feed inside the hive, in the evening if robbing is likely, and finish autumn feeding while bees can still take it down (about mid-October in the northern US).
        </Notice>
        <Text variant="small" tone="muted">
          Sources: honey in a full Langstroth frame — deep 2.7–3.6 kg, medium 1.8–2.2 kg, shallow 1.5–1.8 kg — are physical estimates, not weighed values; winter targets 20 kg (Seeley 2019, UK advice) to 40.8 kg (USDA, Moeller 1977); the plan counts 0.8 kg sugar per kg of honey (Frameside’s assumption: honey is about 80 % sugars), so it is a floor.
        </Text>
      </View>
    </Screen>
  );
}
