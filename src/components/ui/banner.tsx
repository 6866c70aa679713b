import { StyleSheet, View, type ViewProps } from 'react-native';

import { colors, radius, spacing } from '../../theme';

import { Icon, type IconName } from './icon';
import { Text } from './text';

export type BannerTone = 'info' | 'pass' | 'caution' | 'fail';

export interface BannerProps extends ViewProps {
  tone?: BannerTone;
  title?: string;
  children?: React.ReactNode;
}

const toneLook: Record<BannerTone, { icon: IconName; fg: 'cold' | 'pass' | 'caution' | 'fail'; bg: string; word: string }> = {
  info: { icon: 'info', fg: 'cold', bg: colors.coldSoft, word: 'Note' },
  pass: { icon: 'pass', fg: 'pass', bg: colors.passSoft, word: 'Done' },
  caution: { icon: 'caution', fg: 'caution', bg: colors.cautionSoft, word: 'Caution' },
  fail: { icon: 'fail', fg: 'fail', bg: colors.failSoft, word: 'Problem' },
};

/**
 * A message that must be read: cautions, errors, confirmations. The tone is carried by an icon and a
 * word as well as colour.
 */
export function Banner({ tone = 'info', title, children, style, ...rest }: BannerProps) {
  const t = toneLook[tone];
  return (
    <View
      role={tone === 'fail' || tone === 'caution' ? 'alert' : 'status'}
      {...rest}
      style={[styles.banner, { backgroundColor: t.bg, borderLeftColor: colors[t.fg] }, style]}
    >
      <Icon name={t.icon} tone={t.fg} size={20} />
      <View style={styles.body}>
        <Text variant="label" tone={t.fg}>
          {title ?? t.word}
        </Text>
        {typeof children === 'string' ? <Text>{children}</Text> : children}
      </View>
    </View>
  );
}

const styles = StyleSheet.create({
  banner: {
    flexDirection: 'row',
    gap: spacing.sm,
    padding: spacing.md,
    borderRadius: radius.md,
    borderLeftWidth: 4,
    alignItems: 'flex-start',
  },
  body: { flex: 1, gap: spacing.xxs },
});
