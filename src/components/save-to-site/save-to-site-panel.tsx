import { Formik, type FormikHelpers, type FormikProps } from 'formik';
import { useMemo, useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { can } from '../../../shared/schemas/permissions';
import { problemMessage } from '../../api/client';
import { useLibrary } from '../../api/library';
import { useCreateItemInSite } from '../../api/lines';
import { useSession } from '../../api/session';
import { useSites } from '../../api/sites';
import type { LibraryPayload } from '../../api/types';
import type { Draft } from '../../calc/quick-case';
import {
  nearestLibraryFinish,
  nearestLibraryMaterial,
  saveableKind,
  saveFieldOf,
  saveToSiteBody,
  type SaveChoices,
  type SaveMapping,
} from '../../calc/save-to-site';
import { formatSignificant } from '../../calc/format';
import { fromDisplay, parseNumber, unitOf, type UnitSystem } from '../../calc/units';
import { colors, radius, spacing } from '../../theme';
import { Loading, QueryError } from '../common/query-state';
import { FormErrorBanner, FormTextField } from '../forms';
import { finishOptions, libraryName, materialOptions } from '../library/library-options';
import { FieldError } from '../lines/field-error';
import { itemHref } from '../lines/item-rows';
import { KIND_WORDS } from '../lines/labels';
import { Banner, Button, Card, ChoiceGroup, SelectField, Text, TextLink } from '../ui';

import { leftBehindWords, purposeWords, sizeWords } from './save-words';

export interface SaveToSiteProps {
  /** The quick case as it stands (SI). */
  draft: Draft;
  system: UnitSystem;
  /** Every input of the case holds a usable value (nothing marked): only then can it be saved. */
  calculable: boolean;
}

/** Kept in the new item's notes, so whoever reads the line list knows where it came from. */
const SAVED_NOTE = 'Saved from quick sizing.';

type Saved = { kind: 'line' | 'vessel'; id: number; tag: string; siteId: string; siteName: string };

interface Values {
  siteId: string;
  tag: string;
  service: string;
  /** The line's length as typed, in the units shown. */
  length: string;
  location: '' | 'indoor' | 'outdoor';
  /** Stand-ins for custom layers, by layer index. */
  materials: Record<string, string>;
  finish: string;
}

/** Where each problem is shown: a choice of this form, or `case` (a value of the quick case itself). */
type FormErrors = Partial<Record<string, string>>;

/** The line's length typed in the units on screen → metres (null when empty); a word when it is not a number. */
function lengthOf(text: string, system: UnitSystem): { lengthM: number | null; problem?: string } {
  if (text.trim() === '') return { lengthM: null };
  const n = parseNumber(text);
  if (n === null) return { lengthM: null, problem: 'Length must be a number' };
  return { lengthM: Number(fromDisplay('length', system, n).toPrecision(12)) };
}

function choicesOf(v: Values, system: UnitSystem): SaveChoices {
  const materialFor: Record<number, string> = {};
  for (const [i, id] of Object.entries(v.materials)) if (id) materialFor[Number(i)] = id;
  return {
    tag: v.tag,
    service: v.service,
    lengthM: lengthOf(v.length, system).lengthM,
    location: v.location || null,
    materialFor,
    finishFor: v.finish || null,
    notes: SAVED_NOTE,
  };
}

/** The mapping's problems at the fields of this form; problems of the case itself are joined under `case`. */
function errorsOf(m: SaveMapping, v: Values, system: UnitSystem): FormErrors {
  const errors: FormErrors = {};
  if (!v.siteId) errors.site = 'Choose the site to save it to';
  const length = lengthOf(v.length, system);
  if (length.problem) errors.length = length.problem;
  const cases: string[] = [];
  for (const p of m.problems) {
    const field = saveFieldOf(p.field);
    if (field === 'case') cases.push(p.message);
    else if (!errors[field]) errors[field] = p.message;
  }
  if (cases.length > 0) errors.case = cases.join(' ');
  return errors;
}

/**
 * "Save to a site" on the quick-sizing screen: a signed-in owner or engineer saves the case as a line or vessel
 * of one of the team's sites. Everyone else sees why it is not offered to them.
 */
export function SaveToSite({ draft, system, calculable }: SaveToSiteProps) {
  const session = useSession();
  const [open, setOpen] = useState(false);
  const [saved, setSaved] = useState<Saved | null>(null);
  const signedIn = Boolean(session.data?.user);
  const mayEdit = can(session.data?.role, 'lines.edit');
  const kind = saveableKind(draft.kind);

  const reason = !signedIn
    ? 'Sign in to save this to a site'
    : !mayEdit
      ? 'Owners and engineers save cases to a site’s line list; your role reads line lists.'
      : kind.itemKind === null
        ? kind.reason
        : null;

  if (saved) {
    const words = KIND_WORDS[saved.kind];
    return (
      <Banner tone="pass" title={`Saved as ${words.one} ${saved.tag}`} testID="qs-saved" aria-live="polite">
        <Text>{`It is in the line list of ${saved.siteName}, not yet sized: size the site to work out its thickness against the site’s design bases.`}</Text>
        <View style={styles.links}>
          <TextLink href={itemHref(saved.kind, saved.id)} testID="qs-saved-open">{`Open ${saved.tag}`}</TextLink>
          <TextLink href={`/sites/${encodeURIComponent(saved.siteId)}/${saved.kind === 'line' ? 'lines' : 'vessels'}`} testID="qs-saved-list">
            {`The ${words.many} of ${saved.siteName}`}
          </TextLink>
        </View>
        <Button label="Save another" variant="quiet" onPress={() => setSaved(null)} testID="qs-save-another" />
      </Banner>
    );
  }

  if (!open || reason || kind.itemKind === null) {
    return (
      <View style={styles.closed}>
        <Button label="Save to a site" variant="secondary" icon="plus" disabled={reason !== null} onPress={() => setOpen(true)} testID="qs-save-to-site" />
        <Text variant="caption" tone="textMuted" testID="qs-save-note">
          {reason ?? `Adds this case to a site’s line list as a ${kind.itemKind === 'vessel' ? 'vessel' : 'line'}. You can also copy the page link to keep or share it.`}
        </Text>
      </View>
    );
  }
  return (
    <SaveForm
      draft={draft}
      system={system}
      itemKind={kind.itemKind}
      calculable={calculable}
      onSaved={(s) => {
        setOpen(false);
        setSaved(s);
      }}
      onCancel={() => setOpen(false)}
    />
  );
}

interface SaveFormProps {
  draft: Draft;
  system: UnitSystem;
  itemKind: 'line' | 'vessel';
  calculable: boolean;
  onSaved: (s: Saved) => void;
  onCancel: () => void;
}

function SaveForm(props: SaveFormProps) {
  const { draft, system, itemKind, onSaved } = props;
  const sites = useSites();
  const library = useLibrary();
  const create = useCreateItemInSite();
  const words = KIND_WORDS[itemKind];

  if (sites.isPending || library.isPending) {
    return (
      <Card title="Save to a site">
        <Loading label="Loading your sites and the library…" />
      </Card>
    );
  }
  if (sites.isError || library.isError) {
    return (
      <Card title="Save to a site">
        <QueryError error={sites.error ?? library.error} onRetry={() => void (sites.isError ? sites.refetch() : library.refetch())} title="Could not load your sites" />
        <Button label="Cancel" variant="secondary" onPress={props.onCancel} />
      </Card>
    );
  }
  const list = sites.data ?? [];
  if (list.length === 0) {
    return (
      <Card title="Save to a site" testID="qs-save-form">
        <Text>Your team has no sites yet: a line or vessel belongs to a site’s line list.</Text>
        <TextLink href="/sites">Create a site</TextLink>
        <Button label="Cancel" variant="secondary" onPress={props.onCancel} />
      </Card>
    );
  }

  const initial: Values = { siteId: list.length === 1 ? String(list[0].id) : '', tag: '', service: '', length: '', location: '', materials: {}, finish: '' };
  const onSubmit = async (values: Values, helpers: FormikHelpers<Values>) => {
    helpers.setStatus(undefined);
    const m = saveToSiteBody(draft, choicesOf(values, system));
    if (!m.body || !values.siteId) return;
    const result = await create.mutateAsync({ siteId: values.siteId, kind: itemKind, input: m.body as unknown as Record<string, unknown> });
    if (result.kind === 'ok') {
      const item = result.data[itemKind];
      const site = list.find((s) => String(s.id) === values.siteId);
      onSaved({ kind: itemKind, id: item.id, tag: item.tag, siteId: values.siteId, siteName: site?.name ?? 'the site' });
      return;
    }
    if (result.kind === 'validation' && Object.keys(result.fieldErrors).length > 0) {
      const known: FormErrors = {};
      const other: string[] = [];
      for (const [path, message] of Object.entries(result.fieldErrors)) {
        const field = saveFieldOf(path);
        if (field === 'case') other.push(message);
        else known[field] = message;
      }
      helpers.setErrors(known as never);
      if (other.length > 0) helpers.setStatus({ error: other.join(' ') });
      return;
    }
    helpers.setStatus({ error: problemMessage(result) });
  };

  return (
    <Formik<Values>
      initialValues={initial}
      validate={(v) => errorsOf(saveToSiteBody(draft, choicesOf(v, system)), v, system) as never}
      onSubmit={onSubmit}
    >
      {(form) => <SaveFormBody {...props} form={form} sites={list} lib={library.data} words={words} />}
    </Formik>
  );
}

function SaveFormBody({
  draft,
  system,
  itemKind,
  calculable,
  onCancel,
  form,
  sites,
  lib,
  words,
}: SaveFormProps & { form: FormikProps<Values>; sites: { id: number | string; name: string }[]; lib: LibraryPayload | undefined; words: (typeof KIND_WORDS)['line'] }) {
  const v = form.values;
  const shown = form.submitCount > 0;
  const errors = form.errors as FormErrors;
  const err = (name: string) => (shown ? errors[name] : undefined);
  const mapping = useMemo(() => saveToSiteBody(draft, choicesOf(v, system)), [draft, v, system]);
  // Problems of the case itself are shown at once: nothing typed here fixes them.
  const caseProblems = mapping.problems.filter((p) => saveFieldOf(p.field) === 'case').map((p) => p.message);
  const materials = useMemo(() => materialOptions(lib, system), [lib, system]);
  const finishes = useMemo(() => finishOptions(lib), [lib]);
  const still = draft.windSpeedMS === null || draft.windSpeedMS === 0;
  const lengthUnit = unitOf('length', system);
  const holding = itemKind === 'line' && draft.purpose === 'holding';
  const layers = mapping.proposed.buildUp?.layers ?? [];
  const layerWords = layers.map((l) => (l.materialId ? libraryName(lib, l.materialId) : 'custom material')).join(' + ');
  const finishWord = draft.finishId === 'custom' ? (v.finish ? libraryName(lib, v.finish) : 'custom finish') : libraryName(lib, draft.finishId);

  return (
    <Card title="Save to a site" subtitle={`As a ${words.one} of a site’s line list, sized with the rest of the site.`} testID="qs-save-form">
      <FormErrorBanner status={form.status} title="Not saved" />
      {caseProblems.length > 0 ? (
        <Banner tone="fail" title="Change the case first" testID="qs-save-case-problems">
          {caseProblems.map((m) => (
            <Text key={m}>{`• ${m}`}</Text>
          ))}
        </Banner>
      ) : null}

      <View>
        <SelectField
          label="Site"
          value={v.siteId}
          options={sites.map((s) => ({ value: String(s.id), label: s.name }))}
          onChange={(id) => void form.setFieldValue('siteId', id)}
          testID="qs-save-site"
        />
        <FieldError text={err('site')} />
      </View>
      <View style={styles.fields}>
        <View style={styles.field}>
          <FormTextField form={form} name="tag" label="Tag" hint={`Unique among the site’s ${words.many}.`} testID="qs-save-tag" />
        </View>
        <View style={styles.field}>
          <FormTextField form={form} name="service" label="Service (optional)" testID="qs-save-service" />
        </View>
        {itemKind === 'line' && !holding ? (
          <View style={styles.field}>
            <FormTextField
              form={form}
              name="length"
              label="Length of the line"
              unit={lengthUnit.suffix}
              unitSpoken={lengthUnit.spoken}
              inputMode="decimal"
              hint="The whole line’s heat loss and yearly energy rest on it."
              testID="qs-save-length"
            />
          </View>
        ) : null}
      </View>
      {holding && draft.runLengthM !== null ? (
        <Text tone="textMuted" testID="qs-save-run-length">{`Length: ${formatSignificant('length', draft.runLengthM, system, 4).text}, the run’s length (the drop is worked out over the line).`}</Text>
      ) : null}

      {still ? (
        <Text tone="textMuted" testID="qs-save-indoor">
          Location: indoor (the case has no wind).
        </Text>
      ) : (
        <ChoiceGroup
          label="Location (the case has wind)"
          compact
          value={v.location || null}
          onChange={(x) => void form.setFieldValue('location', x)}
          choices={[
            { value: 'outdoor', label: 'Outdoor', description: 'The site’s wind applies.' },
            { value: 'indoor', label: 'Indoor', description: 'Still air.' },
          ]}
          error={err('location')}
          testID="qs-save-location"
        />
      )}

      {draft.layers.map((l, i) => {
        if (l.materialId !== 'custom') return null;
        const nearest = nearestLibraryMaterial(l, draft);
        return (
          <View key={i} style={styles.standIn} testID={`qs-save-layer-${i}`}>
            <Text weight="semibold">{`Layer ${i + 1} has a custom k(T)`}</Text>
            <Text tone="textMuted">A line list holds library and team materials only, so the custom curve cannot be saved as it is. Choose a stand-in.</Text>
            <SelectField
              label={`Material for layer ${i + 1}`}
              value={v.materials[String(i)] ?? ''}
              options={materials}
              onChange={(id) => void form.setFieldValue('materials', { ...v.materials, [String(i)]: id })}
              testID={`qs-save-layer-${i}-material`}
            />
            <FieldError text={err(`material-${i}`)} />
            {nearest ? (
              <Button
                label={`Use the nearest: ${nearest.name}`}
                variant="quiet"
                onPress={() => void form.setFieldValue('materials', { ...v.materials, [String(i)]: nearest.id })}
                testID={`qs-save-layer-${i}-nearest`}
              />
            ) : null}
          </View>
        );
      })}
      {draft.finishId === 'custom' ? (
        <View style={styles.standIn} testID="qs-save-finish-standin">
          <Text weight="semibold">The finish has a custom emissivity</Text>
          <Text tone="textMuted">A line list holds library and team finishes only. Choose a stand-in.</Text>
          <SelectField label="Outer finish" value={v.finish} options={finishes} onChange={(id) => void form.setFieldValue('finish', id)} testID="qs-save-finish" />
          <FieldError text={err('finish')} />
          {(() => {
            const nearest = nearestLibraryFinish(draft.emissivity);
            return nearest ? (
              <Button label={`Use the nearest: ${nearest.name}`} variant="quiet" onPress={() => void form.setFieldValue('finish', nearest.id)} testID="qs-save-finish-nearest" />
            ) : null;
          })()}
        </View>
      ) : null}

      <View style={styles.summary} testID="qs-save-summary">
        <Text variant="label">What is saved</Text>
        <Text>{`${sizeWords(draft, system)}.`}</Text>
        <Text>{`${purposeWords(mapping, draft, system)}.`}</Text>
        <Text>{`Build-up: ${layerWords || 'bare'} under ${finishWord}${mapping.fixed ? ', as built (checked, not sized)' : ', the outer layer sized to the site’s series'}.`}</Text>
        <Text variant="label" style={styles.behindHead}>
          What the site decides instead
        </Text>
        {mapping.leftBehind.map((l) => (
          <Text key={l.code} variant="caption" tone="textMuted">{`• ${leftBehindWords(l, system)}`}</Text>
        ))}
      </View>

      {!calculable ? (
        <Text tone="fail" weight="semibold" testID="qs-save-not-calculable">
          Fix the marked inputs of the case first: a case with missing or unusable values cannot be saved.
        </Text>
      ) : null}
      {shown && Object.keys(errors).some((k) => k !== 'case' && errors[k]) ? (
        <Text tone="fail" weight="semibold" role="alert" testID="qs-save-marked">
          Not saved: the marked fields above say what is needed.
        </Text>
      ) : null}
      <View style={styles.actions}>
        <Button
          label={`Save as a new ${words.one}`}
          busy={form.isSubmitting}
          disabled={!calculable || caseProblems.length > 0}
          onPress={() => form.handleSubmit()}
          testID="qs-save-submit"
        />
        <Button label="Cancel" variant="secondary" onPress={onCancel} testID="qs-save-cancel" />
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  closed: { gap: spacing.xs },
  links: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.lg },
  fields: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.md },
  field: { flexGrow: 1, flexBasis: 200 },
  standIn: { gap: spacing.sm, padding: spacing.md, borderRadius: radius.md, borderWidth: 1, borderColor: colors.border, backgroundColor: colors.surfaceSunk },
  summary: { gap: spacing.xs, padding: spacing.md, borderRadius: radius.md, borderWidth: 1, borderColor: colors.border },
  behindHead: { marginTop: spacing.sm },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
});
