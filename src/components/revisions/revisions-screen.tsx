import { useRouter } from 'expo-router';
import { StyleSheet, View } from 'react-native';

import { can } from '../../../shared/schemas/permissions';
import { useReadiness, useRevisions, type Revision } from '../../api/revisions';
import { useSession } from '../../api/session';
import { useSite } from '../../api/sites';
import { spacing } from '../../theme';
import { Loading, QueryError } from '../common/query-state';
import { ReportDownloads } from '../reports';
import { Banner, Button, Card, EmptyState, Screen, Text, TextLink } from '../ui';

import { RevisionStatusTag, SignatureList, UnitsChoice, revisionName, totalHeatText, useUnitChoice } from './parts';
import { RevisionSchemePanel } from './revision-scheme-panel';

function RevisionCard({ siteId, revision, units, latestIssued }: { siteId: string; revision: Revision; units: 'SI' | 'US'; latestIssued: boolean }) {
  const heat = totalHeatText(revision.totals.heatLossW, units);
  return (
    <Card testID={`revision-${revision.number}`}>
      <View style={styles.cardHead}>
        <View style={styles.cardTitle}>
          <Text variant="title">{`${revisionName(revision)} — ${revision.purposeLabel}`}</Text>
          {revision.description ? <Text tone="textMuted">{revision.description}</Text> : null}
          <Text variant="caption" tone="textMuted">
            {`${revision.itemCount} items (${revision.totals.lines} lines, ${revision.totals.vessels} vessels) · heat loss ${heat}${revision.totals.failing ? ` · ${revision.totals.failing} failing a purpose` : ''}`}
          </Text>
        </View>
        <RevisionStatusTag status={revision.status} testID={`revision-${revision.number}-status`} />
      </View>
      <SignatureList revision={revision} testID={`revision-${revision.number}-signatures`} />
      <View style={styles.links}>
        <TextLink href={`/sites/${siteId}/revisions/${revision.id}`} testID={`revision-${revision.number}-open`}>
          {revision.status === 'issued' ? 'Open' : 'Open to sign'}
        </TextLink>
        <TextLink href={`/sites/${siteId}/compare?from=${revision.id}&to=draft`} testID={`revision-${revision.number}-compare`}>
          {latestIssued ? 'Compare with the draft' : 'Compare'}
        </TextLink>
      </View>
      <ReportDownloads siteId={siteId} revision={revision.id} units={units} label={revisionName(revision)} />
    </Card>
  );
}

/** A site's revision history with who signed what and when, and the reports of the draft and each revision. */
export function RevisionsScreen({ siteId }: { siteId: string }) {
  const session = useSession();
  const site = useSite(siteId);
  const revisions = useRevisions(siteId);
  const readiness = useReadiness(siteId);
  const router = useRouter();
  const [units, setUnits] = useUnitChoice();
  const mayIssue = can(session.data?.role, 'revisions.issue');

  if (site.isError) {
    return (
      <Screen title="Revisions">
        <QueryError error={site.error} onRetry={() => void site.refetch()} title="Could not load the site" />
        <TextLink href="/sites">Back to all sites</TextLink>
      </Screen>
    );
  }
  const list = revisions.data ?? [];
  const latestIssued = list.find((r) => r.status === 'issued');
  const inProgress = list.find((r) => r.status !== 'issued');
  const r = readiness.data;
  return (
    <Screen title={site.data ? `Revisions — ${site.data.name}` : 'Revisions'} intro="The line list is edited as the draft and issued as numbered, signed revisions." testID="revisions-screen">
      <View style={styles.head}>
        <TextLink href={`/sites/${siteId}`}>Back to the site</TextLink>
      </View>
      <UnitsChoice value={units} onChange={setUnits} testID="revisions-units" />

      <Card title="Draft" subtitle="The line list as it stands now." testID="draft-card">
        {readiness.isPending ? (
          <Loading label="Checking the line list…" />
        ) : r ? (
          r.inProgress ? (
            <Banner tone="info" title={`${revisionName(r.inProgress)} is being signed`}>
              <Text>Approve or withdraw it before preparing the next revision.</Text>
            </Banner>
          ) : r.ready ? (
            <Banner tone="pass" title="Ready to issue" testID="draft-ready">
              <Text>{`All ${r.itemCount} items are sized on their current inputs.`}</Text>
            </Banner>
          ) : (
            <Banner tone="caution" title={r.itemCount === 0 ? 'Nothing to issue yet' : `${r.blockerCount} item${r.blockerCount === 1 ? '' : 's'} must be sized first`} testID="draft-blocked">
              <Text>{r.itemCount === 0 ? 'Add lines and vessels to the site, size them, then issue the schedule.' : 'Stale or unsized items block a revision. Size the site, then prepare it.'}</Text>
            </Banner>
          )
        ) : null}
        <View style={styles.links}>
          {mayIssue && !inProgress ? (
            <Button label="Prepare a revision" icon="plus" onPress={() => router.push(`/sites/${siteId}/revisions/prepare`)} testID="prepare-open" />
          ) : null}
          {list.length > 0 ? (
            <TextLink href={`/sites/${siteId}/compare?to=draft`} testID="draft-compare">
              {`Compare the draft with ${revisionName(latestIssued ?? list[0])}`}
            </TextLink>
          ) : null}
        </View>
        <ReportDownloads siteId={siteId} revision={null} units={units} label="draft" />
      </Card>

      <RevisionSchemePanel siteId={siteId} nextNumbers={r?.nextNumbers} />

      <Text variant="title">History</Text>
      {revisions.isPending ? (
        <Loading label="Loading revisions…" />
      ) : revisions.isError ? (
        <QueryError error={revisions.error} onRetry={() => void revisions.refetch()} title="Could not load revisions" />
      ) : list.length === 0 ? (
        <EmptyState
          title="No revisions yet"
          message="A revision freezes the line list with every item's sizing, the design bases and the settings, numbered and signed by a preparer, a checker and an approver."
          actionLabel={mayIssue ? 'Prepare the first revision' : undefined}
          onAction={mayIssue ? () => router.push(`/sites/${siteId}/revisions/prepare`) : undefined}
          note={mayIssue ? undefined : 'An owner or engineer prepares and signs revisions.'}
          testID="revisions-empty"
        />
      ) : (
        <View role="list" style={styles.history} testID="revisions-list">
          {list.map((rev) => (
            <View key={rev.id} role="listitem">
              <RevisionCard siteId={siteId} revision={rev} units={units} latestIssued={rev.id === latestIssued?.id} />
            </View>
          ))}
        </View>
      )}
      <Text variant="caption" tone="textMuted">
        Reports are an aid to, not a substitute for, a competent engineer&apos;s judgement, the plant&apos;s insulation specification and local codes.
      </Text>
    </Screen>
  );
}

const styles = StyleSheet.create({
  head: { gap: spacing.xs },
  cardHead: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm, justifyContent: 'space-between', alignItems: 'flex-start' },
  cardTitle: { flexShrink: 1, flexBasis: 280, flexGrow: 1, gap: spacing.xxs },
  links: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.lg, alignItems: 'center' },
  history: { gap: spacing.lg },
});
