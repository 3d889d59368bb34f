import { Formik } from 'formik';
import { Link, useLocalSearchParams, useRouter } from 'expo-router';
import { View } from 'react-native';
import { signInSchema, type SignInInput } from '@/shared/schemas/auth';
import { useSignInMutation } from '@/components/api/auth';
import { ApiError } from '@/components/api/client';
import { FormTextField } from '@/components/form/form-text-field';
import { serverFieldErrors, zodFormikValidate } from '@/components/form/zod-formik';
import { useTheme } from '@/components/theme/use-theme';
import { BigButton } from '@/components/ui/big-button';
import { Notice } from '@/components/ui/notice';
import { Text } from '@/components/ui/text';
import { AuthFrame } from './auth-frame';

const validate = zodFormikValidate(signInSchema);

/** Only a path inside Frameside ("/hives/…"), never "//elsewhere" or a full URL: no open redirect. */
export function safeNext(next: string | string[] | undefined): string {
  const value = Array.isArray(next) ? next[0] : next;
  return value && value.startsWith('/') && !value.startsWith('//') && !value.includes('\\') ? value : '/';
}
const initialValues: SignInInput = { email: '', password: '' };

export function SignInScreen() {
  const t = useTheme();
  const router = useRouter();
  const { next } = useLocalSearchParams<{ next?: string }>();
  const signIn = useSignInMutation();

  return (
    <Formik<SignInInput>
      initialValues={initialValues}
      validate={validate}
      onSubmit={async (values, { setErrors }) => {
        try {
          await signIn.mutateAsync(signInSchema.parse(values));
          // A checked string path; typed routes cannot know it statically.
          router.replace(safeNext(next) as '/');
        } catch (err) {
          // The message itself is shown from the mutation's error; fields go beside their inputs.
          if (err instanceof ApiError && Object.keys(err.fields).length > 0) setErrors(serverFieldErrors<SignInInput>(err.fields));
        }
      }}
    >
      {({ handleSubmit, isSubmitting }) => (
        <AuthFrame
          title="Sign in"
          heading="Sign in"
          bottomBar={
            <BigButton
              testID="sign-in-submit"
              label="Sign in"
              loadingLabel="Signing in…"
              loading={isSubmitting}
              fullWidth
              onPress={() => handleSubmit()}
            />
          }
        >
          <View style={{ gap: t.space.lg }}>
            {signIn.error ? (
              <Notice tone="warning">
                <Text testID="sign-in-error">{signIn.error.message}</Text>
              </Notice>
            ) : null}
            <FormTextField
              name="email"
              testID="sign-in-email"
              label="E-mail"
              autoCapitalize="none"
              autoComplete="email"
              keyboardType="email-address"
              inputMode="email"
              textContentType="emailAddress"
              returnKeyType="next"
            />
            <FormTextField
              name="password"
              testID="sign-in-password"
              label="Password"
              secureTextEntry
              autoComplete="current-password"
              textContentType="password"
              returnKeyType="go"
              onSubmitEditing={() => handleSubmit()}
            />
            <View style={{ gap: t.space.sm, paddingTop: t.space.md }}>
              <Text tone="muted">New to Frameside?</Text>
              <Link href="/sign-up" asChild>
                <BigButton testID="go-sign-up" variant="secondary" label="Create an account" />
              </Link>
              <Link href="/reset-password" asChild>
                <BigButton testID="go-reset-password" variant="secondary" label="Forgot your password?" />
              </Link>
            </View>
          </View>
        </AuthFrame>
      )}
    </Formik>
  );
}
