import { Formik } from 'formik';
import { StyleSheet, View } from 'react-native';

import { passwordResetConfirmSchema } from '../../../shared/schemas';
import { problemMessage } from '../../api/client';
import { useConfirmPasswordReset } from '../../api/session';
import { spacing } from '../../theme';
import { useHydrated } from '../common/use-hydrated';
import { FormErrorBanner, type FormErrors, type FormStatus, FormTextField, validateWithSchema } from '../forms';
import { Banner, Button, TextLink } from '../ui';

import { AuthFrame, PASSWORD_HINT } from './auth-frame';

type Values = { password: string; confirm: string };

export function ResetPasswordForm({ token }: { token: string | undefined }) {
  const confirm = useConfirmPasswordReset();
  const hydrated = useHydrated();
  if (!hydrated) return <AuthFrame title="Choose a new password">{null}</AuthFrame>;
  if (!token) {
    return (
      <AuthFrame title="Choose a new password" footer={<TextLink href="/forgot-password">Ask for a new link</TextLink>}>
        <Banner tone="fail" title="This link is incomplete">
          Open the link from the reset e-mail again, or ask for a new one.
        </Banner>
      </AuthFrame>
    );
  }
  return (
    <AuthFrame title="Choose a new password" footer={<TextLink href="/">Back to sign in</TextLink>}>
      <Formik<Values>
        initialValues={{ password: '', confirm: '' }}
        validate={(v) => {
          const errors: FormErrors<Values> = validateWithSchema(passwordResetConfirmSchema, { token, password: v.password });
          if (!errors.password && v.confirm !== v.password) errors.confirm = 'The two passwords differ';
          return errors;
        }}
        onSubmit={async (values, helpers) => {
          helpers.setStatus(undefined);
          const result = await confirm.mutateAsync({ token, password: values.password });
          if (result.kind === 'ok') {
            helpers.setStatus({ done: 'yes' });
            return;
          }
          if (result.kind === 'validation' && result.fieldErrors.password) {
            helpers.setErrors({ password: result.fieldErrors.password });
            return;
          }
          helpers.setStatus({
            error:
              result.kind === 'validation' && result.code === 'INVALID_TOKEN'
                ? 'This reset link has expired or was already used. Ask for a new one.'
                : problemMessage(result),
          });
        }}
      >
        {(form) => {
          const status = form.status as FormStatus;
          if (status?.done) {
            return (
              <View style={styles.form}>
                <Banner tone="pass" title="Password changed" testID="reset-done">
                  Sign in with your new password.
                </Banner>
                <TextLink href="/">Go to sign in</TextLink>
              </View>
            );
          }
          return (
            <View style={styles.form}>
              <FormErrorBanner status={status} />
              <FormTextField form={form} name="password" label="New password" password hint={PASSWORD_HINT} autoComplete="new-password" testID="reset-password" />
              <FormTextField form={form} name="confirm" label="New password again" password autoComplete="new-password" testID="reset-confirm" />
              <Button label="Save new password" busy={form.isSubmitting} onPress={() => form.handleSubmit()} block testID="reset-submit" />
            </View>
          );
        }}
      </Formik>
    </AuthFrame>
  );
}

const styles = StyleSheet.create({
  form: { gap: spacing.lg },
});
