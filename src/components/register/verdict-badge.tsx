import { StyleSheet, View } from 'react-native';

import type { RegisterVerdictValue } from '../../../shared/calc/register';
import { colors, radius, spacing } from '../../theme';
import { Icon, Text } from '../ui';

import { VERDICT_SHORT } from './words';

const SOFT: Record<RegisterVerdictValue, string> = { fail: colors.failSoft, caution: colors.cautionSoft, pass: colors.passSoft };

/** A verdict as icon, word and colour together (never colour alone). */
export function VerdictBadge({ verdict, label, testID }: { verdict: RegisterVerdictValue; label?: string; testID?: string }) {
  return (
    <View style={[styles.badge, { backgroundColor: SOFT[verdict], borderColor: colors[verdict] }]} testID={testID} {...({ dataSet: { verdict } } as object)}>
      <Icon name={verdict} tone={verdict} size={16} />
      <Text variant="caption" weight="semibold" tone={verdict}>
        {label ?? VERDICT_SHORT[verdict]}
      </Text>
    </View>
  );
}

const styles = StyleSheet.create({
  badge: {
    flexDirection: 'row',
    alignItems: 'center',
    alignSelf: 'flex-start',
    gap: spacing.xs,
    paddingHorizontal: spacing.sm,
    paddingVertical: spacing.xxs,
    borderRadius: radius.pill,
    borderWidth: 1,
  },
});
