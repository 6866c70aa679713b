import { StyleSheet, View } from 'react-native';

import { colors, spacing } from '../../theme';
import { Text } from '../ui';

/** Label and value pairs, one a row, value to the right. */
export function Facts({ rows, testID }: { rows: [string, string][]; testID?: string }) {
  return (
    <View role="list" style={styles.facts} testID={testID}>
      {rows.map(([k, v]) => (
        <View key={k} role="listitem" style={styles.fact}>
          <Text tone="textMuted" style={styles.factLabel}>
            {k}
          </Text>
          <Text weight="semibold" style={styles.factValue}>
            {v}
          </Text>
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  facts: { borderTopWidth: 1, borderTopColor: colors.border },
  fact: { flexDirection: 'row', justifyContent: 'space-between', gap: spacing.md, paddingVertical: spacing.sm, borderBottomWidth: 1, borderBottomColor: colors.border },
  factLabel: { flexShrink: 0, maxWidth: '45%' },
  factValue: { flexShrink: 1, textAlign: 'right' },
});
