import { Link, useRouter } from 'expo-router';
import { Pressable, StyleSheet, View } from 'react-native';

import { can } from '../../../shared/schemas/permissions';
import { useSiteOverview } from '../../api/lines';
import { useSession } from '../../api/session';
import { useSite } from '../../api/sites';
import type { ItemKind, SiteOverview, SiteOverviewCounts } from '../../api/types';
import { significant } from '../../calc/format';
import type { UnitSystem } from '../../calc/units';
import { colors, radius, spacing } from '../../theme';
import { BarChart } from '../charts';
import { Loading, QueryError } from '../common/query-state';
import { KIND_WORDS } from '../lines/labels';
import { SizeAll, SizingStatus } from '../lines/size-all';
import { ResultValue } from '../quick-sizing/result-value';
import { SiteSectionTabs } from '../sites/site-section-nav';
import { Card, EmptyState, Icon, PageTitle, Screen, Text, type IconName } from '../ui';

import { basisCo2Factor, basisPrice, heatFlowValue, totalCo2, totalEnergy, totalHeatFlow, totalMoney } from './overview-format';

/** Services shown in the chart; the rest are summed into one bar. */
const CHART_SERVICES = 10;

function CountLink({ siteId, kind, status, n, word, icon, tone }: { siteId: string; kind: ItemKind; status: string; n: number; word: string; icon: IconName; tone: 'fail' | 'caution' | 'textMuted' }) {
  return (
    <Link href={`/sites/${encodeURIComponent(siteId)}/${kind === 'line' ? 'lines' : 'vessels'}?status=${status}`} asChild>
      <Pressable role="link" aria-label={`${n} ${word}: show them`} style={StyleSheet.flatten(styles.count)} testID={`overview-${kind}-${status}`}>
        <Icon name={icon} tone={n > 0 ? tone : 'textMuted'} size={18} />
        <Text weight="semibold" tone={n > 0 && tone !== 'textMuted' ? tone : 'text'}>
          {n.toLocaleString('en-US')}
        </Text>
        <Text tone="textMuted">{word}</Text>
      </Pressable>
    </Link>
  );
}

function KindCard({ siteId, kind, c }: { siteId: string; kind: ItemKind; c: SiteOverviewCounts }) {
  const words = KIND_WORDS[kind];
  return (
    <Card title={`${c.items.toLocaleString('en-US')} ${c.items === 1 ? words.one : words.many}`} style={styles.kindCard} testID={`overview-${kind}s`}>
      <View style={styles.counts}>
        <CountLink siteId={siteId} kind={kind} status="failing" n={c.failing} word="failing a purpose" icon="fail" tone="fail" />
        <CountLink siteId={siteId} kind={kind} status="stale" n={c.stale} word="stale" icon="caution" tone="caution" />
        <CountLink siteId={siteId} kind={kind} status="unsized" n={c.unsized} word="not sized" icon="info" tone="textMuted" />
      </View>
    </Card>
  );
}

function Totals({ o, system }: { o: SiteOverview; system: UnitSystem }) {
  const cost = totalMoney(o.annualCost, o.currency);
  const bareCost = totalMoney(o.bareAnnualCost, o.currency);
  const savedCost = o.annualCost !== null && o.bareAnnualCost !== null && o.currency ? totalMoney((Number(o.bareAnnualCost) - Number(o.annualCost)).toFixed(2), o.currency) : null;
  const savedFraction = o.bareHeatLossKW > 0 ? 1 - o.heatLossKW / o.bareHeatLossKW : null;
  const b = o.basis;
  const basis = [
    b.operatingHoursPerYear !== null ? `${b.operatingHoursPerYear.toLocaleString('en-US')} h a year` : 'no operating hours',
    b.energyPricePerKWh !== null && o.currency ? basisPrice(b.energyPricePerKWh, o.currency, system) : 'no energy price',
    b.heatSourceEfficiency !== null ? `heat-source efficiency ${significant(b.heatSourceEfficiency * 100)} %` : null,
    b.co2KgPerKWh !== null ? `CO₂ ${basisCo2Factor(b.co2KgPerKWh, system)} of fuel${b.co2Basis ? ` (${b.co2Basis})` : ''}` : 'no CO₂ factor',
  ].filter(Boolean);
  return (
    <Card title="Totals of the sized items" subtitle={`At the energy basis: ${basis.join('; ')}.`} testID="overview-totals">
      <View style={styles.results}>
        <ResultValue label="Heat loss" value={totalHeatFlow(o.heatLossKW * 1000, system)} si={o.heatLossKW * 1000} note={`bare: ${totalHeatFlow(o.bareHeatLossKW * 1000, system).text}`} testID="overview-heatLoss" />
        <ResultValue label="Energy a year" value={totalEnergy(o.annualEnergyMWh * 1000, system)} si={o.annualEnergyMWh * 1000} note={`bare: ${totalEnergy(o.bareAnnualEnergyMWh * 1000, system).text}`} testID="overview-energy" />
        {cost ? <ResultValue label="Cost a year" value={cost} note={bareCost ? `bare: ${bareCost.text}` : undefined} testID="overview-cost" /> : null}
        {o.annualCo2Tonnes !== null ? (
          <ResultValue label="CO₂ a year" value={totalCo2(o.annualCo2Tonnes * 1000, system)} si={o.annualCo2Tonnes * 1000} note={o.bareAnnualCo2Tonnes !== null ? `bare: ${totalCo2(o.bareAnnualCo2Tonnes * 1000, system).text}` : undefined} testID="overview-co2" />
        ) : null}
      </View>
      <View style={styles.saving} testID="overview-saving">
        <Icon name="pass" tone="pass" size={20} />
        <Text>
          {`Saving against bare: ${savedCost ? `${savedCost.text} and ` : ''}${totalEnergy((o.bareAnnualEnergyMWh - o.annualEnergyMWh) * 1000, system).text} a year${
            o.annualCo2Tonnes !== null && o.bareAnnualCo2Tonnes !== null ? `, ${totalCo2((o.bareAnnualCo2Tonnes - o.annualCo2Tonnes) * 1000, system).text}` : ''
          }${savedFraction !== null ? `; ${significant(savedFraction * 100)} % less heat` : ''}.`}
        </Text>
      </View>
      {!cost ? (
        <Text variant="caption" tone="textMuted">
          Cost needs an energy price and currency in the site’s energy basis.
        </Text>
      ) : null}
    </Card>
  );
}

