import { useState } from 'react';
import { StyleSheet, View } from 'react-native';

import { problemMessage } from '../../api/client';
import { useChangeRole, useRemoveMember } from '../../api/team';
import { ROLES, roleLabels, type Member, type Role } from '../../api/types';
import { colors, radius, spacing } from '../../theme';
import { formatDate } from '../common/format';
import { Banner, Button, Card, ChoiceGroup, Text, personRows } from '../ui';

import { roleAbilities, roleLimits } from './role-abilities';

const roleChoices = ROLES.map((r) => ({ value: r, label: roleLabels[r] }));

/** What a change of role means, said before it is made. */
function RoleChangeConfirm({ member, role, isSelf, busy, onConfirm, onCancel }: { member: Member; role: Role; isSelf: boolean; busy: boolean; onConfirm: () => void; onCancel: () => void }) {
  const may = roleAbilities(role);
  const mayNot = roleLimits(role);
  const who = isSelf ? 'yourself' : member.name;
  return (
    <View style={styles.confirm} role="group" aria-label={`Confirm the role of ${member.name}`} testID={`role-confirm-${member.email}`}>
      <Text weight="semibold">{`Make ${who} ${role === 'owner' || role === 'engineer' ? 'an' : 'a'} ${roleLabels[role]}?`}</Text>
      <Text>{`${isSelf ? 'You' : 'They'} may then:`}</Text>
      <View role="list">
        {may.map((m) => (
          <Text key={m} role="listitem">{`• ${m}`}</Text>
        ))}
      </View>
      {mayNot.length > 0 ? <Text tone="textMuted">{`Not: ${mayNot.join('; ')}.`}</Text> : null}
      {role === 'owner' ? (
        <Text weight="semibold" tone="caution" testID="role-confirm-owner-note">
          {`An owner has full control of the team: ${member.name} could then change your role or remove you. Give it only to someone you trust with the team.`}
        </Text>
      ) : null}
      {isSelf && member.role === 'owner' && role !== 'owner' ? (
        <Text weight="semibold" tone="caution">You will no longer be able to manage the team, and only another owner can give it back.</Text>
      ) : null}
      <View style={styles.rowActions}>
        <Button label={`Make ${roleLabels[role]}`} busy={busy} onPress={onConfirm} aria-label={`Yes, make ${member.name} ${roleLabels[role]}`} />
        <Button label="Cancel" variant="secondary" onPress={onCancel} aria-label={`Keep ${member.name} as ${roleLabels[member.role]}`} />
      </View>
    </View>
  );
}

function MemberRow({ member, canManage, isSelf, onRemoved }: { member: Member; canManage: boolean; isSelf: boolean; onRemoved?: (self: boolean) => void }) {
  const [editing, setEditing] = useState(false);
  const [proposed, setProposed] = useState<Role | null>(null);
  const [confirming, setConfirming] = useState(false);
  const [error, setError] = useState<{ title: string; message: string } | null>(null);
  const change = useChangeRole();
  const remove = useRemoveMember();

  // Choosing a role only proposes it; nothing is sent until the change is confirmed.
  const pick = (role: Role) => {
    setError(null);
    setProposed(role === member.role ? null : role);
  };

  const confirmRole = async () => {
    if (!proposed) return;
    const result = await change.mutateAsync({ userId: member.userId, role: proposed });
    if (result.kind === 'ok') {
      setProposed(null);
      setEditing(false);
    } else {
      setError({ title: 'Role not changed', message: problemMessage(result) });
    }
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
          <ChoiceGroup label={`Role of ${member.name}`} value={proposed ?? member.role} choices={roleChoices} onChange={pick} disabled={change.isPending} compact />
          {proposed ? (
            <RoleChangeConfirm member={member} role={proposed} isSelf={isSelf} busy={change.isPending} onConfirm={() => void confirmRole()} onCancel={() => setProposed(null)} />
          ) : (
            <Button
              label="Done"
              variant="secondary"
              onPress={() => {
                setProposed(null);
                setEditing(false);
              }}
            />
          )}
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
  ...personRows,
  rowActions: personRows.actions,
  roleTag: { paddingHorizontal: spacing.sm, paddingVertical: spacing.xxs, borderRadius: radius.pill, backgroundColor: colors.surfaceSunk },
  edit: { gap: spacing.sm },
});
