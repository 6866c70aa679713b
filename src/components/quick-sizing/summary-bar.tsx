import { StyleSheet, View } from 'react-native';

import type { LiveOutput } from '../../calc/live';
import { present } from '../../calc/present';
import type { Draft } from '../../calc/quick-case';
import type { UnitSystem } from '../../calc/units';
import { colors, spacing } from '../../theme';
import { Icon, Text } from '../ui';

/** Pinned to the bottom on phones, where the thumb is: the answer while the inputs scroll above. */
export function SummaryBar({ draft, output, system }: { draft: Draft; output: LiveOutput; system: UnitSystem }) {
  let body: React.ReactNode;
  let state: 'pass' | 'caution' | 'fail' = 'caution';
  if (output.kind === 'ok') {
    const p = present(draft, output, system);
    state = p.verdict.state;
    // The purpose's own answer (end of run, hours to 0 °C) goes before heat loss when there is one.
    const items = p.headline.length > 3 ? [p.headline[0], p.headline[1], p.headline[p.headline.length - 1]] : p.headline.slice(0, 3);
    body = (
      <View style={styles.row}>
        {items.map((s) => (
          <View key={s.testID} style={styles.item}>
            <Text variant="caption" tone="textMuted" numberOfLines={1}>
              {s.short ?? s.label}
            </Text>
            <Text weight="bold" style={styles.value} testID={`${s.testID}-pinned`} numberOfLines={1}>
              {s.value.text}
            </Text>
          </View>
        ))}
      </View>
    );
  } else {
    state = 'fail';
    body = (
      <Text weight="semibold" tone="fail">
        {output.kind === 'invalid' ? 'Fix the marked inputs to see results.' : output.code === 'TARGET_NOT_REACHABLE' ? 'No thickness reaches this target.' : 'This case cannot be calculated.'}
      </Text>
    );
  }
  const word = state === 'pass' ? 'Pass' : state === 'fail' ? 'Fail' : 'Caution';
  return (
    <View style={styles.bar} testID="qs-summary" role="status" aria-live="polite" {...({ dataSet: { state } } as object)}>
      <View style={styles.verdict}>
        <Icon name={state} tone={state} size={22} />
        <Text variant="caption" weight="semibold" tone={state}>
          {word}
        </Text>
      </View>
      {body}
    </View>
  );
}

const styles = StyleSheet.create({
  bar: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: spacing.md,
    paddingHorizontal: spacing.lg,
    paddingVertical: spacing.sm,
    backgroundColor: colors.surface,
    borderTopWidth: 1,
    borderTopColor: colors.borderStrong,
  },
  verdict: { alignItems: 'center', width: 52 },
  row: { flex: 1, flexDirection: 'row', gap: spacing.md },
  item: { flex: 1, minWidth: 0 },
  value: { fontSize: 18, lineHeight: 24 },
});
