import { StyleSheet, View } from 'react-native';

import { colors, spacing } from '../../theme';
import { Card, Screen, Text } from '../ui';

export interface AuthFrameProps {
  title: string;
  intro?: string;
  children: React.ReactNode;
  /** Links under the card (sign in instead, quick sizing…). */
  footer?: React.ReactNode;
}

/** The signed-out pages: the product's name, one card, a few links under it. */
export function AuthFrame({ title, intro, children, footer }: AuthFrameProps) {
  return (
    <Screen width="narrow">
      <View style={styles.brand}>
        <View style={styles.mark} aria-hidden>
          <View style={styles.markBand} />
        </View>
        <View>
          <Text variant="title" weight="bold" role={undefined} aria-level={undefined}>
            Lagline
          </Text>
          <Text variant="caption" tone="textMuted">
            Insulation sizing and hot-surface tracking for plant teams
          </Text>
        </View>
      </View>
      <Card>
        <View style={styles.head}>
          <Text variant="heading" role="heading" aria-level={1}>
            {title}
          </Text>
          {intro ? <Text tone="textMuted">{intro}</Text> : null}
        </View>
        {children}
      </Card>
      {footer ? <View style={styles.footer}>{footer}</View> : null}
    </Screen>
  );
}

export const PASSWORD_HINT = 'At least 12 characters. Passphrases welcome: a few unrelated words are easy to remember and hard to guess.';

const styles = StyleSheet.create({
  brand: { flexDirection: 'row', alignItems: 'center', gap: spacing.md, marginTop: spacing.lg },
  mark: {
    width: 40,
    height: 40,
    borderRadius: 10,
    backgroundColor: colors.text,
    justifyContent: 'center',
    paddingHorizontal: 6,
  },
  markBand: { height: 9, borderRadius: 2, backgroundColor: colors.heatLine },
  head: { gap: spacing.xs },
  footer: { gap: spacing.sm, alignItems: 'center' },
});
