import { Formik } from 'formik';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { can } from '../../../shared/schemas/permissions';
import { revisionNumber, revisionSchemeSchema, type RevisionScheme } from '../../../shared/schemas/revisions';
import { useRevisionScheme, useUpdateRevisionScheme } from '../../api/revisions';
import { useSession } from '../../api/session';
import { parseNumber } from '../../calc/units';
import { spacing } from '../../theme';
import { Loading, QueryError } from '../common/query-state';
import { applyProblem, FormErrorBanner, FormTextField, validateWithSchema } from '../forms';
import { Banner, Button, Card, ChoiceGroup, Text } from '../ui';

type Values = { kind: RevisionScheme['kind']; prefix: string; start: string; digits: string };

/** A scheme in words, with its first marks. */
export function schemeWords(s: RevisionScheme): string {
  if (s.kind === 'trade') return 'Trade practice: issues for review A, B, C … (no I or O), issues for construction 0, 1, 2 …';
  const first = [1, 2, 3].map((n) => revisionNumber(s, 'review', n)).join(', ');
  return `The team’s own: one counter for every issue, ${first} …`;
}

/** The form's values as the body of PUT /sites/:siteId/revision-scheme (numbers parsed; text kept when it is not one). */
export function schemeInput(v: Values): Record<string, unknown> {
  if (v.kind === 'trade') return { kind: 'trade' };
  const num = (t: string) => (t.trim() === '' ? undefined : (parseNumber(t) ?? t));
  const out: Record<string, unknown> = { kind: 'counter', prefix: v.prefix.trim() };
  const start = num(v.start);
  const digits = num(v.digits);
  if (start !== undefined) out.start = start;
  if (digits !== undefined) out.digits = digits;
  return out;
}

function valuesOf(s: RevisionScheme): Values {
  return s.kind === 'counter' ? { kind: 'counter', prefix: s.prefix, start: String(s.start), digits: String(s.digits) } : { kind: 'trade', prefix: 'P-', start: '1', digits: '2' };
}

/**
 * How the site's revisions are numbered (trade letters and numbers, or the team's own prefix and counter), and
 * for owners and engineers the form that changes it. A revision keeps the number it was given.
 */
export function RevisionSchemePanel({ siteId, nextNumbers }: { siteId: string; nextNumbers?: { review: string; construction: string } }) {
  const session = useSession();
  const scheme = useRevisionScheme(siteId);
  const update = useUpdateRevisionScheme(siteId);
  const [editing, setEditing] = useState(false);
  const [done, setDone] = useState(false);
  const mayEdit = can(session.data?.role, 'revisions.issue');

  return (
    <Card title="Numbering" subtitle="How this site’s revisions are numbered." testID="scheme-panel">
      {scheme.isPending ? (
        <Loading label="Loading the numbering…" />
      ) : scheme.isError ? (
        <QueryError error={scheme.error} onRetry={() => void scheme.refetch()} title="Could not load the numbering" />
      ) : editing ? (
        <Formik<Values>
          initialValues={valuesOf(scheme.data)}
          validate={(v) => validateWithSchema(revisionSchemeSchema, schemeInput(v)) as never}
          onSubmit={async (v, helpers) => {
            helpers.setStatus(undefined);
            const result = await update.mutateAsync(schemeInput(v) as RevisionScheme);
            if (result.kind === 'ok') {
              setEditing(false);
              setDone(true);
              return;
            }
            applyProblem(result, helpers, ['kind', 'prefix', 'start', 'digits']);
          }}
        >
          {(form) => {
            const input = schemeInput(form.values);
            const valid = Object.keys(validateWithSchema(revisionSchemeSchema, input)).length === 0;
            return (
              <View style={styles.form} testID="scheme-form">
                <FormErrorBanner status={form.status} title="Not saved" />
                <ChoiceGroup
                  label="Scheme"
                  value={form.values.kind}
                  onChange={(k) => void form.setFieldValue('kind', k)}
                  choices={[
                    { value: 'trade', label: 'Trade letters and numbers', description: 'Review issues A, B, C … (no I or O); construction issues 0, 1, 2 …' },
                    { value: 'counter', label: 'Our own prefix and counter', description: 'One counter for every issue, e.g. P-01, P-02 …' },
                  ]}
                  testID="scheme-kind"
                />
                {form.values.kind === 'counter' ? (
                  <View style={styles.fields}>
                    <View style={styles.field}>
                      <FormTextField form={form} name="prefix" label="Prefix" hint="Letters, digits and . _ / - (may be empty)." testID="scheme-prefix" />
                    </View>
                    <View style={styles.field}>
                      <FormTextField form={form} name="start" label="First number" inputMode="numeric" testID="scheme-start" />
                    </View>
                    <View style={styles.field}>
                      <FormTextField form={form} name="digits" label="Digits" inputMode="numeric" hint="Zeros fill up to this many digits." testID="scheme-digits" />
                    </View>
                  </View>
                ) : null}
                <Text tone="textMuted" testID="scheme-preview">
                  {valid ? schemeWords(input as RevisionScheme) : 'Fix the marked fields to see the numbers.'}
                </Text>
                <Text variant="caption" tone="textMuted">
                  Revisions already prepared or issued keep their numbers; the next revision takes the new scheme.
                </Text>
                <View style={styles.actions}>
                  <Button label="Save the numbering" busy={form.isSubmitting} onPress={() => form.handleSubmit()} testID="scheme-save" />
                  <Button label="Cancel" variant="secondary" onPress={() => setEditing(false)} testID="scheme-cancel" />
                </View>
              </View>
            );
          }}
        </Formik>
      ) : (
        <>
          <Text testID="scheme-current">{schemeWords(scheme.data)}</Text>
          {nextNumbers ? (
            <Text tone="textMuted" testID="scheme-next">
              {scheme.data.kind === 'trade'
                ? `Next: Rev ${nextNumbers.review} for review, Rev ${nextNumbers.construction} for construction.`
                : `Next: Rev ${nextNumbers.review}.`}
            </Text>
          ) : null}
          {done ? (
            <Banner tone="pass" title="Numbering saved" testID="scheme-saved">
              <Text>The next revision is numbered this way.</Text>
            </Banner>
          ) : null}
          {mayEdit ? (
            <View style={styles.actions}>
              <Button
                label="Change the numbering"
                variant="secondary"
                onPress={() => {
                  setDone(false);
                  setEditing(true);
                }}
                testID="scheme-edit"
              />
            </View>
          ) : (
            <Text variant="caption" tone="textMuted">
              Owners and engineers set the numbering.
            </Text>
          )}
        </>
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  form: { gap: spacing.md },
  fields: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.md },
  field: { flexGrow: 1, flexBasis: 160 },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
});
