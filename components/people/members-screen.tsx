import { useLocalSearchParams, useRouter } from 'expo-router';
import { useState } from 'react';
import { View } from 'react-native';
import { ROLES, type Role } from '@/shared/domain/access';
import { invitationCreateSchema, type MemberDto, type PendingInvitationDto } from '@/shared/schemas/people';
import { useApiaryQuery } from '@/components/api/apiaries';
import { ApiError } from '@/components/api/client';
import {
  useActivityQuery,
  useApiaryDeleteMutation,
  useInvitationCreateMutation,
  useInvitationRevokeMutation,
  useMemberRemoveMutation,
  useMembersQuery,
  useMemberUpdateMutation,
} from '@/components/api/people';
import { canIn, ROLE_LABELS } from '@/components/apiaries/membership';
import { useNow } from '@/components/layout/use-now';
import { useTheme } from '@/components/theme/use-theme';
import { BackLink } from '@/components/ui/back-link';
import { BigButton } from '@/components/ui/big-button';
import { ChoiceChips } from '@/components/ui/choice-chips';
import { Notice } from '@/components/ui/notice';
import { LoadError, Loading } from '@/components/ui/query-state';
import { Screen } from '@/components/ui/screen';
import { Section } from '@/components/ui/section';
import { Stepper } from '@/components/ui/stepper';
import { Text } from '@/components/ui/text';
import { TextField } from '@/components/ui/text-field';
import { dayLabel, daysFromToday, isoDayFrom, ROLE_HELP } from './people-labels';

const ROLE_OPTIONS = ROLES.map((r) => ({ value: r, label: ROLE_LABELS[r] }));
/** A typical sitting is a fortnight away (Frameside's own default). */
const DEFAULT_DAYS = 14;

function accessWords(m: Pick<MemberDto, 'role' | 'startsAt' | 'endsAt' | 'state' | 'daysLeft'>): string {
  if (!m.endsAt) return 'No end date';
  const last = dayLabel(m.endsAt);
  if (m.state === 'ended') return `Access ended ${last}`;
  if (m.state === 'not-started' && m.startsAt) return `From ${dayLabel(m.startsAt)} until ${last}`;
  return `Until ${last} · ${m.daysLeft === 1 ? '1 day' : `${m.daysLeft} days`} left`;
}

/** Start (days from today) and length steppers: a sitter's dates without typing. */
function WindowSteppers({ field, start, days, onStart, onDays, now }: { field: string; start: number; days: number; onStart: (n: number) => void; onDays: (n: number) => void; now: Date }) {
  const t = useTheme();
  const from = isoDayFrom(now, start);
  const to = isoDayFrom(now, start + days - 1);
  return (
    <View style={{ gap: t.space.md }}>
      <Stepper
        field={`${field}-start`}
        label="Starts"
        value={start}
        min={0}
        max={90}
        onChange={onStart}
        format={(v) => (v === 0 ? 'Today' : dayLabel(isoDayFrom(now, v)))}
        decreaseLabel="Start a day earlier"
        increaseLabel="Start a day later"
      />
      <Stepper
        field={`${field}-days`}
        label="For how many days"
        value={days}
        min={1}
        max={120}
        onChange={onDays}
        unit={days === 1 ? 'day' : 'days'}
        decreaseLabel="One day fewer"
        increaseLabel="One day more"
      />
      <Text variant="bodyStrong" testID={`${field}-dates`}>
        {dayLabel(from)} to {dayLabel(to)}, both days included
      </Text>
    </View>
  );
}

