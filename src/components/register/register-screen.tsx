import { Link, useRouter } from 'expo-router';
import { useState } from 'react';
import { Pressable, StyleSheet, useWindowDimensions, View } from 'react-native';

import { can } from '../../../shared/schemas/permissions';
import { exportUrl, useRegister, type RegisterCounts, type RegisterFilters, type RegisterRow } from '../../api/register';
import { useSession } from '../../api/session';
import { useSites } from '../../api/sites';
import type { UnitSystem } from '../../calc/units';
import { breakpoints, colors, radius, spacing } from '../../theme';
import { formatDate } from '../common/format';
import { Loading, QueryError } from '../common/query-state';
import { useHydrated } from '../common/use-hydrated';
import { SelectField } from '../ui/select-field';
import { Button, ChoiceGroup, EmptyState, Screen, Text, TextField } from '../ui';

import { PinnedBar } from './pinned-bar';
import { StatusBadge } from './status-badge';
import { VerdictBadge } from './verdict-badge';
import { METHOD_WORDS, wholeDegrees } from './words';

type StatusFilter = 'active' | 'open' | 'actionAssigned' | 'madeSafe' | 'closed' | 'all';
type VerdictFilter = 'any' | 'fail' | 'caution' | 'pass';

const STATUS_FILTERS: { value: StatusFilter; label: string }[] = [
  { value: 'active', label: 'Needs work' },
  { value: 'open', label: 'Open' },
  { value: 'actionAssigned', label: 'Assigned' },
  { value: 'madeSafe', label: 'To verify' },
  { value: 'closed', label: 'Closed' },
  { value: 'all', label: 'All' },
];
const VERDICT_FILTERS: { value: VerdictFilter; label: string }[] = [
  { value: 'any', label: 'Any verdict' },
  { value: 'fail', label: 'Fail' },
  { value: 'caution', label: 'Caution' },
  { value: 'pass', label: 'Pass' },
];

const NEW_ENTRY_SPACE = 84;

/** The link a row opens: the entry, or (for a calculated risk) a new entry recorded from it. */
function rowHref(r: RegisterRow): string {
  if (r.source === 'measured' && r.id !== null) return `/register/${r.id}`;
  const q = new URLSearchParams({ siteId: String(r.siteId), itemId: String(r.item?.id ?? ''), method: 'calculated', location: r.item?.tag ?? r.location });
  if (r.surfaceMaterial) q.set('material', r.surfaceMaterial);
  return `/register/new?${q.toString()}`;
}

function Reading({ r, system }: { r: RegisterRow; system: UnitSystem }) {
  const limit = r.verdict.limitC === null ? 'cold' : `limit ${wholeDegrees(r.verdict.limitC, system)}`;
  return (
    <View style={styles.reading}>
      <Text weight="bold" testID={`register-row-${r.key}-temperature`}>
        {wholeDegrees(r.measuredTemperatureC, system)}
      </Text>
      <Text variant="caption" tone="textMuted">{`${METHOD_WORDS[r.method].toLowerCase()} · ${limit}`}</Text>
    </View>
  );
}

function RowCard({ r, system, wide }: { r: RegisterRow; system: UnitSystem; wide: boolean }) {
  const who = r.owner ? `${r.owner.name}${r.dueDate ? ` · due ${formatDate(r.dueDate)}` : ''}` : r.source === 'calculated' ? 'Record it on the register' : 'Not assigned';
  return (
    <View role="listitem">
      <Link href={rowHref(r) as never} asChild>
        <Pressable role="link" style={wide ? styles.tableRow : styles.card} testID={`register-row-${r.key}`} {...({ dataSet: { source: r.source, status: r.status ?? 'calculated' } } as object)}>
          <View style={wide ? styles.colWhere : styles.cardHead}>
            <Text weight="semibold" numberOfLines={2}>
              {r.location}
            </Text>
            <Text variant="caption" tone="textMuted" numberOfLines={1}>
              {[r.siteName, r.item && r.item.tag !== r.location ? `${r.item.kind} ${r.item.tag}` : null, r.source === 'calculated' ? 'calculated by sizing' : null].filter(Boolean).join(' · ')}
            </Text>
          </View>
          <View style={wide ? styles.colReading : styles.cardLine}>
            <Reading r={r} system={system} />
            {!wide ? <VerdictBadge verdict={r.verdict.verdict} /> : null}
          </View>
          {wide ? (
            <View style={styles.colVerdict}>
              <VerdictBadge verdict={r.verdict.verdict} />
            </View>
          ) : null}
          <View style={wide ? styles.colStatus : styles.cardLine}>
            <StatusBadge status={r.status} overdue={r.overdue} />
            <Text variant="caption" tone={r.overdue ? 'fail' : 'textMuted'} numberOfLines={1} style={wide ? undefined : styles.who}>
              {who}
            </Text>
          </View>
        </Pressable>
      </Link>
    </View>
  );
}

