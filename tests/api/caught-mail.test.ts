/**
 * The in-app view of caught mail is a development aid: a team sees only the mail its own actions
 * sent, a password reset is never shown, and the view is not there at all without the catcher.
 */
import path from 'node:path';
import request from 'supertest';
import { addMember, type ApiContext, createApiContext, signUpOwner, uniqueEmail } from '../helpers/api';
import { tokenFromMail } from '../helpers/mail';
import { createTestDatabase } from '../helpers/test-db';

jest.setTimeout(60_000);

let ctx: ApiContext;
beforeAll(async () => {
  ctx = await createApiContext();
});
afterAll(async () => {
  await ctx.close();
});

type Shown = { id: number; to: string; subject: string; text: string };
const shown = async (agent: Awaited<ReturnType<typeof signUpOwner>>['agent']) => (await agent.get('/api/v1/dev/mail').expect(200)).body.messages as Shown[];

describe('caught mail in the app', () => {
  it('when team B invites team A\'s member and a reset is asked for that member, then B sees only its own invitation and never A\'s token or the reset', async () => {
    // Arrange: team A with a member who joined through A's invitation.
    const a = await signUpOwner(ctx, { teamName: 'Alder Works' });
    const member = await addMember(ctx, a.agent, 'engineer');
    const aInvitation = await ctx.mail.waitFor(member.email, { subject: /Alder Works/ });
    const aToken = tokenFromMail(aInvitation).token;
    // A second, still open invitation of A's (its token would let B join team A).
    const openInvitee = uniqueEmail('open');
    await a.agent.post('/api/v1/team/invitations').set('X-CSRF-Token', a.agent.csrf).send({ email: openInvitee, role: 'viewer' }).expect(201);
    const aOpenToken = tokenFromMail(await ctx.mail.waitFor(openInvitee, { subject: /Alder Works/ })).token;

    // Act: team B invites A's member (and A's open invitee), and someone asks for a reset of the member's password.
    const b = await signUpOwner(ctx, { teamName: 'Birch Mill' });
    await b.agent.post('/api/v1/team/invitations').set('X-CSRF-Token', b.agent.csrf).send({ email: member.email, role: 'viewer' }).expect(201);
    await b.agent.post('/api/v1/team/invitations').set('X-CSRF-Token', b.agent.csrf).send({ email: openInvitee, role: 'viewer' }).expect(201);
    await ctx.mail.waitFor(member.email, { subject: /Birch Mill/ });
    await ctx.mail.waitFor(openInvitee, { subject: /Birch Mill/ });
    const stranger = await ctx.agent();
    await stranger.post('/api/v1/auth/password-reset').set('X-CSRF-Token', stranger.csrf).send({ email: member.email }).expect(202);
    const reset = await ctx.mail.waitFor(member.email, { subject: /reset/i });
    const resetToken = tokenFromMail(reset).token;

    // Assert: B sees its own two invitations and nothing else.
    const seenByB = await shown(b.agent);
    expect(seenByB.map((m) => m.subject).sort()).toEqual(['You are invited to Birch Mill on Lagline', 'You are invited to Birch Mill on Lagline']);
    const bText = JSON.stringify(seenByB);
    for (const secret of [aToken, aOpenToken, resetToken]) expect(bText).not.toContain(secret);
    expect(bText).not.toMatch(/reset-password/);
    expect(bText).not.toContain('Alder Works');

    // A sees its own invitations, not B's, and not the reset either.
    const seenByA = await shown(a.agent);
    expect(seenByA.map((m) => m.to).sort()).toEqual([member.email, openInvitee].sort());
    const aText = JSON.stringify(seenByA);
    expect(aText).not.toContain('Birch Mill');
    expect(aText).not.toContain(resetToken);
    expect(aText).not.toMatch(/reset-password/);

    // The reset link still works for the one who has the mailbox (the catcher kept it, the app does not show it).
    expect(reset.kind).toBe('password-reset');
    expect(reset.teamId).toBeNull();
  });

  it('when a member of the team opens the mail box, then only owners may; an anonymous caller is told to sign in', async () => {
    const owner = await signUpOwner(ctx);
    const engineer = await addMember(ctx, owner.agent, 'engineer');
    await engineer.agent.get('/api/v1/dev/mail').expect(403);
    await request(ctx.app).get('/api/v1/dev/mail').expect(401);
  });

  it('when the mail catcher is off, then the view does not exist (404) for anyone', async () => {
    const app = ctx.restart({ mailCatcher: false });
    const owner = await ctx.agent(app);
    const res = await owner
      .post('/api/v1/auth/signup')
      .set('X-CSRF-Token', owner.csrf)
      .send({ name: 'No Catcher', email: uniqueEmail('nocatch'), password: 'amber-ledger-quarry-61', teamName: 'Quiet Team' })
      .expect(201);
    owner.csrf = res.body.csrfToken;
    const signedIn = await owner.get('/api/v1/dev/mail');
    expect(signedIn.status).toBe(404);
    expect(signedIn.body.errors[0].code).toBe('NOT_FOUND');
    await request(app).get('/api/v1/dev/mail').expect(404);
  });

  it('when the tagging migration is rolled back and applied again, then caught mail keeps working', async () => {
    const database = await createTestDatabase();
    try {
      const dir = { directory: path.resolve(__dirname, '../../migrations'), loadExtensions: ['.js'] };
      await database.db.migrate.down({ ...dir, name: '20261203100000_tag_caught_mail_with_team.js' });
      expect(await database.db.schema.hasColumn('caught_mail', 'team_id')).toBe(false);
      expect(await database.db.schema.hasColumn('caught_mail', 'kind')).toBe(false);
      await database.db.migrate.latest(dir);
      expect(await database.db.schema.hasColumn('caught_mail', 'team_id')).toBe(true);
      expect(await database.db.schema.hasColumn('caught_mail', 'kind')).toBe(true);
    } finally {
      await database.drop();
    }
  });
});
