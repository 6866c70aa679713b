import type { Caller } from '../auth/auth.service';
import type { Db } from '../db/db';
import { listCaughtMailSentByTeam } from './caught-mail.repository';

/** Caught mail the caller's team sent (its invitations); never another team's, never a reset. */
export async function listTeamMail(deps: { db: Db }, caller: Caller) {
  const messages = await listCaughtMailSentByTeam(deps.db, caller.teamId);
  return messages.map(({ id, to, subject, text, receivedAt }) => ({ id, to, subject, text, receivedAt }));
}
