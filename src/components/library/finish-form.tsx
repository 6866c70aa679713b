import { Formik } from 'formik';
import { StyleSheet, View } from 'react-native';

import { teamFinishCreateSchema, teamFinishPatchSchema } from '../../../shared/schemas/lines';
import type { ContactMaterial } from '../../../shared/calc/types';
import { useCreateTeamFinish, useUpdateTeamFinish } from '../../api/library';
import type { TeamFinish } from '../../api/types';
import { parseNumber } from '../../calc/units';
import { spacing } from '../../theme';
import { applyProblem, FormErrorBanner, FormTextField, validateWithSchema } from '../forms';
import { Button, Card, ChoiceGroup, Text } from '../ui';

export const CONTACT_GROUPS: { value: ContactMaterial; label: string }[] = [
  { value: 'uncoatedMetal', label: 'Bare metal' },
  { value: 'coatedMetal', label: 'Painted or coated metal' },
  { value: 'ceramicGlassStone', label: 'Ceramic, glass or stone' },
  { value: 'plastic', label: 'Plastic, mastic or cloth' },
  { value: 'wood', label: 'Wood' },
];

type Values = { name: string; source: string; emissivity: string; low: string; high: string; contactMaterial: ContactMaterial };

function toInput(v: Values, editing: boolean) {
  const errors: Record<string, string> = {};
  const body: Record<string, unknown> = { name: v.name.trim(), source: v.source.trim(), contactMaterial: v.contactMaterial };
  const num = (key: 'emissivity' | 'low' | 'high', out: string, label: string) => {
    if (v[key].trim() === '') return;
    const n = parseNumber(v[key]);
    if (n === null) errors[key] = `${label} must be a number`;
    else body[out] = n;
  };
  num('emissivity', 'emissivity', 'Emissivity');
  num('low', 'emissivityLow', 'Lowest emissivity');
  num('high', 'emissivityHigh', 'Highest emissivity');
  const paths: Record<string, string> = { emissivityLow: 'low', emissivityHigh: 'high' };
  for (const [p, m] of Object.entries(validateWithSchema(editing ? teamFinishPatchSchema : teamFinishCreateSchema, body))) {
    const f = paths[p] ?? p;
    if (!errors[f] && m) errors[f] = m;
  }
  return { input: Object.keys(errors).length ? null : body, errors };
}

/** Adds or edits a team finish: its emissivity (typical and credible range) and its surface for burn checks. */
export function FinishForm({ finish, onDone }: { finish?: TeamFinish; onDone: () => void }) {
  const create = useCreateTeamFinish();
  const update = useUpdateTeamFinish();
  const initial: Values = finish
    ? { name: finish.name, source: finish.source, emissivity: String(finish.emissivity), low: String(finish.emissivityRange[0]), high: String(finish.emissivityRange[1]), contactMaterial: finish.contactMaterial }
    : { name: '', source: '', emissivity: '', low: '', high: '', contactMaterial: 'uncoatedMetal' };
  return (
    <Card title={finish ? `Edit ${finish.name}` : 'New team finish'} subtitle="An outer jacket or coating with its emissivity." testID="finish-form">
      <Formik<Values>
        initialValues={initial}
        validate={(v) => toInput(v, !!finish).errors}
        onSubmit={async (values, helpers) => {
          helpers.setStatus(undefined);
          const { input } = toInput(values, !!finish);
          if (!input) return;
          const result = finish ? await update.mutateAsync({ id: finish.id, patch: input as never }) : await create.mutateAsync(input as never);
          if (result.kind === 'ok') onDone();
          else applyProblem(result, helpers, ['name', 'source', 'emissivity', 'low', 'high', 'contactMaterial']);
        }}
      >
        {(form) => (
          <View style={styles.form}>
            <FormErrorBanner status={form.status} title="Not saved" />
            <View style={styles.fields}>
              <View style={styles.field}>
                <FormTextField form={form} name="name" label="Name" testID="finish-name" />
              </View>
              <View style={styles.field}>
                <FormTextField form={form} name="source" label="Source (the datasheet)" testID="finish-source" />
              </View>
            </View>
            <View style={styles.fields}>
              <View style={styles.field}>
                <FormTextField form={form} name="emissivity" label="Typical emissivity" inputMode="decimal" hint="0 to 1; the energy basis uses it." testID="finish-emissivity" />
              </View>
              <View style={styles.field}>
                <FormTextField form={form} name="low" label="Lowest emissivity (optional)" inputMode="decimal" hint="Personnel protection and condensation control use it." testID="finish-low" />
              </View>
              <View style={styles.field}>
                <FormTextField form={form} name="high" label="Highest emissivity (optional)" inputMode="decimal" testID="finish-high" />
              </View>
            </View>
            <ChoiceGroup
              label="Surface for the burn check (ISO 13732-1 group)"
              compact
              value={form.values.contactMaterial}
              onChange={(c) => void form.setFieldValue('contactMaterial', c)}
              choices={CONTACT_GROUPS}
              error={form.submitCount > 0 ? form.errors.contactMaterial : undefined}
              testID="finish-contact"
            />
            <Text variant="caption" tone="textMuted">
              A change to a finish marks every item that uses it stale.
            </Text>
            <View style={styles.actions}>
              <Button label={finish ? 'Save the finish' : 'Add the finish'} busy={form.isSubmitting} onPress={() => form.handleSubmit()} testID="finish-save" />
              <Button label="Cancel" variant="secondary" onPress={onDone} />
            </View>
          </View>
        )}
      </Formik>
    </Card>
  );
}

const styles = StyleSheet.create({
  form: { gap: spacing.md },
  fields: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.md },
  field: { flexGrow: 1, flexBasis: 200 },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
});
