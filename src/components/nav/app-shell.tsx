import { Link, usePathname } from 'expo-router';
import { Pressable, StyleSheet, useWindowDimensions, View } from 'react-native';
import { useSafeAreaInsets } from 'react-native-safe-area-context';

import { breakpoints, colors, radius, spacing } from '../../theme';
import { useHydrated } from '../common/use-hydrated';
import { BrandMark, Icon, Text } from '../ui';

import { destinations, isActive } from './destinations';

export const BOTTOM_BAR_HEIGHT = 64;

export interface AppShellProps {
  teamName?: string;
  userName?: string;
  /** Show the bottom bar / side rail; off for a visitor who is not signed in. */
  navigation?: boolean;
  children: React.ReactNode;
}

/**
 * The signed-in frame: a bottom bar on phones, a side rail from the wide breakpoint on.
 * Both are plain links in a landmark, so Tab and Enter reach every destination. (Link asChild hands
 * its child's style straight to the DOM on web, so those styles are flattened objects.)
 */
export function AppShell({ teamName, userName, navigation = true, children }: AppShellProps) {
  const { width } = useWindowDimensions();
  // The exported HTML is laid out for a phone; hydration keeps that first frame, then widens, because
  // React does not patch styles that differ while hydrating (public pages are hydrated in the shell).
  const hydrated = useHydrated();
  const wide = hydrated && width >= breakpoints.wide;
  const pathname = usePathname();
  const insets = useSafeAreaInsets();

  const rail = (
    <View role="navigation" aria-label="Main" style={[styles.rail, { paddingTop: insets.top + spacing.xl }]}>
      <View style={styles.railBrand}>
        <BrandMark size={32} />
        <View style={styles.railBrandText}>
          <Text variant="title" weight="bold" role={undefined} aria-level={undefined}>
            Lagline
          </Text>
          {teamName ? (
            <Text variant="caption" tone="textMuted" numberOfLines={1}>
              {teamName}
            </Text>
          ) : null}
        </View>
      </View>
      <View style={styles.railItems}>
        {destinations.map((d) => {
          const active = isActive(pathname, d.href);
          return (
            <Link key={d.href} href={d.href} asChild>
              <Pressable
                role="link"
                aria-current={active ? 'page' : undefined}
                style={StyleSheet.flatten([styles.railItem, active && styles.railItemActive])}
              >
                <Icon name={d.icon} tone={active ? 'selected' : 'textMuted'} />
                <Text weight={active ? 'semibold' : 'regular'} tone={active ? 'text' : 'textMuted'}>
                  {d.label}
                </Text>
              </Pressable>
            </Link>
          );
        })}
      </View>
      {userName ? (
        <Text variant="caption" tone="textMuted" style={styles.railUser} numberOfLines={1}>
          {`Signed in as ${userName}`}
        </Text>
      ) : null}
    </View>
  );

  const bar = (
    <View role="navigation" aria-label="Main" style={[styles.bar, { paddingBottom: insets.bottom }]}>
      {destinations.map((d) => {
        const active = isActive(pathname, d.href);
        return (
          <Link key={d.href} href={d.href} asChild>
            <Pressable role="link" aria-current={active ? 'page' : undefined} style={styles.barItem}>
              <View style={[styles.barPill, active && styles.barPillActive]}>
                <Icon name={d.icon} tone={active ? 'selected' : 'textMuted'} />
              </View>
              <Text variant="caption" weight={active ? 'semibold' : 'regular'} tone={active ? 'text' : 'textMuted'} numberOfLines={1}>
                {d.label}
              </Text>
            </Pressable>
          </Link>
        );
      })}
    </View>
  );

  // The page keeps its place among the siblings whether or not the navigation shows, so it is not
  // remounted (and loses nothing typed) when the session arrives or the window crosses the breakpoint.
  return (
    <View style={wide ? styles.wideRoot : styles.phoneRoot}>
      {navigation && wide ? rail : null}
      <View style={wide ? styles.wideContent : styles.phoneContent}>{children}</View>
      {navigation && !wide ? bar : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wideRoot: { flex: 1, flexDirection: 'row', backgroundColor: colors.background },
  rail: {
    width: 232,
    borderRightWidth: 1,
    borderRightColor: colors.border,
    backgroundColor: colors.surfaceSunk,
    paddingHorizontal: spacing.md,
    gap: spacing.xl,
  },
  railBrand: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm, paddingHorizontal: spacing.sm },
  railBrandText: { flexShrink: 1 },
  railItems: { gap: spacing.xxs },
  railItem: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: spacing.md,
    minHeight: 44,
    paddingHorizontal: spacing.md,
    borderRadius: radius.md,
    borderLeftWidth: 3,
    borderLeftColor: 'transparent',
  },
  railItemActive: { backgroundColor: colors.surface, borderLeftColor: colors.selected },
  railUser: { marginTop: 'auto', paddingHorizontal: spacing.sm, paddingBottom: spacing.xl },
  wideContent: { flex: 1 },
  phoneRoot: { flex: 1, backgroundColor: colors.background },
  phoneContent: { flex: 1 },
  bar: {
    flexDirection: 'row',
    borderTopWidth: 1,
    borderTopColor: colors.border,
    backgroundColor: colors.surface,
    minHeight: BOTTOM_BAR_HEIGHT,
  },
  barItem: { flex: 1, alignItems: 'center', justifyContent: 'center', gap: spacing.xxs, paddingVertical: spacing.xs, minHeight: BOTTOM_BAR_HEIGHT },
  barPill: { paddingHorizontal: spacing.md, paddingVertical: spacing.xxs, borderRadius: radius.pill },
  barPillActive: { backgroundColor: colors.selectedSoft },
});
