import { useRouter } from 'expo-router';
import { useMemo, useState } from 'react';
import { StyleSheet, useWindowDimensions, View } from 'react-native';

import { registerVerdict, type RegisterVerdict } from '../../../shared/calc/register';
import type { ContactMaterial } from '../../../shared/calc/types';
import { entryCreateSchema, REGISTER_LIMITS, type EntryCreateInput } from '../../../shared/schemas/register';
import { problemMessage } from '../../api/client';
import { useCreateEntry } from '../../api/register';
import { useSession } from '../../api/session';
import { useSite, useSites } from '../../api/sites';
import { formatTemperature } from '../../calc/format';
import type { UnitSystem } from '../../calc/units';
import { breakpoints, spacing } from '../../theme';
import { useHydrated } from '../common/use-hydrated';
import { Loading, QueryError } from '../common/query-state';
import { validateWithSchema } from '../forms';
import { NumberField } from '../quick-sizing/number-field';
import { SelectField } from '../ui/select-field';
import { Banner, Button, Card, ChoiceGroup, EmptyState, Screen, Text, TextField, TextLink } from '../ui';

import { readFieldMemory, rememberField } from './field-memory';
import { PinnedBar } from './pinned-bar';
import { PhotoPicker, type PickedWithPreview } from './photo-picker';
import { VerdictBadge } from './verdict-badge';
import { FINISH_CHOICES, MATERIAL_CHOICES, TALL_LINK, materialOfFinish } from './words';

export type NewEntryStart = { siteId?: string; itemId?: string; location?: string; method?: string; material?: string };

const METHODS = [
  { value: 'contact', label: 'Contact probe' },
  { value: 'infrared', label: 'Infrared' },
] as const;
const REACH = [
  { value: 'yes', label: 'Within reach' },
  { value: 'no', label: 'Out of reach' },
] as const;

/** Height kept free under the form on phones for the pinned save bar. */
const SAVE_BAR_SPACE = 96;

/** The verdict the entry will get, worked out as the reading is typed (the server decides again on save). */
function LiveVerdict({ verdict, system, compact }: { verdict: RegisterVerdict | null; system: UnitSystem; compact?: boolean }) {
  if (!verdict) {
    return (
      <Text variant="caption" tone="textMuted" testID="entry-verdict-pending">
        The verdict shows once the temperature is in.
      </Text>
    );
  }
  const limit = verdict.limitC === null ? 'cold surface: not compared with the hot limits' : `limit ${formatTemperature(verdict.limitC, system).text}`;
  return (
    <View style={compact ? styles.liveCompact : styles.live} testID="entry-verdict" aria-live="polite">
      <VerdictBadge verdict={verdict.verdict} />
      <Text variant="caption" tone="textMuted" numberOfLines={compact ? 1 : undefined} style={styles.liveText}>
        {limit}
      </Text>
      {!compact && verdict.cautions.length ? verdict.cautions.map((c) => <Text key={c.code} variant="caption">{c.message}</Text>) : null}
    </View>
  );
}

/**
 * Field entry: a safety officer on a plant walk records a hot (or very cold) surface with a photo in a few taps.
 * The site and how the last reading was taken are remembered on the device; the save button sits low where
 * the thumb is.
 */
