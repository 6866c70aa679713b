import { useState } from 'react';
import { StyleSheet, useWindowDimensions, View } from 'react-native';

import { ApiProblemError } from '../../api/client';
import { useRegisterEntry, type RegisterEntry } from '../../api/register';
import { useSession } from '../../api/session';
import { formatTemperature, formatTemperatureDelta } from '../../calc/format';
import type { UnitSystem } from '../../calc/units';
import { breakpoints, colors, spacing } from '../../theme';
import { formatDate } from '../common/format';
import { Loading, QueryError } from '../common/query-state';
import { useHydrated } from '../common/use-hydrated';
import { Banner, Button, Card, Screen, Text, TextLink } from '../ui';

import { PinnedBar } from './pinned-bar';
import { EntryComments, EntryDetails, EntryEditForm, EntryHistory, EntryPhotos } from './entry-sections';
import { StatusBadge } from './status-badge';
import { StepPanel } from './step-panel';
import { VerdictBadge } from './verdict-badge';
import { TALL_LINK, VERDICT_SHORT } from './words';

const VERDICT_SENTENCE = {
  fail: 'Above the touch limit, within reach: a touch can burn.',
  caution: 'Read the cautions below.',
  pass: 'At or below the touch limit for this surface and contact time.',
} as const;

/** Measured against the limit, large, with where the limit comes from and every caution. */
function VerdictCard({ entry, system }: { entry: RegisterEntry; system: UnitSystem }) {
  const v = entry.verdict;
  const reading = formatTemperature(entry.measuredTemperatureC ?? Number.NaN, system);
  const limit = v.limitC === null ? null : formatTemperature(v.limitC, system);
  const margin = v.marginK === null ? null : formatTemperatureDelta(Math.abs(v.marginK), system);
  return (
    <Card testID="entry-verdict-card" style={[styles.verdictCard, { borderLeftColor: colors[v.verdict] }]}>
      <View style={styles.verdictHead}>
        <VerdictBadge verdict={v.verdict} label={`${VERDICT_SHORT[v.verdict]}${v.basis === 'cold' ? ': cold surface' : ''}`} testID="entry-verdict-badge" />
        <Text tone="textMuted">{v.basis === 'cold' ? 'Not judged by the hot-surface thresholds.' : VERDICT_SENTENCE[v.verdict]}</Text>
      </View>
      <View style={styles.figures}>
        <View style={styles.figure}>
          <Text variant="caption" tone="textMuted">
            {entry.method === 'calculated' ? 'Calculated surface' : 'Measured'}
          </Text>
          <Text variant="result" testID="entry-reading" aria-label={`Measured ${reading.spoken}`}>
            {reading.text}
          </Text>
        </View>
        {limit ? (
          <View style={styles.figure}>
            <Text variant="caption" tone="textMuted">
              {v.governs === 'touchLimit' ? "Site's touch limit" : `Burn threshold, ${v.contactSeconds ?? '—'} s contact`}
            </Text>
            <Text variant="result" tone="textMuted" testID="entry-limit" aria-label={`Limit ${limit.spoken}`}>
              {limit.text}
            </Text>
          </View>
        ) : null}
      </View>
      {margin && v.marginK !== null ? <Text testID="entry-margin">{`${margin.text} ${v.marginK > 0 ? 'above' : 'below'} the limit`}</Text> : null}
      <Text variant="caption" tone="textMuted" testID="entry-limit-source">
        {v.source}
      </Text>
      {v.cautions.map((c) => (
        <Banner key={c.code} tone="caution" title="Caution" testID={`entry-caution-${c.code}`}>
          <Text>{c.message}</Text>
        </Banner>
      ))}
      {entry.verification ? (
        <Text testID="entry-verification">{`After the fix: ${formatTemperature(entry.verificationTemperatureC ?? Number.NaN, system).text} — ${VERDICT_SHORT[entry.verification.verdict].toLowerCase()}.`}</Text>
      ) : null}
      <Text variant="caption" tone="textMuted">
        A screen against ISO 13732-1 (ASTM C1055 5 s basis when no contact time is known): an aid to, not a substitute for, a competent person, the plant&apos;s specification and local codes.
      </Text>
    </Card>
  );
}

