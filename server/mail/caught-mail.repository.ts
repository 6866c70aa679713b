import type { Db } from '../db/db';

export type CaughtMail = {
  id: number;
  to: string;
  from: string;
  subject: string;
  text: string;
  html: string | null;
  receivedAt: string;
  teamId: number | null;
  kind: string | null;
};

type Row = {
  id: number;
  to_address: string;
  from_address: string;
  subject: string;
  text: string | null;
  html: string | null;
  received_at: Date;
  team_id: number | null;
  kind: string | null;
};

const toMail = (r: Row): CaughtMail => ({
  id: r.id,
  to: r.to_address,
  from: r.from_address,
  subject: r.subject,
  text: r.text ?? '',
  html: r.html,
  receivedAt: new Date(r.received_at).toISOString(),
  teamId: r.team_id,
  kind: r.kind,
});

export async function insertCaughtMail(
  db: Db,
  m: { messageId?: string; from: string; to: string; subject: string; text?: string; html?: string; teamId?: number | null; kind?: string | null },
): Promise<void> {
  await db('caught_mail').insert({
    message_id: m.messageId?.slice(0, 255) ?? null,
    from_address: m.from.slice(0, 254),
    to_address: m.to.slice(0, 1000),
    subject: m.subject.slice(0, 500),
    text: m.text ?? null,
    html: m.html ?? null,
    team_id: m.teamId ?? null,
    kind: m.kind?.slice(0, 32) ?? null,
  });
}

export async function listCaughtMail(db: Db, opts: { to?: string; limit?: number } = {}): Promise<CaughtMail[]> {
  const q = db<Row>('caught_mail').orderBy('id', 'desc').limit(opts.limit ?? 200);
  if (opts.to) q.where('to_address', 'like', `%${opts.to.replace(/[%_\\]/g, (c) => '\\' + c)}%`);
  return (await q).map(toMail);
}

/**
 * Caught mail that the team's own actions sent, newest first. Password resets are never listed (they
 * belong to no team), nor mail filed under an id the team got only later (ids restart after a reseed).
 */
export async function listCaughtMailSentByTeam(db: Db, teamId: number, limit = 200): Promise<CaughtMail[]> {
  const rows = await db('caught_mail as c')
    .join('teams as t', 't.id', 'c.team_id')
    .select('c.*')
    .where('c.team_id', teamId)
    .whereNotNull('c.kind')
    .whereNot('c.kind', 'password-reset')
    .whereRaw('c.received_at >= t.created_at')
    .orderBy('c.id', 'desc')
    .limit(limit);
  return (rows as Row[]).map(toMail);
}
