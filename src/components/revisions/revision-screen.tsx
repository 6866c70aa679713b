import { useRouter } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { can } from '../../../shared/schemas/permissions';
import { ApiProblemError, problemMessage } from '../../api/client';
import { useRevision, useRevisions, useSignRevision, useWithdrawRevision, type RevisionDetail } from '../../api/revisions';
import { useSession } from '../../api/session';
import { spacing } from '../../theme';
import { formatDateTime } from '../common/format';
import { Loading, QueryError } from '../common/query-state';
import { ReportDownloads } from '../reports';
import { Banner, Button, Card, Screen, Text, TextLink } from '../ui';

import { RevisionStatusTag, SignatureList, UnitsChoice, revisionName, totalHeatText, useUnitChoice } from './parts';

/** What the signed-in member may sign on this revision, and why not when they may not. */
export function signingFor(r: Pick<RevisionDetail, 'status' | 'prepared' | 'checked'>, userId: number | string | undefined, mayIssue: boolean): { as: 'check' | 'approve' | null; reason: string | null } {
  if (r.status === 'issued') return { as: null, reason: null };
  if (!mayIssue) return { as: null, reason: 'Owners and engineers sign revisions.' };
  const me = userId === undefined ? undefined : Number(userId);
  if (r.status === 'prepared') {
    return r.prepared.userId === me ? { as: null, reason: 'You prepared this revision: another member checks it.' } : { as: 'check', reason: null };
  }
  if (r.prepared.userId === me) return { as: null, reason: 'You prepared this revision: a third member approves it.' };
  if (r.checked?.userId === me) return { as: null, reason: 'You checked this revision: a third member approves it.' };
  return { as: 'approve', reason: null };
}

function SignPanel({ revision, as }: { revision: RevisionDetail; as: 'check' | 'approve' }) {
  const sign = useSignRevision(String(revision.id));
  const [confirming, setConfirming] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const word = as === 'check' ? 'Sign as checker' : 'Approve and issue';
  return (
    <Card title={as === 'check' ? 'Check' : 'Approve'} subtitle={as === 'check' ? 'Review the schedule and the comparison, then sign.' : 'Approving issues the revision; it is read-only from then on.'} testID="sign-panel">
      {error ? (
        <Banner tone="fail" title="Not signed">
          <Text>{error}</Text>
        </Banner>
      ) : null}
      {!confirming ? (
        <Button label={word} onPress={() => setConfirming(true)} testID={`sign-${as}`} />
      ) : (
        <View style={styles.confirm} role="group" aria-label={`Confirm: ${word}`}>
          <Text>{`You sign ${revisionName(revision)} exactly as it was prepared (snapshot ${revision.snapshotHash.slice(0, 12)}…), with your name and the time.`}</Text>
          <View style={styles.row}>
            <Button
              label={as === 'check' ? 'Yes, sign as checker' : 'Yes, approve and issue'}
              busy={sign.isPending}
              testID={`sign-${as}-confirm`}
              onPress={async () => {
                setError(null);
                const result = await sign.mutateAsync({ as, snapshotHash: revision.snapshotHash });
                if (result.kind !== 'ok') setError(problemMessage(result));
                setConfirming(false);
              }}
            />
            <Button label="Not yet" variant="secondary" onPress={() => setConfirming(false)} />
          </View>
        </View>
      )}
    </Card>
  );
}

function WithdrawPanel({ revision, siteId }: { revision: RevisionDetail; siteId: string }) {
  const withdraw = useWithdrawRevision();
  const router = useRouter();
  const [confirming, setConfirming] = useState(false);
  const [error, setError] = useState<string | null>(null);
  if (!confirming) return <Button label="Withdraw this revision" variant="danger" onPress={() => setConfirming(true)} testID="withdraw" />;
  return (
    <Banner tone="caution" title={`Withdraw ${revisionName(revision)}?`}>
      <Text>It was never issued; its number is free again and its signatures go with it.</Text>
      {error ? <Text tone="fail">{error}</Text> : null}
      <View style={styles.row}>
        <Button
          label="Withdraw"
          variant="danger"
          busy={withdraw.isPending}
          testID="withdraw-confirm"
          onPress={async () => {
            const result = await withdraw.mutateAsync(revision.id);
            if (result.kind === 'ok') router.replace(`/sites/${siteId}/revisions`);
            else setError(problemMessage(result));
          }}
        />
        <Button label="Keep it" variant="secondary" onPress={() => setConfirming(false)} />
      </View>
    </Banner>
  );
}

