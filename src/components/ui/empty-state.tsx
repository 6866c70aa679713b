import { StyleSheet, View } from 'react-native';

import { colors, radius, spacing } from '../../theme';

import { Button } from './button';
import { Icon, type IconName } from './icon';
import { Text } from './text';

export interface EmptyStateProps {
  icon?: IconName;
  title: string;
  /** What belongs here, in a sentence or two. */
  message: string;
  /** The one action that fills the screen; omitted when the viewer may not take it. */
  actionLabel?: string;
  onAction?: () => void;
  /** Shown instead of the action when the viewer's role cannot take it. */
  note?: string;
  testID?: string;
}

export function EmptyState({ icon = 'info', title, message, actionLabel, onAction, note, testID }: EmptyStateProps) {
  return (
    <View style={styles.wrap} testID={testID}>
      <View style={styles.badge}>
        <Icon name={icon} size={28} tone="heat" />
      </View>
      <Text variant="title" style={styles.center}>
        {title}
      </Text>
      <Text tone="textMuted" style={[styles.center, styles.message]}>
        {message}
      </Text>
      {actionLabel && onAction ? <Button label={actionLabel} icon="plus" onPress={onAction} style={styles.action} /> : null}
      {note ? (
        <Text variant="caption" tone="textMuted" style={styles.center}>
          {note}
        </Text>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: {
    alignItems: 'center',
    gap: spacing.md,
    paddingVertical: spacing.xxl,
    paddingHorizontal: spacing.lg,
    borderWidth: 1,
    borderStyle: 'dashed',
    borderColor: colors.borderStrong,
    borderRadius: radius.lg,
    backgroundColor: colors.surfaceSunk,
  },
  badge: {
    width: 56,
    height: 56,
    borderRadius: radius.pill,
    backgroundColor: colors.heatSoft,
    alignItems: 'center',
    justifyContent: 'center',
  },
  center: { textAlign: 'center' },
  message: { maxWidth: 480 },
  action: { alignSelf: 'center' },
});
