import { StyleSheet, View } from 'react-native';

import type { LiveOutput } from '../../calc/live';
import type { Presentation } from '../../calc/present';
import { colors, spacing } from '../../theme';
import { Icon, Text } from '../ui';

import { VERDICT_WORD, type VerdictState } from './result-value';

/** Pinned to the bottom on phones, where the thumb is: the answer while the inputs scroll above. */
export function SummaryBar({ output, presentation: p }: { output: LiveOutput; presentation: Presentation | null }) {
  let body: React.ReactNode;
  let state: VerdictState;
  let reason: string | null = null;
  if (p) {
    // The worst of the purpose, touch safety and the layers' service limits: a pass never hides a fail.
    state = p.overall.state;
    reason = p.overall.text;
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
        {output.kind === 'invalid' ? 'Fix the marked inputs to see results.' : 'This case cannot be calculated.'}
      </Text>
    );
  }
  return (
    <View style={styles.bar} testID="qs-summary" role="status" aria-live="polite" {...({ dataSet: { state } } as object)}>
      <View style={styles.verdict}>
        <Icon name={state} tone={state} size={22} />
        <Text variant="caption" weight="semibold" tone={state}>
          {VERDICT_WORD[state]}
        </Text>
      </View>
      <View style={styles.main}>
        {body}
        {reason ? (
          <Text variant="caption" tone={state === 'pass' ? 'textMuted' : state} weight={state === 'pass' ? 'regular' : 'semibold'} numberOfLines={2} testID="qs-summary-reason">
            {reason}
          </Text>
        ) : null}
      </View>
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
  main: { flex: 1, minWidth: 0, gap: spacing.xxs },
  row: { flexDirection: 'row', gap: spacing.md },
  item: { flex: 1, minWidth: 0 },
  value: { fontSize: 18, lineHeight: 24 },
});
