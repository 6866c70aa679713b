import { useRouter } from 'expo-router';
import { useMemo, useState } from 'react';
import { StyleSheet, useWindowDimensions, View } from 'react-native';

import { can } from '../../../shared/schemas/permissions';
import { ApiProblemError } from '../../api/client';
import { useLibrary } from '../../api/library';
import { useDeleteItem, useItem, useSizingSettings, useUpdateItem } from '../../api/lines';
import { useSession } from '../../api/session';
import { useSite } from '../../api/sites';
import type { SizingBases } from '../../../shared/calc/sizing/types';
import type { ItemKind, ItemSizing, LibraryPayload, Line, Purpose, SiteDetail, Vessel } from '../../api/types';
import { formatMoney, formatSignificant, formatTemperature, formatThickness, significant } from '../../calc/format';
import { annualEnergy } from '../../calc/energy';
import type { UnitSystem } from '../../calc/units';
import { breakpoints, colors, spacing } from '../../theme';
import { formatDate, formatDateTime } from '../common/format';
import { Loading, QueryError } from '../common/query-state';
import { useHydrated } from '../common/use-hydrated';
import { finishOptions, libraryName, materialOptions } from '../library/library-options';
import { ChartsPanel } from '../quick-sizing/charts-panel';
import { MethodPanel } from '../quick-sizing/method-panel';
import { OptionChips } from '../quick-sizing/option-chips';
import { ResultValue, VerdictBadge } from '../quick-sizing/result-value';
import { SiteSectionTabs } from '../sites/site-section-nav';
import { Banner, Button, Card, PageTitle, Screen, Text, TextLink } from '../ui';

import { ConfirmDelete } from './confirm-delete';
import { Facts } from './facts';
import { analyseItem, contextOf, energyAssumptionsOf, taskOfItem } from './item-analysis';
import { ItemForm } from './item-form';
import { itemToForm } from './item-form-model';
import { StatusMark } from './item-rows';
import { BASIS_LABELS, HEAD_TYPE_LABELS, KIND_WORDS, PURPOSE_LABELS, PURPOSE_STATUS_WORDS } from './labels';
import { buildUpWords, siteDefaultNote } from './new-item-screen';
import { purposeNote, purposeTargets } from './purpose-target';
import { formatRow, rowStatus } from './row-format';
import { SizeAll, SizingStatus } from './size-all';

type AnyItem = Line | Vessel;

function isSizing(r: unknown): r is ItemSizing {
  return !!r && typeof r === 'object' && 'purposes' in r;
}

function inputRows(item: AnyItem, kind: ItemKind, system: UnitSystem, lib: LibraryPayload | undefined): [string, string][] {
  const cells = formatRow(item, kind, system);
  const rows: [string, string][] = [];
  if (kind === 'line') {
    const l = item as Line;
    rows.push(['Size', `${cells.size}${l.sizeGivenAs !== 'od' ? ` (OD ${formatSignificant('diameter', l.outerDiameterM, system).text})` : ''}`]);
    rows.push(['Length', cells.length]);
    rows.push(['Orientation', l.orientation === 'vertical' ? `Vertical, run ${formatSignificant('length', l.heightM ?? l.lengthM, system).text}` : 'Horizontal']);
    rows.push(['Fittings', `${l.fittings.valves} valves, ${l.fittings.flanges} flange pairs, ${l.fittings.elbows} elbows, ${l.fittings.tees} tees${l.fittingsInsulated ? '; valves and flanges covered' : '; valves and flanges bare'}`]);
  } else {
    const v = item as Vessel;
    rows.push(['Shell', `Ø ${formatSignificant('length', v.diameterM, system).text} × ${cells.length}`]);
    rows.push(['Orientation', v.orientation === 'vertical' ? 'Vertical' : 'Horizontal']);
    rows.push(['Heads', HEAD_TYPE_LABELS[v.headType]]);
  }
  rows.push(['Operating temperature', formatTemperature(item.operatingTemperatureC, system).text]);
  rows.push(['Location', cells.location]);
  rows.push(['Purposes', item.purposes.map((p) => PURPOSE_LABELS[p].label).join(', ')]);
  const hc = item.purposeParameters?.heatConservation;
  const limit = kind === 'line' ? hc?.maxHeatLossWPerM : hc?.maxHeatLossW;
  if (item.purposes.includes('heatConservation')) rows.push(['Heat-loss limit', limit !== undefined ? formatSignificant(kind === 'line' ? 'heatLossPerLength' : 'heatFlow', limit, system).text : 'the site’s rule (a share of the bare heat loss)']);
  rows.push(['Build-up', item.buildUp ? buildUpWords(item.buildUp, lib) : 'the site’s default for its service']);
  if (item.notes) rows.push(['Notes', item.notes]);
  return rows;
}

