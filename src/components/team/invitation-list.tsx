import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { problemMessage } from '../../api/client';
import { useRevokeInvitation } from '../../api/team';
import { roleLabels, type Invitation } from '../../api/types';
import { colors, spacing } from '../../theme';
import { formatDate } from '../common/format';
import { Banner, Button, Card, Text } from '../ui';

export function InvitationList({ invitations, canManage }: { invitations: Invitation[]; canManage: boolean }) {
  const revoke = useRevokeInvitation();
  const [error, setError] = useState<string | null>(null);
  return (
    <Card title="Open invitations" subtitle="People who have been invited but have not joined yet.">
      {error ? <Banner tone="fail" title="Not revoked">{error}</Banner> : null}
      {invitations.length === 0 ? (
        <Text tone="textMuted" testID="invitations-empty">
          {canManage ? 'No open invitations. Invite someone with the form on this page.' : 'No open invitations. A team owner can invite people.'}
        </Text>
      ) : (
        <View role="list" testID="invitation-list">
          {invitations.map((inv) => (
            <View key={String(inv.id)} role="listitem" style={styles.row}>
              <View style={styles.who}>
                <Text weight="semibold">{inv.email}</Text>
                <Text variant="caption" tone="textMuted">
                  {`${roleLabels[inv.role] ?? inv.role} · expires ${formatDate(inv.expiresAt)}`}
                </Text>
              </View>
              {canManage ? (
                <Button
                  label="Revoke"
                  variant="danger"
                  aria-label={`Revoke the invitation for ${inv.email}`}
                  busy={revoke.isPending && revoke.variables === inv.id}
                  onPress={async () => {
                    setError(null);
                    const result = await revoke.mutateAsync(inv.id);
                    if (result.kind !== 'ok') setError(problemMessage(result));
                  }}
                />
              ) : null}
            </View>
          ))}
        </View>
      )}
    </Card>
  );
}

const styles = StyleSheet.create({
  row: { flexDirection: 'row', alignItems: 'center', flexWrap: 'wrap', gap: spacing.sm, paddingVertical: spacing.md, borderTopWidth: 1, borderTopColor: colors.border },
  who: { flexGrow: 1, flexShrink: 1, flexBasis: 200, gap: spacing.xxs },
});
