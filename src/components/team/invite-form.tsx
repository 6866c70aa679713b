import { Formik } from 'formik';
import { StyleSheet, View } from 'react-native';

import { invitationCreateSchema } from '../../../shared/schemas';
import { useInviteMember } from '../../api/team';
import { ROLES, roleDescriptions, roleLabels, type Role } from '../../api/types';
import { spacing } from '../../theme';
import { applyProblem, FormErrorBanner, type FormStatus, FormTextField, trimStrings, validateWithSchema } from '../forms';
import { Banner, Button, Card, ChoiceGroup, Text } from '../ui';

type Values = { email: string; role: Role | '' };

const roleChoices = ROLES.map((r) => ({ value: r, label: roleLabels[r], description: roleDescriptions[r] }));

export function InviteForm() {
  const invite = useInviteMember();
  return (
    <Card title="Invite someone" subtitle="They get an e-mail with a link that works for 7 days.">
      <Formik<Values>
        initialValues={{ email: '', role: 'engineer' }}
        validate={(v) => validateWithSchema(invitationCreateSchema, trimStrings(v))}
        onSubmit={async (values, helpers) => {
          helpers.setStatus(undefined);
          const input = trimStrings(values) as { email: string; role: Role };
          const result = await invite.mutateAsync(input);
          if (result.kind === 'ok') {
            helpers.resetForm({ values: { email: '', role: values.role }, status: { done: `Invitation sent to ${input.email}.` } });
            return;
          }
          applyProblem(result, helpers, ['email', 'role']);
        }}
      >
        {(form) => {
          const status = form.status as FormStatus;
          return (
            <View style={styles.form}>
              {status?.done ? (
                <Banner tone="pass" title="Sent" testID="invite-sent">
                  {status.done}
                </Banner>
              ) : null}
              <FormErrorBanner status={status} title="Could not invite" />
              <FormTextField form={form} name="email" label="E-mail address" inputMode="email" autoCapitalize="none" autoComplete="off" testID="invite-email" />
              <ChoiceGroup
                label="Role"
                value={form.values.role || null}
                choices={roleChoices}
                onChange={(role) => void form.setFieldValue('role', role)}
                error={form.submitCount > 0 ? form.errors.role : undefined}
                testID="invite-role"
              />
              {form.values.role === 'contractor' ? (
                <Text variant="caption" tone="textMuted" testID="invite-contractor-note">
                  A contractor sees only the sites they are added to: once they have joined, add them on each site’s page under People on this site.
                </Text>
              ) : null}
              <Button label="Send invitation" icon="mail" busy={form.isSubmitting} onPress={() => form.handleSubmit()} testID="invite-submit" />
            </View>
          );
        }}
      </Formik>
    </Card>
  );
}

const styles = StyleSheet.create({
  form: { gap: spacing.lg },
});
