import { ScrollView, StyleSheet } from 'react-native';

import { colors, spacing } from '../../theme';

/**
 * The strip at the bottom of a phone screen, above the navigation, where the thumb is: the screen's primary
 * action. It scrolls on its own when what it holds (a step's form) is taller than it may grow.
 */
export function PinnedBar({ children, testID }: { children: React.ReactNode; testID?: string }) {
  return (
    <ScrollView style={styles.bar} contentContainerStyle={styles.content} keyboardShouldPersistTaps="handled" testID={testID}>
      {children}
    </ScrollView>
  );
}

const styles = StyleSheet.create({
  bar: { flexGrow: 0, maxHeight: 460, backgroundColor: colors.surface, borderTopWidth: 1, borderTopColor: colors.border },
  content: { gap: spacing.sm, paddingHorizontal: spacing.lg, paddingTop: spacing.sm, paddingBottom: spacing.md },
});
