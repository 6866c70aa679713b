import { StyleSheet, View, type ViewProps } from 'react-native';

import { colors, radius, spacing } from '../../theme';

import { Text } from './text';

export interface CardProps extends ViewProps {
  title?: string;
  /** One line under the title that says what the card is for. */
  subtitle?: string;
}

/** A raised panel on the paper background. */
export function Card({ title, subtitle, children, style, ...rest }: CardProps) {
  return (
    <View {...rest} style={[styles.card, style]}>
      {title ? (
        <View style={styles.head}>
          <Text variant="title">{title}</Text>
          {subtitle ? <Text tone="textMuted">{subtitle}</Text> : null}
        </View>
      ) : null}
      {children}
    </View>
  );
}

const styles = StyleSheet.create({
  card: {
    backgroundColor: colors.surface,
    borderColor: colors.border,
    borderWidth: 1,
    borderRadius: radius.lg,
    padding: spacing.lg,
    gap: spacing.md,
  },
  head: { gap: spacing.xxs },
});
