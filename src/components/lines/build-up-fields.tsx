import { StyleSheet, View } from 'react-native';

import { unitOf, type UnitSystem } from '../../calc/units';
import { colors, radius, spacing } from '../../theme';
import { SelectField, type SelectOption } from '../ui/select-field';
import { Button, ChoiceGroup, Text, TextField } from '../ui';

import { buildUpField, MAX_LAYERS, type BuildUpDraft } from './build-up';
import { FieldError } from './field-error';

export interface BuildUpFieldsProps {
  value: BuildUpDraft;
  onChange: (next: BuildUpDraft) => void;
  system: UnitSystem;
  materials: readonly SelectOption[];
  finishes: readonly SelectOption[];
  /** Errors keyed as `buildUpField`; shown as given (the form decides when). */
  errors?: Record<string, string | undefined>;
  /** Offer "the site's default" (items); a site's own defaults have none. */
  allowSiteDefault?: boolean;
  /** Says what the site's default is, under the choice. */
  siteDefaultNote?: string;
  label?: string;
  testID: string;
}

/** Layers inside out and the outer finish; the outermost layer is sized unless the build-up is taken as built. */
export function BuildUpFields({ value, onChange, system, materials, finishes, errors = {}, allowSiteDefault = true, siteDefaultNote, label = 'Build-up', testID }: BuildUpFieldsProps) {
  const t = unitOf('thickness', system);
  const set = (patch: Partial<BuildUpDraft>) => onChange({ ...value, ...patch });
  const setLayer = (i: number, patch: Partial<BuildUpDraft['layers'][number]>) =>
    set({ layers: value.layers.map((l, k) => (k === i ? { ...l, ...patch } : l)) });
  const own = !allowSiteDefault || value.mode === 'own';

  return (
    <View style={styles.wrap} testID={testID}>
      {allowSiteDefault ? (
        <ChoiceGroup
          label={label}
          compact
          value={value.mode}
          onChange={(mode) => set({ mode, layers: mode === 'own' && value.layers.length === 0 ? [{ materialId: materials[0]?.value ?? '', thickness: '' }] : value.layers })}
          choices={[
            { value: 'siteDefault', label: 'Site default' },
            { value: 'own', label: 'Own build-up' },
          ]}
          testID={`${testID}-mode`}
        />
      ) : (
        <Text variant="label">{label}</Text>
      )}
      {!own && siteDefaultNote ? (
        <Text variant="caption" tone="textMuted">
          {siteDefaultNote}
        </Text>
      ) : null}
      {own ? (
        <>
          <ChoiceGroup
            label="What sizing does with it"
            compact
            value={value.fixed ? 'fixed' : 'size'}
            onChange={(v) => set({ fixed: v === 'fixed' })}
            choices={[
              { value: 'size', label: 'Size the outer layer' },
              { value: 'fixed', label: 'Existing insulation: check only' },
            ]}
            testID={`${testID}-fixed`}
          />
          {value.layers.length === 0 ? (
            <Text tone="textMuted">{value.fixed ? 'No layers: a bare surface, checked as it is.' : 'Add the layer to size.'}</Text>
          ) : null}
          {value.layers.map((l, i) => {
            const sized = !value.fixed && i === value.layers.length - 1;
            const where = value.layers.length === 1 ? '' : i === 0 ? ' (inside)' : i === value.layers.length - 1 ? ' (outside)' : '';
            return (
              <View key={i} style={styles.layer} testID={`${testID}-layer-${i}`}>
                <Text variant="label">{`Layer ${i + 1}${where}`}</Text>
                <SelectField
                  label="Material"
                  value={l.materialId}
                  options={materials}
                  onChange={(materialId) => setLayer(i, { materialId })}
                  testID={`${testID}-layer-${i}-material`}
                />
                <FieldError text={errors[buildUpField.material(i)]} />
                {sized ? (
                  <Text variant="caption" tone="textMuted">
                    Sized: its thickness comes from the site’s series.
                  </Text>
                ) : (
                  <TextField
                    label="Thickness"
                    unit={t.suffix}
                    unitSpoken={t.spoken}
                    inputMode="decimal"
                    value={l.thickness}
                    onChangeText={(thickness) => setLayer(i, { thickness })}
                    error={errors[buildUpField.thickness(i)]}
                    testID={`${testID}-layer-${i}-thickness`}
                  />
                )}
                <Button
                  label={`Remove layer ${i + 1}`}
                  variant="quiet"
                  onPress={() => set({ layers: value.layers.filter((_, k) => k !== i) })}
                  testID={`${testID}-layer-${i}-remove`}
                />
              </View>
            );
          })}
          <FieldError text={errors[buildUpField.layers]} />
          {value.layers.length < MAX_LAYERS ? (
            <Button
              label="Add a layer outside"
              icon="plus"
              variant="secondary"
              onPress={() => set({ layers: [...value.layers, { materialId: value.layers[value.layers.length - 1]?.materialId ?? materials[0]?.value ?? '', thickness: '' }] })}
              testID={`${testID}-add-layer`}
            />
          ) : null}
          <SelectField label="Outer finish" value={value.finishId} options={finishes} onChange={(finishId) => set({ finishId })} testID={`${testID}-finish`} />
          <FieldError text={errors[buildUpField.finish]} />
        </>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: spacing.md },
  layer: { gap: spacing.sm, padding: spacing.md, borderRadius: radius.md, borderWidth: 1, borderColor: colors.border, backgroundColor: colors.surfaceSunk },
});
