import { Formik, type FormikProps } from 'formik';
import { useMemo } from 'react';
import { StyleSheet, View } from 'react-native';

import { useCreateTeamMaterial, useUpdateTeamMaterial } from '../../api/library';
import type { TeamMaterial } from '../../api/types';
import { fixed, formatSignificant, significant } from '../../calc/format';
import { toDisplay, unitOf, type UnitSystem } from '../../calc/units';
import { colors, radius, spacing } from '../../theme';
import { LineChart } from '../charts';
import { applyProblem, FormErrorBanner, FormTextField } from '../forms';
import { FieldError } from '../lines/field-error';
import { Banner, Button, Card, Text, TextField } from '../ui';

import {
  emptyMaterialForm,
  fitCurve,
  fitPreview,
  materialFieldOf,
  materialFormToInput,
  materialToForm,
  MAX_POINTS,
  pointField,
  type FitPreview,
  type MaterialFormValues,
} from './material-form-model';

/** How closely the fitted curve follows the datasheet, in words (the fit aims at 2 %). */
export function fitQuality(maxErrorPct: number): { word: string; tone: 'pass' | 'caution' | 'fail' } {
  if (maxErrorPct <= 2) return { word: 'Close fit', tone: 'pass' };
  if (maxErrorPct <= 5) return { word: 'Loose fit', tone: 'caution' };
  return { word: 'Poor fit', tone: 'fail' };
}

/** The live fit: degree, errors, and the curve through the points over the service range. */
export function FitPreviewPanel({ preview, system }: { preview: FitPreview; system: UnitSystem }) {
  if (preview.kind === 'incomplete') {
    return (
      <Text tone="textMuted" testID="fit-preview">
        {preview.message}
      </Text>
    );
  }
  if (preview.kind === 'error') {
    return (
      <Banner tone="fail" title="No fit" testID="fit-preview">
        {preview.message}
      </Banner>
    );
  }
  const { fit, points, serviceRangeC } = preview;
  const q = fitQuality(fit.maxErrorPct);
  const T = (c: number) => toDisplay('temperature', system, c);
  const K = (k: number) => toDisplay('conductivity', system, k);
  const tU = unitOf('temperature', system);
  const kU = unitOf('conductivity', system);
  const degreeWord = ['', 'straight line', 'quadratic', 'cubic'][fit.degree] ?? `degree ${fit.degree}`;
  return (
    <View style={styles.preview} testID="fit-preview" {...({ dataSet: { maxError: String(fit.maxErrorPct), degree: String(fit.degree) } } as object)}>
      <Text weight="semibold" tone={q.tone} testID="fit-quality">
        {`${q.word}: a ${degreeWord} in temperature, largest error ${fixed(fit.maxErrorPct, 1)} %, root mean square ${fixed(fit.rmsErrorPct, 1)} %.`}
      </Text>
      <Text variant="caption" tone="textMuted">
        {`The curve rests on data from ${fixed(T(fit.dataRangeC[0]), 0)} to ${fixed(T(fit.dataRangeC[1]), 0)} ${tU.suffix}; beyond that it is an extrapolation (a layer warns when its mean temperature leaves this range). k at ${fixed(T(points[0].meanTemperatureC), 0)} ${tU.suffix}: ${formatSignificant('conductivity', points[0].conductivityWPerMK, system).text}.`}
      </Text>
      <LineChart
        title="Conductivity against mean temperature"
        xLabel={`Mean temperature (${tU.suffix})`}
        yLabel={`k (${kU.suffix})`}
        series={[{ id: 'fit', points: fitCurve(fit, serviceRangeC).map((p) => ({ x: T(p.t), y: K(p.k) })), color: colors.heatLine }]}
        dots={points.map((p) => ({ x: T(p.meanTemperatureC), y: K(p.conductivityWPerMK) }))}
        formatY={(y) => significant(y, 3)}
        summary={`${points.length} datasheet points from ${fixed(T(fit.dataRangeC[0]), 0)} to ${fixed(T(fit.dataRangeC[1]), 0)} ${tU.suffix}; the fitted curve over the service range, largest error ${fixed(fit.maxErrorPct, 1)} %.`}
        height={200}
        testID="fit-chart"
      />
    </View>
  );
}

export interface MaterialFormProps {
  system: UnitSystem;
  material?: TeamMaterial;
  onDone: () => void;
}

/** Adds or edits a team material from a datasheet's table of k at mean temperatures. */
export function MaterialForm({ system, material, onDone }: MaterialFormProps) {
  const create = useCreateTeamMaterial();
  const update = useUpdateTeamMaterial();
  const start = useMemo(() => (material ? { values: materialToForm(material, system), material } : undefined), [material, system]);
  const initial = start?.values ?? emptyMaterialForm();
  return (
    <Card title={material ? `Edit ${material.name}` : 'New team material'} subtitle="From a datasheet: its table of conductivity at mean temperatures, and its service range." testID="material-form">
      <Formik<MaterialFormValues>
        initialValues={initial}
        validate={(v) => materialFormToInput(v, system, start).errors as never}
        onSubmit={async (values, helpers) => {
          helpers.setStatus(undefined);
          const { input } = materialFormToInput(values, system, start);
          if (!input) return;
          const result = material ? await update.mutateAsync({ id: material.id, patch: input as never }) : await create.mutateAsync(input as never);
          if (result.kind === 'ok') {
            onDone();
            return;
          }
          const mapped = result.kind === 'validation' ? { ...result, fieldErrors: Object.fromEntries(Object.entries(result.fieldErrors).map(([k, m]) => [materialFieldOf(k, values), m])) } : result;
          applyProblem(mapped, helpers, ['name', 'source', 'minService', 'maxService', 'notes', 'points', ...values.points.flatMap((_, i) => [pointField(i, 't'), pointField(i, 'k')])]);
        }}
      >
        {(form) => <MaterialFormBody form={form} system={system} editing={!!material} onCancel={onDone} start={start} />}
      </Formik>
    </Card>
  );
}

