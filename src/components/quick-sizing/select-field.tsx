import { useState } from 'react';
import { Pressable, ScrollView, StyleSheet, View } from 'react-native';

import { colors, radius, spacing } from '../../theme';
import { Text, fieldBox, focusRing } from '../ui';

export type SelectOption = { value: string; label: string; detail?: string };

export interface SelectFieldProps {
  label: string;
  value: string;
  options: readonly SelectOption[];
  onChange: (value: string) => void;
  /** testID of the toggle; options get `${testID}-option-${value}`. */
  testID?: string;
}

/** A labelled choice from a list that opens in place (works on phones and with a keyboard). */
export function SelectField({ label, value, options, onChange, testID }: SelectFieldProps) {
  const [open, setOpen] = useState(false);
  const current = options.find((o) => o.value === value);
  return (
    <View style={styles.wrap}>
      <Text variant="label" aria-hidden>
        {label}
      </Text>
      <Pressable
        role="button"
        aria-label={`${label}: ${current?.label ?? 'none'}`}
        aria-expanded={open}
        testID={testID}
        onPress={() => setOpen((o) => !o)}
        style={(state) => [styles.box, (state as { focused?: boolean }).focused && focusRing]}
      >
        <Text style={styles.value} numberOfLines={1}>
          {current?.label ?? 'Choose…'}
        </Text>
        <Text tone="textMuted" aria-hidden>
          {open ? '▲' : '▼'}
        </Text>
      </Pressable>
      {open ? (
        <ScrollView style={styles.list} {...({ role: 'listbox' } as object)} aria-label={label} nestedScrollEnabled>
          {options.map((o) => {
            const selected = o.value === value;
            return (
              <Pressable
                key={o.value}
                {...({ role: 'option' } as object)}
                aria-selected={selected}
                testID={testID ? `${testID}-option-${o.value}` : undefined}
                onPress={() => {
                  onChange(o.value);
                  setOpen(false);
                }}
                style={(state) => [styles.option, selected && styles.optionSelected, (state as { focused?: boolean }).focused && focusRing]}
              >
                <Text weight={selected ? 'semibold' : 'regular'}>{selected ? `✓ ${o.label}` : o.label}</Text>
                {o.detail ? (
                  <Text variant="caption" tone="textMuted">
                    {o.detail}
                  </Text>
                ) : null}
              </Pressable>
            );
          })}
        </ScrollView>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: spacing.xs },
  box: { ...fieldBox, gap: spacing.sm, paddingHorizontal: spacing.md },
  value: { flex: 1 },
  list: { maxHeight: 260, borderWidth: 1, borderColor: colors.border, borderRadius: radius.md, backgroundColor: colors.surface },
  option: { paddingHorizontal: spacing.md, paddingVertical: spacing.sm, minHeight: 44, justifyContent: 'center' },
  optionSelected: { backgroundColor: colors.heatSoft },
});
