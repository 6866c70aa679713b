import { Formik } from 'formik';
import { StyleSheet, View } from 'react-native';

import { passwordResetRequestSchema } from '../../../shared/schemas';
import { problemMessage } from '../../api/client';
import { useRequestPasswordReset } from '../../api/session';
import { spacing } from '../../theme';
import { FormErrorBanner, type FormStatus, FormTextField, trimStrings, validateWithSchema } from '../forms';
import { Banner, Button, TextLink } from '../ui';

import { AuthFrame } from './auth-frame';

type Values = { email: string };

export function ForgotPasswordForm() {
  const request = useRequestPasswordReset();
  return (
    <AuthFrame
      title="Reset your password"
      intro="Enter the address you sign in with. We will send a link that works once, for one hour."
      footer={<TextLink href="/">Back to sign in</TextLink>}
    >
      <Formik<Values>
        initialValues={{ email: '' }}
        validate={(v) => validateWithSchema(passwordResetRequestSchema, trimStrings(v))}
        onSubmit={async (values, helpers) => {
          helpers.setStatus(undefined);
          const result = await request.mutateAsync(trimStrings(values));
          if (result.kind === 'ok') {
            helpers.setStatus({ done: values.email.trim() });
            return;
          }
          helpers.setStatus({ error: problemMessage(result) });
        }}
      >
        {(form) => {
          const status = form.status as FormStatus;
          if (status?.done) {
            return (
              <Banner tone="pass" title="Check your inbox" testID="reset-sent">
                {`If ${status.done} has a Lagline account, a reset link is on its way. It expires in one hour.`}
              </Banner>
            );
          }
          return (
            <View style={styles.form}>
              <FormErrorBanner status={status} />
              <FormTextField form={form} name="email" label="E-mail address" autoComplete="email" inputMode="email" autoCapitalize="none" onSubmitEditing={() => form.handleSubmit()} testID="forgot-email" />
              <Button label="Send reset link" busy={form.isSubmitting} onPress={() => form.handleSubmit()} block testID="forgot-submit" />
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
