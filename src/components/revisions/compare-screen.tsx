import { useRouter } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, useWindowDimensions, View } from 'react-native';

import { comparisonCsvUrl } from '../../api/reports';
import { comparisonQuery, useComparison, useRevisions, type ComparisonSide, type ItemChange, type Which } from '../../api/revisions';
import { breakpoints, colors, radius, spacing } from '../../theme';
import { useHydrated } from '../common/use-hydrated';
import { Loading, QueryError } from '../common/query-state';
import { DownloadLink } from '../reports';
import { Button, Card, ChoiceGroup, EmptyState, Icon, Screen, Text, TextLink } from '../ui';

import { UnitsChoice, useUnitChoice } from './parts';

const PAGE = 100;

/** `draft`, a revision id, or nothing (the server's default) from a query value. */
export function parseWhich(v: string | undefined): Which | null {
  if (v === 'draft') return 'draft';
  return v && /^\d+$/.test(v) ? Number(v) : null;
}

export const sideName = (s: ComparisonSide) => (s.kind === 'draft' ? 'the draft' : `Rev ${s.number}`);

const CHANGE_WORD = { added: 'Added', removed: 'Removed', changed: 'Changed' } as const;

/** A line of the summary: what changed, in words. */
export function countsText(c: { added: number; removed: number; changed: number; unchanged: number; thicknessChanged: number }): string {
  return `${c.added} added · ${c.removed} removed · ${c.changed} changed (${c.thicknessChanged} with a new thickness) · ${c.unchanged} unchanged`;
}

function ThicknessMark() {
  return (
    <View style={styles.mark}>
      <Icon name="caution" tone="heat" size={14} />
      <Text variant="caption" weight="semibold" tone="heat">
        Thickness changed
      </Text>
    </View>
  );
}

/** Phone: one card per item, its changed fields under it. */
function ChangeCard({ c }: { c: ItemChange }) {
  return (
    <View role="listitem" style={[styles.card, c.thicknessChanged && styles.thick]} testID={`change-${c.tag}`}>
      <View style={styles.cardHead}>
        <Text weight="semibold">{`${c.tag} · ${c.kind}`}</Text>
        <Text variant="label" tone={c.change === 'removed' ? 'fail' : c.change === 'added' ? 'pass' : 'text'}>
          {CHANGE_WORD[c.change]}
        </Text>
      </View>
      {c.thicknessChanged ? <ThicknessMark /> : null}
      {c.change !== 'changed' ? (
        <Text variant="caption" tone="textMuted">
          {c.summary}
        </Text>
      ) : (
        c.fields.map((f) => (
          <View key={f.field} style={[styles.field, f.thickness && styles.fieldThick]}>
            <Text variant="caption" tone="textMuted">
              {f.label}
            </Text>
            <Text weight={f.thickness ? 'semibold' : 'regular'}>{`${f.fromText} → ${f.toText}`}</Text>
          </View>
        ))
      )}
    </View>
  );
}

/** Wide: a table, one row per changed field, thickness rows tinted and marked. */
function ChangeTable({ changes }: { changes: ItemChange[] }) {
  const head = ['Tag', 'Change', 'Field', 'Was', 'Now'];
  return (
    <View role="table" style={styles.table} testID="changes-table">
      <View role="row" style={[styles.tr, styles.th]}>
        {head.map((h, i) => (
          <View key={h} role="columnheader" style={[styles.td, COLS[i]]}>
            <Text variant="label">{h}</Text>
          </View>
        ))}
      </View>
      {changes.flatMap((c) => {
        const rows = c.change === 'changed' ? c.fields.map((f) => ({ key: `${c.key}-${f.field}`, field: f.label, was: f.fromText, now: f.toText, thick: f.thickness })) : [{ key: c.key, field: '', was: c.change === 'removed' ? c.summary : '', now: c.change === 'added' ? c.summary : '', thick: false }];
        return rows.map((row, k) => (
          <View key={row.key} role="row" style={[styles.tr, row.thick && styles.thick]} testID={k === 0 ? `change-${c.tag}` : undefined}>
            <View role="cell" style={[styles.td, COLS[0]]}>
              <Text weight="semibold">{k === 0 ? c.tag : ''}</Text>
            </View>
            <View role="cell" style={[styles.td, COLS[1]]}>
              <Text tone={c.change === 'removed' ? 'fail' : c.change === 'added' ? 'pass' : 'text'}>{k === 0 ? CHANGE_WORD[c.change] : ''}</Text>
            </View>
            <View role="cell" style={[styles.td, COLS[2]]}>
              <Text>{row.field}</Text>
              {row.thick ? <ThicknessMark /> : null}
            </View>
            <View role="cell" style={[styles.td, COLS[3]]}>
              <Text>{row.was}</Text>
            </View>
            <View role="cell" style={[styles.td, COLS[4]]}>
              <Text weight={row.thick ? 'semibold' : 'regular'}>{row.now}</Text>
            </View>
          </View>
        ));
      })}
    </View>
  );
}

