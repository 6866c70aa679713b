import { StyleSheet, View } from 'react-native';

import { can } from '../../../shared/schemas/permissions';
import { problemMessage } from '../../api/client';
import { isFinished, jobProgress, useSiteSizing } from '../../api/jobs';
import { useSession } from '../../api/session';
import { colors, radius, spacing } from '../../theme';
import { Banner, Button, Text } from '../ui';

const count = (n: number) => n.toLocaleString('en-US');

/** A thin progress bar that screen readers read as a progress bar with its value. */
export function ProgressBar({ value, label, testID }: { value: number; label: string; testID?: string }) {
  const pct = Math.round(Math.min(1, Math.max(0, value)) * 100);
  return (
    <View role="progressbar" aria-label={label} aria-valuemin={0} aria-valuemax={100} aria-valuenow={pct} style={styles.track} testID={testID}>
      <View style={[styles.fill, { width: `${pct}%` }]} />
    </View>
  );
}

/**
 * "Size all": owners and engineers start the site's sizing job (others see nothing here). While it runs
 * the button gives way to {@link SizingStatus}.
 */
export function SizeAll({ siteId, compact }: { siteId: number | string; compact?: boolean }) {
  const session = useSession();
  const { job, start } = useSiteSizing(siteId);
  const running = job !== null && !isFinished(job);
  if (!can(session.data?.role, 'lines.edit') || running) return null;
  return <Button label="Size all" variant={compact ? 'secondary' : 'primary'} busy={start.isPending} onPress={() => start.mutate()} testID="size-all" />;
}

/**
 * The site's sizing job as everyone sees it: a progress bar while it runs (the screen stays usable, and
 * the lists and totals refresh when it is done), then what it did.
 */
export function SizingStatus({ siteId }: { siteId: number | string }) {
  const { job, start, dismiss } = useSiteSizing(siteId);
  const running = job !== null && !isFinished(job);
  const startProblem = start.data && start.data.kind !== 'ok' ? problemMessage(start.data) : null;
  if (!startProblem && !job) return null;
  return (
    <View style={styles.wrap}>
      {startProblem ? (
        <Banner tone="fail" title="Sizing did not start">
          {startProblem}
        </Banner>
      ) : null}
      {running && job ? (
        <View style={styles.progress} testID="sizing-progress" {...({ dataSet: { status: job.status } } as object)}>
          <Text variant="label">
            {job.status === 'queued' ? 'Sizing is queued…' : `Sizing ${count(job.done)} of ${count(job.total)} items…`}
          </Text>
          <ProgressBar value={jobProgress(job)} label="Sizing progress" />
          <Text variant="caption" tone="textMuted">
            You can keep working; the list refreshes when sizing is done.
          </Text>
        </View>
      ) : null}
      {job && job.status === 'done' ? (
        <Banner tone="pass" title="Sizing done" testID="sizing-done">
          <Text>{`Sized ${count(job.total)} items against the site’s design bases.`}</Text>
          <Button label="Dismiss" variant="quiet" onPress={dismiss} />
        </Banner>
      ) : null}
      {job && job.status === 'failed' ? (
        <Banner tone="fail" title="Sizing stopped" testID="sizing-failed">
          <Text>{job.error ?? 'The job failed. Try again; if it keeps failing, report it with the site’s name.'}</Text>
          <Button label="Dismiss" variant="quiet" onPress={dismiss} />
        </Banner>
      ) : null}
    </View>
  );
}

const styles = StyleSheet.create({
  wrap: { gap: spacing.sm },
  progress: { gap: spacing.xs, padding: spacing.md, borderRadius: radius.md, borderWidth: 1, borderColor: colors.border, backgroundColor: colors.surface },
  track: { height: 8, borderRadius: radius.pill, backgroundColor: colors.surfaceSunk, overflow: 'hidden', borderWidth: 1, borderColor: colors.borderStrong },
  fill: { height: '100%', backgroundColor: colors.heat },
});
