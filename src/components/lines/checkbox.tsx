import { Pressable, StyleSheet, View } from 'react-native';

import { colors, radius, spacing } from '../../theme';
import { Text, focusRing } from '../ui';

export interface CheckboxProps {
  label: string;
  checked: boolean;
  onChange: (checked: boolean) => void;
  /** Hide the visible label (the accessible one stays), e.g. in a table row. */
  labelHidden?: boolean;
  description?: string;
  disabled?: boolean;
  testID?: string;
}

/** A checkbox that Tab reaches and Space or Enter toggles; the tick is drawn, not only coloured. */
export function Checkbox({ label, checked, onChange, labelHidden, description, disabled, testID }: CheckboxProps) {
  return (
    <Pressable
      role="checkbox"
      aria-checked={checked}
      aria-label={description ? `${label}. ${description}` : label}
      aria-disabled={disabled || undefined}
      disabled={disabled}
      onPress={() => onChange(!checked)}
      // Space toggles a checkbox on the web as in a native one (the press handler answers Enter only).
      {...({
        onKeyDown: (e: { key: string; preventDefault: () => void }) => {
          if (e.key === ' ' && !disabled) {
            e.preventDefault();
            onChange(!checked);
          }
        },
      } as object)}
      testID={testID}
      style={(state) => [styles.row, labelHidden && styles.bare, (state as { focused?: boolean }).focused && focusRing, disabled && styles.disabled]}
    >
      <View style={[styles.box, checked && styles.boxOn]}>
        {checked ? (
          <Text variant="caption" weight="bold" tone="onAccent" aria-hidden>
            ✓
          </Text>
        ) : null}
      </View>
      {labelHidden ? null : (
        <View style={styles.texts}>
          <Text>{label}</Text>
          {description ? (
            <Text variant="caption" tone="textMuted">
              {description}
            </Text>
          ) : null}
        </View>
      )}
    </Pressable>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm, minHeight: 44, paddingVertical: spacing.xxs, borderRadius: radius.sm },
  bare: { minHeight: 44, minWidth: 44, justifyContent: 'center' },
  box: {
    width: 22,
    height: 22,
    borderRadius: radius.sm,
    borderWidth: 2,
    borderColor: colors.textMuted,
    backgroundColor: colors.surface,
    alignItems: 'center',
    justifyContent: 'center',
  },
  boxOn: { borderColor: colors.heat, backgroundColor: colors.heat },
  texts: { flexShrink: 1 },
  disabled: { opacity: 0.55 },
});
