import { Formik } from 'formik';
import { useRouter } from 'expo-router';
import { useEffect } from 'react';
import { StyleSheet, View } from 'react-native';

import { can } from '../../../shared/schemas/permissions';
import { REVISION_PURPOSE_LABELS, REVISION_PURPOSES, revisionPrepareSchema, type RevisionPurpose } from '../../../shared/schemas/revisions';
import { problemMessage } from '../../api/client';
import { isFinished, useSiteSizing } from '../../api/jobs';
import { usePrepareRevision, useReadiness, type Blocker } from '../../api/revisions';
import { useSession } from '../../api/session';
import { useSite } from '../../api/sites';
import { colors, radius, spacing } from '../../theme';
import { Loading, QueryError } from '../common/query-state';
import { FormErrorBanner, FormTextField, trimStrings, validateWithSchema } from '../forms';
import { SizeAll, SizingStatus } from '../lines/size-all';
import { Banner, Button, Card, ChoiceGroup, Icon, Screen, Text, TextLink } from '../ui';

import { revisionName } from './parts';

const REASON_WORD: Record<Blocker['reason'], string> = { unsized: 'Not sized', stale: 'Stale', error: 'Cannot be sized' };

/** The items that keep the draft from being issued: tag, kind and why, each with a word and an icon. */
export function BlockerList({ blockers, total }: { blockers: Blocker[]; total: number }) {
  return (
    <View style={styles.blockers}>
      <View role="list" testID="blocker-list">
        {blockers.map((b) => (
          <View key={`${b.kind}-${b.itemId}`} role="listitem" style={styles.blocker} testID={`blocker-${b.tag}`}>
            <Icon name="caution" tone="caution" size={18} />
            <View style={styles.blockerText}>
              <Text weight="semibold">{`${b.tag} · ${REASON_WORD[b.reason]}`}</Text>
              <Text variant="caption" tone="textMuted">
                {b.message}
              </Text>
            </View>
          </View>
        ))}
      </View>
      {total > blockers.length ? <Text tone="textMuted">{`… and ${total - blockers.length} more.`}</Text> : null}
    </View>
  );
}

type Values = { purpose: RevisionPurpose; description: string };

