import type { Role } from '../../shared/schemas/common';
import type { Db } from '../db/db';

export type InvitationRow = {
  id: number;
  team_id: number;
  email: string;
  role: Role;
  token_hash: string;
  invited_by: number | null;
  expires_at: Date;
  accepted_at: Date | null;
  created_at: Date;
};

export async function insertInvitation(
  db: Db,
  inv: { teamId: number; email: string; role: Role; tokenHash: string; invitedBy: number; expiresAt: Date },
): Promise<number> {
  const [id] = await db('invitations').insert({
    team_id: inv.teamId,
    email: inv.email,
    role: inv.role,
    token_hash: inv.tokenHash,
    invited_by: inv.invitedBy,
    expires_at: inv.expiresAt,
  });
  return id;
}

/** An open (not accepted, not expired) invitation by token hash, with team and inviter names. */
export async function findOpenInvitationByTokenHash(
  db: Db,
  tokenHash: string,
  now: Date,
  opts: { lock?: boolean } = {},
): Promise<(InvitationRow & { team_name: string; invited_by_name: string | null }) | undefined> {
  const q = db('invitations as i')
    .join('teams as t', 't.id', 'i.team_id')
    .leftJoin('users as u', 'u.id', 'i.invited_by')
    .select('i.*', 't.name as team_name', 'u.name as invited_by_name')
    .where('i.token_hash', tokenHash)
    .whereNull('i.accepted_at')
    .where('i.expires_at', '>', now)
    .first();
  return opts.lock ? q.forUpdate() : q;
}

export async function listOpenInvitations(db: Db, teamId: number, now: Date): Promise<InvitationRow[]> {
  return db<InvitationRow>('invitations').where({ team_id: teamId }).whereNull('accepted_at').where('expires_at', '>', now).orderBy('id');
}

export async function markInvitationAccepted(db: Db, id: number, now: Date): Promise<void> {
  await db('invitations').where({ id }).update({ accepted_at: now });
}

/** Deletes an open invitation of the team; returns how many rows went. */
export async function deleteInvitation(db: Db, teamId: number, id: number): Promise<number> {
  return db('invitations').where({ team_id: teamId, id }).whereNull('accepted_at').delete();
}

/** Deletes the team's open invitations to one address (before a new one replaces them). */
export async function deleteOpenInvitationsTo(db: Db, teamId: number, email: string, now: Date): Promise<void> {
  await db('invitations').where({ team_id: teamId, email }).whereNull('accepted_at').where('expires_at', '>', now).delete();
}
