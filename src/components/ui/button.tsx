import { ActivityIndicator, Pressable, StyleSheet, View, type PressableProps, type ViewStyle } from 'react-native';

import { colors, radius, spacing } from '../../theme';

import { Icon, type IconName } from './icon';
import { Text } from './text';

export type ButtonVariant = 'primary' | 'secondary' | 'quiet' | 'danger';

export interface ButtonProps extends Omit<PressableProps, 'children' | 'style'> {
  label: string;
  variant?: ButtonVariant;
  icon?: IconName;
  busy?: boolean;
  /** Stretch to the container's width (phones). */
  block?: boolean;
  style?: ViewStyle;
}

// Primary actions are ink and quiet ones steel blue; only a destructive action is red, and it always carries
// the delete icon as well, so danger never rests on a colour close to the selection or heat accents.
const look: Record<ButtonVariant, { bg: string; fg: 'onAccent' | 'text' | 'link' | 'danger'; border: string }> = {
  primary: { bg: colors.action, fg: 'onAccent', border: colors.action },
  secondary: { bg: colors.surface, fg: 'text', border: colors.borderStrong },
  quiet: { bg: 'transparent', fg: 'link', border: 'transparent' },
  danger: { bg: colors.danger, fg: 'onAccent', border: colors.danger },
};

/** A button with a visible keyboard focus ring and a busy state that keeps its size. */
export function Button({ label, variant = 'primary', icon: iconName, busy, block, disabled, style, ...rest }: ButtonProps) {
  const l = look[variant];
  const icon = iconName ?? (variant === 'danger' ? 'delete' : undefined);
  const inactive = disabled || busy;
  return (
    <Pressable
      role="button"
      accessibilityRole="button"
      aria-label={label}
      aria-busy={busy || undefined}
      aria-disabled={inactive || undefined}
      disabled={inactive}
      {...rest}
      style={(state) => {
        // Keyboard focus is drawn by the global :focus-visible rule (app/+html.tsx), so a click
        // does not leave a ring behind.
        const { pressed, hovered } = state as typeof state & { hovered?: boolean };
        return [
          styles.base,
          { backgroundColor: l.bg, borderColor: l.border },
          block && styles.block,
          variant === 'quiet' && styles.quiet,
          variant === 'danger' && styles.danger,
          (pressed || hovered) && !inactive && styles.pressed,
          inactive && styles.inactive,
          style,
        ];
      }}
    >
      <View style={styles.row}>
        {busy ? (
          <ActivityIndicator size="small" color={colors[l.fg]} />
        ) : icon ? (
          <Icon name={icon} size={18} tone={l.fg} />
        ) : null}
        <Text variant="body" weight="semibold" tone={l.fg}>
          {label}
        </Text>
      </View>
    </Pressable>
  );
}

export const focusRing: ViewStyle = {
  // react-native-web passes outline styles through to CSS.
  outlineColor: colors.focus,
  outlineStyle: 'solid',
  outlineWidth: 3,
  outlineOffset: 2,
} as ViewStyle;

const styles = StyleSheet.create({
  base: {
    minHeight: 44,
    paddingHorizontal: spacing.lg,
    paddingVertical: spacing.sm,
    borderRadius: radius.md,
    borderWidth: 1,
    alignItems: 'center',
    justifyContent: 'center',
    alignSelf: 'flex-start',
  },
  block: { alignSelf: 'stretch' },
  quiet: { paddingHorizontal: spacing.sm },
  danger: { borderWidth: 2 },
  row: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm },
  pressed: { opacity: 0.88 },
  inactive: { opacity: 0.55 },
});
