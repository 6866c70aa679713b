import { Formik, type FormikHelpers, type FormikProps } from 'formik';
import { useMemo } from 'react';
import { StyleSheet, View } from 'react-native';

import type { ApiResult } from '../../api/client';
import type { Item, ItemKind } from '../../api/types';
import { pipeSizes } from '../../calc/library';
import { unitOf, type UnitSystem } from '../../calc/units';
import { spacing } from '../../theme';
import { applyProblem, FormErrorBanner, FormTextField } from '../forms';
import { SelectField, type SelectOption } from '../ui/select-field';
import { Banner, Button, Card, ChoiceGroup, Text } from '../ui';

import { BuildUpFields } from './build-up-fields';
import { Checkbox } from './checkbox';
import {
  emptyItemForm,
  formFieldOfPath,
  formToItemInput,
  NUMBER_FIELDS,
  quantityOf,
  type FormStart,
  type ItemFormValues,
  type NumberFieldName,
} from './item-form-model';
import { FieldError } from './field-error';
import { HEAD_TYPE_LABELS, KIND_WORDS, PURPOSE_LABELS, purposesFor } from './labels';

export interface ItemFormProps {
  kind: ItemKind;
  system: UnitSystem;
  /** The item as it is (editing); absent when adding. */
  start?: FormStart & { version?: number };
  materials: readonly SelectOption[];
  finishes: readonly SelectOption[];
  /** What the site's default build-up is, in words. */
  siteDefaultNote?: string;
  submit: (input: Record<string, unknown>) => Promise<ApiResult<Record<string, Item>>>;
  onDone: (item: Item) => void;
  onCancel: () => void;
}

const NPS_OPTIONS: SelectOption[] = pipeSizes.map((p) => ({ value: p.nps, label: `NPS ${p.nps}`, detail: `DN ${p.dn}` }));
const DN_OPTIONS: SelectOption[] = pipeSizes.map((p) => ({ value: String(p.dn), label: `DN ${p.dn}`, detail: `NPS ${p.nps}` }));

const PURPOSE_HINTS: Record<string, string> = {
  personnelProtection: 'A surface safe to touch at the touch-safety basis.',
  heatConservation: 'Heat loss within a limit at the energy basis (the site’s rule when none is given).',
  condensationControl: 'A cold surface above the dew point by the margin.',
  temperatureHolding: 'A limited drop along the run at the given flow (winter basis).',
  frostProtection: 'Standing water above 0 °C for the minimum hours (winter basis).',
};

/** Adds or edits one line or vessel; numbers in the user's units, errors at their fields after the first save. */
export function ItemForm({ kind, system, start, materials, finishes, siteDefaultNote, submit, onDone, onCancel }: ItemFormProps) {
  const initial = useMemo(() => start?.values ?? emptyItemForm(kind), [start, kind]);
  const words = KIND_WORDS[kind];

  const onSubmit = async (values: ItemFormValues, helpers: FormikHelpers<ItemFormValues>) => {
    helpers.setStatus(undefined);
    const { input } = formToItemInput(values, kind, system, start);
    if (!input) return;
    const result = await submit(input);
    if (result.kind === 'ok') {
      onDone(result.data[kind]);
      return;
    }
    const mapped = result.kind === 'validation' ? { ...result, fieldErrors: Object.fromEntries(Object.entries(result.fieldErrors).map(([k, m]) => [formFieldOfPath(k, kind, values.sizeGivenAs), m])) } : result;
    applyProblem(mapped, helpers, [...Object.keys(values), ...Object.keys(mapped.kind === 'validation' ? mapped.fieldErrors : {}).filter((k) => k.startsWith('buildUp'))]);
  };

  return (
    <Formik<ItemFormValues> initialValues={initial} validate={(v) => formToItemInput(v, kind, system, start).errors as never} onSubmit={onSubmit}>
      {(form) => <ItemFormBody form={form} kind={kind} system={system} materials={materials} finishes={finishes} siteDefaultNote={siteDefaultNote} onCancel={onCancel} editing={!!start} words={words} />}
    </Formik>
  );
}

