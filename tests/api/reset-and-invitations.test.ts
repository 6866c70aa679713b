import { hashToken } from '../../server/auth/passwords';
import { addMember, type ApiContext, createApiContext, signUpOwner, STRONG_PASSWORD, uniqueEmail } from '../helpers/api';
import { tokenFromMail } from '../helpers/mail';

jest.setTimeout(60_000);

let ctx: ApiContext;
beforeAll(async () => {
  ctx = await createApiContext();
});
afterAll(async () => {
  await ctx.close();
});

const NEW_PASSWORD = 'lantern-gravel-orchid-38';

async function requestReset(email: string) {
  const agent = await ctx.agent();
  return agent.post('/api/v1/auth/password-reset').set('X-CSRF-Token', agent.csrf).send({ email });
}

async function confirm(token: string, password = NEW_PASSWORD) {
  const agent = await ctx.agent();
  return agent.post('/api/v1/auth/password-reset/confirm').set('X-CSRF-Token', agent.csrf).send({ token, password });
}

async function signIn(email: string, password: string) {
  const agent = await ctx.agent();
  return agent.post('/api/v1/auth/signin').set('X-CSRF-Token', agent.csrf).send({ email, password });
}

describe('password reset', () => {
  it('when a user resets with the mailed link, then the new password works, the old one and old sessions do not', async () => {
    const { email, agent: oldSession } = await signUpOwner(ctx);
    const res = await requestReset(email);
    expect(res.status).toBe(202);
    const mail = await ctx.mail.waitFor(email, { subject: /reset/i });
    expect(mail.text).toMatch(/1 hour/);
    expect(mail.text).toMatch(/ignore/i);
    const { link, token } = tokenFromMail(mail);
    expect(link.startsWith(`${ctx.config.appUrl}/reset-password?token=`)).toBe(true);
    await confirm(token).then((r) => expect(r.status).toBe(204));
    expect((await signIn(email, STRONG_PASSWORD)).status).toBe(401);
    expect((await signIn(email, NEW_PASSWORD)).status).toBe(200);
    await oldSession.get('/api/v1/sites').expect(401);
  });

  it('when the link is used a second time, then 400 INVALID_TOKEN', async () => {
    const { email } = await signUpOwner(ctx);
    await requestReset(email);
    const { token } = tokenFromMail(await ctx.mail.waitFor(email, { subject: /reset/i }));
    expect((await confirm(token)).status).toBe(204);
    const again = await confirm(token, 'another-fresh-passphrase-77');
    expect(again.status).toBe(400);
    expect(again.body.errors[0]).toMatchObject({ code: 'INVALID_TOKEN', field: 'token' });
  });

  it('when the link has expired, then 400 INVALID_TOKEN and the password is unchanged', async () => {
    const { email } = await signUpOwner(ctx);
    await requestReset(email);
    const { token } = tokenFromMail(await ctx.mail.waitFor(email, { subject: /reset/i }));
    await ctx.db('password_resets').where({ token_hash: hashToken(token) }).update({ expires_at: new Date(Date.now() - 1000) });
    expect((await confirm(token)).status).toBe(400);
    expect((await signIn(email, STRONG_PASSWORD)).status).toBe(200);
  });

  it('when the address has no account, then the answer is the same 202 and no mail is sent', async () => {
    const { email } = await signUpOwner(ctx);
    const known = await requestReset(email);
    const nobody = uniqueEmail('nobody');
    const unknown = await requestReset(nobody);
    expect(unknown.status).toBe(known.status);
    expect(unknown.body).toEqual(known.body);
    await ctx.mail.waitFor(email, { subject: /reset/i });
    expect((await ctx.mail.messages()).some((m) => m.to === nobody)).toBe(false);
  });

  it('when the new password is weak, then 400 WEAK_PASSWORD and the token still works afterwards', async () => {
    const { email } = await signUpOwner(ctx);
    await requestReset(email);
    const { token } = tokenFromMail(await ctx.mail.waitFor(email, { subject: /reset/i }));
    const weak = await confirm(token, 'password12345');
    expect(weak.status).toBe(400);
    expect(weak.body.errors[0]).toMatchObject({ code: 'WEAK_PASSWORD', field: 'password' });
    expect((await confirm(token)).status).toBe(204);
  });
});

