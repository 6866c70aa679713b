import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { problemMessage } from '../../api/client';
import { useChangeRole } from '../../api/team';
import { ROLES, roleLabels, type Member, type Role } from '../../api/types';
import { colors, radius, spacing } from '../../theme';
import { formatDate } from '../common/format';
import { Banner, Button, Card, ChoiceGroup, Text } from '../ui';

const roleChoices = ROLES.map((r) => ({ value: r, label: roleLabels[r] }));

function MemberRow({ member, canManage, isSelf }: { member: Member; canManage: boolean; isSelf: boolean }) {
  const [editing, setEditing] = useState(false);
  const [error, setError] = useState<string | null>(null);
  const change = useChangeRole();

  const pick = async (role: Role) => {
    setError(null);
    if (role === member.role) {
      setEditing(false);
      return;
    }
    const result = await change.mutateAsync({ userId: member.userId, role });
    if (result.kind === 'ok') setEditing(false);
    else setError(problemMessage(result));
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
        {canManage && !editing ? <Button label="Change role" variant="quiet" onPress={() => setEditing(true)} aria-label={`Change role of ${member.name}`} /> : null}
      </View>
      {editing ? (
        <View style={styles.edit}>
          <ChoiceGroup label={`Role of ${member.name}`} value={member.role} choices={roleChoices} onChange={(r) => void pick(r)} disabled={change.isPending} compact />
          <Button label="Done" variant="secondary" onPress={() => setEditing(false)} />
        </View>
      ) : null}
      {error ? <Banner tone="fail" title="Role not changed">{error}</Banner> : null}
    </View>
  );
}

export function MemberList({ members, canManage, selfId }: { members: Member[]; canManage: boolean; selfId?: Member['userId'] }) {
  return (
    <Card title="Members" subtitle={`${members.length} ${members.length === 1 ? 'person' : 'people'} on the team.`}>
      <View role="list" style={styles.list} testID="member-list">
        {members.map((m) => (
          <MemberRow key={String(m.userId)} member={m} canManage={canManage} isSelf={String(m.userId) === String(selfId)} />
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
  edit: { gap: spacing.sm },
});
