import { Formik } from 'formik';
import { useMemo, useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { can } from '../../../shared/schemas/permissions';
import { useLibrary } from '../../api/library';
import { useSizingSettings, useUpdateSizingSettings } from '../../api/lines';
import { useSession } from '../../api/session';
import { useSite } from '../../api/sites';
import type { SizingSettingsPayload } from '../../api/types';
import { formatThickness } from '../../calc/format';
import { unitOf, type UnitSystem } from '../../calc/units';
import { spacing } from '../../theme';
import { applyProblem, FormErrorBanner, FormTextField } from '../forms';
import { Loading, QueryError } from '../common/query-state';
import { finishOptions, materialOptions } from '../library/library-options';
import { SiteSectionTabs } from '../sites/site-section-nav';
import { Banner, Button, Card, ChoiceGroup, PageTitle, Screen, Text } from '../ui';

import { BuildUpFields } from './build-up-fields';
import { Facts } from './facts';
import { buildUpWords } from './new-item-screen';
import { buildUpErrorsOf, SERIES_PRESETS, settingsFieldOf, settingsFormToInput, settingsToForm, type SettingsFormValues } from './sizing-settings-model';

function SettingsView({ s, system, lib }: { s: SizingSettingsPayload; system: UnitSystem; lib: ReturnType<typeof useLibrary>['data'] }) {
  const rows: [string, string][] = [
    ['Thickness series', s.seriesMm.map((mm) => formatThickness(mm / 1000, system).text).join(', ')],
    ['Two layers above', formatThickness(s.maxSingleLayerMm / 1000, system).text],
    ['Largest thickness considered', formatThickness(s.maxThicknessMm / 1000, system).text],
    ['Heat conservation without a limit of its own', `at most ${s.heatConservationMaxPercentOfBare} % of the bare item’s heat loss`],
    ['Default build-up, hot service', buildUpWords(s.defaultBuildUps.hot, lib)],
    ['Default build-up, cold service', buildUpWords(s.defaultBuildUps.cold, lib)],
  ];
  return <Facts rows={rows} testID="sizing-settings-view" />;
}

/** A site's thickness series, multi-layer rule, largest thickness, heat-conservation rule and default build-ups. */
export function SizingSettingsScreen({ siteId }: { siteId: string }) {
  const session = useSession();
  const system: UnitSystem = session.data?.settings?.unitSystem ?? 'SI';
  const canEdit = can(session.data?.role, 'site.edit');
  const site = useSite(siteId);
  const settings = useSizingSettings(siteId);
  const library = useLibrary();
  const update = useUpdateSizingSettings(siteId);
  const [editing, setEditing] = useState(false);
  const [saved, setSaved] = useState(false);
  const materials = useMemo(() => materialOptions(library.data, system), [library.data, system]);
  const finishes = useMemo(() => finishOptions(library.data), [library.data]);
  const tU = unitOf('thickness', system);

  return (
    <Screen testID="sizing-settings-screen">
      <SiteSectionTabs siteId={siteId} siteName={site.data?.name} current="sizing" />
      <PageTitle
        title={`Sizing settings${site.data ? ` · ${site.data.name}` : ''}`}
        intro="How this site’s items are sized: the thicknesses insulation comes in, when to apply two layers, and what to use where an item has no build-up of its own."
      />
      {settings.isPending || library.isPending ? (
        <Loading label="Loading the settings…" />
      ) : settings.isError ? (
        <QueryError error={settings.error} onRetry={() => void settings.refetch()} title="Could not load the settings" />
      ) : settings.data && !editing ? (
        <Card title="Sizing settings">
          {saved ? (
            <Banner tone="pass" title="Saved" testID="sizing-settings-saved">
              Items whose numbers change with these settings are stale until the site is sized again.
            </Banner>
          ) : null}
          <SettingsView s={settings.data} system={system} lib={library.data} />
          {canEdit ? (
            <Button label="Edit the settings" onPress={() => { setSaved(false); setEditing(true); }} testID="sizing-settings-edit" />
          ) : (
            <Text variant="caption" tone="textMuted">
              An owner or engineer changes these.
            </Text>
          )}
        </Card>
      ) : settings.data ? (
        <Formik<SettingsFormValues>
          initialValues={settingsToForm(settings.data, system)}
          validate={(v) => settingsFormToInput(v, system, settings.data!).errors}
          onSubmit={async (values, helpers) => {
            helpers.setStatus(undefined);
            const { input } = settingsFormToInput(values, system, settings.data!);
            if (!input) return;
            const result = await update.mutateAsync(input as never);
            if (result.kind === 'ok') {
              setEditing(false);
              setSaved(true);
              return;
            }
            const mapped = result.kind === 'validation' ? { ...result, fieldErrors: Object.fromEntries(Object.entries(result.fieldErrors).map(([k, m]) => [settingsFieldOf(k), m])) } : result;
            applyProblem(mapped, helpers, ['series', 'maxSingleLayer', 'maxThickness', 'heatRule', ...Object.keys(mapped.kind === 'validation' ? mapped.fieldErrors : {})]);
          }}
        >
          {(form) => {
            const shown = form.submitCount > 0;
            const errors = (shown ? form.errors : {}) as Record<string, string>;
            return (
              <View style={styles.form} testID="sizing-settings-form">
                <FormErrorBanner status={form.status} title="Not saved" />
                <Card title="Thickness series" subtitle="Sizing rounds up to the next thickness in the series.">
                  <ChoiceGroup
                    label="Thicknesses in"
                    compact
                    value={form.values.seriesUnit}
                    onChange={(u) => void form.setValues({ ...form.values, seriesUnit: u, series: SERIES_PRESETS[u] })}
                    choices={[
                      { value: 'mm', label: 'Millimetres (metric steps)' },
                      { value: 'in', label: 'Inches (½-inch steps)' },
                    ]}
                    testID="series-unit"
                  />
                  <FormTextField
                    form={form}
                    name="series"
                    label={`Thicknesses, ${form.values.seriesUnit === 'mm' ? 'millimetres' : 'inches'}, separated by commas`}
                    hint={`Choosing the unit fills in the common series: ${SERIES_PRESETS[form.values.seriesUnit]}.`}
                    testID="series"
                  />
                </Card>
                <Card title="Layers and limits">
                  <View style={styles.fields}>
                    <View style={styles.field}>
                      <FormTextField form={form} name="maxSingleLayer" label="Two layers above" unit={tU.suffix} unitSpoken={tU.spoken} inputMode="decimal" hint="Thicker insulation goes on as two layers with staggered joints." testID="max-single-layer" />
                    </View>
                    <View style={styles.field}>
                      <FormTextField form={form} name="maxThickness" label="Largest thickness considered" unit={tU.suffix} unitSpoken={tU.spoken} inputMode="decimal" hint="A purpose that needs more is reported as not reachable." testID="max-thickness" />
                    </View>
                    <View style={styles.field}>
                      <FormTextField form={form} name="heatRule" label="Heat conservation without a limit: at most" unit="%" unitSpoken="percent of the bare heat loss" inputMode="decimal" hint="Of the bare item’s heat loss, for items that set no limit of their own." testID="heat-rule" />
                    </View>
                  </View>
                </Card>
                <Card title="Default build-ups" subtitle="For items without a build-up of their own; hot service runs at or above the energy basis’s air temperature.">
                  <BuildUpFields value={form.values.hot} onChange={(b) => void form.setFieldValue('hot', b)} system={system} materials={materials} finishes={finishes} errors={buildUpErrorsOf(errors, 'hot')} allowSiteDefault={false} label="Hot service" testID="default-hot" />
                  <BuildUpFields value={form.values.cold} onChange={(b) => void form.setFieldValue('cold', b)} system={system} materials={materials} finishes={finishes} errors={buildUpErrorsOf(errors, 'cold')} allowSiteDefault={false} label="Cold service" testID="default-cold" />
                </Card>
                <Text variant="caption" tone="textMuted">
                  Follow the plant’s insulation specification; a change here marks the items whose numbers change stale.
                </Text>
                <View style={styles.actions}>
                  <Button label="Save the settings" busy={form.isSubmitting} onPress={() => form.handleSubmit()} testID="sizing-settings-save" />
                  <Button label="Cancel" variant="secondary" onPress={() => setEditing(false)} />
                </View>
              </View>
            );
          }}
        </Formik>
      ) : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  form: { gap: spacing.lg },
  fields: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.md },
  field: { flexGrow: 1, flexBasis: 240 },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
});
