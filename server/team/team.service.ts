import type { Role } from '../../shared/schemas/common';
import { can } from '../../shared/schemas/permissions';
import { insertAudit } from '../audit/audit.repository';
import type { Caller } from '../auth/auth.service';
import { type Db, inTransaction } from '../db/db';
import { errors } from '../errors';
import { listInvitations } from '../invitations/invitations.service';
import { deleteMembership, findMember, findTeam, listMembers, lockMemberships, type MemberRow, updateMemberRole } from './teams.repository';

const toMember = (m: MemberRow) => ({ userId: m.user_id, name: m.name, email: m.email, role: m.role, joinedAt: new Date(m.created_at).toISOString() });

export async function getTeam(deps: { db: Db }, caller: Caller) {
  const [team, members] = await Promise.all([findTeam(deps.db, caller.teamId), listMembers(deps.db, caller.teamId)]);
  const invitations = can(caller.role, 'team.manage') ? await listInvitations(deps, caller) : [];
  return { team, members: members.map(toMember), invitations };
}

function assertNotLastOwner(locked: { user_id: number; role: Role }[], userId: number): void {
  const target = locked.find((m) => m.user_id === userId);
  if (!target) throw errors.notFound('The member');
  if (target.role === 'owner' && locked.filter((m) => m.role === 'owner').length === 1) {
    throw errors.conflict('LAST_OWNER', 'A team needs at least one owner: make someone else an owner first.', 'role');
  }
}

export async function changeMemberRole(deps: { db: Db }, caller: Caller, userId: number, role: Role, ip?: string) {
  return inTransaction(deps.db, async (trx) => {
    const locked = await lockMemberships(trx, caller.teamId);
    if (!locked.some((m) => m.user_id === userId)) throw errors.notFound('The member');
    if (role !== 'owner') assertNotLastOwner(locked, userId);
    await updateMemberRole(trx, caller.teamId, userId, role);
    await insertAudit(trx, { teamId: caller.teamId, userId: caller.userId, action: 'member.role_changed', targetType: 'user', targetId: userId, details: { role }, ip });
    return toMember((await findMember(trx, caller.teamId, userId))!);
  });
}

export async function removeMember(deps: { db: Db }, caller: Caller, userId: number, ip?: string): Promise<void> {
  await inTransaction(deps.db, async (trx) => {
    const locked = await lockMemberships(trx, caller.teamId);
    assertNotLastOwner(locked, userId);
    await deleteMembership(trx, caller.teamId, userId);
    await insertAudit(trx, { teamId: caller.teamId, userId: caller.userId, action: 'member.removed', targetType: 'user', targetId: userId, ip });
  });
}
