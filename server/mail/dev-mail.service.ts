import type { Caller } from '../auth/auth.service';
import type { Db } from '../db/db';
import { listCaughtMailForTeam } from './caught-mail.repository';

/** Caught mail addressed to the caller's team (members and invitees). */
export async function listTeamMail(deps: { db: Db }, caller: Caller) {
  const messages = await listCaughtMailForTeam(deps.db, caller.teamId);
  return messages.map(({ id, to, subject, text, receivedAt }) => ({ id, to, subject, text, receivedAt }));
}
