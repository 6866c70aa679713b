import { useRouter } from 'expo-router';
import { Formik } from 'formik';
import { ActivityIndicator, StyleSheet, View } from 'react-native';

import { invitationAcceptSchema, nameField, passwordField } from '../../../shared/schemas';
import { ApiProblemError, problemMessage } from '../../api/client';
import { useAcceptInvitation, useInvitation } from '../../api/session';
import { roleDescriptions, roleLabels } from '../../api/types';
import { colors, radius, spacing } from '../../theme';
import { useHydrated } from '../common/use-hydrated';
import { applyProblem, FormErrorBanner, FormTextField, trimStrings, validateWithSchema } from '../forms';
import { Banner, Button, Text, TextLink } from '../ui';

import { AuthFrame, PASSWORD_HINT } from './auth-frame';

type Values = { name: string; password: string };

// A new member must give both; the shared schema also allows `{}` for an already signed-in user.
const newMemberSchema = invitationAcceptSchema.shape({ name: nameField(), password: passwordField() });

export function AcceptInviteForm({ token }: { token: string | undefined }) {
  const router = useRouter();
  const invitation = useInvitation(token);
  const accept = useAcceptInvitation(token ?? '');
  const hydrated = useHydrated();

  if (!hydrated) {
    return (
      <AuthFrame title="Join a team">
        <ActivityIndicator color={colors.heat} />
      </AuthFrame>
    );
  }

  if (!token) {
    return (
      <AuthFrame title="Join a team" footer={<TextLink href="/">Go to sign in</TextLink>}>
        <Banner tone="fail" title="This link is incomplete">
          Open the link from the invitation e-mail again.
        </Banner>
      </AuthFrame>
    );
  }
  if (invitation.isPending) {
    return (
      <AuthFrame title="Join a team">
        <ActivityIndicator color={colors.heat} />
        <Text tone="textMuted">Checking your invitation…</Text>
      </AuthFrame>
    );
  }
  if (invitation.isError) {
    const problem = invitation.error instanceof ApiProblemError ? invitation.error.problem : null;
    return (
      <AuthFrame title="Join a team" footer={<TextLink href="/">Go to sign in</TextLink>}>
        <Banner tone="fail" title={problem?.kind === 'not-found' ? 'This invitation is no longer valid' : 'Could not open the invitation'}>
          {problem?.kind === 'not-found'
            ? 'It may have expired, been revoked or already been used. Ask the team owner to invite you again.'
            : problem
              ? problemMessage(problem)
              : 'Try again in a moment.'}
        </Banner>
      </AuthFrame>
    );
  }

  const inv = invitation.data;
  return (
    <AuthFrame title={`Join ${inv.teamName}`} intro={`${inv.invitedBy} invited ${inv.email} to the team.`}>
      <View style={styles.role} testID="invite-role">
        <Text variant="caption" tone="textMuted">
          Your role
        </Text>
        <Text variant="title">{roleLabels[inv.role] ?? inv.role}</Text>
        <Text tone="textMuted">{roleDescriptions[inv.role]}</Text>
      </View>
      <Formik<Values>
        initialValues={{ name: '', password: '' }}
        validate={(v) => validateWithSchema(newMemberSchema, trimStrings(v, ['password']))}
        onSubmit={async (values, helpers) => {
          helpers.setStatus(undefined);
          const result = await accept.mutateAsync(trimStrings(values, ['password']));
          if (result.kind === 'ok') {
            router.replace('/sites');
            return;
          }
          applyProblem(result, helpers, ['name', 'password']);
        }}
      >
        {(form) => (
          <View style={styles.form}>
            <FormErrorBanner status={form.status} title="Could not join" />
            <FormTextField form={form} name="name" label="Your name" autoComplete="name" testID="accept-name" />
            <FormTextField form={form} name="password" label="Choose a password" password hint={PASSWORD_HINT} autoComplete="new-password" testID="accept-password" />
            <Button label={`Join ${inv.teamName}`} busy={form.isSubmitting} onPress={() => form.handleSubmit()} block testID="accept-submit" />
          </View>
        )}
      </Formik>
    </AuthFrame>
  );
}

const styles = StyleSheet.create({
  role: {
    gap: spacing.xxs,
    padding: spacing.md,
    borderRadius: radius.md,
    backgroundColor: colors.surfaceSunk,
  },
  form: { gap: spacing.lg },
});