function countLabel(counts: RegisterCounts | undefined): string {
  if (!counts) return '';
  const active = counts.open + counts.actionAssigned + counts.madeSafe;
  return `${active} needing work · ${counts.calculated} calculated · ${counts.overdue} overdue · ${counts.verified + counts.accepted} closed`;
}

/** Download links of the register as the list is filtered. */
function Downloads({ filters }: { filters: RegisterFilters }) {
  const link = (kind: 'csv' | 'pdf', label: string) => (
    <Text
      key={kind}
      weight="semibold"
      tone="heat"
      style={styles.download}
      testID={`register-export-${kind}`}
      {...({ href: exportUrl(kind, filters), hrefAttrs: { download: '' } } as object)}
    >
      {label}
    </Text>
  );
  return <View style={styles.downloads}>{[link('pdf', 'Download PDF'), link('csv', 'Download CSV')]}</View>;
}

/**
 * The hot-surface register: every entry and calculated risk of the sites the person may read, filtered by
 * status, verdict, owner, site and due date, with the register as PDF or CSV. Map-free: a plant walk is by tag.
 */
export function RegisterScreen({ initialSiteId }: { initialSiteId?: string }) {
  const router = useRouter();
  const hydrated = useHydrated();
  const { width } = useWindowDimensions();
  const wide = hydrated && width >= breakpoints.wide;
  const session = useSession();
  const system: UnitSystem = session.data?.settings?.unitSystem ?? 'SI';
  const mayCreate = can(session.data?.role, 'surfaces.create');
  const sites = useSites();
  const [siteId, setSiteId] = useState(initialSiteId ?? '');
  const [status, setStatus] = useState<StatusFilter>('active');
  const [verdict, setVerdict] = useState<VerdictFilter>('any');
  const [mine, setMine] = useState(false);
  const [overdue, setOverdue] = useState(false);
  const [q, setQ] = useState('');
  const [showFilters, setShowFilters] = useState(false);

  const filters: RegisterFilters = {
    ...(siteId ? { siteId } : {}),
    ...(status === 'all' ? {} : { status }),
    ...(verdict === 'any' ? {} : { verdict }),
    ...(mine && session.data?.user ? { ownerId: String(session.data.user.id) } : {}),
    ...(overdue ? { overdue: 'true' as const } : {}),
    ...(q.trim() ? { q: q.trim() } : {}),
  };
  const list = useRegister(filters, !!session.data?.user);
  const rows = list.data?.pages.flatMap((p) => p.entries) ?? [];
  const counts = list.data?.pages[0]?.counts;
  const newEntryHref = `/register/new${siteId ? `?siteId=${siteId}` : ''}`;

  const extraFilters = [siteId !== '', verdict !== 'any', mine, overdue, q.trim() !== ''].filter(Boolean).length;
  const statusChips = <ChoiceGroup compact label="Status" value={status} choices={STATUS_FILTERS} onChange={setStatus} testID="register-status" />;
  const more = (
    <>
      <View style={wide ? styles.filterRow : styles.filterStack}>
        <View style={wide ? styles.siteSelect : undefined}>
          <SelectField
            label="Site"
            value={siteId}
            options={[{ value: '', label: 'All sites' }, ...(sites.data ?? []).map((s) => ({ value: String(s.id), label: s.name }))]}
            onChange={setSiteId}
            testID="register-site"
          />
        </View>
        <View style={wide ? styles.search : undefined}>
          <TextField label="Search" value={q} onChangeText={setQ} placeholder="Location, tag or description" testID="register-search" />
        </View>
      </View>
      <View style={wide ? styles.filterRow : styles.filterStack}>
        <ChoiceGroup compact label="Verdict" value={verdict} choices={VERDICT_FILTERS} onChange={setVerdict} testID="register-verdict" />
        <View style={styles.toggles}>
          <Button label={mine ? '✓ Mine only' : 'Mine only'} variant="secondary" onPress={() => setMine((m) => !m)} testID="register-mine" aria-pressed={mine} />
          <Button label={overdue ? '✓ Overdue only' : 'Overdue only'} variant="secondary" onPress={() => setOverdue((o) => !o)} testID="register-overdue" aria-pressed={overdue} />
        </View>
      </View>
    </>
  );
  // On a phone the list comes first: status stays in view, the other filters open on request.
  const filtersPanel = (
    <View style={styles.filters} testID="register-filters">
      {statusChips}
      {wide || showFilters ? more : null}
      {!wide ? (
        <Button
          label={showFilters ? 'Fewer filters' : extraFilters ? `More filters (${extraFilters} on)` : 'More filters'}
          variant="quiet"
          onPress={() => setShowFilters((v) => !v)}
          testID="register-more-filters"
          aria-expanded={showFilters}
        />
      ) : null}
    </View>
  );

  let body: React.ReactNode;
  if (list.isPending) body = <Loading label="Loading the register…" />;
  else if (list.isError) body = <QueryError error={list.error} onRetry={() => void list.refetch()} title="Could not load the register" />;
  else if (rows.length === 0) {
    const filtered = Object.keys(filters).some((k) => k !== 'status') || status !== 'active';
    body = (
      <EmptyState
        icon="caution"
        title={filtered ? 'Nothing matches these filters' : 'No hot surfaces need work'}
        message={
          filtered
            ? 'Try another status or verdict, or all sites.'
            : 'The register lists hot and very cold surfaces found on the plant, and lines whose sizing leaves them above the touch limit. Record one when you find it on a walk.'
        }
        actionLabel={mayCreate ? 'Record a hot surface' : undefined}
        onAction={mayCreate ? () => router.push(newEntryHref as never) : undefined}
        testID="register-empty"
      />
    );
  } else {
    body = (
      <View style={styles.listWrap}>
        {wide ? (
          <View style={styles.tableHead} aria-hidden>
            {['Location', 'Surface', 'Verdict', 'Status and owner'].map((h, i) => (
              <Text key={h} variant="caption" weight="semibold" tone="textMuted" style={[styles.colWhere, styles.colReading, styles.colVerdict, styles.colStatus][i]}>
                {h}
              </Text>
            ))}
          </View>
        ) : null}
        <View role="list" style={wide ? styles.table : styles.cards} testID="register-list">
          {rows.map((r) => (
            <RowCard key={r.key} r={r} system={system} wide={wide} />
          ))}
        </View>
        {list.hasNextPage ? <Button label="Show more" variant="secondary" busy={list.isFetchingNextPage} onPress={() => void list.fetchNextPage()} testID="register-more" /> : null}
      </View>
    );
  }

  return (
    <View style={styles.root}>
      <Screen title="Hot-surface register" intro={countLabel(counts) || 'Hot and very cold surfaces, judged against the touch limit, until each is fixed and verified.'} bottomInset={!wide && mayCreate ? NEW_ENTRY_SPACE : 0} testID="register-screen">
        {wide ? (
          <View style={[styles.head, styles.headWide]}>
            {mayCreate ? <Button label="Record a hot surface" icon="plus" onPress={() => router.push(newEntryHref as never)} testID="register-new" /> : null}
            <Downloads filters={filters} />
          </View>
        ) : null}
        {filtersPanel}
        {body}
        {!wide ? <Downloads filters={filters} /> : null}
        <Text variant="caption" tone="textMuted">
          Verdicts screen each surface against the ISO 13732-1 burn threshold for its material and contact time (ASTM C1055 5 s basis), or the site&apos;s touch limit. They are an aid to, not a substitute for, a competent person, the plant&apos;s specification and local codes.
        </Text>
      </Screen>
      {!wide && mayCreate ? (
        <PinnedBar>
          <Button label="Record a hot surface" icon="plus" block onPress={() => router.push(newEntryHref as never)} testID="register-new" style={styles.barButton} />
        </PinnedBar>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  root: { flex: 1 },
  head: { gap: spacing.sm },
  headWide: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between' },
  downloads: { flexDirection: 'row', gap: spacing.lg, flexWrap: 'wrap' },
  download: { minHeight: 44, paddingVertical: spacing.sm, textDecorationLine: 'underline' },
  filters: { gap: spacing.md },
  filterRow: { flexDirection: 'row', gap: spacing.lg, alignItems: 'flex-end', flexWrap: 'wrap' },
  filterStack: { gap: spacing.md },
  siteSelect: { width: 320 },
  search: { flex: 1 },
  toggles: { flexDirection: 'row', gap: spacing.sm, flexWrap: 'wrap' },
  listWrap: { gap: spacing.md },
  cards: { gap: spacing.sm },
  card: {
    gap: spacing.sm,
    padding: spacing.md,
    minHeight: 44,
    borderWidth: 1,
    borderColor: colors.border,
    borderRadius: radius.lg,
    backgroundColor: colors.surface,
  },
  cardHead: { gap: spacing.xxs },
  cardLine: { flexDirection: 'row', alignItems: 'center', justifyContent: 'space-between', gap: spacing.sm },
  who: { flexShrink: 1, textAlign: 'right' },
  table: { borderWidth: 1, borderColor: colors.border, borderRadius: radius.lg, backgroundColor: colors.surface, overflow: 'hidden' },
  tableHead: { flexDirection: 'row', paddingHorizontal: spacing.lg, gap: spacing.md },
  tableRow: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: spacing.md,
    minHeight: 56,
    paddingHorizontal: spacing.lg,
    paddingVertical: spacing.sm,
    borderBottomWidth: 1,
    borderBottomColor: colors.border,
  },
  colWhere: { flex: 3, gap: spacing.xxs },
  colReading: { flex: 2 },
  colVerdict: { flex: 1.2 },
  colStatus: { flex: 2.2, gap: spacing.xxs },
  reading: { gap: 0 },
  barButton: { minHeight: 52 },
});
