import { StyleSheet } from 'react-native';

import { colors, radius, spacing } from '../../theme';

/** Layout of a list of people (team members, people on a site): a row per person, actions and a confirmation. */
export const personRows = StyleSheet.create({
  list: { gap: 0 },
  row: { paddingVertical: spacing.md, borderTopWidth: 1, borderTopColor: colors.border, gap: spacing.sm },
  rowHead: { flexDirection: 'row', alignItems: 'center', flexWrap: 'wrap', gap: spacing.sm },
  who: { flexGrow: 1, flexShrink: 1, flexBasis: 200, gap: spacing.xxs },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.xs },
  /** A question asked before something is changed or removed. */
  confirm: { gap: spacing.sm, padding: spacing.md, borderRadius: radius.md, backgroundColor: colors.cautionSoft },
});
