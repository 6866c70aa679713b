import { ScrollView, StyleSheet, View, type ViewStyle } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';

import { breakpoints, colors, spacing } from '../../theme';

import { Text } from './text';

export interface ScreenProps {
  title?: string;
  /** One sentence under the title. */
  intro?: string;
  /** `narrow` for single forms (sign-in), `medium` for settings-like pages, `wide` for lists and tables. */
  width?: 'narrow' | 'medium' | 'wide';
  children?: React.ReactNode;
  /** Extra space at the bottom, e.g. above a bottom bar. */
  bottomInset?: number;
  contentStyle?: ViewStyle;
  testID?: string;
}

/** A scrolling page with content capped in width and centred on wide screens. */
export function Screen({ title, intro, width = 'wide', children, bottomInset = 0, contentStyle, testID }: ScreenProps) {
  const insets = useSafeAreaInsets();
  return (
    <ScrollView
      style={styles.scroll}
      contentContainerStyle={[
        styles.outer,
        { paddingTop: insets.top + spacing.xl, paddingBottom: insets.bottom + spacing.xxl + bottomInset },
      ]}
      keyboardShouldPersistTaps="handled"
      testID={testID}
    >
      <View role="main" style={[styles.content, { maxWidth: maxWidths[width] }, contentStyle]}>
        {title ? <PageTitle title={title} intro={intro} /> : null}
        {children}
      </View>
    </ScrollView>
  );
}

/** The page's one level-1 heading, with an optional sentence under it. */
export function PageTitle({ title, intro }: { title: string; intro?: string }) {
  return (
    <View style={styles.head}>
      <Text variant="heading" role="heading" aria-level={1}>
        {title}
      </Text>
      {intro ? <Text tone="textMuted">{intro}</Text> : null}
    </View>
  );
}

const maxWidths = { narrow: 480, medium: 760, wide: breakpoints.contentMax } as const;

const styles = StyleSheet.create({
  scroll: { flex: 1, backgroundColor: colors.background },
  outer: { flexGrow: 1, paddingHorizontal: spacing.lg, alignItems: 'center' },
  content: { width: '100%', gap: spacing.lg },
  head: { gap: spacing.xs },
});
