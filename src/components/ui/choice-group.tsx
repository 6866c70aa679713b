import { Pressable, StyleSheet, View } from 'react-native';

import { colors, radius, spacing } from '../../theme';

import { useRadioKeys } from './radio-keys';
import { Text } from './text';

export interface Choice<T extends string> {
  value: T;
  label: string;
  description?: string;
}

export interface ChoiceGroupProps<T extends string> {
  label: string;
  value: T | null;
  choices: readonly Choice<T>[];
  onChange: (value: T) => void;
  error?: string | null;
  disabled?: boolean;
  /** Lay choices out as a wrapping row of chips instead of a list. */
  compact?: boolean;
  testID?: string;
}

/**
 * A radio group: one choice, keyboard operable after the WAI-ARIA radio-group pattern (Tab reaches the group at
 * the checked choice, the arrow keys move and check, Space checks).
 */
export function ChoiceGroup<T extends string>({ label, value, choices, onChange, error, disabled, compact, testID }: ChoiceGroupProps<T>) {
  const keys = useRadioKeys(choices, value, onChange, disabled);
  return (
    <View style={styles.wrap} testID={testID}>
      <Text variant="label">{label}</Text>
      <View role="radiogroup" aria-label={label} style={compact ? styles.row : styles.column}>
        {choices.map((choice, i) => {
          const selected = choice.value === value;
          return (
            <Pressable
              key={choice.value}
              ref={keys.ref(i)}
              tabIndex={keys.tabIndex(i)}
              // react-native-web passes key events to the element; React Native's types do not list them.
              {...({ onKeyDown: keys.onKeyDown(i) } as object)}
              role="radio"
              aria-checked={selected}
              aria-label={choice.description ? `${choice.label}. ${choice.description}` : choice.label}
              disabled={disabled}
              onPress={() => onChange(choice.value)}
              style={[
                styles.choice,
                compact && styles.chip,
                selected && styles.selected,
                disabled && styles.disabled,
              ]}
            >
              <View style={[styles.dot, selected && styles.dotOn]}>{selected ? <View style={styles.dotInner} /> : null}</View>
              <View style={styles.texts}>
                <Text weight={selected ? 'semibold' : 'regular'}>{choice.label}</Text>
                {choice.description && !compact ? (
                  <Text variant="caption" tone="textMuted">
                    {choice.description}
                  </Text>
                ) : null}
              </View>
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
  column: { gap: spacing.xs },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.xs },
  choice: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: spacing.sm,
    minHeight: 44,
    paddingHorizontal: spacing.md,
    paddingVertical: spacing.sm,
    borderWidth: 1,
    borderColor: colors.borderStrong,
    borderRadius: radius.md,
    backgroundColor: colors.surface,
  },
  chip: { paddingVertical: spacing.xs },
  selected: { borderColor: colors.selected, backgroundColor: colors.selectedSoft },
  disabled: { opacity: 0.55 },
  dot: {
    width: 18,
    height: 18,
    borderRadius: 9,
    borderWidth: 2,
    borderColor: colors.textMuted,
    alignItems: 'center',
    justifyContent: 'center',
  },
  dotOn: { borderColor: colors.selected },
  dotInner: { width: 8, height: 8, borderRadius: 4, backgroundColor: colors.selected },
  texts: { flexShrink: 1 },
});
