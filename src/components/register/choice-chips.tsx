import { Pressable, StyleSheet, View } from 'react-native';

import { colors, radius, spacing } from '../../theme';
import { Text, focusRing } from '../ui';

export type ChipChoice<T extends string> = { value: T; label: string };

export interface ChoiceChipsProps<T extends string> {
  label: string;
  value: T | null;
  choices: readonly ChipChoice<T>[];
  onChange: (value: T) => void;
  error?: string | null;
  /** Each chip gets `${testID}-${value}`. */
  testID?: string;
}

/**
 * One choice as large chips (at least 48 px tall): made for a thumb on a plant walk, with gloves on.
 * A radio group for screen readers and keyboards.
 */
export function ChoiceChips<T extends string>({ label, value, choices, onChange, error, testID }: ChoiceChipsProps<T>) {
  return (
    <View style={styles.wrap}>
      <Text variant="label">{label}</Text>
      <View role="radiogroup" aria-label={label} style={styles.row}>
        {choices.map((c) => {
          const selected = c.value === value;
          return (
            <Pressable
              key={c.value}
              role="radio"
              aria-checked={selected}
              aria-label={c.label}
              testID={testID ? `${testID}-${c.value}` : undefined}
              onPress={() => onChange(c.value)}
              style={(state) => [styles.chip, selected && styles.selected, (state as { focused?: boolean }).focused && focusRing]}
            >
              <Text weight={selected ? 'semibold' : 'regular'} tone={selected ? 'heat' : 'text'}>
                {selected ? `✓ ${c.label}` : c.label}
              </Text>
            </Pressable>
          );
        })}
      </View>
      {error ? (
        <Text variant="caption" weight="semibold" tone="fail" role="alert">
          {`Error: ${error}`}
        </Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: spacing.xs },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm },
  chip: {
    minHeight: 48,
    minWidth: 48,
    justifyContent: 'center',
    paddingHorizontal: spacing.lg,
    borderWidth: 1,
    borderColor: colors.borderStrong,
    borderRadius: radius.md,
    backgroundColor: colors.surface,
  },
  selected: { borderColor: colors.heat, backgroundColor: colors.heatSoft, borderWidth: 2 },
});
