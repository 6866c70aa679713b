import { useRouter } from 'expo-router';
import { Formik } from 'formik';
import { StyleSheet, View } from 'react-native';

import { signInSchema } from '../../../shared/schemas';
import { useSignIn } from '../../api/session';
import { spacing } from '../../theme';
import { applyProblem, FormErrorBanner, FormTextField, trimStrings, validateWithSchema } from '../forms';
import { Button, Text, TextLink } from '../ui';

import { AuthFrame } from './auth-frame';

type Values = { email: string; password: string };

export function SignInForm() {
  const router = useRouter();
  const signIn = useSignIn();
  return (
    <AuthFrame
      title="Sign in"
      intro="Your team's sites, line lists and surface register."
      footer={
        <>
          <Text tone="textMuted">
            New here? <TextLink href="/sign-up">Create a team</TextLink>
          </Text>
          <TextLink href="/quick-sizing">Quick sizing — no account needed</TextLink>
        </>
      }
    >
      <Formik<Values>
        initialValues={{ email: '', password: '' }}
        validate={(v) => validateWithSchema(signInSchema, trimStrings(v, ['password']))}
        onSubmit={async (values, helpers) => {
          helpers.setStatus(undefined);
          const result = await signIn.mutateAsync(trimStrings(values, ['password']));
          if (result.kind === 'ok') {
            router.replace('/sites');
            return;
          }
          if (result.kind === 'unauthenticated') {
            helpers.setStatus({ error: 'That e-mail address and password do not match an account.' });
            return;
          }
          applyProblem(result, helpers, ['email', 'password']);
        }}
      >
        {(form) => (
          <View style={styles.form}>
            <FormErrorBanner status={form.status} title="Could not sign in" />
            <FormTextField form={form} name="email" label="E-mail address" autoComplete="email" inputMode="email" autoCapitalize="none" testID="signin-email" />
            <FormTextField form={form} name="password" label="Password" password autoComplete="current-password" testID="signin-password" onSubmitEditing={() => form.handleSubmit()} />
            <Button label="Sign in" busy={form.isSubmitting} onPress={() => form.handleSubmit()} block testID="signin-submit" />
            <TextLink href="/forgot-password" variant="label">
              Forgot your password?
            </TextLink>
          </View>
        )}
      </Formik>
    </AuthFrame>
  );
}

const styles = StyleSheet.create({
  form: { gap: spacing.lg },
});
