import { createElement, useEffect, useRef, useState } from 'react';
import { Image, Platform, Pressable, StyleSheet, View } from 'react-native';

import { REGISTER_LIMITS } from '../../../shared/schemas/register';
import type { PickedPhoto } from '../../api/register';
import { colors, radius, spacing } from '../../theme';
import { Button, Text, focusRing } from '../ui';

export type PickedWithPreview = PickedPhoto & { preview: string };

const TYPES = ['image/jpeg', 'image/png', 'image/webp'];
const MB = REGISTER_LIMITS.photoBytesMax / (1024 * 1024);

/** Checks a file before it is sent (the server checks the content again): the reason it cannot go, or null. */
export function photoProblem(file: { type: string; size: number; name: string }): string | null {
  if (file.size === 0) return `"${file.name}" is empty.`;
  if (file.type && !TYPES.includes(file.type)) return `"${file.name}" is not a JPEG, PNG or WebP photo.`;
  if (file.size > REGISTER_LIMITS.photoBytesMax) return `"${file.name}" is larger than ${MB} MB.`;
  return null;
}

const previewOf = (file: Blob) => (typeof URL !== 'undefined' && URL.createObjectURL ? URL.createObjectURL(file) : '');

export interface PhotoPickerProps {
  photos: PickedWithPreview[];
  onChange: (photos: PickedWithPreview[]) => void;
  /** How many more may be added (an entry's limit). */
  max?: number;
  error?: string | null;
  testID?: string;
}

/**
 * Take a photo with the phone's camera (or choose one): a large button that opens the camera on phones, with
 * previews that can be removed before saving.
 */
export function PhotoPicker({ photos, onChange, max = REGISTER_LIMITS.photosPerRequest, error, testID = 'photo' }: PhotoPickerProps) {
  const input = useRef<HTMLInputElement | null>(null);
  const [problem, setProblem] = useState<string | null>(null);
  const latest = useRef(photos);
  useEffect(() => {
    latest.current = photos;
  }, [photos]);
  // Previews are object URLs: let them go with the form.
  useEffect(() => () => latest.current.forEach((p) => p.preview && URL.revokeObjectURL(p.preview)), []);

  if (Platform.OS !== 'web') return null;
  const room = max - photos.length;

  const onFiles = (list: FileList | null) => {
    if (!list) return;
    const files = Array.from(list);
    const bad = files.map(photoProblem).find(Boolean) ?? null;
    const good = files.filter((f) => !photoProblem(f)).slice(0, Math.max(0, room));
    setProblem(bad ?? (files.length > room ? `At most ${max} photos at a time.` : null));
    if (good.length) onChange([...photos, ...good.map((f) => ({ file: f, name: f.name || 'photo.jpg', preview: previewOf(f) }))]);
    if (input.current) input.current.value = '';
  };

  return (
    <View style={styles.wrap}>
      <Text variant="label">Photos</Text>
      {createElement('input', {
        ref: input,
        type: 'file',
        accept: TYPES.join(','),
        capture: 'environment',
        multiple: true,
        'data-testid': `${testID}-input`,
        'aria-hidden': true,
        tabIndex: -1,
        style: { display: 'none' },
        onChange: (e: { target: HTMLInputElement }) => onFiles(e.target.files),
      })}
      {photos.length ? (
        <View style={styles.grid} role="list" aria-label="Photos to save">
          {photos.map((p, i) => (
            <View key={p.preview || i} role="listitem" style={styles.item}>
              {p.preview ? <Image source={{ uri: p.preview }} style={styles.thumb} accessibilityLabel={`Photo ${i + 1}: ${p.name}`} /> : null}
              <Pressable
                role="button"
                aria-label={`Remove photo ${i + 1}`}
                testID={`${testID}-remove-${i}`}
                onPress={() => {
                  if (p.preview) URL.revokeObjectURL(p.preview);
                  onChange(photos.filter((_, k) => k !== i));
                }}
                style={(state) => [styles.remove, (state as { focused?: boolean }).focused && focusRing]}
              >
                <Text variant="caption" weight="semibold" tone="fail">
                  Remove
                </Text>
              </Pressable>
            </View>
          ))}
        </View>
      ) : null}
      {room > 0 ? (
        <Button
          label={photos.length ? 'Add another photo' : 'Take or add a photo'}
          icon="plus"
          variant="secondary"
          block
          testID={`${testID}-add`}
          style={styles.add}
          onPress={() => input.current?.click()}
        />
      ) : null}
      <Text variant="caption" tone="textMuted">{`JPEG, PNG or WebP, up to ${MB} MB each. Location is removed from the photo.`}</Text>
      {problem || error ? (
        <Text variant="caption" weight="semibold" tone="fail" role="alert" testID={`${testID}-problem`}>
          {`Error: ${problem ?? error}`}
        </Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: spacing.sm },
  grid: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
  item: { width: 104, gap: spacing.xs },
  thumb: { width: 104, height: 104, borderRadius: radius.md, backgroundColor: colors.surfaceSunk },
  remove: { minHeight: 44, alignItems: 'center', justifyContent: 'center', borderRadius: radius.sm, borderWidth: 1, borderColor: colors.border },
  add: { minHeight: 56 },
});
