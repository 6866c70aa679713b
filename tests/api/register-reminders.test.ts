/**
 * Register reminders with a clock the test moves: assignment mail, due-soon and overdue reminders, requests to
 * verify — each sent once, also with two server processes (two apps, each with its own scheduler) on one
 * database, and across a restart.
 */
import { createApp } from '../../server/app';
import type { Mailer } from '../../server/mail/mailer';
import { addMember, type Agent, type ApiContext, createApiContext, signUpOwner } from '../helpers/api';

jest.setTimeout(120_000);

const DAY = 86_400_000;
let clock = Date.parse('2027-03-01T07:30:00Z');
const now = () => clock;
let ctx: ApiContext;
let owner: Agent;
let safety: Agent;
let engineer: Agent;
let engineerId: number;
let engineerEmail: string;
let safetyEmail: string;
let siteId: number;

const post = (a: Agent, p: string, body: object = {}) => a.post(p).set('X-CSRF-Token', a.csrf).send(body);
const day = (offset: number) => new Date(clock + offset * DAY).toISOString().slice(0, 10);

async function assignedEntry(location: string, dueInDays: number) {
  const e = (await post(safety, `/api/v1/sites/${siteId}/register`, { location, measuredTemperatureC: 90, method: 'contact', surfaceMaterial: 'uncoatedMetal', withinReach: true }).expect(201)).body.entry;
  await post(safety, `/api/v1/register/entries/${e.id}/assign`, { ownerUserId: engineerId, dueDate: day(dueInDays), action: `Cover ${location}` }).expect(200);
  return e.id as number;
}

/** Caught mail to an address whose subject mentions the location, by kind of subject. */
async function mailsAbout(location: string) {
  return (await ctx.mail.messages()).filter((m) => m.subject.includes(location)).map((m) => `${m.to} | ${m.subject.replace(/ at .*$/, '')}`).sort();
}

/** Lets the pokes fired by the requests finish, so only the test's own ticks are in play. */
const settle = () => ctx.app.locals.reminders.tick();

beforeAll(async () => {
  ctx = await createApiContext({ now });
  const o = await signUpOwner(ctx, { teamName: 'Reminder team' });
  owner = o.agent;
  const s = await addMember(ctx, owner, 'safety');
  safety = s.agent;
  safetyEmail = s.email;
  const en = await addMember(ctx, owner, 'engineer');
  engineer = en.agent;
  engineerId = en.userId;
  engineerEmail = en.email;
  siteId = (await post(owner, '/api/v1/sites', { name: 'Reminder site' }).expect(201)).body.site.id;
});
afterAll(async () => {
  await ctx.close();
});

describe('one process', () => {
  it('when an action is assigned and the clock passes two days before, then the due date, then one assignment, one due-soon and one overdue mail arrive', async () => {
    await assignedEntry('Valve V-1', 5);
    await settle();
    expect(await mailsAbout('Valve V-1')).toEqual([`${engineerEmail} | Action for you: hot surface`]);

    clock += 2 * DAY; // 3 days before: nothing new
    await ctx.app.locals.reminders.tick();
    expect(await mailsAbout('Valve V-1')).toHaveLength(1);

    clock += DAY; // 2 days before
    await ctx.app.locals.reminders.tick();
    await ctx.app.locals.reminders.tick();
    expect(await mailsAbout('Valve V-1')).toEqual([`${engineerEmail} | Action for you: hot surface`, `${engineerEmail} | Due in 2 days: hot surface`].sort());

    clock += 3 * DAY; // a day late
    await ctx.app.locals.reminders.tick();
    clock += 2 * DAY; // still late: no second overdue mail for the same due date
    await ctx.app.locals.reminders.tick();
    const mails = await mailsAbout('Valve V-1');
    expect(mails.filter((m) => m.includes('Overdue since'))).toHaveLength(1);
    expect(mails).toHaveLength(3);
    const overdue = (await ctx.mail.messages()).find((m) => m.subject.startsWith('Overdue since') && m.subject.includes('Valve V-1'))!;
    expect(overdue.text).toContain('keep people away');
  });

  it('when an action is assigned due within two days, then the assignment mail is the only one before the due date', async () => {
    await assignedEntry('Vent V-5', 1);
    await settle();
    await ctx.app.locals.reminders.tick();
    expect(await mailsAbout('Vent V-5')).toEqual([`${engineerEmail} | Action for you: hot surface`]);
  });

  it('when an entry is made safe before its due date, then no overdue mail follows, and the safety officers are asked to verify', async () => {
    const id = await assignedEntry('Trap T-2', 1);
    await settle();
    await post(engineer, `/api/v1/register/entries/${id}/made-safe`, { note: 'Insulating jacket fitted' }).expect(200);
    await settle();
    clock += 3 * DAY;
    await ctx.app.locals.reminders.tick();
    const mails = await mailsAbout('Trap T-2');
    expect(mails).toEqual([`${engineerEmail} | Action for you: hot surface`, `${safetyEmail} | Please verify: hot surface`].sort());
    const dueRows = await ctx.db('register_reminders').where({ entry_id: id }).whereIn('kind', ['dueSoon', 'overdue']);
    // The due-soon reminder queued before the fix is skipped, not sent.
    expect(dueRows.every((r: { status: string }) => r.status === 'skipped')).toBe(true);
  });

  it('when sending fails, then the reminder is tried again later and sent once', async () => {
    const failing: Mailer = { send: async () => Promise.reject(new Error('SMTP down')), close: () => undefined };
    const down = createApp({ db: ctx.db, mailer: failing, config: ctx.config, now });
    try {
      const id = await assignedEntry('Pump P-3', 10);
      // The request's own poke may have sent it already through the working app: take the row back.
      await ctx.app.locals.reminders.tick();
      await ctx.db('register_reminders').where({ entry_id: id, kind: 'assigned' }).update({ status: 'pending', attempts: 0, sent_at: null });
      await ctx.db('caught_mail').where('subject', 'like', '%Pump P-3%').delete();
      const first = await down.locals.reminders.tick();
      expect(first.retried).toBe(1);
      const row = await ctx.db('register_reminders').where({ entry_id: id, kind: 'assigned' }).first();
      expect(row).toMatchObject({ status: 'pending', last_error: 'SMTP down' });
      await ctx.app.locals.reminders.tick(); // not yet due again
      expect(await mailsAbout('Pump P-3')).toEqual([]);
      clock += 2 * 60_000;
      await ctx.app.locals.reminders.tick();
      expect(await mailsAbout('Pump P-3')).toEqual([`${engineerEmail} | Action for you: hot surface`]);
    } finally {
      await down.locals.reminders.stop();
      await down.locals.jobs.stop();
      await down.locals.calc.close();
    }
  });
});

