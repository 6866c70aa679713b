import { Text as RNText, StyleSheet, type TextProps as RNTextProps, type TextStyle } from 'react-native';

import { colors, fonts, fontSizes, lineHeights, tabularFigures, type ColorName } from '../../theme';

export type TextVariant = 'body' | 'label' | 'caption' | 'title' | 'heading' | 'result';
export type TextWeight = 'regular' | 'semibold' | 'bold';

export interface TextProps extends RNTextProps {
  variant?: TextVariant;
  weight?: TextWeight;
  /** Semantic colour from the theme. */
  tone?: ColorName;
}

const defaultWeight: Record<TextVariant, TextWeight> = {
  body: 'regular',
  label: 'semibold',
  caption: 'regular',
  title: 'semibold',
  heading: 'bold',
  result: 'semibold',
};

/** Headings get a level so a page keeps one h1 (the Screen title) and cards sit under it as h2. */
const headingLevel: Partial<Record<TextVariant, number>> = { heading: 1, title: 2 };

/**
 * Every piece of text in the app. Figures are always tabular, so numbers line up in lists and
 * live results do not jitter as they change.
 */
export function Text({ variant = 'body', weight, tone = 'text', style, ...rest }: TextProps) {
  const w = weight ?? defaultWeight[variant];
  const base: TextStyle = {
    fontFamily: fonts[w],
    fontSize: fontSizes[variant],
    lineHeight: lineHeights[variant],
    color: colors[tone],
  };
  return (
    <RNText
      role={headingLevel[variant] ? 'heading' : undefined}
      aria-level={headingLevel[variant]}
      {...rest}
      style={[styles.base, base, style]}
    />
  );
}

const styles = StyleSheet.create({
  base: { ...tabularFigures },
});