/** Compares two revisions, or a revision with the draft, line by line. */
export function CompareScreen({ siteId, from: fromParam, to: toParam }: { siteId: string; from?: string; to?: string }) {
  const router = useRouter();
  const { width } = useWindowDimensions();
  const wide = useHydrated() && width >= breakpoints.wide;
  const [units, setUnits] = useUnitChoice();
  const [shown, setShown] = useState(PAGE);
  const [only, setOnly] = useState<'all' | 'thickness'>('all');
  const from = parseWhich(fromParam);
  const to = parseWhich(toParam) ?? 'draft';
  const revisions = useRevisions(siteId);
  const list = revisions.data ?? [];
  const comparison = useComparison(siteId, from, to, units, revisions.isSuccess && list.length > 0);

  const c = comparison.data;
  const currentFrom = c ? (c.from.kind === 'draft' ? 'draft' : String(c.from.id)) : from === null ? null : String(from);
  const pick = (side: 'from' | 'to', v: string) => {
    setShown(PAGE);
    router.setParams({ from: side === 'from' ? v : (currentFrom ?? ''), to: side === 'to' ? v : String(to) });
  };
  const sideChoices = () => [
    { value: 'draft', label: 'Draft' },
    ...list.map((r) => ({ value: String(r.id), label: `Rev ${r.number}${r.status === 'issued' ? '' : ' (not issued)'}` })),
  ];
  const changes = c ? (only === 'thickness' ? c.changes.filter((x) => x.thicknessChanged) : c.changes) : [];

  return (
    <Screen title="Compare" intro="Line by line: items added, removed and changed, field by field." testID="compare-screen">
      <TextLink href={`/sites/${siteId}/revisions`}>Back to the revisions</TextLink>
      {revisions.isPending ? (
        <Loading label="Loading revisions…" />
      ) : revisions.isError ? (
        <QueryError error={revisions.error} onRetry={() => void revisions.refetch()} />
      ) : list.length === 0 ? (
        <EmptyState title="Nothing to compare yet" message="A comparison needs at least one revision. Prepare one from the revisions page." testID="compare-empty" />
      ) : (
        <>
          <Card>
            <View style={styles.pickers}>
              <View style={styles.shrink}>
                <ChoiceGroup label="From" compact value={currentFrom} choices={sideChoices()} onChange={(v) => pick('from', v)} testID="compare-from" />
              </View>
              <View style={styles.shrink}>
                <ChoiceGroup label="To" compact value={String(to)} choices={sideChoices()} onChange={(v) => pick('to', v)} testID="compare-to" />
              </View>
              <UnitsChoice value={units} onChange={setUnits} />
            </View>
          </Card>
          {comparison.isPending ? (
            <Loading label="Comparing…" />
          ) : comparison.isError ? (
            <QueryError error={comparison.error} onRetry={() => void comparison.refetch()} title="Could not compare" />
          ) : c ? (
            <>
              <View style={styles.summary} testID="compare-summary">
                <Text variant="title">{`From ${sideName(c.from)} to ${sideName(c.to)}`}</Text>
                <Text testID="compare-counts">{countsText(c.counts)}</Text>
                <View style={styles.pickers}>
                  <ChoiceGroup
                    label="Show"
                    compact
                    value={only}
                    onChange={(v) => {
                      setOnly(v);
                      setShown(PAGE);
                    }}
                    choices={[
                      { value: 'all', label: 'Every change' },
                      { value: 'thickness', label: 'Thickness changes only' },
                    ]}
                  />
                  <DownloadLink
                    href={comparisonCsvUrl(siteId, comparisonQuery(c.from.kind === 'draft' ? 'draft' : c.from.id, c.to.kind === 'draft' ? 'draft' : c.to.id, units))}
                    label="Download CSV"
                    accessibleName={`Comparison from ${sideName(c.from)} to ${sideName(c.to)}, CSV`}
                    testID="compare-csv"
                  />
                </View>
              </View>
              {changes.length === 0 ? (
                <Text tone="textMuted" testID="compare-none">
                  {only === 'thickness' ? 'No thickness changed.' : 'The two line lists are the same.'}
                </Text>
              ) : wide ? (
                <ChangeTable changes={changes.slice(0, shown)} />
              ) : (
                <View role="list" style={styles.cards} testID="changes-cards">
                  {changes.slice(0, shown).map((x) => (
                    <ChangeCard key={x.key} c={x} />
                  ))}
                </View>
              )}
              {changes.length > shown ? <Button label={`Show ${Math.min(PAGE, changes.length - shown)} more of ${changes.length - shown}`} variant="secondary" onPress={() => setShown(shown + PAGE)} /> : null}
            </>
          ) : null}
        </>
      )}
    </Screen>
  );
}

const COLS = [{ flex: 1.2 }, { flex: 0.9 }, { flex: 1.6 }, { flex: 2.2 }, { flex: 2.2 }];

const styles = StyleSheet.create({
  shrink: { flexShrink: 1, maxWidth: '100%' },
  pickers: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.lg, alignItems: 'flex-end' },
  summary: { gap: spacing.sm },
  cards: { gap: spacing.md },
  card: { gap: spacing.xs, padding: spacing.md, borderWidth: 1, borderColor: colors.border, borderRadius: radius.md, backgroundColor: colors.surface },
  cardHead: { flexDirection: 'row', justifyContent: 'space-between', gap: spacing.sm },
  thick: { backgroundColor: colors.heatSoft, borderColor: colors.heat },
  field: { paddingVertical: spacing.xxs, paddingHorizontal: spacing.xs, borderRadius: radius.sm },
  fieldThick: { backgroundColor: colors.surface },
  mark: { flexDirection: 'row', alignItems: 'center', gap: spacing.xxs },
  table: { borderWidth: 1, borderColor: colors.border, borderRadius: radius.md, backgroundColor: colors.surface, overflow: 'hidden' },
  tr: { flexDirection: 'row', borderBottomWidth: 1, borderBottomColor: colors.border },
  th: { backgroundColor: colors.surfaceSunk },
  td: { paddingHorizontal: spacing.sm, paddingVertical: spacing.xs, gap: spacing.xxs },
});
