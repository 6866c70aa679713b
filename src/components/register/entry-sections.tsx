import { useState } from 'react';
import { Image, Pressable, StyleSheet, View } from 'react-native';

import { FINISHES } from '../../../shared/calc/library/finishes';
import { problemMessage } from '../../api/client';
import { useAddComment, useAddPhotos, useDeletePhoto, useUpdateEntry, type RegisterEntry, type RegisterHistoryItem } from '../../api/register';
import { formatTemperature } from '../../calc/format';
import type { UnitSystem } from '../../calc/units';
import { colors, radius, spacing } from '../../theme';
import { formatDateTime } from '../common/format';
import { NumberField } from '../quick-sizing/number-field';
import { Banner, Button, Card, ChoiceGroup, focusRing, Text, TextField } from '../ui';

import { PhotoPicker, type PickedWithPreview } from './photo-picker';
import { STEP_WORDS } from './step-panel';
import { MATERIAL_WORDS, METHOD_WORDS, STATUS_WORDS } from './words';

function Row({ label, value, testID }: { label: string; value: string; testID?: string }) {
  return (
    <View style={styles.row} role="listitem">
      <Text tone="textMuted" style={styles.rowLabel}>
        {label}
      </Text>
      <Text weight="semibold" style={styles.rowValue} testID={testID}>
        {value}
      </Text>
    </View>
  );
}

/** What was found: how it was measured, the surface, its reach and contact time. */
export function EntryDetails({ entry, system }: { entry: RegisterEntry; system: UnitSystem }) {
  const finish = entry.surfaceFinishId ? (FINISHES.find((f) => f.id === entry.surfaceFinishId)?.name ?? entry.surfaceFinishId) : 'not stated';
  return (
    <Card title="What was found" testID="entry-details">
      {entry.description ? <Text>{entry.description}</Text> : null}
      <View role="list" style={styles.rows}>
        <Row label="Measured with" value={`${METHOD_WORDS[entry.method]}${entry.emissivitySetting !== null ? `, emissivity setting ${entry.emissivitySetting}` : ''}`} testID="entry-method-value" />
        <Row label="Surface" value={entry.surfaceMaterial ? MATERIAL_WORDS[entry.surfaceMaterial] : '—'} />
        <Row label="Finish" value={finish} />
        <Row label="Reach" value={entry.withinReach ? 'Within reach of a walkway, platform or ladder' : 'Out of reach'} />
        <Row label="Contact time" value={entry.contactSeconds !== null ? `${entry.contactSeconds} s` : `site's basis (${entry.verdict.contactSeconds ?? '—'} s)`} />
        <Row label="Measured" value={formatDateTime(entry.measuredAt)} />
        {entry.item ? <Row label={entry.item.kind === 'line' ? 'Line' : 'Vessel'} value={entry.item.tag} /> : null}
        {entry.verificationTemperatureC !== null ? <Row label="After the fix" value={formatTemperature(entry.verificationTemperatureC, system).text} testID="entry-verification-value" /> : null}
        <Row label="Recorded by" value={`${entry.createdBy?.name ?? '—'}, ${formatDateTime(entry.createdAt)}`} />
      </View>
    </Card>
  );
}

/** Corrections to the reading and description while the entry is open. */
export function EntryEditForm({ entry, system, onDone }: { entry: RegisterEntry; system: UnitSystem; onDone: () => void }) {
  const update = useUpdateEntry(entry.id);
  const [location, setLocation] = useState(entry.location);
  const [description, setDescription] = useState(entry.description);
  const [temperatureC, setTemperatureC] = useState<number | null>(entry.measuredTemperatureC);
  const [method, setMethod] = useState<'contact' | 'infrared'>(entry.method === 'infrared' ? 'infrared' : 'contact');
  const [emissivity, setEmissivity] = useState<number | null>(entry.emissivitySetting ?? 0.95);
  const [reach, setReach] = useState<'yes' | 'no'>(entry.withinReach ? 'yes' : 'no');
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [problem, setProblem] = useState<string | null>(null);
  const save = async () => {
    setProblem(null);
    const measurementChanged = temperatureC !== entry.measuredTemperatureC || method !== entry.method || (method === 'infrared' && emissivity !== entry.emissivitySetting);
    const patch = {
      location: location.trim(),
      description: description.trim(),
      withinReach: reach === 'yes',
      version: entry.version,
      ...(measurementChanged && temperatureC !== null ? { measuredTemperatureC: temperatureC, method, ...(method === 'infrared' && emissivity !== null ? { emissivitySetting: emissivity } : {}) } : {}),
    };
    const result = await update.mutateAsync(patch);
    if (result.kind === 'ok') return onDone();
    if (result.kind === 'validation') setErrors(result.fieldErrors);
    setProblem(problemMessage(result));
  };
  return (
    <Card title="Correct the entry" testID="entry-edit">
      <TextField label="Location or tag" value={location} onChangeText={setLocation} error={errors.location} testID="edit-location" />
      <NumberField label="Surface temperature" quantity="temperature" system={system} value={temperatureC} onChange={setTemperatureC} error={errors.measuredTemperatureC} testID="edit-temperature" />
      <ChoiceGroup compact label="Measured with" value={method} choices={[{ value: 'contact', label: 'Contact probe' }, { value: 'infrared', label: 'Infrared' }]} onChange={setMethod} testID="edit-method" />
      {method === 'infrared' ? <NumberField label="Emissivity setting" quantity="ratio" system={system} value={emissivity} onChange={setEmissivity} error={errors.emissivitySetting} testID="edit-emissivity" /> : null}
      <ChoiceGroup compact label="Reach" value={reach} choices={[{ value: 'yes', label: 'Within reach' }, { value: 'no', label: 'Out of reach' }]} onChange={setReach} testID="edit-reach" />
      <TextField label="Description" value={description} onChangeText={setDescription} multiline error={errors.description} testID="edit-description" />
      {problem ? (
        <Banner tone="fail" title="Not saved">
          <Text>{problem}</Text>
        </Banner>
      ) : null}
      <View style={styles.buttons}>
        <Button label="Save" busy={update.isPending} onPress={() => void save()} testID="edit-save" />
        <Button label="Cancel" variant="secondary" onPress={onDone} />
      </View>
    </Card>
  );
}

