import { Link } from 'expo-router';
import { Pressable, ScrollView, StyleSheet, View } from 'react-native';

import { colors, radius, spacing } from '../../theme';
import { Text, TextLink } from '../ui';

import { SectionIcon } from './section-icon';
import { SITE_SECTIONS } from './site-sections';

/** The site page's way into its sections: one link per section with what it holds. */
export function SiteSectionLinks({ siteId }: { siteId: number | string }) {
  return (
    <View role="navigation" aria-label="Site sections" style={styles.grid} testID="site-sections">
      {SITE_SECTIONS.map((s) => (
        <Link key={s.key} href={s.href(siteId)} asChild>
          <Pressable role="link" style={StyleSheet.flatten(styles.card)} testID={`site-section-${s.key}`}>
            <SectionIcon name={s.icon} tone="heat" />
            <View style={styles.cardText}>
              <Text weight="semibold">{s.label}</Text>
              <Text variant="caption" tone="textMuted">
                {s.description}
              </Text>
            </View>
          </Pressable>
        </Link>
      ))}
    </View>
  );
}

/**
 * The head of a section screen: back to the site, and the site's sections as tabs (the current one
 * marked with aria-current and an underline as well as colour).
 */
export function SiteSectionTabs({ siteId, siteName, current }: { siteId: number | string; siteName?: string; current: string }) {
  return (
    <View style={styles.head}>
      <View style={styles.crumbs}>
        <TextLink href="/sites" variant="caption">
          All sites
        </TextLink>
        <Text variant="caption" tone="textMuted" aria-hidden>
          ›
        </Text>
        <TextLink href={`/sites/${encodeURIComponent(String(siteId))}`} variant="caption" testID="section-site-link">
          {siteName || 'Site'}
        </TextLink>
      </View>
      <ScrollView horizontal showsHorizontalScrollIndicator={false} contentContainerStyle={styles.tabs}>
        <View role="navigation" aria-label="Site sections" style={styles.tabRow}>
          {SITE_SECTIONS.map((s) => {
            const active = s.key === current;
            return (
              <Link key={s.key} href={s.href(siteId)} asChild>
                <Pressable
                  role="link"
                  aria-current={active ? 'page' : undefined}
                  style={StyleSheet.flatten([styles.tab, active && styles.tabActive])}
                  testID={`section-tab-${s.key}`}
                >
                  <SectionIcon name={s.icon} size={18} tone={active ? 'heat' : 'textMuted'} />
                  <Text variant="label" weight={active ? 'semibold' : 'regular'} tone={active ? 'text' : 'textMuted'}>
                    {s.label}
                  </Text>
                </Pressable>
              </Link>
            );
          })}
        </View>
      </ScrollView>
    </View>
  );
}

const styles = StyleSheet.create({
  grid: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.md },
  card: {
    flexGrow: 1,
    flexBasis: 220,
    flexDirection: 'row',
    alignItems: 'flex-start',
    gap: spacing.md,
    padding: spacing.md,
    minHeight: 44,
    borderWidth: 1,
    borderColor: colors.border,
    borderRadius: radius.lg,
    backgroundColor: colors.surface,
  },
  cardText: { flex: 1, gap: spacing.xxs },
  head: { gap: spacing.xs },
  crumbs: { flexDirection: 'row', alignItems: 'center', gap: spacing.xs, flexWrap: 'wrap' },
  tabs: { flexGrow: 1 },
  tabRow: { flexDirection: 'row', gap: spacing.xxs, borderBottomWidth: 1, borderBottomColor: colors.border, flexGrow: 1 },
  tab: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: spacing.xs,
    minHeight: 44,
    paddingHorizontal: spacing.md,
    borderBottomWidth: 3,
    borderBottomColor: 'transparent',
  },
  tabActive: { borderBottomColor: colors.heat },
});