function ByService({ o, system }: { o: SiteOverview; system: UnitSystem }) {
  const top = o.byService.slice(0, CHART_SERVICES);
  const rest = o.byService.slice(CHART_SERVICES);
  const rows = [...top];
  if (rest.length > 0) rows.push({ service: `${rest.length} other services`, heatLossW: rest.reduce((s, r) => s + r.heatLossW, 0), annualEnergyKWh: 0, items: rest.reduce((s, r) => s + r.items, 0) });
  const unit = totalHeatFlow(1000, system).unit;
  const bars = rows.map((r, i) => ({ id: `${i}`, label: r.service, value: heatFlowValue(Math.abs(r.heatLossW), system), valueText: totalHeatFlow(Math.abs(r.heatLossW), system).text }));
  const summary = rows.map((r) => `${r.service}: ${totalHeatFlow(Math.abs(r.heatLossW), system).text} over ${r.items} items`).join('; ');
  return (
    <Card title="Heat loss by service" subtitle="Sized items at the energy basis, largest first." testID="overview-by-service">
      <BarChart title="Heat loss by service" xLabel={`Heat loss (${unit})`} bars={bars} summary={summary} testID="overview-chart" />
    </Card>
  );
}

/** A site's totals: heat loss, energy, cost and CO₂ with the saving against bare; what fails, is stale or unsized. */
export function OverviewScreen({ siteId }: { siteId: string }) {
  const session = useSession();
  const router = useRouter();
  const system: UnitSystem = session.data?.settings?.unitSystem ?? 'SI';
  const site = useSite(siteId);
  const overview = useSiteOverview(siteId);
  const canEdit = can(session.data?.role, 'lines.edit');
  const o = overview.data;
  const items = o ? o.counts.line.items + o.counts.vessel.items : 0;
  const unsized = o ? o.counts.line.unsized + o.counts.vessel.unsized : 0;

  return (
    <Screen testID="overview-screen">
      <SiteSectionTabs siteId={siteId} siteName={site.data?.name} current="overview" />
      <PageTitle title={`Overview${site.data ? ` · ${site.data.name}` : ''}`} />
      {overview.isPending ? (
        <Loading label="Adding up the site…" />
      ) : overview.isError ? (
        <QueryError error={overview.error} onRetry={() => void overview.refetch()} title="Could not load the totals" />
      ) : o && items === 0 ? (
        <EmptyState
          icon="sites"
          title="Nothing to add up yet"
          message="The overview totals the site’s sized lines and vessels: heat loss, energy, cost and CO₂ a year, the saving against bare, and what fails a purpose."
          actionLabel={canEdit ? 'Add a line' : undefined}
          onAction={canEdit ? () => router.push(`/sites/${encodeURIComponent(siteId)}/lines/new`) : undefined}
          note={canEdit ? undefined : 'An owner or engineer adds lines and vessels.'}
          testID="overview-empty"
        />
      ) : o ? (
        <>
          <SizeAll siteId={siteId} />
          <SizingStatus siteId={siteId} />
          <View style={styles.kinds}>
            <KindCard siteId={siteId} kind="line" c={o.counts.line} />
            <KindCard siteId={siteId} kind="vessel" c={o.counts.vessel} />
          </View>
          {unsized === items ? (
            <Text tone="textMuted">Nothing is sized yet: size the site and its totals appear here.</Text>
          ) : (
            <>
              <Totals o={o} system={system} />
              {o.byService.length > 0 ? <ByService o={o} system={system} /> : null}
            </>
          )}
          <Text variant="caption" tone="textMuted">
            Totals are an aid to, not a substitute for, a competent engineer’s judgement; stale items count with their last result and unsized items not at all until the site is sized again.
          </Text>
        </>
      ) : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  kinds: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.lg },
  kindCard: { flexGrow: 1, flexBasis: 300 },
  counts: { gap: spacing.xs },
  count: { flexDirection: 'row', alignItems: 'center', gap: spacing.sm, minHeight: 40, paddingHorizontal: spacing.sm, borderRadius: radius.md, backgroundColor: colors.surfaceSunk },
  results: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.lg },
  saving: { flexDirection: 'row', alignItems: 'flex-start', gap: spacing.sm, padding: spacing.md, borderRadius: radius.md, backgroundColor: colors.passSoft },
});
