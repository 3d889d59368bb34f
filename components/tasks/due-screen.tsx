import { Link } from 'expo-router';
import { useState } from 'react';
import { View } from 'react-native';
import { useMeQuery } from '@/components/api/auth';
import { useDueQuery, useTaskResolveMutation, type TaskAction } from '@/components/api/due';
import { useBreakpoints } from '@/components/layout/use-breakpoints';
import { useNow } from '@/components/layout/use-now';
import { useTheme } from '@/components/theme/use-theme';
import { BigButton } from '@/components/ui/big-button';
import { CheckIcon, WarningIcon } from '@/components/ui/icons';
import { Notice } from '@/components/ui/notice';
import { LoadError, Loading } from '@/components/ui/query-state';
import { Screen } from '@/components/ui/screen';
import { Text } from '@/components/ui/text';
import { addDays } from '@/shared/domain/dates';
import type { DueTaskDto } from '@/shared/schemas/tasks';
import { DUE_GROUP_TITLES, dueGroup, dueLine, formatDay, localToday, type DueGroup } from './due-dates';

const GROUPS: readonly DueGroup[] = ['overdue', 'today', 'week', 'later'];

/** Writes the rules' YYYY-MM-DD dates the way the rest of the screen does ("Thu 26 Nov"). */
export const readableDates = (text: string) => text.replace(/\b(\d{4}-\d{2}-\d{2})\b/g, (d) => formatDay(d));

/** A test-id-safe form of a task key (keys hold colons). */
export const taskTestId = (key: string) => key.replace(/[^a-zA-Z0-9-]/g, '-');

/**
 * The signed-in home: what is due across every apiary the keeper may see, in sections —
 * overdue, today, this week, later. Each task says why it is due; its source opens on demand.
 * One tap opens the hive, one tap marks it done; snooze and dismiss sit behind "Not now".
 */
export function DueScreen() {
  const t = useTheme();
  const now = useNow();
  const today = localToday(now);
  const me = useMeQuery();
  const due = useDueQuery();
  const name = me.data?.user.name?.trim().split(/\s+/)[0];

  const grouped = new Map<DueGroup, DueTaskDto[]>(GROUPS.map((g) => [g, []]));
  for (const task of due.data ?? []) grouped.get(dueGroup(task, today))!.push(task);
  const overdueCount = grouped.get('overdue')!.length;

  return (
    <Screen title="Due" testID="due-screen">
      <View style={{ gap: t.space.lg }}>
        <View style={{ gap: t.space.xxs }}>
          <Text variant="display">{name ? `Hello, ${name}` : 'Due'}</Text>
          <Text tone="muted">{`What is due, ${formatDay(today)}`}</Text>
        </View>
        {due.isPending ? (
          <Loading label="Working out what is due…" />
        ) : due.isError ? (
          <LoadError error={due.error} onRetry={() => void due.refetch()} />
        ) : due.data.length === 0 ? (
          <Notice tone="good" title="Nothing due" testID="due-empty">
            Nothing is due in your apiaries. New checks and records add their next steps here.
          </Notice>
        ) : (
          <>
            {overdueCount > 0 ? (
              <Notice tone="warning" title={`${overdueCount} overdue`} testID="due-overdue-summary">
                {overdueCount === 1 ? 'One task is past its date: it is first below.' : 'These are past their dates: they are first below.'}
              </Notice>
            ) : null}
            {GROUPS.map((g) => {
              const list = grouped.get(g)!;
              if (list.length === 0) return null;
              return (
                <View key={g} style={{ gap: t.targetGap }} testID={`due-group-${g}`}>
                  <Text variant="title">{`${DUE_GROUP_TITLES[g]} (${list.length})`}</Text>
                  {list.map((task) => (
                    <DueTaskCard key={task.key} task={task} today={today} />
                  ))}
                </View>
              );
            })}
            <Text tone="muted" testID="due-horizon">
              Shows what is overdue and what falls due in the next 14 days.
            </Text>
          </>
        )}
      </View>
    </Screen>
  );
}

