import { ActivityIndicator, StyleSheet, View } from 'react-native';

import { ApiProblemError, problemMessage } from '../../api/client';
import { colors, spacing } from '../../theme';
import { Banner, Button, Text } from '../ui';

/** Loading line shown while a list is on its way. */
export function Loading({ label }: { label: string }) {
  return (
    <View style={styles.loading} role="status" aria-label={label}>
      <ActivityIndicator color={colors.heat} />
      <Text tone="textMuted">{label}</Text>
    </View>
  );
}

/** A failed query: says what happened and offers a retry. */
export function QueryError({ error, onRetry, title = 'Could not load this' }: { error: unknown; onRetry?: () => void; title?: string }) {
  const message = error instanceof ApiProblemError ? problemMessage(error.problem) : 'Something went wrong. Try again in a moment.';
  return (
    <Banner tone="fail" title={title}>
      <Text>{message}</Text>
      {onRetry ? <Button label="Try again" variant="secondary" onPress={onRetry} style={styles.retry} /> : null}
    </Banner>
  );
}

const styles = StyleSheet.create({
  loading: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm, paddingVertical: spacing.lg },
  retry: { marginTop: spacing.sm },
});
