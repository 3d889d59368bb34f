import { useLocalSearchParams } from 'expo-router';
import { Linking, View } from 'react-native';
import type { HandoverDto } from '@/shared/schemas/people';
import { useHandoverQuery } from '@/components/api/people';
import { useBreakpoints } from '@/components/layout/use-breakpoints';
import { useTheme } from '@/components/theme/use-theme';
import { BackLink } from '@/components/ui/back-link';
import { BigButton } from '@/components/ui/big-button';
import { Notice } from '@/components/ui/notice';
import { LoadError, Loading } from '@/components/ui/query-state';
import { Screen } from '@/components/ui/screen';
import { Section } from '@/components/ui/section';
import { Text } from '@/components/ui/text';
import { dayLabel, frames, queenWords } from './people-labels';
import { canPrint, printMark, printPage, usePrintStyle } from './print-style';

/**
 * The Handover brief: what a sitter needs on one or two printed pages — the hives as they were
 * last seen, what falls due in the window, the cautions, and how to reach the owner.
 */
export function HandoverScreen() {
  const { apiaryId } = useLocalSearchParams<{ apiaryId: string }>();
  const t = useTheme();
  const q = useHandoverQuery(apiaryId);
  usePrintStyle();

  return (
    <Screen
      title={q.data ? `Handover · ${q.data.apiary.name}` : 'Handover'}
      testID="handover-screen"
      bottomBar={canPrint && q.data ? <BigButton testID="handover-print" label="Print the brief" fullWidth onPress={printPage} /> : undefined}
    >
      <View style={{ gap: t.space.lg }}>
        <View {...printMark('hide')}>
          <BackLink href={{ pathname: '/apiaries/[apiaryId]', params: { apiaryId } }} label={q.data?.apiary.name ?? 'Apiary'} />
        </View>
        {q.isPending ? (
          <Loading label="Loading the brief…" />
        ) : q.isError ? (
          <LoadError error={q.error} onRetry={() => void q.refetch()} testID="handover-error" />
        ) : (
          <Brief h={q.data} />
        )}
      </View>
    </Screen>
  );
}

function Brief({ h }: { h: HandoverDto }) {
  const t = useTheme();
  const { gtCompact } = useBreakpoints();
  const overdue = h.due.filter((d) => d.overdue);
  return (
    <View style={{ gap: t.space.lg }}>
      <View style={{ gap: t.space.xs }}>
        <Text variant="display" testID="handover-title">
          Handover: {h.apiary.name}
        </Text>
        <Text variant="bodyStrong" testID="handover-window">
          {dayLabel(h.window.from)} to {dayLabel(h.window.to)}
          {h.sitter ? ` · looked after by ${h.sitter.name}` : ''}
        </Text>
        {h.apiary.climateNote ? <Text tone="muted">{h.apiary.climateNote}</Text> : null}
      </View>

      <Section title="Reach the owner" testID="handover-owner">
        {h.owners.map((o) => (
          <View key={o.email} style={{ gap: t.space.xxs }} {...printMark('keep')}>
            <Text variant="bodyStrong">{o.name}</Text>
            <Text
              accessibilityRole="link"
              style={{ textDecorationLine: 'underline' }}
              onPress={() => void Linking.openURL(`mailto:${o.email}`)}
            >
              {o.email}
            </Text>
          </View>
        ))}
        <Text tone="muted" variant="small">
          If you are stung and feel unwell beyond the spot itself, call emergency services first, then the owner.
        </Text>
      </Section>

      <Section title={h.due.length ? `Due while you look after them (${h.due.length})` : 'Due while you look after them'} testID="handover-due">
        {h.due.length === 0 ? (
          <Text tone="muted">Nothing falls due in these dates. A look at the entrances on a warm afternoon is enough.</Text>
        ) : (
          <View style={{ gap: t.space.sm }}>
            {overdue.length ? (
              <Notice tone="warning" title={`${overdue.length} already overdue`}>
                Start with these; the owner knows about them.
              </Notice>
            ) : null}
            {h.due.map((d) => (
              <View key={d.key} {...printMark('keep')} style={{ flexDirection: 'row', gap: t.space.sm, alignItems: 'flex-start' }} testID={`handover-due-${d.key}`}>
                <Text variant="bodyStrong" style={{ minWidth: 108 }}>
                  {d.overdue ? 'Overdue' : dayLabel(d.dueDate)}
                </Text>
                <View style={{ flex: 1 }}>
                  <Text variant="bodyStrong">
                    {d.title}
                    {d.hiveName && !d.title.includes(d.hiveName) ? ` — ${d.hiveName}` : ''}
                  </Text>
                  <Text tone="muted" variant="small">
                    {d.detail}
                  </Text>
                </View>
              </View>
            ))}
          </View>
        )}
      </Section>

      <Section title={`Hives (${h.hives.length})`} testID="handover-hives">
        <View style={{ flexDirection: gtCompact ? 'row' : 'column', flexWrap: 'wrap', gap: t.space.sm }}>
          {h.hives.map((v) => (
            <View
              key={v.id}
              {...printMark('keep')}
              testID={`handover-hive-${v.name}`}
              style={{
                flexBasis: gtCompact ? '48%' : undefined,
                flexGrow: 1,
                gap: t.space.xxs,
                padding: t.space.sm,
                borderRadius: t.radius.md,
                borderWidth: t.borderWidth.thin,
                borderColor: t.colours.line,
              }}
            >
              <Text variant="bodyStrong">
                {v.name} <Text tone="muted">· {v.boxes === 1 ? '1 box' : `${v.boxes} boxes`}</Text>
              </Text>
              {v.lastCheck ? (
                <>
                  <Text>
                    {frames(v.lastCheck.framesBrood)} of brood, {frames(v.lastCheck.framesBees)} of bees, {queenWords(v.lastCheck.queenStatus)}
                    {v.lastCheck.temperament && v.lastCheck.temperament >= 4 ? ' · defensive: veil and gloves on' : ''}
                  </Text>
                  <Text tone="muted" variant="small">
                    Last check {dayLabel(v.lastCheck.occurredAt)}
                    {v.lastCheck.by ? ` by ${v.lastCheck.by}` : ''}
                    {v.lastCheck.note ? ` — ${v.lastCheck.note}` : ''}
                  </Text>
                </>
              ) : (
                <Text tone="muted">No Quick check recorded yet.</Text>
              )}
            </View>
          ))}
        </View>
      </Section>

      <Section title="Take care" testID="handover-cautions">
        {h.cautions.map((c) => (
          <View key={c.id} {...printMark('keep')} testID={`handover-caution-${c.id}`}>
            <Notice tone={c.severity === 'stop' ? 'warning' : 'info'} title={c.title}>
              <View style={{ gap: t.space.xxs }}>
                {c.lines.map((l) => (
                  <Text key={l}>• {l}</Text>
                ))}
              </View>
            </Notice>
          </View>
        ))}
      </Section>
      <Text tone="muted" variant="small">
        Made {new Date(h.generatedAt).toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short' })}. Frameside records and reminds; the
        product label and your local rules decide.
      </Text>
    </View>
  );
}
