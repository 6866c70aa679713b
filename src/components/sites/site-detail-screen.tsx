import { useRouter } from 'expo-router';
import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { can } from '../../../shared/schemas/permissions';
import { ApiProblemError, problemMessage } from '../../api/client';
import { useSession } from '../../api/session';
import { useDeleteSite, useSite } from '../../api/sites';
import type { SiteDetail } from '../../api/types';
import type { UnitSystem } from '../../calc/units';
import { colors, radius, spacing } from '../../theme';
import { formatDate } from '../common/format';
import { Loading, QueryError } from '../common/query-state';
import { Banner, Button, Card, EmptyState, Screen, Text, TextLink } from '../ui';

import { BASES, displayValue, type BasisSpec, type EditScope } from './design-basis-fields';
import { SiteEditForm } from './site-edit-form';

function BasisCard({ spec, site, system, onEdit }: { spec: BasisSpec; site: SiteDetail; system: UnitSystem; onEdit?: () => void }) {
  const basis = site.designBases?.[spec.key] as Record<string, unknown> | undefined;
  return (
    <Card title={`${spec.title} basis`} subtitle={spec.purpose} testID={`basis-${spec.key}`}>
      {basis ? (
        <View role="list" style={styles.values}>
          {spec.fields.map((f) => {
            const text = displayValue(f, basis[f.key], system, basis.currency);
            return (
              <View key={f.key} role="listitem" style={styles.valueRow}>
                <Text tone="textMuted" style={styles.valueLabel}>
                  {f.label}
                </Text>
                <Text weight="semibold" tone={text ? 'text' : 'textMuted'} testID={`basis-${spec.key}-${f.key}-value`}>
                  {text ?? 'not set'}
                </Text>
              </View>
            );
          })}
        </View>
      ) : (
        <View style={styles.unset}>
          <Text tone="textMuted">{`No ${spec.title.toLowerCase()} basis yet. Sizing for this purpose needs one.`}</Text>
          {onEdit ? <Button label={`Set the ${spec.title.toLowerCase()} basis`} icon="plus" variant="secondary" onPress={onEdit} /> : null}
        </View>
      )}
      {spec.key === 'touch' ? (
        <Text variant="caption" tone="textMuted">
          Check these conditions against the plant&apos;s specification and local codes; a competent engineer decides what is safe to touch.
        </Text>
      ) : null}
    </Card>
  );
}

function DeleteSite({ site }: { site: SiteDetail }) {
  const [confirming, setConfirming] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const del = useDeleteSite();
  const router = useRouter();
  if (!confirming) return <Button label="Delete site" variant="danger" onPress={() => setConfirming(true)} testID="site-delete" />;
  return (
    <Banner tone="caution" title={`Delete ${site.name}?`} testID="site-delete-confirm">
      <Text>Its design bases and everything recorded under it go with it. This cannot be undone.</Text>
      {error ? <Text tone="fail">{error}</Text> : null}
      <View style={styles.actions}>
        <Button
          label="Delete for good"
          variant="danger"
          busy={del.isPending}
          testID="site-delete-confirm-button"
          onPress={async () => {
            setError(null);
            const result = await del.mutateAsync(site.id);
            if (result.kind === 'ok') router.replace('/sites');
            else setError(problemMessage(result));
          }}
        />
        <Button label="Keep the site" variant="secondary" onPress={() => setConfirming(false)} />
      </View>
    </Banner>
  );
}

export function SiteDetailScreen({ id }: { id: string }) {
  const session = useSession();
  const site = useSite(id);
  const [editing, setEditing] = useState(false);
  const role = session.data?.role;
  const system: UnitSystem = session.data?.settings?.unitSystem ?? 'SI';
  const scope: EditScope | null = can(role, 'site.edit') ? 'all' : can(role, 'site.editTouchBasis') ? 'touch' : null;
  const startEditing = () => setEditing(true);
  /** A safety officer may set the touch-safety basis only. */
  const mayEditBasis = (key: BasisSpec['key']) => scope === 'all' || (scope === 'touch' && key === 'touch');

  if (site.isPending) {
    return (
      <Screen title="Site">
        <Loading label="Loading the site…" />
      </Screen>
    );
  }
  if (site.isError) {
    const missing = site.error instanceof ApiProblemError && site.error.problem.kind === 'not-found';
    return (
      <Screen title={missing ? 'Site not found' : 'Site'}>
        {missing ? (
          <Text tone="textMuted" testID="site-missing">
            This site is not in your team, or it was deleted, or you have not been invited to it.
          </Text>
        ) : (
          <QueryError error={site.error} onRetry={() => void site.refetch()} title="Could not load the site" />
        )}
        <TextLink href="/sites">Back to all sites</TextLink>
      </Screen>
    );
  }

  const s = site.data;
  return (
    <Screen title={s.name} intro={s.description || undefined} testID="site-detail">
      <View style={styles.head}>
        <TextLink href="/sites">All sites</TextLink>
        <TextLink href={`/sites/${s.id}/revisions`} testID="site-revisions">
          Revisions and reports
        </TextLink>
        <Text variant="caption" tone="textMuted">
          {`Created ${formatDate(s.createdAt)}${s.updatedAt && s.updatedAt !== s.createdAt ? ` · changed ${formatDate(s.updatedAt)}` : ''}`}
        </Text>
      </View>
      {editing && scope ? (
        <SiteEditForm site={s} system={system} scope={scope} onDone={() => setEditing(false)} />
      ) : (
        <>
          {scope || can(role, 'site.delete') ? (
            <View style={styles.actions}>
              {scope ? (
                <Button label={scope === 'all' ? 'Edit site' : 'Edit touch-safety basis'} onPress={startEditing} testID="site-edit" />
              ) : null}
              {can(role, 'site.delete') ? <DeleteSite site={s} /> : null}
            </View>
          ) : null}
          {!s.description ? (
            scope === 'all' ? (
              <EmptyState
                title="No description yet"
                message="Say what this site covers — the plant area, its services and where its line list comes from — so the team knows what belongs here."
                actionLabel="Add a description"
                onAction={startEditing}
                testID="site-no-description"
              />
            ) : null
          ) : null}
          <View style={styles.bases}>
            {BASES.map((b) => (
              <View key={b.key} style={styles.basis}>
                <BasisCard spec={b} site={s} system={system} onEdit={mayEditBasis(b.key) ? startEditing : undefined} />
              </View>
            ))}
          </View>
        </>
      )}
    </Screen>
  );
}

const styles = StyleSheet.create({
  head: { gap: spacing.xs },
  actions: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.sm, alignItems: 'flex-start' },
  bases: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.lg, alignItems: 'flex-start' },
  basis: { flexGrow: 1, flexBasis: 320 },
  values: { borderTopWidth: 1, borderTopColor: colors.border },
  valueRow: {
    flexDirection: 'row',
    justifyContent: 'space-between',
    gap: spacing.md,
    paddingVertical: spacing.sm,
    borderBottomWidth: 1,
    borderBottomColor: colors.border,
  },
  valueLabel: { flexShrink: 1 },
  unset: { gap: spacing.sm, padding: spacing.md, borderRadius: radius.md, backgroundColor: colors.surfaceSunk },
});
