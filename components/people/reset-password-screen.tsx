import { Link, useLocalSearchParams } from 'expo-router';
import { useState } from 'react';
import { View } from 'react-native';
import { passwordSchema } from '@/shared/schemas/auth';
import { usePasswordResetMutation, usePasswordResetRequestMutation } from '@/components/api/people';
import { AuthFrame } from '@/components/auth/auth-frame';
import { useTheme } from '@/components/theme/use-theme';
import { BigButton } from '@/components/ui/big-button';
import { Notice } from '@/components/ui/notice';
import { TextField } from '@/components/ui/text-field';

/** /reset-password: ask for a link. The answer is the same whether or not the account exists. */
export function ResetRequestScreen() {
  const t = useTheme();
  const [email, setEmail] = useState('');
  const req = usePasswordResetRequestMutation();
  return (
    <AuthFrame
      title="Forgot password"
      heading="Forgot your password?"
      bottomBar={<BigButton testID="reset-request-submit" label="E-mail me a link" loading={req.isPending} fullWidth onPress={() => req.mutate(email.trim())} />}
    >
      <View style={{ gap: t.space.lg }}>
        {req.isSuccess ? (
          <Notice tone="good" testID="reset-request-sent">
            {req.data.message}
          </Notice>
        ) : null}
        {req.error ? <Notice tone="warning">{req.error.message}</Notice> : null}
        <TextField testID="reset-request-email" label="E-mail" value={email} onChangeText={setEmail} autoCapitalize="none" keyboardType="email-address" inputMode="email" autoComplete="email" />
        <Link href="/sign-in" asChild>
          <BigButton variant="secondary" label="Back to sign in" />
        </Link>
      </View>
    </AuthFrame>
  );
}

/** /reset-password/[token]: a new password from the e-mailed link (once, within the hour). */
export function ResetPasswordScreen() {
  const { token } = useLocalSearchParams<{ token: string }>();
  const t = useTheme();
  const [password, setPassword] = useState('');
  const [touched, setTouched] = useState(false);
  const reset = usePasswordResetMutation(token);
  const problem = passwordSchema.safeParse(password).error?.issues[0]?.message;

  return (
    <AuthFrame
      title="New password"
      heading="Choose a new password"
      bottomBar={
        reset.isSuccess ? (
          <Link href="/sign-in" asChild>
            <BigButton testID="reset-go-sign-in" label="Sign in" fullWidth />
          </Link>
        ) : (
          <BigButton
            testID="reset-submit"
            label="Save the new password"
            loading={reset.isPending}
            fullWidth
            onPress={() => {
              setTouched(true);
              if (!problem) reset.mutate(password);
            }}
          />
        )
      }
    >
      <View style={{ gap: t.space.lg }}>
        {reset.isSuccess ? (
          <Notice tone="good" testID="reset-done" title="Password changed">
            Every other device signed in to this account has been signed out. Sign in with the new password.
          </Notice>
        ) : (
          <>
            {reset.error ? (
              <Notice tone="warning" testID="reset-error">
                {reset.error.message}
              </Notice>
            ) : null}
            <TextField
              testID="reset-password"
              label="New password"
              hint="At least 10 characters."
              value={password}
              onChangeText={setPassword}
              onBlur={() => setTouched(true)}
              error={touched ? problem : undefined}
              secureTextEntry
              autoComplete="new-password"
            />
          </>
        )}
      </View>
    </AuthFrame>
  );
}