/** One revision: its status and signatures, signing as checker or approver, its reports and comparisons. */
export function RevisionScreen({ siteId, revisionId }: { siteId: string; revisionId: string }) {
  const session = useSession();
  const revision = useRevision(revisionId);
  const revisions = useRevisions(siteId);
  const [units, setUnits] = useUnitChoice();
  const mayIssue = can(session.data?.role, 'revisions.issue');

  if (revision.isPending) {
    return (
      <Screen title="Revision">
        <Loading label="Loading the revision…" />
      </Screen>
    );
  }
  if (revision.isError) {
    const missing = revision.error instanceof ApiProblemError && revision.error.problem.kind === 'not-found';
    return (
      <Screen title={missing ? 'Revision not found' : 'Revision'}>
        {missing ? <Text tone="textMuted">This revision was withdrawn, or it is not one of your team&apos;s.</Text> : <QueryError error={revision.error} onRetry={() => void revision.refetch()} />}
        <TextLink href={`/sites/${siteId}/revisions`}>Back to the revisions</TextLink>
      </Screen>
    );
  }
  const r = revision.data;
  const sign = signingFor(r, session.data?.user?.id, mayIssue);
  const earlier = (revisions.data ?? []).filter((x) => x.id < r.id && x.status === 'issued')[0];
  const heat = totalHeatText(r.totals.heatLossW, units);
  return (
    <Screen title={`${revisionName(r)} — ${r.purposeLabel}`} intro={r.site.name} width="medium" testID="revision-screen">
      <TextLink href={`/sites/${siteId}/revisions`}>Back to the revisions</TextLink>
      <Card>
        <RevisionStatusTag status={r.status} testID="revision-status" />
        {r.description ? <Text>{r.description}</Text> : null}
        <Text variant="caption" tone="textMuted">
          {`${r.itemCount} items (${r.totals.lines} lines, ${r.totals.vessels} vessels), heat loss ${heat} · snapshot ${r.snapshotHash.slice(0, 12)}…`}
        </Text>
        <SignatureList revision={r} testID="revision-signatures" />
        {r.status === 'issued' ? (
          <Banner tone="pass" title="Issued" testID="revision-issued">
            <Text>{`Issued ${formatDateTime(r.issuedAt)}. An issued revision is read-only; changes go into the next one.`}</Text>
          </Banner>
        ) : null}
      </Card>
      {sign.as ? <SignPanel revision={r} as={sign.as} /> : sign.reason ? <Banner tone="info" title="Signing" testID="sign-not-yours">{sign.reason}</Banner> : null}
      <Card title="Review" subtitle="What is being signed, in the reports and against the draft or the previous issue.">
        <View style={styles.row}>
          <TextLink href={`/sites/${siteId}/compare?from=${r.id}&to=draft`} testID="revision-compare-draft">
            Compare with the draft
          </TextLink>
          {earlier ? (
            <TextLink href={`/sites/${siteId}/compare?from=${earlier.id}&to=${r.id}`} testID="revision-compare-previous">
              {`Compare with ${revisionName(earlier)}`}
            </TextLink>
          ) : null}
        </View>
        <UnitsChoice value={units} onChange={setUnits} />
        <ReportDownloads siteId={siteId} revision={r.id} units={units} label={revisionName(r)} />
      </Card>
      {mayIssue && r.status !== 'issued' ? <WithdrawPanel revision={r} siteId={siteId} /> : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  confirm: { gap: spacing.sm },
  row: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.md, alignItems: 'center' },
});
