import { StyleSheet, View } from 'react-native';

import type { Formatted } from '../../calc/format';
import { colors, radius, spacing } from '../../theme';
import { Icon, Text } from '../ui';

export interface ResultValueProps {
  label: string;
  value: Formatted;
  /** Raw SI value, exposed as data-si so tests and tools can compare with the API. */
  si?: number | null;
  /** A short line under the value (basis, threshold used…). */
  note?: string;
  size?: 'large' | 'medium';
  testID: string;
}

/** One result: large figure with its unit, label above, optional note below. */
export function ResultValue({ label, value, si, note, size = 'large', testID }: ResultValueProps) {
  const data = { dataSet: { si: si === null || si === undefined ? '' : String(si), text: value.text } } as object;
  return (
    <View style={styles.cell} aria-label={`${label}: ${value.spoken}`} role="group">
      <Text variant="caption" tone="textMuted" aria-hidden>
        {label}
      </Text>
      <View style={styles.valueRow} aria-hidden>
        <Text variant={size === 'large' ? 'result' : 'title'} testID={testID} {...data}>
          {value.value}
        </Text>
        {value.unit ? (
          <Text tone="textMuted" style={styles.unit}>
            {value.unit}
          </Text>
        ) : null}
      </View>
      {note ? (
        <Text variant="caption" tone="textMuted">
          {note}
        </Text>
      ) : null}
    </View>
  );
}

export type VerdictState = 'pass' | 'caution' | 'fail';

/** The word that goes with every verdict, so it never rests on colour alone. */
export const VERDICT_WORD: Record<VerdictState, string> = { pass: 'Pass', caution: 'Caution', fail: 'Fail' };

const verdictBackground: Record<VerdictState, string> = { pass: colors.passSoft, caution: colors.cautionSoft, fail: colors.failSoft };

/** Pass / caution / fail with an icon and a word as well as colour. */
export function VerdictBadge({ state, text, testID }: { state: VerdictState; text: string; testID?: string }) {
  return (
    <View style={[styles.badge, { backgroundColor: verdictBackground[state], borderColor: colors[state] }]} testID={testID} {...({ dataSet: { state } } as object)}>
      <Icon name={state} tone={state} size={20} />
      <Text weight="semibold" tone={state}>
        {`${VERDICT_WORD[state]}: `}
      </Text>
      <Text style={styles.badgeText}>{text}</Text>
    </View>
  );
}

const styles = StyleSheet.create({
  cell: { gap: spacing.xxs, minWidth: 150, flexGrow: 1, flexBasis: 150 },
  valueRow: { flexDirection: 'row', alignItems: 'baseline', gap: spacing.xs, flexWrap: 'wrap' },
  unit: { fontSize: 16 },
  badge: {
    flexDirection: 'row',
    alignItems: 'center',
    flexWrap: 'wrap',
    gap: spacing.xs,
    paddingHorizontal: spacing.md,
    paddingVertical: spacing.sm,
    borderRadius: radius.md,
    borderWidth: 1,
  },
  badgeText: { flexShrink: 1 },
});