function DeleteItem({ item, kind }: { item: AnyItem; kind: ItemKind }) {
  const del = useDeleteItem(kind, item.siteId);
  const router = useRouter();
  const words = KIND_WORDS[kind];
  return (
    <ConfirmDelete
      label={`Delete ${words.one}`}
      question={`Delete ${item.tag}?`}
      consequence="Its sizing result goes with it. This cannot be undone."
      keepLabel={`Keep the ${words.one}`}
      busy={del.isPending}
      remove={() => del.mutateAsync(item.id)}
      onDeleted={() => router.replace(`/sites/${item.siteId}/${kind === 'line' ? 'lines' : 'vessels'}`)}
      testID="item-delete"
    />
  );
}

function ResultsPanel({ item, kind, result, site, system, lib, targets }: { item: AnyItem; kind: ItemKind; result: ItemSizing; site: SiteDetail | undefined; system: UnitSystem; lib: LibraryPayload | undefined; /** What each purpose asks, in the user's units. */ targets: Partial<Record<Purpose, string>> }) {
  const s = item.sizing!;
  const gain = (s.heatLossW ?? 0) < 0;
  const governing = result.governingPurpose;
  const layersText = result.layers.length > 1 ? `${result.layers.length} layers: ${result.layers.map((l) => `${formatThickness(l.thicknessM, system).text} ${libraryName(lib, l.materialId)}`).join(' + ')}` : result.layers.length === 1 ? libraryName(lib, result.layers[0].materialId) : 'no insulation needed';
  const energy = energyAssumptionsOf(site?.designBases.energy);
  const figures = energy && result.heatLossW !== undefined ? annualEnergy(Math.abs(result.heatLossW), result.bareHeatLossW !== undefined ? Math.abs(result.bareHeatLossW) : null, energy) : null;
  const perLength = kind === 'line' && s.heatLossWPerM !== undefined && s.heatLossWPerM !== null;

  return (
    <View style={styles.column}>
      <Card title="Governing thickness" subtitle={governing ? `${PURPOSE_LABELS[governing].label} governs: the thickest purpose.` : 'No purpose could be sized.'} testID="item-governing">
        <View style={styles.results}>
          <ResultValue label="Total insulation" value={formatThickness(result.totalThicknessM, system)} si={result.totalThicknessM} note={`${layersText}, under ${libraryName(lib, result.finishId)}`} testID="item-result-thickness" />
          <ResultValue
            label={`${gain ? 'Heat gain' : 'Heat loss'}${perLength ? ' per length' : ', whole vessel'}`}
            value={formatSignificant(perLength ? 'heatLossPerLength' : 'heatFlow', Math.abs(perLength ? (s.heatLossWPerM as number) : (s.heatLossW ?? NaN)), system)}
            si={perLength ? s.heatLossWPerM : s.heatLossW}
            note={`At the energy basis${result.bareHeatLossWPerM !== undefined && perLength ? `; bare ${formatSignificant('heatLossPerLength', Math.abs(result.bareHeatLossWPerM), system).text}` : result.bareHeatLossW !== undefined && !perLength ? `; bare ${formatSignificant('heatFlow', Math.abs(result.bareHeatLossW), system).text}` : ''}`}
            size="medium"
            testID="item-result-heatLoss"
          />
          {kind === 'line' && result.heatLossW !== undefined ? (
            <ResultValue label="Whole line, with valves and flanges" value={formatSignificant('heatFlow', Math.abs(result.heatLossW), system)} si={result.heatLossW} size="medium" testID="item-result-heatLossW" />
          ) : null}
          {result.surfaceTemperatureC !== null ? (
            <ResultValue
              label="Surface temperature"
              value={formatTemperature(result.surfaceTemperatureC, system)}
              si={result.surfaceTemperatureC}
              note={result.surfaceBasis ? `At the ${BASIS_LABELS[result.surfaceBasis].toLowerCase()} basis` : undefined}
              size="medium"
              testID="item-result-surface"
            />
          ) : null}
        </View>
        {result.burnVerdict !== 'notApplicable' && result.burn ? (
          <View style={styles.burn} testID="item-burn">
            <VerdictBadge
              state={result.burnVerdict === 'pass' ? 'pass' : 'fail'}
              text={result.burnVerdict === 'pass' ? `Below the burn limit of ${formatTemperature(result.burn.limitC, system).text}.` : `Above the burn limit of ${formatTemperature(result.burn.limitC, system).text}: a touch can burn.`}
            />
            <Text variant="caption" tone="textMuted">{`Limit source: ${result.burn.source}`}</Text>
          </View>
        ) : (
          <Text variant="caption" tone="textMuted" testID="item-burn">
            {result.service === 'cold' ? 'Cold service: hot-surface burn thresholds do not apply (cold contact can still harm skin).' : 'No burn check: the site has no touch-safety basis.'}
          </Text>
        )}
      </Card>

      <Card title="Each purpose" subtitle="Sized against its design basis; the thickest governs." testID="item-purposes">
        <View role="table" style={styles.table}>
          {result.purposes.map((p) => {
            const gov = p.purpose === governing;
            const thick = p.totalThicknessM !== undefined ? formatThickness(p.totalThicknessM, system).text : '—';
            const split = p.roundedLayersM && p.roundedLayersM.length > 1 ? ` (${p.roundedLayersM.map((t) => formatThickness(t, system).text).join(' + ')})` : '';
            const failing = result.failing.includes(p.purpose);
            return (
              <View key={p.purpose} role="row" style={[styles.purposeRow, gov && styles.purposeGoverns]} testID={`item-purpose-${p.purpose}`}>
                <View style={styles.purposeName}>
                  <Text weight="semibold">{PURPOSE_LABELS[p.purpose].label}</Text>
                  <Text variant="caption" tone="textMuted">{`${BASIS_LABELS[p.basis]} basis: ${targets[p.purpose] ?? p.target}`}</Text>
                  {purposeNote(p) ? (
                    <Text variant="caption" tone={failing ? 'fail' : 'textMuted'}>
                      {purposeNote(p)}
                    </Text>
                  ) : null}
                </View>
                <View style={styles.purposeFigures}>
                  <Text weight="semibold" testID={`item-purpose-${p.purpose}-thickness`}>{`${thick}${split}`}</Text>
                  <Text variant="caption" tone={failing ? 'fail' : 'textMuted'}>
                    {`${failing ? '✗ ' : ''}${PURPOSE_STATUS_WORDS[p.status]}${gov ? ' · governs' : ''}`}
                  </Text>
                </View>
              </View>
            );
          })}
        </View>
      </Card>

      <Card title="A year of it" subtitle={site?.designBases.energy ? `At the site’s energy basis: ${site.designBases.energy.operatingHoursPerYear ?? '—'} h a year.` : 'The site has no energy basis.'} testID="item-energy">
        <View style={styles.results}>
          {result.annualEnergyKWh !== null ? (
            <ResultValue label={gain ? 'Heat gained a year' : 'Heat lost a year'} value={formatSignificant('energy', result.annualEnergyKWh, system)} si={result.annualEnergyKWh} size="medium" testID="item-result-annualEnergy" />
          ) : null}
          {figures ? (
            <>
              <ResultValue label="Fuel to make it up" value={formatSignificant('energy', figures.fuelKWh, system)} si={figures.fuelKWh} note={`Heat-source efficiency ${significant((energy?.efficiency ?? 1) * 100)} %`} size="medium" testID="item-result-fuel" />
              <ResultValue label="Energy cost a year" value={formatMoney(figures.cost, energy!.currency)} si={figures.cost} size="medium" testID="item-result-cost" />
              <ResultValue label="CO₂ a year" value={formatSignificant('co2Mass', figures.co2Kg, system)} si={figures.co2Kg} note={energy!.co2Basis || undefined} size="medium" testID="item-result-co2" />
              {figures.savingCost !== null ? (
                <ResultValue
                  label="Saved against bare"
                  value={formatMoney(figures.savingCost, energy!.currency)}
                  si={figures.savingCost}
                  note={figures.savingFraction !== null ? `${significant(figures.savingFraction * 100)} % less heat than the bare ${kind}` : undefined}
                  size="medium"
                  testID="item-result-saving"
                />
              ) : null}
            </>
          ) : (
            <Text tone="textMuted">Cost and CO₂ need the energy basis’s price, efficiency and CO₂ factor.</Text>
          )}
        </View>
      </Card>
    </View>
  );
}

