import type { Role } from '../../shared/schemas/common';
import type { SignInInput, SignUpInput } from '../../shared/schemas/auth';
import { insertAudit } from '../audit/audit.repository';
import type { Config } from '../config';
import { type Db, inTransaction } from '../db/db';
import { errors } from '../errors';
import type { Logger } from '../logger';
import type { Mailer } from '../mail/mailer';
import { passwordResetMail } from '../mail/templates';
import { findSettings } from '../me/settings.repository';
import { findMember, findTeam, firstMembershipOfUser, insertMembership, insertTeam, listTeamNamesOfUser } from '../team/teams.repository';
import { assertStrongPassword, dummyHash, hashPassword, hashToken, newToken, verifyPassword } from './passwords';
import { findPasswordResetUserId, findUsablePasswordReset, insertPasswordReset, markPasswordResetsUsed } from './password-resets.repository';
import { deleteSessionsOfUser } from './sessions.repository';
import { findUserByEmail, findUserById, insertUser, updateUserPassword } from './users.repository';

export const normaliseEmail = (email: string) => email.trim().toLowerCase();

export type Caller = { userId: number; teamId: number; role: Role; email: string; name: string };

export const RESET_TTL_MS = 60 * 60 * 1000;

/** The caller behind a session, or null when the user has left the team. */
export async function loadCaller(deps: { db: Db }, userId: number, teamId: number): Promise<Caller | null> {
  const m = await findMember(deps.db, teamId, userId);
  return m ? { userId, teamId, role: m.role, email: m.email, name: m.name } : null;
}

/** True when a session signed in at signedInAt has outlived the absolute timeout. */
export function isPastAbsoluteTimeout(signedInAt: number | undefined, now: number, absoluteMs: number): boolean {
  return typeof signedInAt !== 'number' || !Number.isFinite(signedInAt) || now - signedInAt > absoluteMs || signedInAt > now + 60_000;
}

export async function sessionPayload(deps: { db: Db }, caller: Caller | undefined, csrfToken: string) {
  if (!caller) return { user: null, team: null, role: null, settings: null, csrfToken };
  const [team, settings] = await Promise.all([findTeam(deps.db, caller.teamId), findSettings(deps.db, caller.userId)]);
  return {
    user: { id: caller.userId, name: caller.name, email: caller.email },
    team: team ? { id: team.id, name: team.name } : null,
    role: caller.role,
    settings,
    csrfToken,
  };
}

/** Creates the user, the team and the owner membership together. */
export async function signUp(deps: { db: Db; config: Config }, input: SignUpInput, ip?: string): Promise<{ userId: number; teamId: number }> {
  const email = normaliseEmail(input.email);
  assertStrongPassword(input.password, [email, input.name, input.teamName]);
  const passwordHash = await hashPassword(input.password, deps.config.bcryptCost);
  return inTransaction(deps.db, async (trx) => {
    if (await findUserByEmail(trx, email)) {
      throw errors.conflict('EMAIL_TAKEN', 'An account with this e-mail address already exists; sign in instead.', 'email');
    }
    const userId = await insertUser(trx, { email, name: input.name, passwordHash });
    const teamId = await insertTeam(trx, input.teamName);
    await insertMembership(trx, { teamId, userId, role: 'owner' });
    await insertAudit(trx, { teamId, userId, action: 'team.created', targetType: 'team', targetId: teamId, ip });
    return { userId, teamId };
  });
}

/** Same answer, and about the same time, whether the address is unknown or the password wrong. */
export async function signIn(deps: { db: Db; config: Config }, input: SignInInput, ip?: string): Promise<{ userId: number; teamId: number }> {
  const email = normaliseEmail(input.email);
  const user = await findUserByEmail(deps.db, email);
  const ok = await verifyPassword(input.password, user?.password_hash ?? (await dummyHash(deps.config.bcryptCost)));
  if (!user || !ok) {
    if (user) await insertAudit(deps.db, { userId: user.id, action: 'auth.signin_failed', ip });
    throw errors.invalidCredentials();
  }
  const membership = await firstMembershipOfUser(deps.db, user.id);
  if (!membership) throw errors.forbidden('Your account no longer belongs to a team; ask a team owner for an invitation.');
  await insertAudit(deps.db, { teamId: membership.team_id, userId: user.id, action: 'auth.signin', ip });
  return { userId: user.id, teamId: membership.team_id };
}

/** Mails a single-use link when the address has an account; the caller answers the same either way. */
export async function requestPasswordReset(
  deps: { db: Db; config: Config; mailer: Mailer; logger: Logger },
  emailRaw: string,
  ip?: string,
): Promise<void> {
  const email = normaliseEmail(emailRaw);
  const user = await findUserByEmail(deps.db, email);
  if (!user) return;
  // Finished in the background: the answer must not take longer for real accounts than for unknown ones.
  void (async () => {
    const { token, hash } = newToken();
    await inTransaction(deps.db, async (trx) => {
      await insertPasswordReset(trx, { userId: user.id, tokenHash: hash, expiresAt: new Date(Date.now() + RESET_TTL_MS) });
      await insertAudit(trx, { userId: user.id, action: 'auth.password_reset_requested', ip });
    });
    const link = `${deps.config.appUrl}/reset-password?token=${encodeURIComponent(token)}`;
    await deps.mailer.send(passwordResetMail({ to: user.email, link }));
  })().catch((e) => deps.logger.error('password reset request failed:', e));
}

export async function confirmPasswordReset(deps: { db: Db; config: Config }, token: string, password: string, ip?: string): Promise<void> {
  const tokenHash = hashToken(token);
  const pendingUserId = await findPasswordResetUserId(deps.db, tokenHash);
  const user = pendingUserId ? await findUserById(deps.db, pendingUserId) : undefined;
  if (user) assertStrongPassword(password, [user.email, user.name, ...(await listTeamNamesOfUser(deps.db, user.id))]);
  const passwordHash = await hashPassword(password, deps.config.bcryptCost);
  await inTransaction(deps.db, async (trx) => {
    const now = new Date();
    const reset = await findUsablePasswordReset(trx, tokenHash, now);
    if (!reset) throw errors.badRequest('INVALID_TOKEN', 'This reset link is invalid, used or expired; ask for a new one.', 'token');
    await updateUserPassword(trx, reset.user_id, passwordHash);
    await markPasswordResetsUsed(trx, reset.user_id, now);
    await deleteSessionsOfUser(trx, reset.user_id);
    await insertAudit(trx, { userId: reset.user_id, action: 'auth.password_reset', ip });
  });
}
