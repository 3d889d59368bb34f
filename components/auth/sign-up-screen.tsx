import { Formik } from 'formik';
import { Link, useRouter } from 'expo-router';
import { View } from 'react-native';
import { signUpSchema, type SignUpInput } from '@/shared/schemas/auth';
import { useSignUpMutation } from '@/components/api/auth';
import { ApiError } from '@/components/api/client';
import { FormTextField } from '@/components/form/form-text-field';
import { serverFieldErrors, zodFormikValidate } from '@/components/form/zod-formik';
import { useTheme } from '@/components/theme/use-theme';
import { BigButton } from '@/components/ui/big-button';
import { Notice } from '@/components/ui/notice';
import { Text } from '@/components/ui/text';
import { AuthFrame } from './auth-frame';

interface SignUpValues {
  name: string;
  email: string;
  password: string;
}

/** The name is optional: an empty box means "no name given", not an empty name. */
const toInput = (v: SignUpValues): SignUpInput => ({ email: v.email, password: v.password, name: v.name.trim() === '' ? undefined : v.name });
const validate = zodFormikValidate(signUpSchema, toInput);
const initialValues: SignUpValues = { name: '', email: '', password: '' };

export function SignUpScreen() {
  const t = useTheme();
  const router = useRouter();
  const signUp = useSignUpMutation();

  return (
    <Formik<SignUpValues>
      initialValues={initialValues}
      validate={validate}
      onSubmit={async (values, { setErrors }) => {
        try {
          await signUp.mutateAsync(signUpSchema.parse(toInput(values)));
          router.replace('/');
        } catch (err) {
          if (err instanceof ApiError && Object.keys(err.fields).length > 0) setErrors(serverFieldErrors<SignUpValues>(err.fields));
        }
      }}
    >
      {({ handleSubmit, isSubmitting }) => (
        <AuthFrame
          title="Create an account"
          heading="Create an account"
          bottomBar={
            <BigButton
              testID="sign-up-submit"
              label="Create account"
              loadingLabel="Creating account…"
              loading={isSubmitting}
              fullWidth
              onPress={() => handleSubmit()}
            />
          }
        >
          <View style={{ gap: t.space.lg }}>
            {signUp.error ? (
              <Notice tone="warning">
                <Text testID="sign-up-error">{signUp.error.message}</Text>
              </Notice>
            ) : null}
            <FormTextField name="name" testID="sign-up-name" label="Your name" hint="Shown on the records you make." autoComplete="name" textContentType="name" />
            <FormTextField
              name="email"
              testID="sign-up-email"
              label="E-mail"
              autoCapitalize="none"
              autoComplete="email"
              keyboardType="email-address"
              inputMode="email"
              textContentType="emailAddress"
            />
            <FormTextField
              name="password"
              testID="sign-up-password"
              label="Password"
              hint="At least 10 characters."
              secureTextEntry
              autoComplete="new-password"
              textContentType="newPassword"
              returnKeyType="go"
              onSubmitEditing={() => handleSubmit()}
            />
            <View style={{ gap: t.space.sm, paddingTop: t.space.md }}>
              <Text tone="muted">Already have an account?</Text>
              <Link href="/sign-in" asChild>
                <BigButton testID="go-sign-in" variant="secondary" label="Sign in instead" />
              </Link>
            </View>
          </View>
        </AuthFrame>
      )}
    </Formik>
  );
}