/** One line or vessel: its inputs, what each purpose needs, the results, charts, method and cautions. */
export function ItemScreen({ id, kind }: { id: string; kind: ItemKind }) {
  const { width } = useWindowDimensions();
  const hydrated = useHydrated();
  const large = hydrated && width >= breakpoints.large;
  const wide = hydrated && width >= breakpoints.wide;
  const session = useSession();
  const system: UnitSystem = session.data?.settings?.unitSystem ?? 'SI';
  const canEdit = can(session.data?.role, 'lines.edit');
  const item = useItem(kind, id);
  const siteId = item.data?.siteId ?? '';
  const site = useSite(siteId);
  const settings = useSizingSettings(siteId);
  const library = useLibrary();
  const update = useUpdateItem(kind, id);
  const [editing, setEditing] = useState(false);
  const [chartPurpose, setChartPurpose] = useState<string | null>(null);
  const words = KIND_WORDS[kind];

  const analysis = useMemo(() => {
    if (!item.data || !site.data || !settings.data || !library.data) return null;
    try {
      return analyseItem(taskOfItem(item.data, kind), contextOf(site.data.designBases, settings.data, library.data));
    } catch {
      return null;
    }
  }, [item.data, site.data, settings.data, library.data, kind]);

  if (item.isPending) {
    return (
      <Screen title={words.One}>
        <Loading label={`Loading the ${words.one}…`} />
      </Screen>
    );
  }
  if (item.isError) {
    const missing = item.error instanceof ApiProblemError && item.error.problem.kind === 'not-found';
    return (
      <Screen title={missing ? `${words.One} not found` : words.One}>
        {missing ? (
          <Text tone="textMuted" testID="item-missing">{`This ${words.one} is not in your team, or it was deleted.`}</Text>
        ) : (
          <QueryError error={item.error} onRetry={() => void item.refetch()} title={`Could not load the ${words.one}`} />
        )}
        <TextLink href="/sites">Back to all sites</TextLink>
      </Screen>
    );
  }

  const it = item.data as AnyItem;
  const status = rowStatus(it);
  const stored = it.sizing?.result;
  const result = isSizing(stored) ? stored : null;
  const storedError = stored && !isSizing(stored) ? stored.error : null;
  const views = analysis?.kind === 'ok' ? analysis.views : [];
  const shownPurpose = chartPurpose ?? result?.governingPurpose ?? views[0]?.purpose ?? null;
  const view = views.find((v) => v.purpose === shownPurpose) ?? views[0];
  // Targets from the current inputs; a stale result keeps the words it was sized with.
  const targets = analysis?.kind === 'ok' && status.state !== 'stale' && site.data ? purposeTargets(analysis.plan, site.data.designBases as SizingBases, system) : {};
  const materials = materialOptions(library.data, system);
  const finishes = finishOptions(library.data);

  return (
    <Screen testID="item-screen">
      <SiteSectionTabs siteId={it.siteId} siteName={site.data?.name} current={kind === 'line' ? 'lines' : 'vessels'} />
      <PageTitle title={it.tag} intro={it.service || undefined} />
      <View style={styles.stateRow}>
        <StatusMark status={status} testID="item-state" />
        <Text variant="caption" tone="textMuted">
          {it.sizing ? `Sized ${formatDateTime(it.sizing.sizedAt)}` : `Added ${formatDate(it.createdAt)}`}
        </Text>
      </View>
      {status.state === 'unsized' ? (
        <Banner tone="info" title="Not sized yet" testID="item-unsized">
          <Text>{`Size the site to work out this ${words.one}’s thickness for each of its purposes.`}</Text>
        </Banner>
      ) : status.state === 'stale' ? (
        <Banner tone="caution" title="Stale: the inputs changed since sizing" testID="item-stale">
          <Text>The results below were worked out from earlier inputs (this item, its build-up, the site’s bases or settings, or a team material). Size the site again to bring them up to date; the charts already show the current inputs.</Text>
        </Banner>
      ) : null}
      {storedError ? (
        <Banner tone="fail" title="Sizing failed for this item">
          {storedError.message}
        </Banner>
      ) : null}
      {result && result.failing.length > 0 ? (
        <Banner tone="fail" title="Fails a purpose" testID="item-failing">
          {`${result.failing.map((p) => PURPOSE_LABELS[p].label).join(', ')}: see each purpose below for why and what would help.`}
        </Banner>
      ) : null}

      {editing && item.data ? (
        <ItemForm
          kind={kind}
          system={system}
          start={{ ...itemToForm(it, kind, system, settings.data?.defaultBuildUps[result?.service ?? 'hot']), version: it.version }}
          materials={materials}
          finishes={finishes}
          siteDefaultNote={siteDefaultNote(settings.data?.defaultBuildUps, library.data)}
          submit={(input) => update.mutateAsync(input)}
          onDone={() => setEditing(false)}
          onCancel={() => setEditing(false)}
        />
      ) : (
        <>
          <SizingStatus siteId={it.siteId} />
          <View style={styles.actions}>
            {canEdit ? <Button label={`Edit ${words.one}`} onPress={() => setEditing(true)} testID="item-edit" /> : null}
            <SizeAll siteId={it.siteId} compact={status.state !== 'unsized' && status.state !== 'stale'} />
            {canEdit ? <DeleteItem item={it} kind={kind} /> : null}
          </View>
          {(() => {
            const inputs = (
              <View key="inputs" style={large ? styles.inputsWide : styles.column}>
                <Card title="Inputs" testID="item-inputs">
                  <Facts rows={inputRows(it, kind, system, library.data)} />
                </Card>
              </View>
            );
            const results = (
              <View key="results" style={large ? styles.resultsWide : styles.column}>
                {result && it.sizing ? (
                  <ResultsPanel item={it} kind={kind} result={result} site={site.data} system={system} lib={library.data} targets={targets} />
                ) : !storedError ? (
                  <Card title="Results">
                    <Text tone="textMuted">{`No results yet: size the site and this ${words.one}’s thickness, heat loss and surface temperature appear here.`}</Text>
                  </Card>
                ) : null}
              </View>
            );
            // Results first on a phone (what the page is for); inputs beside them on a large screen.
            return <View style={large ? styles.sideBySide : styles.column}>{large ? [inputs, results] : [results, inputs]}</View>;
          })()}
          {analysis?.kind === 'error' ? (
            <Banner tone="fail" title="Cannot chart these inputs">
              {analysis.message}
            </Banner>
          ) : null}
          {views.length > 0 && view ? (
            <View style={styles.column} testID="item-charts">
              {views.length > 1 ? (
                <OptionChips
                  label="Charts for"
                  value={view.purpose}
                  options={views.map((v) => ({ value: v.purpose, label: PURPOSE_LABELS[v.purpose].label, note: v.purpose === result?.governingPurpose ? 'governs' : undefined }))}
                  onChange={(p) => setChartPurpose(p)}
                  testID="item-chart-purpose"
                />
              ) : null}
              {view.output.kind === 'ok' ? (
                <ChartsPanel draft={view.draft} output={view.output} system={system} wide={wide} />
              ) : (
                <Banner tone="caution" title={`${PURPOSE_LABELS[view.purpose].label}: no curve`}>
                  {view.output.message}
                </Banner>
              )}
              <Text variant="caption" tone="textMuted">
                {`Curves re-run the ${PURPOSE_LABELS[view.purpose].label.toLowerCase()} case at its design basis for every thickness of the site’s series; inputs as they are now${status.state === 'stale' ? ' (newer than the stored result)' : ''}.`}
              </Text>
            </View>
          ) : null}
          <MethodPanel result={view?.output.kind === 'ok' ? { ...view.output.result, warnings: result?.warnings ?? view.output.result.warnings } : null} />
        </>
      )}
    </Screen>
  );
}

const styles = StyleSheet.create({
  stateRow: { flexDirection: 'row', flexWrap: 'wrap', alignItems: 'center', gap: spacing.md },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm, alignItems: 'flex-start' },
  sideBySide: { flexDirection: 'row', gap: spacing.lg, alignItems: 'flex-start' },
  inputsWide: { flex: 2, gap: spacing.lg },
  resultsWide: { flex: 3, gap: spacing.lg },
  column: { gap: spacing.lg },
  results: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.lg },
  burn: { gap: spacing.xs },
  table: { borderTopWidth: 1, borderTopColor: colors.border },
  purposeRow: { flexDirection: 'row', gap: spacing.md, paddingVertical: spacing.sm, paddingHorizontal: spacing.xs, borderBottomWidth: 1, borderBottomColor: colors.border },
  purposeGoverns: { borderLeftWidth: 3, borderLeftColor: colors.heat, backgroundColor: colors.heatSoft },
  purposeName: { flex: 1, gap: spacing.xxs },
  purposeFigures: { alignItems: 'flex-end', gap: spacing.xxs },
});