function DueTaskCard({ task, today }: { task: DueTaskDto; today: string }) {
  const t = useTheme();
  const { gtCompact } = useBreakpoints();
  const [showSource, setShowSource] = useState(false);
  const [showLater, setShowLater] = useState(false);
  const resolve = useTaskResolveMutation();
  const id = taskTestId(task.key);
  const overdue = task.overdue || task.dueDate < today;
  const act = (action: TaskAction) => resolve.mutate({ key: task.key, action });
  const pending = resolve.isPending ? resolve.variables?.action.kind : undefined;

  return (
    <View
      testID={`due-task-${id}`}
      style={{
        gap: t.space.sm,
        padding: t.space.md,
        borderRadius: t.radius.lg,
        borderWidth: t.borderWidth.thin,
        borderColor: overdue ? t.colours.red : t.colours.line,
        // Overdue: a thick brick-red rule on the left, plus the word and the sign below.
        borderLeftWidth: overdue ? 10 : t.borderWidth.thin,
        backgroundColor: t.colours.surface,
      }}
    >
      <View style={{ flexDirection: 'row', alignItems: 'center', gap: t.space.xs, flexWrap: 'wrap' }}>
        {overdue ? <WarningIcon colour={t.colours.red} size={24} /> : null}
        <Text variant="bodyStrong" style={{ color: overdue ? t.colours.red : t.colours.ink }} testID={`due-when-${id}`}>
          {dueLine(task, today)}
        </Text>
        {task.status === 'snoozed' && task.snoozedUntil ? (
          <Text tone="muted">{`· snoozed${task.by ? ` by ${task.by.name}` : ''}`}</Text>
        ) : null}
      </View>
      <Text variant="heading">{task.title}</Text>
      <Text tone="muted">{task.hiveName ? `${task.hiveName} · ${task.apiaryName}` : task.apiaryName}</Text>
      <Text testID={`due-reason-${id}`}>{readableDates(task.reason)}</Text>
      {showSource ? (
        <Text tone="muted" testID={`due-source-${id}`}>
          {`Source: ${task.source}`}
        </Text>
      ) : null}

      {resolve.isError ? (
        <Notice tone="warning" title="Not saved">
          {resolve.error instanceof Error ? resolve.error.message : 'Try again.'}
        </Notice>
      ) : null}

      <View style={gtCompact ? { flexDirection: 'row', gap: t.targetGap, flexWrap: 'wrap' } : { gap: t.targetGap }}>
        <BigButton
          testID={`due-done-${id}`}
          label="Done"
          loading={pending === 'done'}
          loadingLabel="Saving…"
          fullWidth={!gtCompact}
          icon={(c) => <CheckIcon colour={c} />}
          onPress={() => act({ kind: 'done' })}
        />
        {task.hiveId ? (
          <Link href={{ pathname: '/hives/[hiveId]', params: { hiveId: task.hiveId } }} asChild>
            <BigButton testID={`due-open-hive-${id}`} variant="secondary" fullWidth={!gtCompact} label={`Open ${task.hiveName ?? 'hive'}`} />
          </Link>
        ) : null}
        <BigButton
          testID={`due-later-toggle-${id}`}
          variant="secondary"
          fullWidth={!gtCompact}
          label={showLater ? 'Close snooze options' : 'Not now…'}
          accessibilityState={{ expanded: showLater }}
          onPress={() => setShowLater((v) => !v)}
        />
        <BigButton
          testID={`due-source-toggle-${id}`}
          variant="secondary"
          fullWidth={!gtCompact}
          label={showSource ? 'Hide the source' : 'Why? Source'}
          accessibilityState={{ expanded: showSource }}
          onPress={() => setShowSource((v) => !v)}
        />
      </View>
      {showLater ? (
        <View style={{ gap: t.targetGap }} testID={`due-later-${id}`}>
          <Text variant="label">Snooze until</Text>
          <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: t.targetGap }}>
            {[
              { days: 1, label: 'Tomorrow' },
              { days: 3, label: 'In 3 days' },
              { days: 7, label: 'In a week' },
            ].map((o) => (
              <BigButton
                key={o.days}
                testID={`due-snooze-${o.days}-${id}`}
                variant="secondary"
                label={o.label}
                loading={pending === 'snooze' && resolve.variables?.action.kind === 'snooze' && resolve.variables.action.until === addDays(today, o.days)}
                onPress={() => act({ kind: 'snooze', until: addDays(today, o.days) })}
              />
            ))}
          </View>
          <BigButton
            testID={`due-dismiss-${id}`}
            variant="danger"
            label="Dismiss: it does not apply"
            loading={pending === 'dismiss'}
            onPress={() => act({ kind: 'dismiss' })}
          />
        </View>
      ) : null}
    </View>
  );
}
