import { Link } from 'expo-router';
import { useState } from 'react';
import { Pressable, StyleSheet, View } from 'react-native';

import { can } from '../../../shared/schemas/permissions';
import { useSession } from '../../api/session';
import { useSites } from '../../api/sites';
import { colors, radius, spacing } from '../../theme';
import { formatDate } from '../common/format';
import { Loading, QueryError } from '../common/query-state';
import { Button, EmptyState, Icon, Screen, Text } from '../ui';

import { CreateSiteForm } from './create-site-form';

export function SitesScreen({ bottomInset = 0 }: { bottomInset?: number }) {
  const session = useSession();
  const sites = useSites();
  const [creating, setCreating] = useState(false);
  const canCreate = can(session.data?.role, 'site.create');

  return (
    <Screen title="Sites" intro="Plant areas and projects, each with its line list and design bases." bottomInset={bottomInset}>
      {creating ? <CreateSiteForm onDone={() => setCreating(false)} /> : null}
      {sites.isPending ? (
        <Loading label="Loading sites…" />
      ) : sites.isError ? (
        <QueryError error={sites.error} onRetry={() => void sites.refetch()} title="Could not load sites" />
      ) : sites.data.length === 0 ? (
        creating ? null : (
          <EmptyState
            icon="sites"
            title="No sites yet"
            message="A site is a plant area or project. It holds the line list of pipes and vessels, and the design bases for touch safety, energy and condensation that sizing works from."
            actionLabel={canCreate ? 'Create a site' : undefined}
            onAction={canCreate ? () => setCreating(true) : undefined}
            note={
              canCreate
                ? undefined
                : session.data?.role === 'contractor'
                  ? 'You see only the sites you are added to; an owner or engineer adds you to one from its page, under People on this site.'
                  : 'An owner or engineer on your team can create the first site.'
            }
            testID="sites-empty"
          />
        )
      ) : (
        <View style={styles.listWrap}>
          {canCreate && !creating ? <Button label="Create a site" icon="plus" variant="secondary" onPress={() => setCreating(true)} /> : null}
          <View role="list" style={styles.list} testID="sites-list">
            {sites.data.map((site) => (
              <View key={String(site.id)} role="listitem">
                <Link href={`/sites/${encodeURIComponent(String(site.id))}`} asChild>
                  <Pressable role="link" style={styles.row} testID={`site-${site.id}`}>
                    <Icon name="sites" tone="heat" />
                    <View style={styles.rowText}>
                      <Text weight="semibold">{site.name}</Text>
                      {site.description ? (
                        <Text variant="caption" tone="textMuted" numberOfLines={2}>
                          {site.description}
                        </Text>
                      ) : null}
                    </View>
                    {site.createdAt ? (
                      <Text variant="caption" tone="textMuted">
                        {`Created ${formatDate(site.createdAt)}`}
                      </Text>
                    ) : null}
                  </Pressable>
                </Link>
              </View>
            ))}
          </View>
        </View>
      )}
    </Screen>
  );
}

const styles = StyleSheet.create({
  listWrap: { gap: spacing.md },
  list: { borderWidth: 1, borderColor: colors.border, borderRadius: radius.lg, backgroundColor: colors.surface, overflow: 'hidden' },
  row: {
    flexDirection: 'row',
    alignItems: 'center',
    gap: spacing.md,
    paddingHorizontal: spacing.lg,
    paddingVertical: spacing.md,
    borderBottomWidth: 1,
    borderBottomColor: colors.border,
  },
  rowText: { flex: 1, gap: spacing.xxs },
});