export function NewEntryScreen({ start }: { start: NewEntryStart }) {
  const router = useRouter();
  const hydrated = useHydrated();
  const { width } = useWindowDimensions();
  const wide = hydrated && width >= breakpoints.wide;
  const session = useSession();
  const system: UnitSystem = session.data?.settings?.unitSystem ?? 'SI';
  const sites = useSites();
  const [memory] = useState(readFieldMemory);
  const calculated = start.method === 'calculated' && !!start.itemId;

  const [siteId, setSiteId] = useState<string>(start.siteId ?? memory.siteId ?? '');
  const [location, setLocation] = useState(start.location ?? '');
  const [temperatureC, setTemperatureC] = useState<number | null>(null);
  const [method, setMethod] = useState<'contact' | 'infrared'>(memory.method ?? 'contact');
  const [emissivity, setEmissivity] = useState<number | null>(memory.emissivitySetting ?? 0.95);
  const [material, setMaterial] = useState<ContactMaterial>((MATERIAL_CHOICES.find((m) => m.value === start.material)?.value ?? 'uncoatedMetal') as ContactMaterial);
  const [finishId, setFinishId] = useState('');
  const [reach, setReach] = useState<'yes' | 'no'>('yes');
  const [contactSeconds, setContactSeconds] = useState<number | null>(null);
  const [description, setDescription] = useState('');
  const [photos, setPhotos] = useState<PickedWithPreview[]>([]);
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [problem, setProblem] = useState<string | null>(null);
  const [more, setMore] = useState(false);

  const siteList = sites.data ?? [];
  // One site: nothing to choose. A remembered site that is gone (or not visible) is forgotten.
  const chosen = siteList.find((s) => String(s.id) === siteId) ? siteId : siteList.length === 1 ? String(siteList[0].id) : '';
  const site = useSite(chosen);
  const create = useCreateEntry(chosen);

  const body: EntryCreateInput = {
    location: location.trim(),
    ...(description.trim() ? { description: description.trim() } : {}),
    ...(calculated ? { method: 'calculated', itemId: Number(start.itemId) } : { method, ...(temperatureC !== null ? { measuredTemperatureC: temperatureC } : {}) }),
    ...(!calculated && method === 'infrared' && emissivity !== null ? { emissivitySetting: emissivity } : {}),
    surfaceMaterial: material,
    ...(finishId ? { surfaceFinishId: finishId } : {}),
    withinReach: reach === 'yes',
    ...(contactSeconds !== null ? { contactSeconds } : {}),
  } as EntryCreateInput;

  const verdict = useMemo(() => {
    if (calculated || temperatureC === null || !site.data) return null;
    try {
      return registerVerdict(
        { temperatureC, method, emissivitySetting: method === 'infrared' ? emissivity : null, surfaceMaterial: material, surfaceFinishId: finishId || null, withinReach: reach === 'yes', contactSeconds },
        (site.data.designBases?.touch ?? {}) as { contactSeconds?: number; maxSurfaceC?: number },
      );
    } catch {
      return null;
    }
  }, [calculated, temperatureC, site.data, method, emissivity, material, finishId, reach, contactSeconds]);

  const save = async () => {
    setProblem(null);
    const found = validateWithSchema(entryCreateSchema, body as unknown as Record<string, unknown>) as Record<string, string>;
    if (!chosen) found.siteId = 'Choose the site';
    setErrors(found);
    if (Object.keys(found).length) return;
    const result = await create.mutateAsync({ entry: body, photos: photos.map(({ file, name }) => ({ file, name })) });
    if (result.kind === 'ok') {
      rememberField({ siteId: chosen, ...(calculated ? {} : { method }), ...(method === 'infrared' && emissivity !== null ? { emissivitySetting: emissivity } : {}) });
      router.replace(`/register/${result.data.entry.id}`);
      return;
    }
    if (result.kind === 'validation') {
      const fieldErrors: Record<string, string> = {};
      for (const [k, v] of Object.entries(result.fieldErrors)) fieldErrors[k.startsWith('photos') ? 'photos' : k] = v;
      setErrors(fieldErrors);
      setProblem(Object.keys(fieldErrors).length ? 'Some fields need attention.' : result.message);
    } else {
      setProblem(problemMessage(result));
    }
  };

  if (sites.isPending) {
    return (
      <Screen title="Record a hot surface">
        <Loading label="Loading your sites…" />
      </Screen>
    );
  }
  if (sites.isError) {
    return (
      <Screen title="Record a hot surface">
        <QueryError error={sites.error} onRetry={() => void sites.refetch()} title="Could not load your sites" />
      </Screen>
    );
  }
  if (siteList.length === 0) {
    return (
      <Screen title="Record a hot surface">
        <EmptyState icon="sites" title="No site to record on" message="Register entries belong to a site. An owner or engineer creates sites; contractors see the sites they are invited to." testID="entry-no-sites" />
      </Screen>
    );
  }

  const saveButton = (
    <Button label={create.isPending ? 'Saving…' : 'Save entry'} busy={create.isPending} block testID="entry-save" onPress={() => void save()} style={styles.save} />
  );

  const form = (
    <View style={styles.form} testID="entry-form">
      {siteList.length > 1 ? (
        <View style={styles.field}>
          <SelectField label="Site" value={chosen} options={siteList.map((s) => ({ value: String(s.id), label: s.name }))} onChange={setSiteId} testID="entry-site" />
          {errors.siteId ? (
            <Text variant="caption" weight="semibold" tone="fail" role="alert">{`Error: ${errors.siteId}`}</Text>
          ) : null}
        </View>
      ) : (
        <Text tone="textMuted">{`Site: ${siteList[0].name}`}</Text>
      )}
      <TextField
        label="Location or tag"
        value={location}
        onChangeText={setLocation}
        placeholder="e.g. Flange F-12 by the feed pump"
        error={errors.location}
        maxLength={REGISTER_LIMITS.locationMax}
        testID="entry-location"
      />
      {calculated ? (
        <Banner tone="info" title="Calculated by sizing">
          <Text>The surface temperature is taken from the line&apos;s or vessel&apos;s current sizing. Record a measurement later to replace it.</Text>
        </Banner>
      ) : (
        <>
          <NumberField label="Surface temperature" quantity="temperature" system={system} value={temperatureC} onChange={setTemperatureC} error={errors.measuredTemperatureC} testID="entry-temperature" />
          <ChoiceGroup compact label="Measured with" value={method} choices={METHODS} onChange={setMethod} testID="entry-method" />
          {method === 'infrared' ? (
            <NumberField
              label="Emissivity setting"
              quantity="ratio"
              system={system}
              value={emissivity}
              onChange={setEmissivity}
              hint="As set on the thermometer (often 0.95). Shiny metal reads low."
              error={errors.emissivitySetting}
              testID="entry-emissivity"
            />
          ) : null}
        </>
      )}
      <ChoiceGroup compact label="Surface" value={material} choices={MATERIAL_CHOICES} onChange={setMaterial} error={errors.surfaceMaterial} testID="entry-material" />
      <ChoiceGroup compact label="Reach" value={reach} choices={REACH} onChange={setReach} testID="entry-reach" />
      <Text variant="caption" tone="textMuted">
        Within reach: someone on a walkway, platform or ladder can touch it.
      </Text>
      <PhotoPicker photos={photos} onChange={setPhotos} error={errors.photos} testID="entry-photo" />
      {more ? (
        <>
          <SelectField
            label="Surface finish"
            value={finishId}
            options={FINISH_CHOICES}
            onChange={(v) => {
              setFinishId(v);
              const m = materialOfFinish(v);
              if (m) setMaterial(m);
            }}
            testID="entry-finish"
          />
          <NumberField
            label="Expected contact time"
            quantity="seconds"
            system={system}
            value={contactSeconds}
            onChange={setContactSeconds}
            hint={`Blank: the site's contact time${site.data?.designBases?.touch?.contactSeconds ? ` (${site.data.designBases.touch.contactSeconds} s)` : ''}, else 5 s (ASTM C1055).`}
            error={errors.contactSeconds}
            testID="entry-contact-seconds"
          />
          <TextField label="Description" value={description} onChangeText={setDescription} multiline numberOfLines={3} error={errors.description} testID="entry-description" />
        </>
      ) : (
        <Button label="More details (finish, contact time, description)" variant="quiet" onPress={() => setMore(true)} testID="entry-more" />
      )}
      {problem ? (
        <Banner tone="fail" title="Not saved" testID="entry-problem">
          <Text>{problem}</Text>
        </Banner>
      ) : null}
      <Text variant="caption" tone="textMuted">
        The verdict is a screen against ISO 13732-1 burn thresholds; the plant&apos;s specification, local codes and a competent person decide what is safe.
      </Text>
      {wide ? saveButton : null}
    </View>
  );

  return (
    <View style={styles.root}>
      <Screen title="Record a hot surface" width={wide ? 'wide' : 'narrow'} bottomInset={wide ? 0 : SAVE_BAR_SPACE} testID="entry-new">
        <TextLink href="/register" style={TALL_LINK}>
          Back to the register
        </TextLink>
        {wide ? (
          <View style={styles.columns}>
            <Card style={styles.formCard}>{form}</Card>
            <Card title="Verdict" subtitle="Measured against the touch limit for this surface" style={styles.side}>
              <LiveVerdict verdict={verdict} system={system} />
            </Card>
          </View>
        ) : (
          form
        )}
      </Screen>
      {!wide ? (
        <PinnedBar testID="entry-bar">
          <LiveVerdict verdict={verdict} system={system} compact />
          {saveButton}
        </PinnedBar>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  root: { flex: 1 },
  form: { gap: spacing.lg },
  field: { gap: spacing.xs },
  columns: { flexDirection: 'row', gap: spacing.xl, alignItems: 'flex-start' },
  formCard: { flex: 3 },
  side: { flex: 2 },
  live: { gap: spacing.sm },
  liveCompact: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm },
  liveText: { flexShrink: 1 },
  save: { minHeight: 52 },
});
