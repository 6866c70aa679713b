import { useId, useState } from 'react';
import { Pressable, StyleSheet, TextInput, View, type TextInputProps, type ViewStyle } from 'react-native';

import { colors, fonts, fontSizes, radius, spacing, tabularFigures } from '../../theme';

import { focusRing } from './button';
import { Text } from './text';

export interface TextFieldProps extends Omit<TextInputProps, 'value' | 'onChangeText' | 'style'> {
  label: string;
  /** The raw text as typed; numeric fields keep it and parse elsewhere, so "0." survives. */
  value: string;
  onChangeText: (text: string) => void;
  /** Short unit shown as a suffix, e.g. "mm". */
  unit?: string;
  /** The unit spelled out for screen readers, e.g. "millimetres"; defaults to `unit`. */
  unitSpoken?: string;
  hint?: string;
  error?: string | null;
  /** Offers a show/hide switch for passwords. */
  password?: boolean;
  testID?: string;
}

/**
 * A labelled input. The accessible label includes the unit ("Outer diameter, millimetres"), the unit
 * also sits as a suffix, and an error is shown under the field and announced with it.
 */
export function TextField({
  label,
  value,
  onChangeText,
  unit,
  unitSpoken,
  hint,
  error,
  password,
  testID,
  onFocus,
  onBlur,
  ...rest
}: TextFieldProps) {
  const id = useId().replace(/:/g, '');
  const [focused, setFocused] = useState(false);
  const [revealed, setRevealed] = useState(false);
  const spokenLabel = unit ? `${label}, ${unitSpoken ?? unit}` : label;
  const visibleLabel = unit ? `${label} (${unit})` : label;
  const describedBy = [hint ? `${id}-hint` : null, error ? `${id}-error` : null].filter(Boolean).join(' ') || undefined;

  return (
    <View style={styles.wrap}>
      <Text variant="label" nativeID={`${id}-label`} aria-hidden>
        {visibleLabel}
      </Text>
      <View style={[styles.box, focused ? styles.boxFocused : null]}>
        {/* The border is drawn over the input rather than around it, so the input itself fills the whole
            44 px box a thumb taps (WCAG 2.5.5) while the field keeps the look of the other fields. */}
        <View style={[styles.frame, error ? styles.frameError : null, focused ? styles.frameFocused : null]} />
        <TextInput
          {...rest}
          testID={testID}
          value={value}
          onChangeText={onChangeText}
          aria-label={spokenLabel}
          aria-invalid={error ? true : undefined}
          aria-describedby={describedBy}
          secureTextEntry={password ? !revealed : rest.secureTextEntry}
          placeholderTextColor={colors.textMuted}
          onFocus={(e) => {
            setFocused(true);
            onFocus?.(e);
          }}
          onBlur={(e) => {
            setFocused(false);
            onBlur?.(e);
          }}
          style={[styles.input, unit ? styles.inputWithUnit : null]}
        />
        {unit ? (
          <Text tone="textMuted" style={styles.unit} aria-hidden>
            {unit}
          </Text>
        ) : null}
        {password ? (
          <Pressable
            role="button"
            aria-label={revealed ? `Hide ${label.toLowerCase()}` : `Show ${label.toLowerCase()}`}
            onPress={() => setRevealed((r) => !r)}
            style={styles.reveal}
          >
            <Text variant="caption" weight="semibold" tone="link">
              {revealed ? 'Hide' : 'Show'}
            </Text>
          </Pressable>
        ) : null}
      </View>
      {hint ? (
        <Text variant="caption" tone="textMuted" nativeID={`${id}-hint`} id={`${id}-hint`}>
          {hint}
        </Text>
      ) : null}
      {error ? (
        <Text variant="caption" weight="semibold" tone="fail" nativeID={`${id}-error`} id={`${id}-error`} role="alert">
          {`Error: ${error}`}
        </Text>
      ) : null}
    </View>
  );
}

/** The bordered box of a form field, shared by text inputs and choices that open in place. */
export const fieldBox: ViewStyle = {
  flexDirection: 'row',
  alignItems: 'center',
  minHeight: 44,
  borderWidth: 1,
  borderColor: colors.borderStrong,
  borderRadius: radius.md,
  backgroundColor: colors.surface,
};

/** The smallest touch target of an input [px] (WCAG 2.5.5; the platforms' 44 pt guidance). */
export const MIN_TOUCH_PX = 44;

const styles = StyleSheet.create({
  wrap: { gap: spacing.xs },
  box: { ...fieldBox, borderWidth: 0, alignItems: 'stretch', minHeight: MIN_TOUCH_PX },
  boxFocused: { ...focusRing, outlineOffset: 0 } as never,
  frame: { position: 'absolute', top: 0, right: 0, bottom: 0, left: 0, pointerEvents: 'none', borderWidth: 1, borderColor: colors.borderStrong, borderRadius: radius.md },
  frameFocused: { borderColor: colors.focus },
  frameError: { borderColor: colors.fail, borderWidth: 2 },
  input: {
    flex: 1,
    minWidth: 0,
    minHeight: MIN_TOUCH_PX,
    // One pixel more than the padding of a bordered field, so the text sits where it does in the others.
    paddingHorizontal: spacing.md + 1,
    paddingVertical: spacing.sm,
    fontFamily: fonts.regular,
    fontSize: fontSizes.body,
    color: colors.text,
    // The box draws the focus ring; the browser's own outline would double it.
    outlineStyle: 'none',
    ...tabularFigures,
  } as never,
  inputWithUnit: { textAlign: 'right' },
  unit: { paddingRight: spacing.md + 1, alignSelf: 'center' },
  reveal: { paddingHorizontal: spacing.md, paddingVertical: spacing.sm, borderRadius: radius.sm, alignSelf: 'center', minHeight: MIN_TOUCH_PX, justifyContent: 'center' },
});