/** The entry's photos, with adding and removing while it is open. */
export function EntryPhotos({ entry }: { entry: RegisterEntry }) {
  const add = useAddPhotos(entry.id);
  const remove = useDeletePhoto(entry.id);
  const [picked, setPicked] = useState<PickedWithPreview[]>([]);
  const [problem, setProblem] = useState<string | null>(null);
  const mayAdd = entry.allowed.includes('addPhoto');
  const mayRemove = entry.allowed.includes('removePhoto');
  return (
    <Card title="Photos" testID="entry-photos">
      {entry.photos.length === 0 ? <Text tone="textMuted">No photos yet.</Text> : null}
      <View style={styles.photos} role="list">
        {entry.photos.map((p, i) => (
          <View key={p.id} role="listitem" style={styles.photo}>
            <Pressable
              role="link"
              aria-label={`Open photo ${i + 1} full size`}
              onPress={() => typeof window !== 'undefined' && window.open(p.url, '_blank', 'noopener')}
              style={(state) => [(state as { focused?: boolean }).focused && focusRing]}
              testID={`entry-photo-${i}`}
            >
              <Image source={{ uri: p.thumbnailUrl }} style={[styles.thumb, { aspectRatio: p.width / p.height }]} accessibilityLabel={`Photo ${i + 1}`} />
            </Pressable>
            <Text variant="caption" tone="textMuted">
              {`${p.uploadedBy?.name ?? '—'}, ${formatDateTime(p.createdAt)}`}
            </Text>
            {p.location ? <Text variant="caption" tone="textMuted">{`Taken at ${p.location.latitude.toFixed(5)}, ${p.location.longitude.toFixed(5)}`}</Text> : null}
            {mayRemove ? <Button label="Remove" variant="danger" busy={remove.isPending} onPress={() => void remove.mutateAsync(p.id)} testID={`entry-photo-remove-${i}`} /> : null}
          </View>
        ))}
      </View>
      {mayAdd ? (
        <>
          <PhotoPicker photos={picked} onChange={setPicked} error={problem} testID="entry-add-photo" />
          {picked.length ? (
            <Button
              label={`Upload ${picked.length} photo${picked.length > 1 ? 's' : ''}`}
              busy={add.isPending}
              testID="entry-upload"
              onPress={async () => {
                setProblem(null);
                const result = await add.mutateAsync(picked.map(({ file, name }) => ({ file, name })));
                if (result.kind === 'ok') setPicked([]);
                else setProblem(problemMessage(result));
              }}
            />
          ) : null}
        </>
      ) : null}
    </Card>
  );
}