function MaterialFormBody({ form, system, editing, onCancel, start }: { form: FormikProps<MaterialFormValues>; system: UnitSystem; editing: boolean; onCancel: () => void; start?: { values: MaterialFormValues; material: TeamMaterial } }) {
  const shown = form.submitCount > 0;
  const errors = form.errors as Record<string, string | undefined>;
  const err = (k: string) => (shown ? errors[k] : undefined);
  const tU = unitOf('temperature', system);
  const kU = unitOf('conductivity', system);
  const preview = useMemo(() => fitPreview(form.values, system, start), [form.values, system, start]);
  const setPoint = (i: number, which: 't' | 'k', text: string) => void form.setFieldValue(pointField(i, which), text);

  return (
    <View style={styles.form}>
      <FormErrorBanner status={form.status} title="Not saved" />
      <View style={styles.fields}>
        <View style={styles.field}>
          <FormTextField form={form} name="name" label="Name" hint="A generic name, e.g. Flexible aerogel blanket, grade 10." testID="material-name" />
        </View>
        <View style={styles.field}>
          <FormTextField form={form} name="source" label="Source (the datasheet)" hint="Supplier, document, revision and table." testID="material-source" />
        </View>
      </View>
      <View style={styles.fields}>
        <View style={styles.field}>
          <FormTextField form={form} name="minService" label="Minimum service temperature" unit={tU.suffix} unitSpoken={tU.spoken} inputMode="decimal" testID="material-min" />
        </View>
        <View style={styles.field}>
          <FormTextField form={form} name="maxService" label="Maximum service temperature" unit={tU.suffix} unitSpoken={tU.spoken} inputMode="decimal" testID="material-max" />
        </View>
      </View>
      <View style={styles.points} role="group" aria-label="Table points">
        <Text variant="label">Table points: conductivity at mean temperature</Text>
        {form.values.points.map((p, i) => (
          <View key={i} style={styles.pointRow} testID={`material-point-${i}`}>
            <View style={styles.pointCell}>
              <TextField label={`Point ${i + 1} mean temperature`} unit={tU.suffix} unitSpoken={tU.spoken} inputMode="decimal" value={p.t} onChangeText={(x) => setPoint(i, 't', x)} error={err(pointField(i, 't'))} testID={`material-point-${i}-t`} />
            </View>
            <View style={styles.pointCell}>
              <TextField label={`Point ${i + 1} k`} unit={kU.suffix} unitSpoken={kU.spoken} inputMode="decimal" value={p.k} onChangeText={(x) => setPoint(i, 'k', x)} error={err(pointField(i, 'k'))} testID={`material-point-${i}-k`} />
            </View>
            {form.values.points.length > 2 ? (
              <Button label={`Remove point ${i + 1}`} variant="quiet" onPress={() => void form.setFieldValue('points', form.values.points.filter((_, k) => k !== i))} />
            ) : null}
          </View>
        ))}
        <FieldError text={err('points')} />
        {form.values.points.length < MAX_POINTS ? (
          <Button label="Add a point" icon="plus" variant="secondary" onPress={() => void form.setFieldValue('points', [...form.values.points, { t: '', k: '' }])} testID="material-add-point" />
        ) : null}
      </View>
      <View style={styles.fitBox}>
        <Text variant="label">Fit, as you type</Text>
        <FitPreviewPanel preview={preview} system={system} />
      </View>
      <FormTextField form={form} name="notes" label="Notes (optional)" multiline numberOfLines={2} testID="material-notes" />
      <Text variant="caption" tone="textMuted">
        Datasheet values are the supplier’s; check them against the plant’s specification. A change to a material marks every item built with it stale.
      </Text>
      <View style={styles.actions}>
        <Button label={editing ? 'Save the material' : 'Add the material'} busy={form.isSubmitting} onPress={() => form.handleSubmit()} testID="material-save" />
        <Button label="Cancel" variant="secondary" onPress={onCancel} />
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  form: { gap: spacing.md },
  fields: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.md },
  field: { flexGrow: 1, flexBasis: 240 },
  points: { gap: spacing.sm },
  pointRow: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm, alignItems: 'flex-end' },
  pointCell: { flexGrow: 1, flexBasis: 150 },
  fitBox: { gap: spacing.sm, padding: spacing.md, borderRadius: radius.md, borderWidth: 1, borderColor: colors.border, backgroundColor: colors.surfaceSunk },
  preview: { gap: spacing.sm },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
});
