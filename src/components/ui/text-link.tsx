import { Link, type Href } from 'expo-router';
import { StyleSheet } from 'react-native';

import { colors, fonts } from '../../theme';

import { Text, type TextProps } from './text';

export interface TextLinkProps extends Omit<TextProps, 'children'> {
  href: Href;
  children: string;
}

/** An in-app link styled as text, underlined so it does not rely on colour alone. */
export function TextLink({ href, children, style, variant = 'body', ...rest }: TextLinkProps) {
  return (
    <Link href={href} asChild>
      <Text variant={variant} {...rest} role="link" style={[styles.link, style]}>
        {children}
      </Text>
    </Link>
  );
}

const styles = StyleSheet.create({
  link: {
    color: colors.heat,
    fontFamily: fonts.semibold,
    textDecorationLine: 'underline',
  },
});