describe('invitations', () => {
  it('when an owner invites by e-mail, then the mail names team and role, and accepting creates user and membership', async () => {
    const { agent: owner, teamId } = await signUpOwner(ctx, { teamName: 'Larkspur Mill' });
    const email = uniqueEmail('invitee');
    const created = await owner.post('/api/v1/team/invitations').set('X-CSRF-Token', owner.csrf).send({ email, role: 'safety' }).expect(201);
    expect(created.body.invitation).toMatchObject({ email, role: 'safety' });
    const mail = await ctx.mail.waitFor(email, { subject: /invited/i });
    expect(mail.subject).toContain('Larkspur Mill');
    expect(mail.text).toContain('safety officer');
    const { link, token } = tokenFromMail(mail);
    expect(link.startsWith(`${ctx.config.appUrl}/accept-invite?token=`)).toBe(true);

    const visitor = await ctx.agent();
    const info = await visitor.get(`/api/v1/invitations/${token}`).expect(200);
    expect(info.body).toEqual({ teamName: 'Larkspur Mill', email, role: 'safety', invitedBy: 'Test Owner' });
    const accepted = await visitor
      .post(`/api/v1/invitations/${token}/accept`)
      .set('X-CSRF-Token', visitor.csrf)
      .send({ name: 'Rhiannon Veal', password: STRONG_PASSWORD })
      .expect(201);
    expect(accepted.body).toMatchObject({ user: { email, name: 'Rhiannon Veal' }, team: { id: teamId }, role: 'safety' });
    const members = await owner.get('/api/v1/team').expect(200);
    expect(members.body.members.map((m: { email: string }) => m.email)).toContain(email);
    expect(members.body.invitations).toEqual([]);
  });

  it('when an invitation was accepted, then its token is spent (GET and accept 404)', async () => {
    const { agent: owner } = await signUpOwner(ctx);
    const email = uniqueEmail('once');
    await owner.post('/api/v1/team/invitations').set('X-CSRF-Token', owner.csrf).send({ email, role: 'viewer' }).expect(201);
    const { token } = tokenFromMail(await ctx.mail.waitFor(email, { subject: /invited/i }));
    const a = await ctx.agent();
    await a.post(`/api/v1/invitations/${token}/accept`).set('X-CSRF-Token', a.csrf).send({ name: 'First', password: STRONG_PASSWORD }).expect(201);
    const b = await ctx.agent();
    await b.get(`/api/v1/invitations/${token}`).expect(404);
    await b.post(`/api/v1/invitations/${token}/accept`).set('X-CSRF-Token', b.csrf).send({ name: 'Second', password: STRONG_PASSWORD }).expect(404);
  });

  it('when accepting fails half-way (weak password), then no user or membership is left behind', async () => {
    const { agent: owner } = await signUpOwner(ctx);
    const email = uniqueEmail('weak');
    await owner.post('/api/v1/team/invitations').set('X-CSRF-Token', owner.csrf).send({ email, role: 'engineer' }).expect(201);
    const { token } = tokenFromMail(await ctx.mail.waitFor(email, { subject: /invited/i }));
    const a = await ctx.agent();
    const res = await a.post(`/api/v1/invitations/${token}/accept`).set('X-CSRF-Token', a.csrf).send({ name: 'Weak', password: 'password12345' });
    expect(res.status).toBe(400);
    expect(await ctx.db('users').where({ email })).toHaveLength(0);
    await a.get(`/api/v1/invitations/${token}`).expect(200);
  });

  it('when an existing signed-in user with the invited address accepts with {}, then they join the team', async () => {
    const { agent: owner, teamId } = await signUpOwner(ctx, { teamName: 'Second Team' });
    const other = await signUpOwner(ctx, { teamName: 'Home Team' });
    await owner.post('/api/v1/team/invitations').set('X-CSRF-Token', owner.csrf).send({ email: other.email, role: 'engineer' }).expect(201);
    const { token } = tokenFromMail(await ctx.mail.waitFor(other.email, { subject: /invited/i }));
    const res = await other.agent.post(`/api/v1/invitations/${token}/accept`).set('X-CSRF-Token', other.agent.csrf).send({}).expect(201);
    expect(res.body).toMatchObject({ user: { id: other.userId }, team: { id: teamId }, role: 'engineer' });
  });

  it('when an owner revokes an invitation, then its token no longer works', async () => {
    const { agent: owner } = await signUpOwner(ctx);
    const email = uniqueEmail('revoked');
    const created = await owner.post('/api/v1/team/invitations').set('X-CSRF-Token', owner.csrf).send({ email, role: 'viewer' }).expect(201);
    const { token } = tokenFromMail(await ctx.mail.waitFor(email, { subject: /invited/i }));
    await owner.delete(`/api/v1/team/invitations/${created.body.invitation.id}`).set('X-CSRF-Token', owner.csrf).expect(204);
    await owner.get(`/api/v1/invitations/${token}`).expect(404);
  });

  it('when the invitation has expired, then GET answers 404', async () => {
    const { agent: owner } = await signUpOwner(ctx);
    const email = uniqueEmail('late');
    await owner.post('/api/v1/team/invitations').set('X-CSRF-Token', owner.csrf).send({ email, role: 'viewer' }).expect(201);
    const { token } = tokenFromMail(await ctx.mail.waitFor(email, { subject: /invited/i }));
    await ctx.db('invitations').where({ token_hash: hashToken(token) }).update({ expires_at: new Date(Date.now() - 1000) });
    await owner.get(`/api/v1/invitations/${token}`).expect(404);
  });
});

