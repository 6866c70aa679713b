import type { Role } from '../../shared/schemas/common';
import type { Db } from '../db/db';

export type MemberRow = { user_id: number; name: string; email: string; role: Role; created_at: Date };

export async function insertTeam(db: Db, name: string): Promise<number> {
  const [id] = await db('teams').insert({ name });
  return id;
}

export async function findTeam(db: Db, id: number): Promise<{ id: number; name: string } | undefined> {
  return db('teams').select('id', 'name').where({ id }).first();
}

export async function insertMembership(db: Db, m: { teamId: number; userId: number; role: Role }): Promise<void> {
  await db('memberships').insert({ team_id: m.teamId, user_id: m.userId, role: m.role });
}

export async function findMember(db: Db, teamId: number, userId: number): Promise<MemberRow | undefined> {
  return db('memberships as m')
    .join('users as u', 'u.id', 'm.user_id')
    .select('m.user_id', 'u.name', 'u.email', 'm.role', 'm.created_at')
    .where({ 'm.team_id': teamId, 'm.user_id': userId })
    .first();
}

/** The team a user signs into: their earliest membership. */
export async function firstMembershipOfUser(db: Db, userId: number): Promise<{ team_id: number; role: Role } | undefined> {
  return db('memberships').select('team_id', 'role').where({ user_id: userId }).orderBy('id').first();
}

/** Names of every team the user belongs to (their password must not lean on them). */
export async function listTeamNamesOfUser(db: Db, userId: number): Promise<string[]> {
  const rows = await db('memberships as m').join('teams as t', 't.id', 'm.team_id').select('t.name').where('m.user_id', userId);
  return rows.map((r: { name: string }) => r.name);
}

export async function listMembers(db: Db, teamId: number): Promise<MemberRow[]> {
  return db('memberships as m')
    .join('users as u', 'u.id', 'm.user_id')
    .select('m.user_id', 'u.name', 'u.email', 'm.role', 'm.created_at')
    .where({ 'm.team_id': teamId })
    .orderBy('m.id');
}

/** Locks the team's memberships so concurrent demotions cannot remove the last owner. */
export async function lockMemberships(db: Db, teamId: number): Promise<{ user_id: number; role: Role }[]> {
  return db('memberships').select('user_id', 'role').where({ team_id: teamId }).forUpdate();
}

export async function updateMemberRole(db: Db, teamId: number, userId: number, role: Role): Promise<void> {
  await db('memberships').where({ team_id: teamId, user_id: userId }).update({ role });
}

export async function deleteMembership(db: Db, teamId: number, userId: number): Promise<void> {
  await db('memberships').where({ team_id: teamId, user_id: userId }).delete();
  await db('site_members')
    .whereIn('site_id', db('sites').select('id').where({ team_id: teamId }))
    .andWhere({ user_id: userId })
    .delete();
}