export function MembersScreen() {
  const { apiaryId } = useLocalSearchParams<{ apiaryId: string }>();
  const t = useTheme();
  const now = useNow();
  const apiary = useApiaryQuery(apiaryId);
  const manage = canIn(apiary.data, 'members:manage', now);
  const members = useMembersQuery(apiaryId, canIn(apiary.data, 'members:read', now));
  const activity = useActivityQuery(apiaryId, canIn(apiary.data, 'activity:read', now));

  const [email, setEmail] = useState('');
  const [role, setRole] = useState<Role>('sitter');
  const [start, setStart] = useState(0);
  const [days, setDays] = useState(DEFAULT_DAYS);
  const [sentTo, setSentTo] = useState<string | null>(null);
  const [touched, setTouched] = useState(false);
  const invite = useInvitationCreateMutation(apiaryId);

  const input = {
    email,
    role,
    ...(role === 'sitter' ? { startsAt: isoDayFrom(now, start), endsAt: isoDayFrom(now, start + days - 1) } : {}),
  };
  const check = invitationCreateSchema.safeParse(input);
  const clientErrors: Record<string, string> = {};
  if (!check.success) for (const i of check.error.issues) clientErrors[String(i.path[0] ?? '_')] ??= i.message;
  const serverErrors = invite.error instanceof ApiError ? invite.error.fields : {};
  const emailError = touched ? (clientErrors.email ?? serverErrors.email) : undefined;

  const send = async () => {
    setTouched(true);
    if (!check.success) return;
    try {
      await invite.mutateAsync(check.data);
      setSentTo(check.data.email);
      setEmail('');
      setTouched(false);
    } catch {
      // The error is shown from the mutation.
    }
  };

  return (
    <Screen
      title={apiary.data ? `People · ${apiary.data.name}` : 'People'}
      testID="members-screen"
      bottomBar={
        manage ? (
          <BigButton testID="invite-submit" label="Send invitation" loadingLabel="Sending…" loading={invite.isPending} fullWidth onPress={() => void send()} />
        ) : undefined
      }
    >
      <View style={{ gap: t.space.lg }}>
        <BackLink href={{ pathname: '/apiaries/[apiaryId]', params: { apiaryId } }} label={apiary.data?.name ?? 'Apiary'} />
        <Text variant="display">People{apiary.data ? ` at ${apiary.data.name}` : ''}</Text>

        {apiary.isError ? <LoadError error={apiary.error} /> : null}
        {manage ? (
          <Section title="Invite someone" testID="invite-form">
            {sentTo ? (
              <Notice tone="good" testID="invite-sent" title="Invitation sent">
                {`An e-mail with a link is on its way to ${sentTo}. The link works once, for 7 days.`}
              </Notice>
            ) : null}
        {members.isPending && members.fetchStatus !== 'idle' ? (
          <Loading label="Loading who has access…" />
        ) : members.isError ? (
          <LoadError error={members.error} onRetry={() => void members.refetch()} />
        ) : members.data ? (
          <Section title="Who has access" testID="members-list">
            {members.data.members.map((m) => (
              <MemberRow
                key={m.userId}
                apiaryId={apiaryId}
                m={m}
                manage={manage}
                now={now}
                onlyOwner={m.role === 'owner' && members.data.members.filter((x) => x.role === 'owner').length === 1}
              />
            ))}
          </Section>
        ) : apiary.data ? (
          <Notice>Only the owner and keepers see who has access here.</Notice>
        ) : null}

        {members.data && members.data.invitations.length > 0 ? (
          <Section title="Invitations not yet accepted" testID="invitations-list">
            {members.data.invitations.map((i) => (
              <PendingRow key={i.id} apiaryId={apiaryId} i={i} manage={manage} />
            ))}
          </Section>
        ) : null}

            {invite.error && !serverErrors.email ? (
              <Notice tone="warning" testID="invite-error">
                {invite.error.message}
              </Notice>
            ) : null}
            <TextField
              testID="invite-email"
              label="Their e-mail"
              value={email}
              onChangeText={(v) => {
                setEmail(v);
                setSentTo(null);
              }}
              onBlur={() => setTouched(true)}
              error={emailError}
              autoCapitalize="none"
              autoComplete="email"
              keyboardType="email-address"
              inputMode="email"
            />
            <ChoiceChips field="invite-role" label="As" options={ROLE_OPTIONS} value={role} onChange={setRole} hint={ROLE_HELP[role]} />
            {role === 'sitter' ? <WindowSteppers field="invite" start={start} days={days} onStart={setStart} onDays={setDays} now={now} /> : null}
          </Section>
        ) : null}

        {activity.data ? (
          <Section title="Recent changes" testID="activity-list">
            {activity.data.length === 0 ? <Text tone="muted">Nothing yet.</Text> : null}
            {activity.data.map((a) => (
              <View key={a.id} style={{ gap: 2 }}>
                <Text>
                  <Text variant="bodyStrong">{a.who?.name ?? 'Someone'}</Text> {a.action === 'create' ? 'added' : a.action === 'update' ? 'changed' : 'removed'}{' '}
                  {a.entity === 'membership' ? 'a member' : a.entity.replace(/-/g, ' ')}
                  {a.action === 'update' ? ` (${Object.keys(a.changes).join(', ') || 'no visible change'})` : ''}
                </Text>
                <Text tone="muted" variant="small">
                  {new Date(a.at).toLocaleString('en-GB', { dateStyle: 'medium', timeStyle: 'short' })}
                </Text>
              </View>
            ))}
          </Section>
        ) : null}

        {canIn(apiary.data, 'apiary:delete', now) ? <DeleteApiary apiaryId={apiaryId} name={apiary.data?.name ?? ''} /> : null}
      </View>
    </Screen>
  );
}