describe('team roles', () => {
  it('when the only owner tries to demote or remove themself, then 409 LAST_OWNER', async () => {
    const { agent: owner, userId } = await signUpOwner(ctx);
    const demote = await owner.patch(`/api/v1/team/members/${userId}`).set('X-CSRF-Token', owner.csrf).send({ role: 'engineer' });
    expect(demote.status).toBe(409);
    expect(demote.body.errors[0].code).toBe('LAST_OWNER');
    await owner.delete(`/api/v1/team/members/${userId}`).set('X-CSRF-Token', owner.csrf).expect(409);
  });

  it('when there are two owners, then one may be demoted; the role applies at once', async () => {
    const { agent: owner, userId } = await signUpOwner(ctx);
    const second = await addMember(ctx, owner, 'engineer');
    await owner.patch(`/api/v1/team/members/${second.userId}`).set('X-CSRF-Token', owner.csrf).send({ role: 'owner' }).expect(200);
    await second.agent.patch(`/api/v1/team/members/${userId}`).set('X-CSRF-Token', second.agent.csrf).send({ role: 'viewer' }).expect(200);
    const me = await owner.get('/api/v1/auth/session').expect(200);
    expect(me.body.role).toBe('viewer');
    await owner.post('/api/v1/sites').set('X-CSRF-Token', owner.csrf).send({ name: 'Not any more' }).expect(403);
  });

  it('when a member is removed, then their session loses access immediately', async () => {
    const { agent: owner } = await signUpOwner(ctx);
    const member = await addMember(ctx, owner, 'engineer');
    await member.agent.get('/api/v1/sites').expect(200);
    await owner.delete(`/api/v1/team/members/${member.userId}`).set('X-CSRF-Token', owner.csrf).expect(204);
    await member.agent.get('/api/v1/sites').expect(401);
  });

  it('when an owner invites someone already in the team, then 409 ALREADY_MEMBER names email', async () => {
    const { agent: owner, email } = await signUpOwner(ctx);
    const res = await owner.post('/api/v1/team/invitations').set('X-CSRF-Token', owner.csrf).send({ email, role: 'viewer' }).expect(409);
    expect(res.body.errors[0]).toMatchObject({ code: 'ALREADY_MEMBER', field: 'email' });
  });

  it('when the owner opens the development mail box, then it lists the team\'s caught mail only', async () => {
    const { agent: owner } = await signUpOwner(ctx);
    const other = await signUpOwner(ctx);
    const email = uniqueEmail('boxed');
    await owner.post('/api/v1/team/invitations').set('X-CSRF-Token', owner.csrf).send({ email, role: 'viewer' }).expect(201);
    await ctx.mail.waitFor(email);
    const mine = await owner.get('/api/v1/dev/mail').expect(200);
    expect(mine.body.messages.some((m: { to: string }) => m.to === email)).toBe(true);
    const theirs = await other.agent.get('/api/v1/dev/mail').expect(200);
    expect(theirs.body.messages.some((m: { to: string }) => m.to === email)).toBe(false);
  });
});
