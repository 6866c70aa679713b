import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { bulkEditSchema } from '../../../shared/schemas/lines';
import { problemMessage } from '../../api/client';
import { useBulkEdit } from '../../api/lines';
import type { ItemKind, Purpose } from '../../api/types';
import type { UnitSystem } from '../../calc/units';
import { spacing } from '../../theme';
import { validateWithSchema } from '../forms/validate';
import type { SelectOption } from '../ui/select-field';
import { Banner, Button, Card, ChoiceGroup } from '../ui';

import { draftToBuildUp, type BuildUpDraft } from './build-up';
import { BuildUpFields } from './build-up-fields';
import { Checkbox } from './checkbox';
import { FieldError } from './field-error';
import { KIND_WORDS, PURPOSE_LABELS, purposesFor } from './labels';

type BuildUpChoice = 'keep' | 'siteDefault' | 'own';

export interface BulkEditProps {
  siteId: number | string;
  kind: ItemKind;
  ids: number[];
  system: UnitSystem;
  materials: readonly SelectOption[];
  finishes: readonly SelectOption[];
  onDone: (message: string) => void;
  onCancel: () => void;
}

/** The same purposes and/or build-up for every selected item, all or nothing. */
export function BulkEdit({ siteId, kind, ids, system, materials, finishes, onDone, onCancel }: BulkEditProps) {
  const bulk = useBulkEdit(siteId, kind);
  const words = KIND_WORDS[kind];
  const [setPurposes, setSetPurposes] = useState(false);
  const [purposes, setPurposesValue] = useState<Purpose[]>(['personnelProtection']);
  const [choice, setChoice] = useState<BuildUpChoice>('keep');
  const [draft, setDraft] = useState<BuildUpDraft>({ mode: 'own', fixed: false, layers: [{ materialId: materials[0]?.value ?? '', thickness: '' }], finishId: finishes[0]?.value ?? '' });
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [problem, setProblem] = useState<string | null>(null);

  const apply = async () => {
    setProblem(null);
    const body: Record<string, unknown> = { ids };
    const errs: Record<string, string> = {};
    if (setPurposes) body.purposes = purposes;
    if (choice === 'siteDefault') body.buildUp = null;
    if (choice === 'own') {
      const b = draftToBuildUp({ ...draft, mode: 'own' }, system);
      Object.assign(errs, b.errors);
      if (b.buildUp) body.buildUp = b.buildUp;
    }
    // The schema's own "something to apply" check sits at the root, which field errors leave out.
    if (!('purposes' in body) && !('buildUp' in body) && choice !== 'own') errs[''] = 'Choose purposes or a build-up to apply.';
    Object.assign(errs, validateWithSchema(bulkEditSchema, body));
    setErrors(errs);
    if (Object.keys(errs).length > 0) return;
    const result = await bulk.mutateAsync(body as never);
    if (result.kind === 'ok') {
      onDone(`${result.data.updated.toLocaleString('en-US')} ${result.data.updated === 1 ? words.one : words.many} changed, ${result.data.unchanged.toLocaleString('en-US')} already so. Changed items are stale until the site is sized again.`);
      return;
    }
    setProblem(result.kind === 'validation' && Object.keys(result.fieldErrors).length > 0 ? Object.values(result.fieldErrors).join(' ') : problemMessage(result));
  };

  const general = errors[''] ?? null;
  return (
    <Card title={`Edit ${ids.length.toLocaleString('en-US')} selected ${ids.length === 1 ? words.one : words.many}`} subtitle="Purposes and build-up only; everything else stays as it is." testID="bulk-edit">
      {problem ? (
        <Banner tone="fail" title="Not changed">
          {problem}
        </Banner>
      ) : null}
      {general ? (
        <Banner tone="fail" title="Nothing to apply">
          Choose purposes or a build-up to apply.
        </Banner>
      ) : null}
      <Checkbox label="Set the purposes" description="Replaces each item’s purposes with these." checked={setPurposes} onChange={setSetPurposes} testID="bulk-set-purposes" />
      {setPurposes ? (
        <View style={styles.indent} role="group" aria-label="Purposes to set">
          {purposesFor(kind).map((p) => (
            <Checkbox
              key={p}
              label={PURPOSE_LABELS[p].label}
              checked={purposes.includes(p)}
              onChange={(on) => setPurposesValue(on ? [...purposes, p] : purposes.filter((x) => x !== p))}
              testID={`bulk-purpose-${p}`}
            />
          ))}
          <FieldError text={errors.purposes} />
        </View>
      ) : null}
      <ChoiceGroup
        label="Build-up"
        compact
        value={choice}
        onChange={setChoice}
        choices={[
          { value: 'keep', label: 'Leave as it is' },
          { value: 'siteDefault', label: 'Site default' },
          { value: 'own', label: 'This build-up' },
        ]}
        testID="bulk-buildup-choice"
      />
      {choice === 'own' ? (
        <BuildUpFields value={draft} onChange={setDraft} system={system} materials={materials} finishes={finishes} errors={errors} allowSiteDefault={false} label="Build-up for all selected" testID="bulk-buildup" />
      ) : null}
      <View style={styles.actions}>
        <Button label="Apply to the selection" busy={bulk.isPending} onPress={() => void apply()} testID="bulk-apply" />
        <Button label="Cancel" variant="secondary" onPress={onCancel} />
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  indent: { paddingLeft: spacing.lg },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
});