function MemberRow({ apiaryId, m, manage, now, onlyOwner }: { apiaryId: string; m: MemberDto; manage: boolean; now: Date; onlyOwner: boolean }) {
  const t = useTheme();
  const [editing, setEditing] = useState(false);
  const [confirmEnd, setConfirmEnd] = useState(false);
  const [role, setRole] = useState<Role>(m.role);
  const [start, setStart] = useState(m.startsAt ? Math.max(0, daysFromToday(now, m.startsAt)) : 0);
  const [days, setDays] = useState(m.startsAt && m.endsAt ? Math.max(1, daysFromToday(now, m.endsAt) - Math.max(0, daysFromToday(now, m.startsAt)) + 1) : DEFAULT_DAYS);
  const update = useMemberUpdateMutation(apiaryId);
  const remove = useMemberRemoveMutation(apiaryId);

  return (
    <View testID={`member-${m.userId}`} style={{ gap: t.space.sm, paddingVertical: t.space.xs, borderTopWidth: t.borderWidth.thin, borderTopColor: t.colours.line }}>
      <View style={{ gap: 2 }}>
        <Text variant="bodyStrong">
          {m.name} · {ROLE_LABELS[m.role]}
        </Text>
        <Text tone="muted">{m.email}</Text>
        <Text testID={`member-${m.userId}-access`}>{accessWords(m)}</Text>
      </View>
      {update.error || remove.error ? (
        <Notice tone="warning" testID={`member-${m.userId}-error`}>
          {(update.error ?? remove.error)!.message}
        </Notice>
      ) : null}
      {manage && onlyOwner ? (
        <Text tone="muted" variant="small">
          The only owner: make someone else an owner before changing this.
        </Text>
      ) : null}
      {manage && !onlyOwner && !editing && !confirmEnd ? (
        <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: t.targetGap }}>
          <BigButton testID={`member-${m.userId}-edit`} variant="secondary" label="Change role or dates" onPress={() => setEditing(true)} />
          <BigButton testID={`member-${m.userId}-end`} variant="secondary" label="End access" onPress={() => setConfirmEnd(true)} />
        </View>
      ) : null}
      {confirmEnd ? (
        <View style={{ gap: t.space.sm }}>
          <Text>{`End ${m.name}'s access now? Their records stay.`}</Text>
          <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: t.targetGap }}>
            <BigButton testID={`member-${m.userId}-end-confirm`} variant="danger" label="End access" loading={remove.isPending} onPress={() => remove.mutate(m.userId)} />
            <BigButton variant="secondary" label="Keep" onPress={() => setConfirmEnd(false)} />
          </View>
        </View>
      ) : null}
      {editing ? (
        <View style={{ gap: t.space.md }}>
          <ChoiceChips field={`member-${m.userId}-role`} label="Role" options={ROLE_OPTIONS} value={role} onChange={setRole} hint={ROLE_HELP[role]} />
          {role === 'sitter' ? <WindowSteppers field={`member-${m.userId}`} start={start} days={days} onStart={setStart} onDays={setDays} now={now} /> : null}
          <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: t.targetGap }}>
            <BigButton
              testID={`member-${m.userId}-save`}
              label="Save"
              loading={update.isPending}
              onPress={() =>
                update.mutate(
                  {
                    userId: m.userId,
                    input: role === 'sitter' ? { role, startsAt: isoDayFrom(now, start), endsAt: isoDayFrom(now, start + days - 1) } : { role },
                  },
                  { onSuccess: () => setEditing(false) },
                )
              }
            />
            <BigButton variant="secondary" label="Cancel" onPress={() => setEditing(false)} />
          </View>
        </View>
      ) : null}
    </View>
  );
}

function PendingRow({ apiaryId, i, manage }: { apiaryId: string; i: PendingInvitationDto; manage: boolean }) {
  const t = useTheme();
  const revoke = useInvitationRevokeMutation(apiaryId);
  return (
    <View testID={`invitation-${i.id}`} style={{ gap: t.space.xs }}>
      <Text variant="bodyStrong">
        {i.email} · {ROLE_LABELS[i.role]}
      </Text>
      <Text tone="muted">
        {i.startsAt && i.endsAt ? `${dayLabel(i.startsAt)} to ${dayLabel(i.endsAt)} · ` : ''}link works until {dayLabel(i.expiresAt)}
      </Text>
      {manage ? <BigButton testID={`invitation-${i.id}-withdraw`} variant="secondary" label="Withdraw" loading={revoke.isPending} onPress={() => revoke.mutate(i.id)} /> : null}
    </View>
  );
}

function DeleteApiary({ apiaryId, name }: { apiaryId: string; name: string }) {
  const t = useTheme();
  const router = useRouter();
  const [confirm, setConfirm] = useState(false);
  const del = useApiaryDeleteMutation(apiaryId);
  return (
    <Section title="Delete this apiary" testID="apiary-delete-section">
      <Text>Deletes {name}, its hives and every record in it, for everyone. It cannot be undone; export the records first if you may need them.</Text>
      {del.error ? <Notice tone="warning">{del.error.message}</Notice> : null}
      {confirm ? (
        <View style={{ flexDirection: 'row', flexWrap: 'wrap', gap: t.targetGap }}>
          <BigButton
            testID="apiary-delete-confirm"
            variant="danger"
            label={`Delete ${name}`}
            loading={del.isPending}
            onPress={() => del.mutate(undefined, { onSuccess: () => router.replace('/apiaries') })}
          />
          <BigButton variant="secondary" label="Keep it" onPress={() => setConfirm(false)} />
        </View>
      ) : (
        <BigButton testID="apiary-delete" variant="secondary" label="Delete this apiary…" onPress={() => setConfirm(true)} />
      )}
    </Section>
  );
}