/** Prepares the next revision: what blocks it, why it is issued, and a line on what changed. */
export function PrepareRevisionScreen({ siteId }: { siteId: string }) {
  const session = useSession();
  const site = useSite(siteId);
  const readiness = useReadiness(siteId);
  const prepare = usePrepareRevision(siteId);
  const router = useRouter();
  const mayIssue = can(session.data?.role, 'revisions.issue');
  const r = readiness.data;
  // Stale and unsized items are fixed by sizing the site; items that cannot be sized need their inputs changed.
  const sizable = !!r && r.blockers.some((b) => b.reason !== 'error');
  const sizing = useSiteSizing(siteId);
  const finished = isFinished(sizing.job);
  const refetchReadiness = readiness.refetch;
  // When the site's sizing finishes, the blockers are asked for again (they are what sizing changes).
  useEffect(() => {
    if (finished) void refetchReadiness();
  }, [finished, sizing.jobId, refetchReadiness]);
  const toInput = (v: Values) => {
    const t = trimStrings(v);
    return t.description ? { purpose: t.purpose, description: t.description } : { purpose: t.purpose };
  };

  return (
    <Screen title="Prepare a revision" intro={site.data ? site.data.name : undefined} width="medium" testID="prepare-screen">
      <TextLink href={`/sites/${siteId}/revisions`}>Back to the revisions</TextLink>
      {!mayIssue ? (
        <Banner tone="info" title="Owners and engineers issue revisions">
          <Text>Your role can read revisions and download their reports.</Text>
        </Banner>
      ) : readiness.isPending ? (
        <Loading label="Checking the line list…" />
      ) : readiness.isError ? (
        <QueryError error={readiness.error} onRetry={() => void readiness.refetch()} title="Could not check the line list" />
      ) : r ? (
        <>
          {r.inProgress ? (
            <Banner tone="info" title={`${revisionName(r.inProgress)} is being signed`} testID="prepare-in-progress">
              <Text>One revision at a time: approve or withdraw it first.</Text>
              <TextLink href={`/sites/${siteId}/revisions/${r.inProgress.id}`}>{`Open ${revisionName(r.inProgress)}`}</TextLink>
            </Banner>
          ) : null}
          {r.blockerCount > 0 ? (
            <Card
              title={`${r.blockerCount} item${r.blockerCount === 1 ? '' : 's'} to fix first`}
              subtitle={
                sizable
                  ? 'Every item must be sized on its current inputs before the schedule is frozen. Size all here; the list below refreshes when sizing is done.'
                  : 'Every item must be sized on its current inputs before the schedule is frozen. Fix these items in the line list, then size the site again.'
              }
              testID="prepare-blocked"
            >
              {sizable ? (
                <View style={styles.sizing}>
                  <View style={styles.sizeAll}>
                    <SizeAll siteId={siteId} />
                  </View>
                  <SizingStatus siteId={siteId} />
                </View>
              ) : null}
              <BlockerList blockers={r.blockers} total={r.blockerCount} />
            </Card>
          ) : sizing.job?.status === 'done' ? (
            <SizingStatus siteId={siteId} />
          ) : null}
          {r.itemCount === 0 ? (
            <Banner tone="caution" title="The line list is empty">
              <Text>Add the site&apos;s lines and vessels and size them; a revision freezes them.</Text>
            </Banner>
          ) : null}
          {r.failingCount > 0 ? (
            <Banner tone="caution" title={`${r.failingCount} item${r.failingCount === 1 ? '' : 's'} do not meet a purpose`} testID="prepare-failing">
              <Text>{`They can be issued, marked in the schedule: ${r.failing.slice(0, 12).map((f) => f.tag).join(', ')}${r.failingCount > 12 ? ' …' : ''}. Check them with a competent engineer first.`}</Text>
            </Banner>
          ) : null}
          <Card title="Issue" subtitle="The snapshot is taken now; a checker and then an approver sign it.">
            <Formik<Values>
              initialValues={{ purpose: 'review', description: '' }}
              validate={(v) => validateWithSchema(revisionPrepareSchema, toInput(v))}
              onSubmit={async (values, helpers) => {
                helpers.setStatus(undefined);
                const result = await prepare.mutateAsync(toInput(values));
                if (result.kind === 'ok') {
                  router.replace(`/sites/${siteId}/revisions/${result.data.revision.id}`);
                  return;
                }
                helpers.setStatus({ error: problemMessage(result) });
                void readiness.refetch();
              }}
            >
              {(form) => (
                <View style={styles.form}>
                  <FormErrorBanner status={form.status} title="Not prepared" />
                  <ChoiceGroup
                    label="Purpose of issue"
                    value={form.values.purpose}
                    onChange={(p) => void form.setFieldValue('purpose', p)}
                    testID="prepare-purpose"
                    choices={REVISION_PURPOSES.map((p) => ({ value: p, label: REVISION_PURPOSE_LABELS[p], description: `It will be ${revisionName({ number: r.nextNumbers[p] })}.` }))}
                  />
                  <FormTextField form={form} name="description" label="What this revision is for (optional)" multiline numberOfLines={3} testID="prepare-description" />
                  <Button
                    label={`Prepare ${revisionName({ number: r.nextNumbers[form.values.purpose] })}`}
                    busy={form.isSubmitting}
                    disabled={!r.ready}
                    onPress={() => form.handleSubmit()}
                    testID="prepare-submit"
                  />
                </View>
              )}
            </Formik>
          </Card>
        </>
      ) : null}
    </Screen>
  );
}

const styles = StyleSheet.create({
  form: { gap: spacing.lg },
  sizing: { gap: spacing.sm },
  sizeAll: { flexDirection: 'row' },
  blockers: { gap: spacing.sm },
  blocker: {
    flexDirection: 'row',
    gap: spacing.sm,
    alignItems: 'flex-start',
    paddingVertical: spacing.sm,
    borderBottomWidth: 1,
    borderBottomColor: colors.border,
  },
  blockerText: { flex: 1, gap: spacing.xxs, borderRadius: radius.sm },
});