export function EntryComments({ entry }: { entry: RegisterEntry }) {
  const add = useAddComment(entry.id);
  const [body, setBody] = useState('');
  const [problem, setProblem] = useState<string | null>(null);
  return (
    <Card title="Comments" testID="entry-comments">
      {entry.comments.length === 0 ? <Text tone="textMuted">No comments yet.</Text> : null}
      <View role="list" style={styles.rows}>
        {entry.comments.map((c) => (
          <View key={c.id} role="listitem" style={styles.comment}>
            <Text variant="caption" tone="textMuted">{`${c.author?.name ?? '—'}, ${formatDateTime(c.createdAt)}`}</Text>
            <Text>{c.body}</Text>
          </View>
        ))}
      </View>
      {entry.allowed.includes('comment') ? (
        <>
          <TextField label="Add a comment" value={body} onChangeText={setBody} multiline error={problem} testID="comment-text" />
          <Button
            label="Post comment"
            variant="secondary"
            busy={add.isPending}
            testID="comment-post"
            onPress={async () => {
              if (!body.trim()) return setProblem('Write the comment first');
              const result = await add.mutateAsync(body.trim());
              if (result.kind === 'ok') {
                setBody('');
                setProblem(null);
              } else setProblem(problemMessage(result));
            }}
          />
        </>
      ) : null}
    </Card>
  );
}

const FIELD_WORDS: Record<string, string> = {
  location: 'location',
  description: 'description',
  measuredTemperatureC: 'temperature',
  method: 'method',
  emissivitySetting: 'emissivity setting',
  surfaceMaterial: 'surface',
  surfaceFinishId: 'finish',
  withinReach: 'reach',
  contactSeconds: 'contact time',
  itemId: 'line or vessel',
  measuredAt: 'time measured',
  owner: 'owner',
  dueDate: 'due date',
  action: 'action',
  status: 'status',
  verificationTemperatureC: 'reading after the fix',
};

function historyText(h: RegisterHistoryItem): string {
  if (h.action === 'created') return 'Recorded';
  if (h.action === 'updated') return `Changed ${Object.keys(h.changes).map((k) => FIELD_WORDS[k] ?? k).join(', ')}`;
  if (h.action === 'photoAdded') return `Added ${h.note || 'a photo'}`;
  if (h.action === 'photoRemoved') return 'Removed a photo';
  const step = STEP_WORDS[h.action as keyof typeof STEP_WORDS];
  const to = h.toStatus ? ` → ${STATUS_WORDS[h.toStatus]}` : '';
  return `${step ? step.confirm : h.action}${to}`;
}

function changeText(k: string, c: { from: unknown; to: unknown }, system: UnitSystem): string {
  const show = (v: unknown) => {
    if (v === null || v === undefined || v === '') return '—';
    if (k === 'measuredTemperatureC' || k === 'verificationTemperatureC') return formatTemperature(Number(v), system).text;
    if (k === 'status') return STATUS_WORDS[v as keyof typeof STATUS_WORDS] ?? String(v);
    if (k === 'method') return METHOD_WORDS[v as keyof typeof METHOD_WORDS] ?? String(v);
    if (typeof v === 'boolean') return v ? 'yes' : 'no';
    return String(v);
  };
  return `${FIELD_WORDS[k] ?? k}: ${show(c.from)} → ${show(c.to)}`;
}

/** Who changed what, and when: the entry's own audit trail. */
export function EntryHistory({ entry, system }: { entry: RegisterEntry; system: UnitSystem }) {
  return (
    <Card title="History" subtitle="Who changed what, and when" testID="entry-history">
      <View role="list" style={styles.rows}>
        {entry.history.map((h) => (
          <View key={h.id} role="listitem" style={styles.historyItem} testID={`history-${h.action}`}>
            <Text weight="semibold">{historyText(h)}</Text>
            <Text variant="caption" tone="textMuted">{`${h.by?.name ?? '—'}, ${formatDateTime(h.at)}`}</Text>
            {h.note && h.action !== 'photoAdded' ? <Text>{h.note}</Text> : null}
            {Object.entries(h.changes)
              .filter(([k]) => k !== 'status' && k !== 'ownerUserId')
              .map(([k, c]) => (
                <Text key={k} variant="caption" tone="textMuted">
                  {changeText(k, c, system)}
                </Text>
              ))}
          </View>
        ))}
      </View>
    </Card>
  );
}

const styles = StyleSheet.create({
  rows: { gap: spacing.sm },
  row: { flexDirection: 'row', justifyContent: 'space-between', gap: spacing.md, paddingVertical: spacing.xs, borderBottomWidth: 1, borderBottomColor: colors.border },
  rowLabel: { flexShrink: 0 },
  rowValue: { flexShrink: 1, textAlign: 'right' },
  buttons: { flexDirection: 'row', gap: spacing.sm, flexWrap: 'wrap' },
  photos: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.md },
  photo: { width: 160, gap: spacing.xs },
  thumb: { width: 160, borderRadius: radius.md, backgroundColor: colors.surfaceSunk },
  comment: { gap: spacing.xxs, paddingVertical: spacing.xs, borderBottomWidth: 1, borderBottomColor: colors.border },
  historyItem: { gap: spacing.xxs, paddingLeft: spacing.md, borderLeftWidth: 3, borderLeftColor: colors.border },
});
