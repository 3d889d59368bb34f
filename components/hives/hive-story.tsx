import { useState } from 'react';
import { View } from 'react-native';
import { useStoryQuery } from '@/components/api/story';
import { PhotoStrip } from '@/components/photos/photo-strip';
import { formatDay } from '@/components/tasks/due-dates';
import { useTheme } from '@/components/theme/use-theme';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { WarningIcon } from '@/components/ui/icons';
import { LoadError, Loading } from '@/components/ui/query-state';
import { Text } from '@/components/ui/text';
import type { StoryItemDto } from '@/shared/schemas/story';

/**
 * The Hive story: every record of one season, newest first, each with what changed since the
 * check before, the dates that follow from it, who recorded it, and its photos.
 */
export function HiveStory({ hiveId }: { hiveId: string }) {
  const t = useTheme();
  const [season, setSeason] = useState<number | undefined>(undefined);
  const story = useStoryQuery(hiveId, season);

  if (story.isPending) return <Loading label="Loading the hive’s story…" />;
  if (story.isError) return <LoadError error={story.error} onRetry={() => void story.refetch()} />;
  const s = story.data;
  const seasons = s.seasons.includes(s.season) ? s.seasons : [s.season, ...s.seasons];
  const items = [...s.items].reverse();

  return (
    <View style={{ gap: t.space.md }} testID="hive-story">
      {seasons.length > 1 ? (
        <ChoiceChips
          field="story-season"
          label="Season"
          options={seasons.slice(0, 6).map((y) => ({ value: String(y), label: String(y) }))}
          value={String(s.season)}
          onChange={(v) => setSeason(Number(v))}
        />
      ) : null}
      {items.length === 0 ? (
        <Text tone="muted" testID="hive-story-empty">
          {`Nothing recorded for ${s.hiveName} in the ${s.season} season yet. A Quick check starts the story.`}
        </Text>
      ) : (
        <View style={{ gap: t.targetGap }}>
          <Text tone="muted">{`${items.length} ${items.length === 1 ? 'record' : 'records'} in ${s.season}, newest first`}</Text>
          {items.map((item) => (
            <StoryCard key={`${item.kind}-${item.id}`} item={item} />
          ))}
        </View>
      )}
    </View>
  );
}

function StoryCard({ item }: { item: StoryItemDto }) {
  const t = useTheme();
  return (
    <View
      testID={`story-item-${item.id}`}
      style={{
        gap: t.space.xs,
        padding: t.space.md,
        borderRadius: t.radius.md,
        borderWidth: t.borderWidth.thin,
        borderColor: t.colours.line,
        backgroundColor: item.scope === 'apiary' ? t.colours.sunk : t.colours.bg,
      }}
    >
      <Text tone="muted">{`${formatDay(item.date)} · ${item.recordedBy.name || 'someone'}`}</Text>
      <Text variant="heading">{item.title}</Text>
      {item.facts.length > 0 ? <Text>{item.facts.join(' · ')}</Text> : null}
      {item.changes.length > 0 ? (
        <View style={{ gap: t.space.xxs }} testID={`story-changes-${item.id}`}>
          <Text variant="label">Since the one before</Text>
          {item.changes.map((c) => (
            <Text key={c.field} variant="bodyStrong">{`• ${c.text}`}</Text>
          ))}
        </View>
      ) : null}
      {item.derivedDates.length > 0 ? (
        <View style={{ gap: t.space.xxs }} testID={`story-dates-${item.id}`}>
          {item.derivedDates.map((d) => (
            <Text key={`${d.label}-${d.date}`}>
              <Text variant="bodyStrong">{`${d.label}: ${formatDay(d.date)}`}</Text>
              <Text tone="muted" variant="small">{`  (${d.source})`}</Text>
            </Text>
          ))}
        </View>
      ) : null}
      {item.cautions.map((c) => (
        <View key={c} style={{ flexDirection: 'row', gap: t.space.xs, alignItems: 'flex-start' }}>
          <WarningIcon colour={t.colours.red} size={22} />
          <Text style={{ flex: 1 }}>{c}</Text>
        </View>
      ))}
      {item.note ? <Text italic>{`“${item.note}”`}</Text> : null}
      {item.photos.length > 0 ? (
        <PhotoStrip
          testID={`story-photo-${item.id}`}
          subtitle={formatDay(item.date)}
          photos={item.photos.map((p) => ({ id: p.id, label: p.caption ?? `Photo from ${formatDay(item.date)}` }))}
        />
      ) : null}
    </View>
  );
}
