import { StyleSheet, View } from 'react-native';

import type { RegisterStatus } from '../../../shared/schemas/register';
import { colors, radius, spacing } from '../../theme';
import { Text } from '../ui';

import { STATUS_WORDS } from './words';

/** Where an entry stands in the workflow; a calculated risk has no status yet. */
export function StatusBadge({ status, overdue, testID }: { status: RegisterStatus | null; overdue?: boolean; testID?: string }) {
  const closed = status === 'verified' || status === 'accepted';
  return (
    <View style={styles.row} testID={testID}>
      <View style={[styles.badge, closed ? styles.closed : styles.active]}>
        <Text variant="caption" weight="semibold" tone={closed ? 'textMuted' : 'text'}>
          {status ? STATUS_WORDS[status] : 'Calculated risk'}
        </Text>
      </View>
      {overdue ? (
        <View style={[styles.badge, styles.overdue]}>
          <Text variant="caption" weight="semibold" tone="fail">
            Overdue
          </Text>
        </View>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', gap: spacing.xs, flexWrap: 'wrap' },
  badge: { paddingHorizontal: spacing.sm, paddingVertical: spacing.xxs, borderRadius: radius.sm, borderWidth: 1 },
  active: { borderColor: colors.borderStrong, backgroundColor: colors.surface },
  closed: { borderColor: colors.border, backgroundColor: colors.surfaceSunk },
  overdue: { borderColor: colors.fail, backgroundColor: colors.failSoft },
});
