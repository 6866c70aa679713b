import { StyleSheet } from 'react-native';

import { Text } from '../ui';

/** What a chart shows, in words: kept in the accessibility tree, out of sight (the chart carries the same words as its label). */
export function ChartSummary({ summary, testID }: { summary: string; testID?: string }) {
  return (
    <Text variant="caption" style={styles.visuallyHidden} testID={testID ? `${testID}-summary` : undefined}>
      {summary}
    </Text>
  );
}

const styles = StyleSheet.create({
  visuallyHidden: { position: 'absolute', width: 1, height: 1, overflow: 'hidden', opacity: 0 },
});
