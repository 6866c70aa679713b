import { Link, type Href } from 'expo-router';
import { StyleSheet, type TextStyle } from 'react-native';

import { colors, fonts, fontSizes, lineHeights, tabularFigures } from '../../theme';

import type { TextVariant } from './text';

export interface TextLinkProps {
  href: Href;
  children: string;
  variant?: TextVariant;
  style?: TextStyle;
  testID?: string;
}

/** An in-app link styled as text, underlined so it does not rely on colour alone. */
export function TextLink({ href, children, variant = 'body', style, testID }: TextLinkProps) {
  return (
    <Link
      href={href}
      testID={testID}
      style={[styles.link, { fontSize: fontSizes[variant], lineHeight: lineHeights[variant] }, style]}
    >
      {children}
    </Link>
  );
}

const styles = StyleSheet.create({
  link: {
    color: colors.link,
    fontFamily: fonts.semibold,
    textDecorationLine: 'underline',
    ...tabularFigures,
  },
});
