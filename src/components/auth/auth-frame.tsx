import { StyleSheet, View } from 'react-native';

import { spacing } from '../../theme';
import { BrandMark, Card, PageTitle, Screen, Text } from '../ui';

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
        <BrandMark size={40} />
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
        <PageTitle title={title} intro={intro} />
        {children}
      </Card>
      {footer ? <View style={styles.footer}>{footer}</View> : null}
    </Screen>
  );
}

export const PASSWORD_HINT = 'At least 12 characters. Passphrases welcome: a few unrelated words are easy to remember and hard to guess.';

const styles = StyleSheet.create({
  brand: { flexDirection: 'row', alignItems: 'center', gap: spacing.md, marginTop: spacing.lg },
  footer: { gap: spacing.sm, alignItems: 'center' },
});
