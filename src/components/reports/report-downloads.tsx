import { StyleSheet, View, type TextStyle } from 'react-native';

import { REPORTS, reportUrl, type ReportFormat } from '../../api/reports';
import type { UnitSystem } from '../../api/types';
import { colors, radius, spacing } from '../../theme';
import { Text } from '../ui';

/**
 * A link the browser downloads (the server sends the file as an attachment). react-native-web renders a
 * Text with `href` as an anchor; `hrefAttrs` carries the download attribute.
 */
export function DownloadLink({ href, label, accessibleName, testID, style }: { href: string; label: string; accessibleName?: string; testID?: string; style?: TextStyle }) {
  const anchor = { href, hrefAttrs: { download: true, rel: 'noopener' } } as Record<string, unknown>;
  return (
    <Text {...anchor} weight="semibold" style={[styles.link, style]} aria-label={accessibleName ?? label} testID={testID}>
      {label}
    </Text>
  );
}

/**
 * PDF and CSV of each report for the draft (`revision` null) or a revision, in the chosen units.
 * `label` names the list in accessible names and test ids ("Rev A", "draft").
 */
export function ReportDownloads({ siteId, revision, units, label }: { siteId: number | string; revision: number | null; units: UnitSystem; label: string }) {
  const tag = revision ? `rev-${revision}` : 'draft';
  return (
    <View role="list" style={styles.list} aria-label={`Reports of ${label}`}>
      {REPORTS.map((r) => (
        <View key={r.key} role="listitem" style={styles.row}>
          <View style={styles.text}>
            <Text weight="semibold">{r.label}</Text>
            <Text variant="caption" tone="textMuted">
              {r.description}
            </Text>
          </View>
          <View style={styles.links}>
            {(['pdf', 'csv'] as ReportFormat[]).map((format) => (
              <DownloadLink
                key={format}
                href={reportUrl(siteId, r.key, format, { revision, units })}
                label={format.toUpperCase()}
                accessibleName={`${r.label}, ${label}, ${format.toUpperCase()} in ${units === 'SI' ? 'SI' : 'US customary'} units`}
                testID={`download-${tag}-${r.key}-${format}`}
              />
            ))}
          </View>
        </View>
      ))}
    </View>
  );
}

const styles = StyleSheet.create({
  list: { gap: spacing.xs },
  row: {
    flexDirection: 'row',
    flexWrap: 'wrap',
    alignItems: 'center',
    justifyContent: 'space-between',
    gap: spacing.sm,
    paddingVertical: spacing.xs,
    borderBottomWidth: 1,
    borderBottomColor: colors.border,
  },
  text: { flexGrow: 1, flexShrink: 1, flexBasis: 220 },
  links: { flexDirection: 'row', gap: spacing.sm },
  link: {
    color: colors.heat,
    textDecorationLine: 'underline',
    paddingHorizontal: spacing.md,
    paddingVertical: spacing.sm,
    minHeight: 44,
    minWidth: 56,
    textAlign: 'center',
    borderWidth: 1,
    borderColor: colors.borderStrong,
    borderRadius: radius.md,
    backgroundColor: colors.surface,
  },
});
