import { useRouter } from 'expo-router';
import { Formik } from 'formik';
import { StyleSheet, View } from 'react-native';

import { signUpSchema } from '../../../shared/schemas';
import { useSignUp } from '../../api/session';
import { spacing } from '../../theme';
import { applyProblem, FormErrorBanner, FormTextField, trimStrings, validateWithSchema } from '../forms';
import { Button, Text, TextLink } from '../ui';

import { AuthFrame, PASSWORD_HINT } from './auth-frame';

type Values = { name: string; email: string; password: string; teamName: string };
const FIELDS = ['name', 'email', 'password', 'teamName'] as const;

export function SignUpForm() {
  const router = useRouter();
  const signUp = useSignUp();
  return (
    <AuthFrame
      title="Create a team"
      intro="You will own the team and can invite engineers, safety officers and contractors."
      footer={
        <Text tone="textMuted">
          Already have an account? <TextLink href="/">Sign in</TextLink>
        </Text>
      }
    >
      <Formik<Values>
        initialValues={{ name: '', email: '', password: '', teamName: '' }}
        validate={(v) => validateWithSchema(signUpSchema, trimStrings(v, ['password']))}
        onSubmit={async (values, helpers) => {
          helpers.setStatus(undefined);
          const result = await signUp.mutateAsync(trimStrings(values, ['password']));
          if (result.kind === 'ok') {
            router.replace('/sites');
            return;
          }
          applyProblem(result, helpers, FIELDS);
        }}
      >
        {(form) => (
          <View style={styles.form}>
            <FormErrorBanner status={form.status} title="Could not create the team" />
            <FormTextField form={form} name="teamName" label="Team name" hint="Usually the plant or company, e.g. North Ridge Works." testID="signup-team" />
            <FormTextField form={form} name="name" label="Your name" autoComplete="name" testID="signup-name" />
            <FormTextField form={form} name="email" label="E-mail address" autoComplete="email" inputMode="email" autoCapitalize="none" testID="signup-email" />
            <FormTextField form={form} name="password" label="Password" password hint={PASSWORD_HINT} autoComplete="new-password" testID="signup-password" />
            <Button label="Create team" busy={form.isSubmitting} onPress={() => form.handleSubmit()} block testID="signup-submit" />
          </View>
        )}
      </Formik>
    </AuthFrame>
  );
}

const styles = StyleSheet.create({
  form: { gap: spacing.lg },
});
