import type { Db } from '../db/db';

export type CaughtMail = { id: number; to: string; from: string; subject: string; text: string; html: string | null; receivedAt: string };

type Row = { id: number; to_address: string; from_address: string; subject: string; text: string | null; html: string | null; received_at: Date };

const toMail = (r: Row): CaughtMail => ({
  id: r.id,
  to: r.to_address,
  from: r.from_address,
  subject: r.subject,
  text: r.text ?? '',
  html: r.html,
  receivedAt: new Date(r.received_at).toISOString(),
});

export async function insertCaughtMail(
  db: Db,
  m: { messageId?: string; from: string; to: string; subject: string; text?: string; html?: string },
): Promise<void> {
  await db('caught_mail').insert({
    message_id: m.messageId?.slice(0, 255) ?? null,
    from_address: m.from.slice(0, 254),
    to_address: m.to.slice(0, 1000),
    subject: m.subject.slice(0, 500),
    text: m.text ?? null,
    html: m.html ?? null,
  });
}

export async function listCaughtMail(db: Db, opts: { to?: string; limit?: number } = {}): Promise<CaughtMail[]> {
  const q = db<Row>('caught_mail').orderBy('id', 'desc').limit(opts.limit ?? 200);
  if (opts.to) q.where('to_address', 'like', `%${opts.to.replace(/[%_\\]/g, (c) => '\\' + c)}%`);
  return (await q).map(toMail);
}

/** Caught mail addressed to the team's members or invitees. */
export async function listCaughtMailForTeam(db: Db, teamId: number, limit = 200): Promise<CaughtMail[]> {
  const rows = await db<Row>('caught_mail')
    .where((w) => {
      w.whereIn('to_address', db('memberships as m').join('users as u', 'u.id', 'm.user_id').select('u.email').where('m.team_id', teamId)).orWhereIn(
        'to_address',
        db('invitations').select('email').where({ team_id: teamId }),
      );
    })
    .orderBy('id', 'desc')
    .limit(limit);
  return rows.map(toMail);
}