describe('two processes and a restart', () => {
  it('when two apps with their own schedulers share the database, then every reminder is sent exactly once', async () => {
    const second = ctx.restart({}, { now });
    const locations = Array.from({ length: 12 }, (_, i) => `Header H-${10 + i}`);
    for (const [i, loc] of locations.entries()) await assignedEntry(loc, 3 + (i % 2));
    const race = async () => {
      for (let k = 0; k < 3; k++) await Promise.all([ctx.app.locals.reminders.tick(), second.locals.reminders.tick(), second.locals.reminders.tick()]);
    };
    // Both processes race for the queued assignment mails, then for the due-soon ones, then the overdue ones.
    await race();
    clock += 2 * DAY;
    await race();
    clock += 5 * DAY;
    await race();
    const all = (await ctx.mail.messages()).filter((m) => m.subject.includes('Header H-'));
    const bySubject = new Map<string, number>();
    for (const m of all) bySubject.set(`${m.to} ${m.subject}`, (bySubject.get(`${m.to} ${m.subject}`) ?? 0) + 1);
    expect([...bySubject.values()].every((n) => n === 1)).toBe(true);
    // Each entry: one assignment, one due-soon and one overdue mail.
    for (const loc of locations) {
      const kinds = all.filter((m) => m.subject.endsWith(`${loc} (Reminder site)`)).map((m) => m.subject.split(':')[0].replace(/ \d+ [A-Z][a-z]{2} \d{4}$/, '').replace(/ in \d+ days| tomorrow| today/, ''));
      expect(kinds.sort()).toEqual(['Action for you', 'Due', 'Overdue since']);
    }
    const rows = await ctx.db('register_reminders').where('team_id', (await ctx.db('register_entries').first('team_id')).team_id).select('status');
    expect(rows.every((r: { status: string }) => r.status === 'sent' || r.status === 'skipped')).toBe(true);
  });

  it('when a process stopped after claiming a reminder, then another sends it once its lease has run out; a restart resends nothing', async () => {
    const id = await assignedEntry('Drum D-7', 20);
    await settle();
    await ctx.db('caught_mail').where('subject', 'like', '%Drum D-7%').delete();
    // As if a process claimed the mail and died before sending it.
    await ctx.db('register_reminders').where({ entry_id: id, kind: 'assigned' }).update({ status: 'sending', claimed_by: 'gone:1:dead', lease_until: new Date(clock + 60_000) });
    const restarted = ctx.restart({}, { now });
    await restarted.locals.reminders.tick();
    expect(await mailsAbout('Drum D-7')).toEqual([]); // the lease still holds
    clock += 2 * 60_000;
    await restarted.locals.reminders.tick();
    expect(await mailsAbout('Drum D-7')).toEqual([`${engineerEmail} | Action for you: hot surface`]);
    const again = ctx.restart({}, { now });
    await again.locals.reminders.tick();
    await ctx.app.locals.reminders.tick();
    expect(await mailsAbout('Drum D-7')).toHaveLength(1);
  });

  it('when a scheduler stops with reminders it claimed but did not send, then it hands them back for the next process', async () => {
    const id = await assignedEntry('Tank TK-9', 20);
    await settle();
    const stopping = ctx.restart({}, { now });
    await ctx.db('register_reminders').where({ entry_id: id, kind: 'assigned' }).update({ status: 'sending', claimed_by: stopping.locals.reminders.owner, lease_until: new Date(clock + 3_600_000) });
    await stopping.locals.reminders.stop();
    const row = await ctx.db('register_reminders').where({ entry_id: id, kind: 'assigned' }).first();
    expect(row).toMatchObject({ status: 'pending', claimed_by: null });
  });
});
