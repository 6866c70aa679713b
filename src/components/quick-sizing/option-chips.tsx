import { Pressable, StyleSheet, View } from 'react-native';

import { colors, radius, spacing } from '../../theme';
import { Text, focusRing, useRadioKeys } from '../ui';

export type ChipOption<T extends string> = { value: T; label: string; disabled?: boolean; note?: string };

export interface OptionChipsProps<T extends string> {
  label: string;
  value: T;
  options: readonly ChipOption<T>[];
  onChange: (value: T) => void;
  /** testID prefix: each chip gets `${testID}-${value}`. */
  testID?: string;
}

/**
 * A compact single choice shown as chips; a choice can be unavailable with a reason. A radio group for the
 * keyboard: Tab reaches the checked chip, the arrow keys move and check, Space checks.
 */
export function OptionChips<T extends string>({ label, value, options, onChange, testID }: OptionChipsProps<T>) {
  const keys = useRadioKeys(options, value, onChange);
  return (
    <View style={styles.wrap}>
      <Text variant="label">{label}</Text>
      <View role="radiogroup" aria-label={label} style={styles.row}>
        {options.map((o, i) => {
          const selected = o.value === value;
          return (
            <Pressable
              key={o.value}
              ref={keys.ref(i)}
              tabIndex={keys.tabIndex(i)}
              // react-native-web passes key events to the element; React Native's types do not list them.
              {...({ onKeyDown: keys.onKeyDown(i) } as object)}
              role="radio"
              aria-checked={selected}
              aria-disabled={o.disabled || undefined}
              aria-label={o.note ? `${o.label} (${o.note})` : o.label}
              disabled={o.disabled}
              testID={testID ? `${testID}-${o.value}` : undefined}
              onPress={() => onChange(o.value)}
              style={(state) => [
                styles.chip,
                selected && styles.selected,
                o.disabled && styles.disabled,
                (state as { focused?: boolean }).focused && focusRing,
              ]}
            >
              <Text weight={selected ? 'semibold' : 'regular'} tone="text">
                {selected ? `✓ ${o.label}` : o.label}
              </Text>
              {o.note ? (
                <Text variant="caption" tone="textMuted">
                  {o.note}
                </Text>
              ) : null}
            </Pressable>
          );
        })}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: spacing.xs },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.xs },
  chip: {
    minHeight: 40,
    justifyContent: 'center',
    paddingHorizontal: spacing.md,
    paddingVertical: spacing.xs,
    borderWidth: 1,
    borderColor: colors.borderStrong,
    borderRadius: radius.md,
    backgroundColor: colors.surface,
  },
  // Ink border, a tint and a check mark: a choice, never the heat or danger colours.
  selected: { borderColor: colors.selected, borderWidth: 2, backgroundColor: colors.selectedSoft },
  disabled: { opacity: 0.6, borderStyle: 'dashed' },
});
