import { useState } from 'react';
import { View } from 'react-native';
import { localToday, formatDay } from '@/components/tasks/due-dates';
import { useNow } from '@/components/layout/use-now';
import { useTheme } from '@/components/theme/use-theme';
import { BackLink } from '@/components/ui/back-link';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { Screen } from '@/components/ui/screen';
import { Detail, Section } from '@/components/ui/section';
import { Stepper } from '@/components/ui/stepper';
import { Text } from '@/components/ui/text';
import { broodCalendar, type BroodAnchor, type Caste } from '@/shared/domain/brood';
import { addDays } from '@/shared/domain/dates';

/** "30 Sept": short enough for the stepper's value box on a 390 px phone. */
const shortDay = (iso: string) => new Date(`${iso}T12:00:00Z`).toLocaleDateString('en-GB', { day: 'numeric', month: 'short', timeZone: 'UTC' });

/**
 * Brood calendar: pick a caste and the day an egg was laid or a cell was capped (steppers move
 * the day, no typing) and read off hatching, capping and emergence, and for a queen her
 * maturity, earliest laying and the day to worry if there are no eggs.
 */
export function BroodCalendarScreen() {
  const t = useTheme();
  const today = localToday(useNow());
  const [caste, setCaste] = useState<Caste>('queen');
  const [from, setFrom] = useState<BroodAnchor>('cell-capped');
  const [offset, setOffset] = useState(0);
  const date = addDays(today, offset);
  const cal = broodCalendar({ caste, from, date });
  const queen = 'mature' in cal ? cal : null;
  const rel = (d: string) => {
    const n = Math.round((Date.parse(`${d}T00:00:00Z`) - Date.parse(`${today}T00:00:00Z`)) / 86_400_000);
    return n === 0 ? 'today' : n > 0 ? `in ${n} ${n === 1 ? 'day' : 'days'}` : `${-n} ${n === -1 ? 'day' : 'days'} ago`;
  };
  const row = (label: string, d: string, id: string) => <Detail label={label} value={`${formatDay(d)} (${rel(d)})`} testID={`brood-${id}`} />;

  return (
    <Screen title="Brood calendar" testID="brood-calendar-screen">
      <View style={{ gap: t.space.lg }}>
        <View style={{ gap: t.space.xs }}>
          <BackLink href="/tools" label="Tools" />
          <Text variant="display">Brood calendar</Text>
          <Text tone="muted">What hatches, is capped and emerges when.</Text>
        </View>
        <ChoiceChips<Caste>
          field="brood-caste"
          label="Which bee"
          options={[
            { value: 'queen', label: 'Queen' },
            { value: 'worker', label: 'Worker' },
            { value: 'drone', label: 'Drone' },
          ]}
          value={caste}
          onChange={setCaste}
        />
        <ChoiceChips<BroodAnchor>
          field="brood-from"
          label="Counting from"
          options={[
            { value: 'egg-laid', label: 'Egg laid' },
            { value: 'cell-capped', label: 'Cell capped' },
          ]}
          value={from}
          onChange={setFrom}
        />
        <Stepper
          field="brood-day"
          label={from === 'egg-laid' ? 'Day the egg was laid' : 'Day the cell was capped'}
          value={offset}
          onChange={setOffset}
          min={-60}
          max={30}
          format={(v) => shortDay(addDays(today, v))}
          decreaseLabel="One day earlier"
          increaseLabel="One day later"
          hint={`${formatDay(date)}: ${offset === 0 ? 'today' : offset < 0 ? `${-offset} ${offset === -1 ? 'day' : 'days'} ago` : `in ${offset} ${offset === 1 ? 'day' : 'days'}`}`}
        />
        <Section title={`${caste === 'queen' ? 'Queen' : caste === 'worker' ? 'Worker' : 'Drone'} timeline`} testID="brood-result">
          {row('Egg laid', cal.eggLaid, 'egg')}
          {row('Hatches', cal.hatch, 'hatch')}
          {row('Capped', cal.capped, 'capped')}
          {row('Emerges', cal.emerges, 'emerges')}
          {queen ? (
            <>
              {row('Mature', queen.mature, 'mature')}
              {row('Earliest laying', queen.earliestLaying, 'laying')}
              {row('Worry if no eggs by', queen.worryIfNoEggsBy, 'worry')}
            </>
          ) : null}
        </Section>
        <Text variant="small" tone="muted">
          Sources: egg to adult 16 / 21 / 24 days for queen / worker / drone, eggs hatch on day 3 (Winston 1987, via University of Florida); a queen cell is sealed on day 8 and emerges 8 days later (Welsh Beekeepers’ Association); a virgin queen matures 5–6 days after emerging (The Hive and the Honey Bee); laying usually starts 2–3 weeks after emergence (BBKA). Worker and drone capping days are counted from the larval stage and are approximate.
        </Text>
      </View>
    </Screen>
  );
}
