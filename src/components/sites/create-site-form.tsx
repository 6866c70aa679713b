import { Formik } from 'formik';
import { StyleSheet, View } from 'react-native';

import { siteCreateSchema } from '../../../shared/schemas';
import { useCreateSite } from '../../api/sites';
import { spacing } from '../../theme';
import { applyProblem, FormErrorBanner, FormTextField, trimStrings, validateWithSchema } from '../forms';
import { Button, Card } from '../ui';

type Values = { name: string; description: string };

export function CreateSiteForm({ onDone }: { onDone: () => void }) {
  const create = useCreateSite();
  const toInput = (v: Values) => {
    const t = trimStrings(v);
    return t.description ? { name: t.name, description: t.description } : { name: t.name };
  };
  return (
    <Card title="New site" subtitle="A plant area or project, e.g. Boiler house or Tank farm east.">
      <Formik<Values>
        initialValues={{ name: '', description: '' }}
        validate={(v) => validateWithSchema(siteCreateSchema, toInput(v))}
        onSubmit={async (values, helpers) => {
          helpers.setStatus(undefined);
          const result = await create.mutateAsync(toInput(values));
          if (result.kind === 'ok') {
            helpers.resetForm();
            onDone();
            return;
          }
          applyProblem(result, helpers, ['name', 'description']);
        }}
      >
        {(form) => (
          <View style={styles.form}>
            <FormErrorBanner status={form.status} />
            <FormTextField form={form} name="name" label="Site name" testID="site-name" />
            <FormTextField form={form} name="description" label="Description (optional)" multiline numberOfLines={3} />
            <View style={styles.actions}>
              <Button label="Create site" busy={form.isSubmitting} onPress={() => form.handleSubmit()} testID="site-submit" />
              <Button label="Cancel" variant="secondary" onPress={onDone} />
            </View>
          </View>
        )}
      </Formik>
    </Card>
  );
}

const styles = StyleSheet.create({
  form: { gap: spacing.lg },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
});