function ItemFormBody({
  form,
  kind,
  system,
  materials,
  finishes,
  siteDefaultNote,
  onCancel,
  editing,
  words,
}: {
  form: FormikProps<ItemFormValues>;
  kind: ItemKind;
  system: UnitSystem;
  materials: readonly SelectOption[];
  finishes: readonly SelectOption[];
  siteDefaultNote?: string;
  onCancel: () => void;
  editing: boolean;
  words: (typeof KIND_WORDS)[ItemKind];
}) {
  const v = form.values;
  const shown = form.submitCount > 0;
  const errors = form.errors as Record<string, string | undefined>;
  const err = (name: string) => (shown ? errors[name] : undefined);
  const set = <K extends keyof ItemFormValues>(name: K, value: ItemFormValues[K]) => void form.setFieldValue(name, value);

  const numberField = (name: NumberFieldName, opts: { label?: string; hint?: string; narrow?: boolean } = {}) => {
    const unit = unitOf(quantityOf(name, kind), system);
    return (
      <View style={opts.narrow ? styles.narrowField : styles.field}>
        <FormTextField
          form={form}
          name={name}
          label={opts.label ?? NUMBER_FIELDS[name].label}
          hint={opts.hint}
          unit={unit.suffix || undefined}
          unitSpoken={unit.spoken || undefined}
          inputMode="decimal"
          testID={`item-${name}`}
        />
      </View>
    );
  };

  const purposes = purposesFor(kind);
  const has = (p: string) => v.purposes.includes(p as never);
  const bad = shown && Object.values(errors).some(Boolean);

  return (
    <View style={styles.form} testID="item-form">
      <FormErrorBanner status={form.status} title="Not saved" />
      {bad ? (
        <Banner tone="fail" title="Not saved">
          Some fields need attention; each is marked below.
        </Banner>
      ) : null}

      <Card title={words.One} subtitle={`The tag is unique among the site’s ${words.many}.`}>
        <View style={styles.fields}>
          <View style={styles.field}>
            <FormTextField form={form} name="tag" label="Tag" testID="item-tag" />
          </View>
          <View style={styles.field}>
            <FormTextField form={form} name="service" label="Service (optional)" testID="item-service" />
          </View>
        </View>
      </Card>

      <Card title={kind === 'line' ? 'Size and run' : 'Shell'}>
        {kind === 'line' ? (
          <>
            <ChoiceGroup
              label="Size given as"
              compact
              value={v.sizeGivenAs}
              onChange={(x) => set('sizeGivenAs', x)}
              choices={[
                { value: 'nps', label: 'NPS' },
                { value: 'dn', label: 'DN' },
                { value: 'od', label: 'Outside diameter' },
              ]}
              testID="item-size-kind"
            />
            <View style={styles.fields}>
              {v.sizeGivenAs === 'nps' ? (
                <View style={styles.field}>
                  <SelectField label="Nominal pipe size (ASME B36.10M)" value={v.nps} options={NPS_OPTIONS} onChange={(x) => set('nps', x)} testID="item-nps" />
                  <FieldError text={err('nps')} />
                </View>
              ) : v.sizeGivenAs === 'dn' ? (
                <View style={styles.field}>
                  <SelectField label="Nominal diameter DN" value={v.dn} options={DN_OPTIONS} onChange={(x) => set('dn', x)} testID="item-dn" />
                  <FieldError text={err('dn')} />
                </View>
              ) : (
                numberField('outerDiameter', { hint: 'The bare pipe’s outside diameter.' })
              )}
              {numberField('length', { label: 'Length of the run' })}
            </View>
          </>
        ) : (
          <View style={styles.fields}>
            {numberField('diameter', { label: 'Shell outside diameter' })}
            {numberField('length', { label: 'Shell length, tangent to tangent' })}
          </View>
        )}
        <ChoiceGroup
          label="Orientation"
          compact
          value={v.orientation}
          onChange={(x) => set('orientation', x)}
          choices={[
            { value: 'horizontal', label: 'Horizontal' },
            { value: 'vertical', label: 'Vertical' },
          ]}
          testID="item-orientation"
        />
        {kind === 'line' && v.orientation === 'vertical' ? numberField('height', { hint: 'Continuous vertical run; the length when left empty.' }) : null}
        {kind === 'vessel' ? (
          <ChoiceGroup
            label="Heads"
            compact
            value={v.headType}
            onChange={(x) => set('headType', x)}
            choices={(Object.keys(HEAD_TYPE_LABELS) as (keyof typeof HEAD_TYPE_LABELS)[]).map((k) => ({ value: k, label: HEAD_TYPE_LABELS[k] }))}
            testID="item-heads"
          />
        ) : null}
      </Card>

      <Card title="Service conditions">
        <View style={styles.fields}>{numberField('operatingTemperature')}</View>
        <ChoiceGroup
          label="Location"
          compact
          value={v.location}
          onChange={(x) => set('location', x)}
          choices={[
            { value: 'outdoor', label: 'Outdoor', description: 'The energy basis’s wind applies.' },
            { value: 'indoor', label: 'Indoor', description: 'Still air.' },
          ]}
          testID="item-location"
        />
      </Card>

      <Card title="Purposes" subtitle="Each purpose is sized against its design basis; the thickest governs.">
        <View role="group" aria-label="Purposes">
          {purposes.map((p) => (
            <Checkbox
              key={p}
              label={PURPOSE_LABELS[p].label}
              description={PURPOSE_HINTS[p]}
              checked={has(p)}
              onChange={(on) => set('purposes', on ? [...v.purposes, p] : v.purposes.filter((x) => x !== p))}
              testID={`item-purpose-${p}`}
            />
          ))}
        </View>
        <FieldError text={err('purposes')} />
        {has('heatConservation') ? (
          <View style={styles.fields}>{numberField('heatLimit', { label: kind === 'vessel' ? 'Heat-loss limit, whole vessel (optional)' : 'Heat-loss limit (optional)', hint: 'Empty: the site’s rule, a share of the bare heat loss.' })}</View>
        ) : null}
        {kind === 'line' && has('temperatureHolding') ? (
          <View style={styles.fields}>
            {numberField('holdingMassFlow')}
            {numberField('holdingSpecificHeat')}
            {numberField('holdingMaxChange')}
          </View>
        ) : null}
        {kind === 'line' && has('frostProtection') ? (
          <View style={styles.fields}>
            {numberField('frostMinHours')}
            {numberField('frostBore', { label: 'Bore (optional)', hint: 'Empty: the standard wall of the NPS.' })}
            {numberField('frostPipeMass', { label: 'Pipe mass (optional)' })}
            {numberField('frostStart', { label: 'Water start temperature (optional)', hint: 'Empty: the operating temperature.' })}
          </View>
        ) : null}
      </Card>

      {kind === 'line' ? (
        <Card title="Fittings" subtitle="Valves and flanges count as an equivalent length of pipe in the heat loss.">
          <View style={styles.fields}>
            {numberField('valves', { narrow: true })}
            {numberField('flanges', { narrow: true })}
            {numberField('elbows', { narrow: true })}
            {numberField('tees', { narrow: true })}
          </View>
          <Checkbox
            label="Valves and flanges carry insulating covers"
            checked={v.fittingsInsulated === 'yes'}
            onChange={(on) => set('fittingsInsulated', on ? 'yes' : 'no')}
            testID="item-fittings-insulated"
          />
        </Card>
      ) : null}

      <Card title="Build-up" subtitle="Layers inside out and the outer finish, from the library.">
        <BuildUpFields
          value={v.buildUp}
          onChange={(b) => set('buildUp', b)}
          system={system}
          materials={materials}
          finishes={finishes}
          errors={shown ? errors : {}}
          siteDefaultNote={siteDefaultNote}
          testID="item-buildup"
        />
      </Card>

      <Card title="Notes">
        <FormTextField form={form} name="notes" label="Notes (optional)" multiline numberOfLines={3} testID="item-notes" />
      </Card>

      <View style={styles.actions}>
        <Button label={editing ? 'Save changes' : `Add the ${words.one}`} busy={form.isSubmitting} onPress={() => form.handleSubmit()} testID="item-save" />
        <Button label="Cancel" variant="secondary" onPress={onCancel} testID="item-cancel" />
      </View>
      {editing ? (
        <Text variant="caption" tone="textMuted">
          A change to anything that sizing uses marks the result stale until the site is sized again.
        </Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  form: { gap: spacing.lg },
  fields: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.md },
  field: { flexGrow: 1, flexBasis: 220 },
  narrowField: { flexGrow: 1, flexBasis: 120 },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
});