/** The action, who owns it, when it is due, and what was last said. */
function ActionCard({ entry }: { entry: RegisterEntry }) {
  return (
    <Card title="Action" testID="entry-action">
      <StatusBadge status={entry.status} overdue={entry.overdue} testID="entry-status" />
      {entry.action ? <Text testID="entry-action-text">{entry.action}</Text> : <Text tone="textMuted">No action assigned yet.</Text>}
      {entry.owner ? <Text testID="entry-owner">{`Owner: ${entry.owner.name}${entry.dueDate ? ` · due ${formatDate(entry.dueDate)}` : ''}`}</Text> : null}
      {entry.statusNote ? (
        <Text testID="entry-status-note">{`${entry.status === 'accepted' ? 'Reason' : entry.status === 'madeSafe' ? 'What was done' : 'Note'}: ${entry.statusNote}`}</Text>
      ) : null}
      {entry.closedBy ? <Text variant="caption" tone="textMuted">{`Closed by ${entry.closedBy.name}, ${formatDate(entry.closedAt)}`}</Text> : null}
    </Card>
  );
}

const BAR_SPACE = 140;

/**
 * One register entry: the reading against its limit, the action and its workflow, photos, details, comments and
 * the history of who changed what. On phones the next step sits in a bar at the bottom.
 */
export function EntryScreen({ id }: { id: string }) {
  const hydrated = useHydrated();
  const { width } = useWindowDimensions();
  const wide = hydrated && width >= breakpoints.wide;
  const session = useSession();
  const system: UnitSystem = session.data?.settings?.unitSystem ?? 'SI';
  const entry = useRegisterEntry(id);
  const [editing, setEditing] = useState(false);

  if (entry.isPending) {
    return (
      <Screen title="Register entry">
        <Loading label="Loading the entry…" />
      </Screen>
    );
  }
  if (entry.isError) {
    const missing = entry.error instanceof ApiProblemError && entry.error.problem.kind === 'not-found';
    return (
      <Screen title={missing ? 'Entry not found' : 'Register entry'}>
        {missing ? (
          <Text tone="textMuted" testID="entry-missing">
            This entry is not in your team, or its site is not one you are invited to.
          </Text>
        ) : (
          <QueryError error={entry.error} onRetry={() => void entry.refetch()} title="Could not load the entry" />
        )}
        <TextLink href="/register" style={TALL_LINK}>
          Back to the register
        </TextLink>
      </Screen>
    );
  }

  const e = entry.data;
  const steps = <StepPanel entry={e} system={system} />;
  const hasSteps = e.allowed.some((a) => ['assign', 'madeSafe', 'verify', 'sendBack', 'accept', 'reopen'].includes(a));
  const main = (
    <>
      <VerdictCard entry={e} system={system} />
      {editing ? <EntryEditForm entry={e} system={system} onDone={() => setEditing(false)} /> : <EntryDetails entry={e} system={system} />}
      {!editing && e.allowed.includes('edit') ? <Button label="Correct the entry" variant="secondary" onPress={() => setEditing(true)} testID="entry-edit-open" /> : null}
      <EntryPhotos entry={e} />
    </>
  );
  const side = (
    <>
      <ActionCard entry={e} />
      {wide && hasSteps ? <Card title="Next step">{steps}</Card> : null}
      <EntryComments entry={e} />
      <EntryHistory entry={e} system={system} />
    </>
  );

  return (
    <View style={styles.root} testID="entry-screen" {...({ dataSet: { status: e.status } } as object)}>
      <Screen title={e.location} intro={[e.siteName, e.item ? `${e.item.kind} ${e.item.tag}` : null].filter(Boolean).join(' · ')} bottomInset={!wide && hasSteps ? BAR_SPACE : 0}>
        <TextLink href="/register" style={TALL_LINK}>
          All of the register
        </TextLink>
        {wide ? (
          <View style={styles.columns}>
            <View style={styles.mainCol}>{main}</View>
            <View style={styles.sideCol}>{side}</View>
          </View>
        ) : (
          <View style={styles.stack}>
            {main}
            {side}
          </View>
        )}
      </Screen>
      {!wide && hasSteps ? (
        <PinnedBar testID="entry-bar">{steps}</PinnedBar>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  root: { flex: 1 },
  stack: { gap: spacing.lg },
  columns: { flexDirection: 'row', gap: spacing.xl, alignItems: 'flex-start' },
  mainCol: { flex: 3, gap: spacing.lg, minWidth: 0 },
  sideCol: { flex: 2, gap: spacing.lg, minWidth: 0 },
  verdictCard: { borderLeftWidth: 6 },
  verdictHead: { gap: spacing.xs },
  figures: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.xl },
  figure: { gap: spacing.xxs },
});
