import type { Role } from '../../shared/schemas/common';
import type { InvitationAcceptInput, InvitationCreateInput } from '../../shared/schemas/team';
import { insertAudit } from '../audit/audit.repository';
import { type Caller, normaliseEmail } from '../auth/auth.service';
import { assertStrongPassword, hashPassword, hashToken, newToken } from '../auth/passwords';
import { findUserByEmail, insertUser } from '../auth/users.repository';
import type { Config } from '../config';
import { type Db, inTransaction } from '../db/db';
import { errors } from '../errors';
import type { Logger } from '../logger';
import type { Mailer } from '../mail/mailer';
import { invitationMail } from '../mail/templates';
import { findMember, findTeam, insertMembership } from '../team/teams.repository';
import {
  deleteInvitation,
  deleteOpenInvitationsTo,
  findOpenInvitationByTokenHash,
  insertInvitation,
  listOpenInvitations,
  markInvitationAccepted,
} from './invitations.repository';

export const INVITATION_TTL_MS = 7 * 24 * 60 * 60 * 1000;

export type InvitationSummary = { id: number; email: string; role: Role; expiresAt: string };

export async function createInvitation(
  deps: { db: Db; config: Config; mailer: Mailer; logger: Logger },
  caller: Caller,
  input: InvitationCreateInput,
  ip?: string,
): Promise<InvitationSummary> {
  const email = normaliseEmail(input.email);
  const role = input.role;
  const existing = await findUserByEmail(deps.db, email);
  if (existing && (await findMember(deps.db, caller.teamId, existing.id))) {
    throw errors.conflict('ALREADY_MEMBER', 'This person is already a member of the team.', 'email');
  }
  const team = await findTeam(deps.db, caller.teamId);
  const { token, hash } = newToken();
  const expiresAt = new Date(Date.now() + INVITATION_TTL_MS);
  const id = await inTransaction(deps.db, async (trx) => {
    // A new invitation to the same address replaces the open one.
    await deleteOpenInvitationsTo(trx, caller.teamId, email, new Date());
    const newId = await insertInvitation(trx, { teamId: caller.teamId, email, role, tokenHash: hash, invitedBy: caller.userId, expiresAt });
    await insertAudit(trx, { teamId: caller.teamId, userId: caller.userId, action: 'invitation.created', targetType: 'invitation', targetId: newId, details: { email, role }, ip });
    return newId;
  });
  const link = `${deps.config.appUrl}/accept-invite?token=${encodeURIComponent(token)}`;
  deps.mailer
    .send(invitationMail({ to: email, teamId: caller.teamId, teamName: team?.name ?? 'your team', role, invitedBy: caller.name, link, expiresAt }))
    .catch((e) => deps.logger.error('invitation mail failed:', e));
  return { id, email, role, expiresAt: expiresAt.toISOString() };
}

export async function listInvitations(deps: { db: Db }, caller: Caller): Promise<InvitationSummary[]> {
  const rows = await listOpenInvitations(deps.db, caller.teamId, new Date());
  return rows.map((r) => ({ id: r.id, email: r.email, role: r.role, expiresAt: new Date(r.expires_at).toISOString() }));
}

export async function revokeInvitation(deps: { db: Db }, caller: Caller, id: number, ip?: string): Promise<void> {
  await inTransaction(deps.db, async (trx) => {
    if (!(await deleteInvitation(trx, caller.teamId, id))) throw errors.notFound('The invitation');
    await insertAudit(trx, { teamId: caller.teamId, userId: caller.userId, action: 'invitation.revoked', targetType: 'invitation', targetId: id, ip });
  });
}

export async function describeInvitation(deps: { db: Db }, token: string) {
  const inv = await findOpenInvitationByTokenHash(deps.db, hashToken(token), new Date());
  if (!inv) throw errors.notFound('The invitation');
  return { teamName: inv.team_name, email: inv.email, role: inv.role, invitedBy: inv.invited_by_name ?? '' };
}

/**
 * Joins the team: a signed-in user with the invited address joins as they are; anyone else sends a
 * name and password and a new account is made. The user, the membership and the acceptance are one
 * transaction.
 */
export async function acceptInvitation(
  deps: { db: Db; config: Config },
  token: string,
  input: InvitationAcceptInput,
  caller: Caller | undefined,
  ip?: string,
): Promise<{ userId: number; teamId: number }> {
  const tokenHash = hashToken(token);
  const preview = await findOpenInvitationByTokenHash(deps.db, tokenHash, new Date());
  if (!preview) throw errors.notFound('The invitation');
  const joiningAsCaller = !!caller && caller.email === preview.email;
  let passwordHash: string | undefined;
  if (!joiningAsCaller) {
    if (!input.name) throw errors.badRequest('VALIDATION_FAILED', 'Name is required', 'name');
    if (!input.password) throw errors.badRequest('VALIDATION_FAILED', 'Password is required', 'password');
    assertStrongPassword(input.password, [preview.email, input.name, preview.team_name]);
    passwordHash = await hashPassword(input.password, deps.config.bcryptCost);
  }
  return inTransaction(deps.db, async (trx) => {
    const now = new Date();
    const inv = await findOpenInvitationByTokenHash(trx, tokenHash, now, { lock: true });
    if (!inv) throw errors.notFound('The invitation');
    let userId: number;
    if (joiningAsCaller) {
      userId = caller!.userId;
    } else {
      if (await findUserByEmail(trx, inv.email)) {
        throw errors.conflict('ACCOUNT_EXISTS', 'This address already has an account: sign in first, then open the invitation again.', 'email');
      }
      userId = await insertUser(trx, { email: inv.email, name: input.name!, passwordHash: passwordHash! });
    }
    if (!(await findMember(trx, inv.team_id, userId))) await insertMembership(trx, { teamId: inv.team_id, userId, role: inv.role });
    await markInvitationAccepted(trx, inv.id, now);
    await insertAudit(trx, { teamId: inv.team_id, userId, action: 'invitation.accepted', targetType: 'invitation', targetId: inv.id, ip });
    return { userId, teamId: inv.team_id };
  });
}
