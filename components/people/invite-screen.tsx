import { Link, useLocalSearchParams, useRouter } from 'expo-router';
import { useState } from 'react';
import { View } from 'react-native';
import { invitationAcceptSchema } from '@/shared/schemas/people';
import { useMeQuery } from '@/components/api/auth';
import { ApiError } from '@/components/api/client';
import { useInvitationAcceptMutation, useInvitationInfoQuery } from '@/components/api/people';
import { ROLE_LABELS } from '@/components/apiaries/membership';
import { AuthFrame } from '@/components/auth/auth-frame';
import { useTheme } from '@/components/theme/use-theme';
import { BigButton } from '@/components/ui/big-button';
import { Notice } from '@/components/ui/notice';
import { Loading } from '@/components/ui/query-state';
import { Text } from '@/components/ui/text';
import { TextField } from '@/components/ui/text-field';
import { dayLabel, ROLE_HELP } from './people-labels';

/** /invite/[token]: what the invitation is for, then accept — signed in as is, or by signing up or in. */
export function InviteScreen() {
  const { token } = useLocalSearchParams<{ token: string }>();
  const t = useTheme();
  const router = useRouter();
  const me = useMeQuery();
  const info = useInvitationInfoQuery(token);
  const accept = useInvitationAcceptMutation(token);
  const [name, setName] = useState('');
  const [email, setEmail] = useState<string | null>(null);
  const [password, setPassword] = useState('');

  const inv = info.data;
  const signedIn = me.data?.user;
  const newAccount = inv ? !inv.accountExists : false;
  const emailValue = email ?? inv?.email ?? '';
  const fields = accept.error instanceof ApiError ? accept.error.fields : {};

  const done = (apiaryId: string, role: string) =>
    router.replace(role === 'sitter' ? { pathname: '/apiaries/[apiaryId]/handover', params: { apiaryId } } : { pathname: '/apiaries/[apiaryId]', params: { apiaryId } });

  const submit = async () => {
    try {
      if (signedIn) {
        const r = await accept.mutateAsync(undefined);
        done(r.apiaryId, r.role);
        return;
      }
      const body = invitationAcceptSchema.parse({ email: emailValue, password, ...(newAccount && name.trim() ? { name: name.trim() } : {}) });
      const r = await accept.mutateAsync(body);
      done(r.apiaryId, r.role);
    } catch {
      // Shown from the mutation (or the schema's message below).
    }
  };
  const localProblem = !signedIn && inv ? invitationAcceptSchema.safeParse({ email: emailValue, password }).error?.issues[0]?.message : undefined;

  const action = inv ? (signedIn ? `Accept as ${signedIn.name}` : newAccount ? 'Create account and accept' : 'Sign in and accept') : undefined;

  return (
    <AuthFrame
      title="Invitation"
      heading={inv ? `Join ${inv.apiaryName}` : 'Invitation'}
      bottomBar={
        action ? (
          <BigButton testID="invite-accept" label={action} loadingLabel="Accepting…" loading={accept.isPending} disabled={Boolean(localProblem)} fullWidth onPress={() => void submit()} />
        ) : null
      }
    >
      <View style={{ gap: t.space.lg }} testID="invite-screen">
        {info.isPending ? (
          <Loading label="Reading the invitation…" />
        ) : info.isError ? (
          <View style={{ gap: t.space.md }}>
            <Notice tone="warning" title="This link cannot be used" testID="invite-unusable">
              {info.error.message}
            </Notice>
            <Link href="/sign-in" asChild>
              <BigButton variant="secondary" label="Go to sign in" />
            </Link>
          </View>
        ) : inv ? (
          <>
            <View style={{ gap: t.space.xs }} testID="invite-summary">
              <Text>
                {inv.invitedBy ?? 'The owner'} invites you as <Text variant="bodyStrong">{ROLE_LABELS[inv.role]}</Text>.
              </Text>
              <Text tone="muted">{ROLE_HELP[inv.role]}</Text>
              {inv.startsAt && inv.endsAt ? (
                <Text variant="bodyStrong" testID="invite-window">
                  {dayLabel(inv.startsAt)} to {dayLabel(inv.endsAt)}
                </Text>
              ) : null}
            </View>
            {accept.error ? (
              <Notice tone="warning" testID="invite-accept-error">
                {accept.error.message}
              </Notice>
            ) : null}
            {signedIn ? (
              <Text>{`You are signed in as ${signedIn.email}. The apiary is added to this account.`}</Text>
            ) : (
              <View style={{ gap: t.space.md }}>
                <Text>{newAccount ? 'Choose a password to create your account.' : 'You already have an account: enter its password.'}</Text>
                {newAccount ? <TextField testID="invite-name" label="Your name" hint="Shown on the records you make." value={name} onChangeText={setName} autoComplete="name" /> : null}
                <TextField
                  testID="invite-email"
                  label="E-mail"
                  value={emailValue}
                  onChangeText={setEmail}
                  autoCapitalize="none"
                  keyboardType="email-address"
                  inputMode="email"
                  autoComplete="email"
                  error={fields.email}
                />
                <TextField
                  testID="invite-password"
                  label="Password"
                  hint={newAccount ? 'At least 10 characters.' : undefined}
                  value={password}
                  onChangeText={setPassword}
                  secureTextEntry
                  autoComplete={newAccount ? 'new-password' : 'current-password'}
                  error={fields.password}
                  onSubmitEditing={() => void submit()}
                />
              </View>
            )}
          </>
        ) : null}
      </View>
    </AuthFrame>
  );
}
