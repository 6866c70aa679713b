import { Formik } from 'formik';
import { useMemo } from 'react';
import { StyleSheet, View } from 'react-native';

import type { ApiProblem } from '../../api/client';
import { useUpdateSite } from '../../api/sites';
import type { SiteDetail } from '../../api/types';
import { unitOf, type UnitSystem } from '../../calc/units';
import { spacing } from '../../theme';
import { applyProblem, FormErrorBanner, FormTextField } from '../forms';
import { Banner, Button, Card, Icon, Text } from '../ui';

import { BASES, basisWarnings, fieldName, formFieldOf, formToPatch, siteToForm, unitSuffix, type EditScope, type SiteFormValues } from './design-basis-fields';

export interface SiteEditFormProps {
  site: SiteDetail;
  system: UnitSystem;
  scope: EditScope;
  onDone: () => void;
}

/** Moves the server's field paths onto the form's flat field names. */
function onFormFields(problem: ApiProblem): ApiProblem {
  if (problem.kind !== 'validation') return problem;
  const fieldErrors: Record<string, string> = {};
  for (const [path, message] of Object.entries(problem.fieldErrors)) fieldErrors[formFieldOf(path)] = message;
  return { ...problem, fieldErrors };
}

/**
 * Edits a site's name, description and design bases in the user's units; a safety officer gets the
 * touch-safety basis alone (the server refuses anything more from that role).
 */
export function SiteEditForm({ site, system, scope, onDone }: SiteEditFormProps) {
  const update = useUpdateSite(site.id);
  const initial = useMemo(() => siteToForm(site, system), [site, system]);
  const bases = scope === 'touch' ? BASES.filter((b) => b.key === 'touch') : BASES;
  const fieldNames = useMemo(() => Object.keys(initial), [initial]);

  return (
    <Formik<SiteFormValues>
      initialValues={initial}
      validate={(v) => formToPatch(v, initial, site.designBases, system, scope).errors}
      onSubmit={async (values, helpers) => {
        helpers.setStatus(undefined);
        const { patch } = formToPatch(values, initial, site.designBases, system, scope);
        if (!patch) return;
        const result = await update.mutateAsync(patch);
        if (result.kind === 'ok') {
          onDone();
          return;
        }
        applyProblem(onFormFields(result), helpers, fieldNames);
      }}
    >
      {(form) => {
        // Unusual but credible values are saved as they are; the form only says so.
        const warnings = basisWarnings(form.values, system, scope);
        const currency = form.values[fieldName('energy', 'currency')];
        return (
          <View style={styles.form} testID="site-edit-form">
            <FormErrorBanner status={form.status} title="Not saved" />
            {form.submitCount > 0 && !form.isValid ? (
              <Banner tone="fail" title="Not saved">
                Some fields need attention; each is marked below.
              </Banner>
            ) : null}
            {scope === 'all' ? (
              <Card title="Site">
                <FormTextField form={form} name="name" label="Site name" testID="site-edit-name" />
                <FormTextField form={form} name="description" label="Description (optional)" multiline numberOfLines={3} testID="site-edit-description" />
              </Card>
            ) : (
              <Text tone="textMuted">Your role may change the touch-safety basis only; an owner or engineer edits the rest.</Text>
            )}
            {bases.map((b) => (
              <Card key={b.key} title={`${b.title} basis`} subtitle={b.purpose}>
                <View style={styles.fields}>
                  {b.fields.map((f) => {
                    const name = fieldName(b.key, f.key);
                    const unit = unitSuffix(f, system, currency);
                    const spoken = f.quantity ? unitOf(f.quantity, system).spoken : '';
                    const warning = warnings[name];
                    return (
                      <View key={f.key} style={styles.field}>
                        <FormTextField
                          form={form}
                          name={name}
                          label={f.label}
                          hint={f.required ? undefined : 'Optional'}
                          unit={unit || undefined}
                          unitSpoken={spoken ? (f.quantity === 'pricePerEnergy' && currency ? `${currency} ${spoken}` : spoken) : undefined}
                          inputMode={f.quantity ? 'decimal' : 'text'}
                          testID={`basis-${b.key}-${f.key}`}
                        />
                        {warning ? (
                          <View style={styles.warning} testID={`basis-${b.key}-${f.key}-warning`}>
                            <Icon name="caution" tone="caution" size={16} />
                            <Text variant="caption" tone="caution" weight="semibold" style={styles.warningText}>
                              {`Unusual, saved as entered: ${warning}`}
                            </Text>
                          </View>
                        ) : null}
                      </View>
                    );
                  })}
                </View>
              </Card>
            ))}
            <View style={styles.actions}>
              <Button label="Save changes" busy={form.isSubmitting} onPress={() => form.handleSubmit()} testID="site-save" />
              <Button label="Cancel" variant="secondary" onPress={onDone} testID="site-cancel" />
            </View>
          </View>
        );
      }}
    </Formik>
  );
}

const styles = StyleSheet.create({
  form: { gap: spacing.lg },
  fields: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.md },
  field: { flexGrow: 1, flexBasis: 240 },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
  warning: { flexDirection: 'row', gap: spacing.xs, alignItems: 'flex-start', marginTop: spacing.xs },
  warningText: { flexShrink: 1 },
});
