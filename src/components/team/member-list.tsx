import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { problemMessage } from '../../api/client';
import { useChangeRole, useRemoveMember } from '../../api/team';
import { ROLES, roleLabels, type Member, type Role } from '../../api/types';
import { colors, radius, spacing } from '../../theme';
import { formatDate } from '../common/format';
import { Banner, Button, Card, ChoiceGroup, Text } from '../ui';

const roleChoices = ROLES.map((r) => ({ value: r, label: roleLabels[r] }));

function MemberRow({ member, canManage, isSelf, onRemoved }: { member: Member; canManage: boolean; isSelf: boolean; onRemoved?: (self: boolean) => void }) {
  const [editing, setEditing] = useState(false);
  const [confirming, setConfirming] = useState(false);
  const [error, setError] = useState<{ title: string; message: string } | null>(null);
  const change = useChangeRole();
  const remove = useRemoveMember();

  const pick = async (role: Role) => {
    setError(null);
    if (role === member.role) {
      setEditing(false);
      return;
    }
    const result = await change.mutateAsync({ userId: member.userId, role });
    if (result.kind === 'ok') setEditing(false);
    else setError({ title: 'Role not changed', message: problemMessage(result) });
  };

  const confirmRemove = async () => {
    setError(null);
    const result = await remove.mutateAsync(member.userId);
    if (result.kind === 'ok') {
      onRemoved?.(isSelf);
      return;
    }
    setConfirming(false);
    setError({ title: 'Not removed', message: problemMessage(result) });
  };

  return (
    <View role="listitem" style={styles.row} testID={`member-${member.email}`}>
      <View style={styles.rowHead}>
        <View style={styles.who}>
          <Text weight="semibold">{isSelf ? `${member.name} (you)` : member.name}</Text>
          <Text variant="caption" tone="textMuted">
            {member.email}
            {member.joinedAt ? ` · joined ${formatDate(member.joinedAt)}` : ''}
          </Text>
        </View>
        <View style={styles.roleTag}>
          <Text variant="label">{roleLabels[member.role] ?? member.role}</Text>
        </View>
        {canManage && !editing && !confirming ? (
          <View style={styles.rowActions}>
            <Button label="Change role" variant="quiet" onPress={() => setEditing(true)} aria-label={`Change role of ${member.name}`} />
            <Button
              label="Remove"
              variant="quiet"
              onPress={() => {
                setError(null);
                setConfirming(true);
              }}
              aria-label={`Remove ${member.name} from the team`}
            />
          </View>
        ) : null}
      </View>
      {confirming ? (
        <View style={styles.confirm} role="group" aria-label={`Confirm removing ${member.name}`} testID={`remove-confirm-${member.email}`}>
          <Text>
            {isSelf
              ? 'Remove yourself from the team? You lose access to its sites at once, and only an owner can invite you back.'
              : `Remove ${member.name} from the team? They lose access to its sites at once; what they recorded stays.`}
          </Text>
          <View style={styles.rowActions}>
            <Button label="Remove from team" variant="danger" busy={remove.isPending} onPress={() => void confirmRemove()} aria-label={`Yes, remove ${member.name}`} />
            <Button label="Keep" variant="secondary" onPress={() => setConfirming(false)} aria-label={`Keep ${member.name}`} />
          </View>
        </View>
      ) : null}
      {editing ? (
        <View style={styles.edit}>
          <ChoiceGroup label={`Role of ${member.name}`} value={member.role} choices={roleChoices} onChange={(r) => void pick(r)} disabled={change.isPending} compact />
          <Button label="Done" variant="secondary" onPress={() => setEditing(false)} />
        </View>
      ) : null}
      {error ? <Banner tone="fail" title={error.title}>{error.message}</Banner> : null}
    </View>
  );
}

export interface MemberListProps {
  members: Member[];
  canManage: boolean;
  selfId?: Member['userId'];
  /** Called after the server removed a member; `self` when it was the signed-in user. */
  onRemoved?: (self: boolean) => void;
}

export function MemberList({ members, canManage, selfId, onRemoved }: MemberListProps) {
  return (
    <Card title="Members" subtitle={`${members.length} ${members.length === 1 ? 'person' : 'people'} on the team.`}>
      <View role="list" style={styles.list} testID="member-list">
        {members.map((m) => (
          <MemberRow key={String(m.userId)} member={m} canManage={canManage} isSelf={String(m.userId) === String(selfId)} onRemoved={onRemoved} />
        ))}
      </View>
      {canManage ? (
        <Text variant="caption" tone="textMuted">
          A team always keeps at least one owner.
        </Text>
      ) : null}
    </Card>
  );
}

const styles = StyleSheet.create({
  list: { gap: 0 },
  row: { paddingVertical: spacing.md, borderTopWidth: 1, borderTopColor: colors.border, gap: spacing.sm },
  rowHead: { flexDirection: 'row', alignItems: 'center', flexWrap: 'wrap', gap: spacing.sm },
  who: { flexGrow: 1, flexShrink: 1, flexBasis: 200, gap: spacing.xxs },
  roleTag: { paddingHorizontal: spacing.sm, paddingVertical: spacing.xxs, borderRadius: radius.pill, backgroundColor: colors.surfaceSunk },
  rowActions: { flexDirection: 'row', flexWrap: 'wrap', gap: spacing.xs },
  edit: { gap: spacing.sm },
  confirm: { gap: spacing.sm, padding: spacing.md, borderRadius: radius.md, backgroundColor: colors.cautionSoft },
});
