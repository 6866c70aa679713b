import fs from 'node:fs';
import os from 'node:os';
import path from 'node:path';
import express from 'express';
import sharp from 'sharp';
import request from 'supertest';
import { insertPasswordReset } from '../../server/auth/password-resets.repository';
import { newToken } from '../../server/auth/passwords';
import { type ListedRoute, listRoutes, publicRoute, route } from '../../server/http/routes';
import { insertInvitation } from '../../server/invitations/invitations.repository';
import { insertJob } from '../../server/jobs/jobs.repository';
import { addSiteMember, insertSite } from '../../server/sites/sites.repository';
import { ROLES, type Role } from '../../shared/schemas/common';
import type { Permission } from '../../shared/schemas/permissions';
import { sizeSiteAndWait } from '../helpers/sizing';
import { addMember, type Agent, type ApiContext, createApiContext, signUpOwner, STRONG_PASSWORD, uniqueEmail } from '../helpers/api';

jest.setTimeout(60_000);

let ctx: ApiContext;
let owner: Agent;
let ownerId: number;
let teamId: number;
const users = {} as Record<Role, { email: string; userId: number }>;
let siteId: number;
let resetUserId: number;
let uploadDir: string;
/** A sized site with an issued revision, for the revision and report routes. */
let revSiteId: number;
let issuedRevisionId: number;
/** Two more engineers who prepare and check the revisions other roles then sign. */
let preparerAgent: Agent;
let checkerAgent: Agent;

const CASE = {
  geometry: { type: 'pipe', outerDiameterM: 0.1143, orientation: 'horizontal' },
  processTemperatureC: 250,
  layers: [{ thicknessM: 0.05, conductivity: [0.035, 0.00015] }],
  surfaceEmissivity: 0.1,
  ambient: { airTemperatureC: 30 },
};

beforeAll(async () => {
  uploadDir = fs.mkdtempSync(path.join(os.tmpdir(), 'lagline-matrix-'));
  ctx = await createApiContext({ config: { uploadDir } });
  const o = await signUpOwner(ctx, { teamName: 'Matrix Works' });
  owner = o.agent;
  ownerId = o.userId;
  teamId = o.teamId;
  users.owner = { email: o.email, userId: o.userId };
  for (const role of ROLES.filter((r) => r !== 'owner')) {
    const m = await addMember(ctx, owner, role);
    users[role] = { email: m.email, userId: m.userId };
  }
  siteId = await insertSite(ctx.db, { teamId, name: 'Matrix site', description: '', designBases: {}, createdBy: ownerId });
  await addSiteMember(ctx.db, siteId, users.contractor.userId, ownerId);
  photoJpeg = await sharp({ create: { width: 64, height: 48, channels: 3, background: '#b23a12' } }).jpeg().toBuffer();
  const resettee = await signUpOwner(ctx, { teamName: 'Reset team' });
  resetUserId = resettee.userId;
  preparerAgent = (await addMember(ctx, owner, 'engineer')).agent;
  checkerAgent = (await addMember(ctx, owner, 'engineer')).agent;
  revSiteId = (await owner.post('/api/v1/sites').set('X-CSRF-Token', owner.csrf).send({ name: 'Revision matrix site' }).expect(201)).body.site.id;
  await addSiteMember(ctx.db, revSiteId, users.contractor.userId, ownerId);
  await owner.post(`/api/v1/sites/${revSiteId}/lines`).set('X-CSRF-Token', owner.csrf).send({ ...LINE, tag: 'R-1' }).expect(201);
  await sizeSiteAndWait(owner, revSiteId);
  const issued = await freshRevision('checked');
  issuedRevisionId = (await owner.post(`/api/v1/revisions/${issued.id}/approve`).set('X-CSRF-Token', owner.csrf).send({ snapshotHash: issued.snapshotHash }).expect(200)).body.revision.id;
}, 60_000);
afterAll(async () => {
  await ctx.close();
  fs.rmSync(uploadDir, { recursive: true, force: true });
});

/**
 * The product's role table, written out independently of the server's permission table so that a
 * change to either is caught: who may call each route.
 */
const ALL: Role[] = ['owner', 'engineer', 'safety', 'contractor', 'viewer'];
const SPEC: Record<string, 'public' | 'signedIn' | { permission: Permission; roles: Role[] }> = {
  'GET /api/v1/health': 'public',
  'GET /api/v1/auth/session': 'public',
  'POST /api/v1/auth/signup': 'public',
  'POST /api/v1/auth/signin': 'public',
  'POST /api/v1/auth/signout': 'public',
  'POST /api/v1/auth/password-reset': 'public',
  'POST /api/v1/auth/password-reset/confirm': 'public',
  'GET /api/v1/invitations/:token': 'public',
  'POST /api/v1/invitations/:token/accept': 'public',
  'POST /api/v1/team/invitations': { permission: 'team.manage', roles: ['owner'] },
  'DELETE /api/v1/team/invitations/:id': { permission: 'team.manage', roles: ['owner'] },
  'GET /api/v1/team': { permission: 'team.read', roles: ALL },
  'PATCH /api/v1/team/members/:userId': { permission: 'team.manage', roles: ['owner'] },
  'DELETE /api/v1/team/members/:userId': { permission: 'team.manage', roles: ['owner'] },
  'GET /api/v1/me/settings': 'signedIn',
  'PATCH /api/v1/me/settings': 'signedIn',
  'GET /api/v1/sites': { permission: 'site.read', roles: ALL },
  'POST /api/v1/sites': { permission: 'site.create', roles: ['owner', 'engineer'] },
  'GET /api/v1/sites/:id': { permission: 'site.read', roles: ALL },
  'PATCH /api/v1/sites/:id': { permission: 'site.editTouchBasis', roles: ['owner', 'engineer', 'safety'] },
  'DELETE /api/v1/sites/:id': { permission: 'site.delete', roles: ['owner'] },
  'POST /api/v1/sites/:id/members': { permission: 'site.members', roles: ['owner', 'engineer'] },
  'DELETE /api/v1/sites/:id/members/:userId': { permission: 'site.members', roles: ['owner', 'engineer'] },
  'GET /api/v1/dev/mail': { permission: 'dev.mail', roles: ['owner'] },
  'POST /api/v1/calculations': 'public',
  'GET /api/v1/sites/:siteId/lines': { permission: 'site.read', roles: ALL },
  'POST /api/v1/sites/:siteId/lines': { permission: 'lines.edit', roles: ['owner', 'engineer'] },
  'POST /api/v1/sites/:siteId/lines/bulk': { permission: 'lines.edit', roles: ['owner', 'engineer'] },
  'GET /api/v1/lines/:id': { permission: 'site.read', roles: ALL },
  'PATCH /api/v1/lines/:id': { permission: 'lines.edit', roles: ['owner', 'engineer'] },
  'DELETE /api/v1/lines/:id': { permission: 'lines.edit', roles: ['owner', 'engineer'] },
  'GET /api/v1/sites/:siteId/vessels': { permission: 'site.read', roles: ALL },
  'POST /api/v1/sites/:siteId/vessels': { permission: 'lines.edit', roles: ['owner', 'engineer'] },
  'POST /api/v1/sites/:siteId/vessels/bulk': { permission: 'lines.edit', roles: ['owner', 'engineer'] },
  'GET /api/v1/vessels/:id': { permission: 'site.read', roles: ALL },
  'PATCH /api/v1/vessels/:id': { permission: 'lines.edit', roles: ['owner', 'engineer'] },
  'DELETE /api/v1/vessels/:id': { permission: 'lines.edit', roles: ['owner', 'engineer'] },
  'GET /api/v1/library': { permission: 'site.read', roles: ALL },
  'POST /api/v1/library/materials': { permission: 'library.edit', roles: ['owner', 'engineer'] },
  'PATCH /api/v1/library/materials/:id': { permission: 'library.edit', roles: ['owner', 'engineer'] },
  'DELETE /api/v1/library/materials/:id': { permission: 'library.edit', roles: ['owner', 'engineer'] },
  'POST /api/v1/library/finishes': { permission: 'library.edit', roles: ['owner', 'engineer'] },
  'PATCH /api/v1/library/finishes/:id': { permission: 'library.edit', roles: ['owner', 'engineer'] },
  'DELETE /api/v1/library/finishes/:id': { permission: 'library.edit', roles: ['owner', 'engineer'] },
  'POST /api/v1/sites/:siteId/sizing': { permission: 'lines.edit', roles: ['owner', 'engineer'] },
  'GET /api/v1/jobs/:id': 'signedIn',
  'GET /api/v1/sites/:siteId/overview': { permission: 'site.read', roles: ALL },
  'GET /api/v1/sites/:siteId/sizing-settings': { permission: 'site.read', roles: ALL },
  'PATCH /api/v1/sites/:siteId/sizing-settings': { permission: 'site.edit', roles: ['owner', 'engineer'] },
  'GET /api/v1/register': { permission: 'site.read', roles: ALL },
  'GET /api/v1/register/export.csv': { permission: 'site.read', roles: ALL },
  'GET /api/v1/register/export.pdf': { permission: 'site.read', roles: ALL },
  'GET /api/v1/register/settings': { permission: 'site.read', roles: ALL },
  'PATCH /api/v1/register/settings': { permission: 'team.manage', roles: ['owner'] },
  'POST /api/v1/sites/:siteId/register': { permission: 'surfaces.create', roles: ['owner', 'engineer', 'safety', 'contractor'] },
  'GET /api/v1/register/entries/:id': { permission: 'site.read', roles: ALL },
  'PATCH /api/v1/register/entries/:id': { permission: 'surfaces.create', roles: ['owner', 'engineer', 'safety', 'contractor'] },
  'POST /api/v1/register/entries/:id/assign': { permission: 'surfaces.assign', roles: ['owner', 'safety'] },
  'POST /api/v1/register/entries/:id/made-safe': { permission: 'surfaces.create', roles: ['owner', 'engineer', 'safety', 'contractor'] },
  'POST /api/v1/register/entries/:id/verify': { permission: 'surfaces.verify', roles: ['owner', 'safety'] },
  'POST /api/v1/register/entries/:id/send-back': { permission: 'surfaces.verify', roles: ['owner', 'safety'] },
  'POST /api/v1/register/entries/:id/accept': { permission: 'surfaces.accept', roles: ['owner', 'safety'] },
  'POST /api/v1/register/entries/:id/reopen': { permission: 'surfaces.assign', roles: ['owner', 'safety'] },
  'POST /api/v1/register/entries/:id/comments': { permission: 'surfaces.create', roles: ['owner', 'engineer', 'safety', 'contractor'] },
  'POST /api/v1/register/entries/:id/photos': { permission: 'surfaces.create', roles: ['owner', 'engineer', 'safety', 'contractor'] },
  'GET /api/v1/register/photos/:id/image': { permission: 'site.read', roles: ALL },
  'GET /api/v1/register/photos/:id/thumbnail': { permission: 'site.read', roles: ALL },
  'DELETE /api/v1/register/photos/:id': { permission: 'surfaces.assign', roles: ['owner', 'safety'] },
  'GET /api/v1/sites/:siteId/revisions': { permission: 'site.read', roles: ALL },
  'GET /api/v1/sites/:siteId/revisions/readiness': { permission: 'site.read', roles: ALL },
  'POST /api/v1/sites/:siteId/revisions': { permission: 'revisions.issue', roles: ['owner', 'engineer'] },
  'GET /api/v1/sites/:siteId/revisions/compare': { permission: 'site.read', roles: ALL },
  'GET /api/v1/sites/:siteId/revisions/compare.csv': { permission: 'site.read', roles: ALL },
  'GET /api/v1/sites/:siteId/revision-scheme': { permission: 'site.read', roles: ALL },
  'PUT /api/v1/sites/:siteId/revision-scheme': { permission: 'revisions.issue', roles: ['owner', 'engineer'] },
  'GET /api/v1/revisions/:id': { permission: 'site.read', roles: ALL },
  'PATCH /api/v1/revisions/:id': { permission: 'revisions.issue', roles: ['owner', 'engineer'] },
  'DELETE /api/v1/revisions/:id': { permission: 'revisions.issue', roles: ['owner', 'engineer'] },
  'POST /api/v1/revisions/:id/check': { permission: 'revisions.issue', roles: ['owner', 'engineer'] },
  'POST /api/v1/revisions/:id/approve': { permission: 'revisions.issue', roles: ['owner', 'engineer'] },
  'GET /api/v1/sites/:siteId/reports/insulation-schedule.pdf': { permission: 'site.read', roles: ALL },
  'GET /api/v1/sites/:siteId/reports/insulation-schedule.csv': { permission: 'site.read', roles: ALL },
  'GET /api/v1/sites/:siteId/reports/heat-loss-summary.pdf': { permission: 'site.read', roles: ALL },
  'GET /api/v1/sites/:siteId/reports/heat-loss-summary.csv': { permission: 'site.read', roles: ALL },
  'GET /api/v1/sites/:siteId/reports/take-off.pdf': { permission: 'site.read', roles: ALL },
  'GET /api/v1/sites/:siteId/reports/take-off.csv': { permission: 'site.read', roles: ALL },
};

/** `photo`: sent as multipart field "photos" instead of a JSON body. */
type Sample = { path: string; body?: unknown; photo?: Buffer };
let n = 0;
const freshInvitation = async () => {
  const { token, hash } = newToken();
  const id = await insertInvitation(ctx.db, {
    teamId,
    email: uniqueEmail('inv'),
    role: 'viewer',
    tokenHash: hash,
    invitedBy: ownerId,
    expiresAt: new Date(Date.now() + 3600_000),
  });
  return { id, token };
};
const LINE = { service: 'Steam', nps: '4', lengthM: 20, operatingTemperatureC: 180, purposes: ['personnelProtection'] };
const VESSEL = { diameterM: 2, lengthM: 5, operatingTemperatureC: 150, purposes: ['personnelProtection'] };
const POINTS = [
  { meanTemperatureC: 0, conductivityWPerMK: 0.034 },
  { meanTemperatureC: 100, conductivityWPerMK: 0.045 },
  { meanTemperatureC: 200, conductivityWPerMK: 0.06 },
];
const MATERIAL = { source: 'Test datasheet, rev. 1', tablePoints: POINTS, maxServiceTemperatureC: 250, minServiceTemperatureC: -20 };
const FINISH = { source: 'Test datasheet, rev. 1', emissivity: 0.3, contactMaterial: 'uncoatedMetal' };
async function created(path: string, body: object, key: string): Promise<number> {
  const res = await owner.post(path).set('X-CSRF-Token', owner.csrf).send(body).expect(201);
  return res.body[key].id;
}
const freshLine = () => created(`/api/v1/sites/${siteId}/lines`, { ...LINE, tag: `L-${n++}` }, 'line');
const freshVessel = () => created(`/api/v1/sites/${siteId}/vessels`, { ...VESSEL, tag: `V-${n++}` }, 'vessel');
const freshMaterial = () => created('/api/v1/library/materials', { ...MATERIAL, name: `Foam ${n++}` }, 'material');
const freshFinish = () => created('/api/v1/library/finishes', { ...FINISH, name: `Sheet ${n++}` }, 'finish');
const REGISTER_ENTRY = { location: 'Matrix flange', measuredTemperatureC: 90, method: 'contact', surfaceMaterial: 'uncoatedMetal', withinReach: true };
const inAWeek = () => new Date(Date.now() + 7 * 86_400_000).toISOString().slice(0, 10);
let photoJpeg: Buffer;
/** A register entry on the matrix site (the contractor is invited to it), taken to the given status by the owner. */
async function freshEntry(status: 'open' | 'actionAssigned' | 'madeSafe' | 'accepted' = 'open'): Promise<number> {
  const id = await created(`/api/v1/sites/${siteId}/register`, REGISTER_ENTRY, 'entry');
  const step = (name: string, body: object) => owner.post(`/api/v1/register/entries/${id}/${name}`).set('X-CSRF-Token', owner.csrf).send(body).expect(200);
  if (status === 'actionAssigned' || status === 'madeSafe') await step('assign', { ownerUserId: users.engineer.userId, dueDate: inAWeek(), action: 'Cover it' });
  if (status === 'madeSafe') await step('made-safe', { note: 'Covered' });
  if (status === 'accepted') await step('accept', { reason: 'Out of reach' });
  return id;
}
async function freshPhoto(): Promise<number> {
  const res = await owner
    .post(`/api/v1/sites/${siteId}/register`)
    .set('X-CSRF-Token', owner.csrf)
    .field('entry', JSON.stringify(REGISTER_ENTRY))
    .attach('photos', photoJpeg, 'matrix.jpg')
    .expect(201);
  return res.body.entry.photos[0].id;
}
/**
 * A revision of the revision site prepared by one extra engineer (and checked by the other), so that the
 * owner and the matrix engineer may sign it; any revision still in progress there is withdrawn first.
 */
async function freshRevision(status: 'prepared' | 'checked'): Promise<{ id: number; snapshotHash: string }> {
  await ctx.db('revisions').where({ site_id: revSiteId }).whereNot({ status: 'issued' }).delete();
  const r = (await preparerAgent.post(`/api/v1/sites/${revSiteId}/revisions`).set('X-CSRF-Token', preparerAgent.csrf).send({ purpose: 'review' }).expect(201)).body.revision;
  if (status === 'checked') await checkerAgent.post(`/api/v1/revisions/${r.id}/check`).set('X-CSRF-Token', checkerAgent.csrf).send({ snapshotHash: r.snapshotHash }).expect(200);
  return r;
}
const freshSite = () => insertSite(ctx.db, { teamId, name: `Doomed ${n++}`, description: '', designBases: {}, createdBy: ownerId });

/** A request each route answers with success when the caller may use it. Every route needs one. */
const SAMPLES: Record<string, () => Promise<Sample>> = {
  'GET /api/v1/health': async () => ({ path: '/api/v1/health' }),
  'GET /api/v1/auth/session': async () => ({ path: '/api/v1/auth/session' }),
  'POST /api/v1/auth/signup': async () => ({
    path: '/api/v1/auth/signup',
    body: { name: 'New', email: uniqueEmail('signup'), password: STRONG_PASSWORD, teamName: 'New team' },
  }),
  'POST /api/v1/auth/signin': async () => ({ path: '/api/v1/auth/signin', body: { email: users.viewer.email, password: STRONG_PASSWORD } }),
  'POST /api/v1/auth/signout': async () => ({ path: '/api/v1/auth/signout' }),
  'POST /api/v1/auth/password-reset': async () => ({ path: '/api/v1/auth/password-reset', body: { email: users.viewer.email } }),
  'POST /api/v1/auth/password-reset/confirm': async () => {
    const { token, hash } = newToken();
    await insertPasswordReset(ctx.db, { userId: resetUserId, tokenHash: hash, expiresAt: new Date(Date.now() + 3600_000) });
    return { path: '/api/v1/auth/password-reset/confirm', body: { token, password: STRONG_PASSWORD } };
  },
  'GET /api/v1/invitations/:token': async () => ({ path: `/api/v1/invitations/${(await freshInvitation()).token}` }),
  'POST /api/v1/invitations/:token/accept': async () => ({
    path: `/api/v1/invitations/${(await freshInvitation()).token}/accept`,
    body: { name: 'Joiner', password: STRONG_PASSWORD },
  }),
  'POST /api/v1/team/invitations': async () => ({ path: '/api/v1/team/invitations', body: { email: uniqueEmail('invited'), role: 'viewer' } }),
  'DELETE /api/v1/team/invitations/:id': async () => ({ path: `/api/v1/team/invitations/${(await freshInvitation()).id}` }),
  'GET /api/v1/team': async () => ({ path: '/api/v1/team' }),
  'PATCH /api/v1/team/members/:userId': async () => ({ path: `/api/v1/team/members/${users.viewer.userId}`, body: { role: 'viewer' } }),
  'DELETE /api/v1/team/members/:userId': async () => {
    const m = await addMember(ctx, owner, 'viewer');
    return { path: `/api/v1/team/members/${m.userId}` };
  },
  'GET /api/v1/me/settings': async () => ({ path: '/api/v1/me/settings' }),
  'PATCH /api/v1/me/settings': async () => ({ path: '/api/v1/me/settings', body: { unitSystem: 'SI' } }),
  'GET /api/v1/sites': async () => ({ path: '/api/v1/sites' }),
  'POST /api/v1/sites': async () => ({ path: '/api/v1/sites', body: { name: `Matrix new ${n++}` } }),
  'GET /api/v1/sites/:id': async () => ({ path: `/api/v1/sites/${siteId}` }),
  'PATCH /api/v1/sites/:id': async () => ({ path: `/api/v1/sites/${siteId}`, body: { designBases: { touch: { airTemperatureC: 38 } } } }),
  'DELETE /api/v1/sites/:id': async () => ({ path: `/api/v1/sites/${await freshSite()}` }),
  'POST /api/v1/sites/:id/members': async () => ({ path: `/api/v1/sites/${siteId}/members`, body: { userId: users.contractor.userId } }),
  'DELETE /api/v1/sites/:id/members/:userId': async () => {
    await addSiteMember(ctx.db, siteId, users.viewer.userId, ownerId);
    return { path: `/api/v1/sites/${siteId}/members/${users.viewer.userId}` };
  },
  'GET /api/v1/dev/mail': async () => ({ path: '/api/v1/dev/mail' }),
  'POST /api/v1/calculations': async () => ({ path: '/api/v1/calculations', body: CASE }),
  'GET /api/v1/sites/:siteId/lines': async () => ({ path: `/api/v1/sites/${siteId}/lines` }),
  'POST /api/v1/sites/:siteId/lines': async () => ({ path: `/api/v1/sites/${siteId}/lines`, body: { ...LINE, tag: `L-${n++}` } }),
  'POST /api/v1/sites/:siteId/lines/bulk': async () => ({ path: `/api/v1/sites/${siteId}/lines/bulk`, body: { ids: [await freshLine()], purposes: ['heatConservation'] } }),
  'GET /api/v1/lines/:id': async () => ({ path: `/api/v1/lines/${await freshLine()}` }),
  'PATCH /api/v1/lines/:id': async () => ({ path: `/api/v1/lines/${await freshLine()}`, body: { notes: 'checked' } }),
  'DELETE /api/v1/lines/:id': async () => ({ path: `/api/v1/lines/${await freshLine()}` }),
  'GET /api/v1/sites/:siteId/vessels': async () => ({ path: `/api/v1/sites/${siteId}/vessels` }),
  'POST /api/v1/sites/:siteId/vessels': async () => ({ path: `/api/v1/sites/${siteId}/vessels`, body: { ...VESSEL, tag: `V-${n++}` } }),
  'POST /api/v1/sites/:siteId/vessels/bulk': async () => ({ path: `/api/v1/sites/${siteId}/vessels/bulk`, body: { ids: [await freshVessel()], purposes: ['heatConservation'] } }),
  'GET /api/v1/vessels/:id': async () => ({ path: `/api/v1/vessels/${await freshVessel()}` }),
  'PATCH /api/v1/vessels/:id': async () => ({ path: `/api/v1/vessels/${await freshVessel()}`, body: { notes: 'checked' } }),
  'DELETE /api/v1/vessels/:id': async () => ({ path: `/api/v1/vessels/${await freshVessel()}` }),
  'GET /api/v1/library': async () => ({ path: '/api/v1/library' }),
  'POST /api/v1/library/materials': async () => ({ path: '/api/v1/library/materials', body: { ...MATERIAL, name: `Foam ${n++}` } }),
  'PATCH /api/v1/library/materials/:id': async () => ({ path: `/api/v1/library/materials/${await freshMaterial()}`, body: { notes: 'checked' } }),
  'DELETE /api/v1/library/materials/:id': async () => ({ path: `/api/v1/library/materials/${await freshMaterial()}` }),
  'POST /api/v1/library/finishes': async () => ({ path: '/api/v1/library/finishes', body: { ...FINISH, name: `Sheet ${n++}` } }),
  'PATCH /api/v1/library/finishes/:id': async () => ({ path: `/api/v1/library/finishes/${await freshFinish()}`, body: { emissivity: 0.35 } }),
  'DELETE /api/v1/library/finishes/:id': async () => ({ path: `/api/v1/library/finishes/${await freshFinish()}` }),
  'POST /api/v1/sites/:siteId/sizing': async () => ({ path: `/api/v1/sites/${siteId}/sizing`, body: {} }),
  'GET /api/v1/jobs/:id': async () => ({
    path: `/api/v1/jobs/${await insertJob(ctx.db, { teamId, siteId, kind: 'siteSizing', params: {}, total: 0, createdBy: ownerId })}`,
  }),
  'GET /api/v1/sites/:siteId/overview': async () => ({ path: `/api/v1/sites/${siteId}/overview` }),
  'GET /api/v1/sites/:siteId/sizing-settings': async () => ({ path: `/api/v1/sites/${siteId}/sizing-settings` }),
  'PATCH /api/v1/sites/:siteId/sizing-settings': async () => ({ path: `/api/v1/sites/${siteId}/sizing-settings`, body: { heatConservationMaxPercentOfBare: 5 + (n++ % 10) } }),
  'GET /api/v1/register': async () => ({ path: `/api/v1/register?siteId=${siteId}` }),
  'GET /api/v1/register/export.csv': async () => ({ path: `/api/v1/register/export.csv?siteId=${siteId}` }),
  'GET /api/v1/register/export.pdf': async () => ({ path: `/api/v1/register/export.pdf?siteId=${siteId}&status=active` }),
  'GET /api/v1/register/settings': async () => ({ path: '/api/v1/register/settings' }),
  'PATCH /api/v1/register/settings': async () => ({ path: '/api/v1/register/settings', body: { keepPhotoLocation: false } }),
  'POST /api/v1/sites/:siteId/register': async () => ({ path: `/api/v1/sites/${siteId}/register`, body: REGISTER_ENTRY }),
  'GET /api/v1/register/entries/:id': async () => ({ path: `/api/v1/register/entries/${await freshEntry()}` }),
  'PATCH /api/v1/register/entries/:id': async () => ({ path: `/api/v1/register/entries/${await freshEntry()}`, body: { measuredTemperatureC: 92 } }),
  'POST /api/v1/register/entries/:id/assign': async () => ({
    path: `/api/v1/register/entries/${await freshEntry()}/assign`,
    body: { ownerUserId: users.engineer.userId, dueDate: inAWeek(), action: 'Fit a cover' },
  }),
  'POST /api/v1/register/entries/:id/made-safe': async () => ({ path: `/api/v1/register/entries/${await freshEntry('actionAssigned')}/made-safe`, body: { note: 'Cover fitted' } }),
  'POST /api/v1/register/entries/:id/verify': async () => ({ path: `/api/v1/register/entries/${await freshEntry('madeSafe')}/verify`, body: { note: 'Checked' } }),
  'POST /api/v1/register/entries/:id/send-back': async () => ({ path: `/api/v1/register/entries/${await freshEntry('madeSafe')}/send-back`, body: { reason: 'Cover loose' } }),
  'POST /api/v1/register/entries/:id/accept': async () => ({ path: `/api/v1/register/entries/${await freshEntry()}/accept`, body: { reason: 'Guarded by position' } }),
  'POST /api/v1/register/entries/:id/reopen': async () => ({ path: `/api/v1/register/entries/${await freshEntry('accepted')}/reopen`, body: { reason: 'Access changed' } }),
  'POST /api/v1/register/entries/:id/comments': async () => ({ path: `/api/v1/register/entries/${await freshEntry()}/comments`, body: { body: 'Seen on the walk' } }),
  'POST /api/v1/register/entries/:id/photos': async () => ({ path: `/api/v1/register/entries/${await freshEntry()}/photos`, photo: photoJpeg }),
  'GET /api/v1/register/photos/:id/image': async () => ({ path: `/api/v1/register/photos/${await freshPhoto()}/image` }),
  'GET /api/v1/register/photos/:id/thumbnail': async () => ({ path: `/api/v1/register/photos/${await freshPhoto()}/thumbnail` }),
  'DELETE /api/v1/register/photos/:id': async () => ({ path: `/api/v1/register/photos/${await freshPhoto()}` }),
  'GET /api/v1/sites/:siteId/revisions': async () => ({ path: `/api/v1/sites/${revSiteId}/revisions` }),
  'GET /api/v1/sites/:siteId/revisions/readiness': async () => ({ path: `/api/v1/sites/${revSiteId}/revisions/readiness` }),
  'POST /api/v1/sites/:siteId/revisions': async () => {
    await ctx.db('revisions').where({ site_id: revSiteId }).whereNot({ status: 'issued' }).delete();
    return { path: `/api/v1/sites/${revSiteId}/revisions`, body: { purpose: 'review' } };
  },
  'GET /api/v1/sites/:siteId/revisions/compare': async () => ({ path: `/api/v1/sites/${revSiteId}/revisions/compare?from=${issuedRevisionId}&to=draft` }),
  'GET /api/v1/sites/:siteId/revisions/compare.csv': async () => ({ path: `/api/v1/sites/${revSiteId}/revisions/compare.csv?from=${issuedRevisionId}` }),
  'GET /api/v1/sites/:siteId/revision-scheme': async () => ({ path: `/api/v1/sites/${revSiteId}/revision-scheme` }),
  'PUT /api/v1/sites/:siteId/revision-scheme': async () => ({ path: `/api/v1/sites/${revSiteId}/revision-scheme`, body: { kind: 'trade' } }),
  'GET /api/v1/revisions/:id': async () => ({ path: `/api/v1/revisions/${issuedRevisionId}` }),
  'PATCH /api/v1/revisions/:id': async () => ({ path: `/api/v1/revisions/${(await freshRevision('prepared')).id}`, body: { description: 'Checked against the P&IDs' } }),
  'DELETE /api/v1/revisions/:id': async () => ({ path: `/api/v1/revisions/${(await freshRevision('prepared')).id}` }),
  'POST /api/v1/revisions/:id/check': async () => {
    const r = await freshRevision('prepared');
    return { path: `/api/v1/revisions/${r.id}/check`, body: { snapshotHash: r.snapshotHash } };
  },
  'POST /api/v1/revisions/:id/approve': async () => {
    const r = await freshRevision('checked');
    return { path: `/api/v1/revisions/${r.id}/approve`, body: { snapshotHash: r.snapshotHash } };
  },
  'GET /api/v1/sites/:siteId/reports/insulation-schedule.pdf': async () => ({ path: `/api/v1/sites/${revSiteId}/reports/insulation-schedule.pdf?revision=${issuedRevisionId}` }),
  'GET /api/v1/sites/:siteId/reports/insulation-schedule.csv': async () => ({ path: `/api/v1/sites/${revSiteId}/reports/insulation-schedule.csv` }),
  'GET /api/v1/sites/:siteId/reports/heat-loss-summary.pdf': async () => ({ path: `/api/v1/sites/${revSiteId}/reports/heat-loss-summary.pdf?units=US` }),
  'GET /api/v1/sites/:siteId/reports/heat-loss-summary.csv': async () => ({ path: `/api/v1/sites/${revSiteId}/reports/heat-loss-summary.csv?revision=${issuedRevisionId}` }),
  'GET /api/v1/sites/:siteId/reports/take-off.pdf': async () => ({ path: `/api/v1/sites/${revSiteId}/reports/take-off.pdf?revision=draft&overlapPct=12` }),
  'GET /api/v1/sites/:siteId/reports/take-off.csv': async () => ({ path: `/api/v1/sites/${revSiteId}/reports/take-off.csv?units=SI` }),
};

async function agentFor(role: Role | 'anonymous'): Promise<Agent> {
  const agent = await ctx.agent();
  if (role === 'anonymous') return agent;
  const res = await agent.post('/api/v1/auth/signin').set('X-CSRF-Token', agent.csrf).send({ email: users[role].email, password: STRONG_PASSWORD }).expect(200);
  agent.csrf = res.body.csrfToken;
  return agent;
}

function expectedOutcome(r: ListedRoute, who: Role | 'anonymous'): 'allowed' | 401 | 403 {
  const spec = SPEC[`${r.method} ${r.path}`];
  if (spec === 'public') return 'allowed';
  if (who === 'anonymous') return 401;
  if (spec === 'signedIn') return 'allowed';
  return spec.roles.includes(who) ? 'allowed' : 403;
}

describe('route registry', () => {
  it('when the API router is listed, then every route declares an access rule as its first step', () => {
    const routes = listRoutes(ctx.app.locals.apiRouter);
    expect(routes.length).toBeGreaterThanOrEqual(45);
    const missing = routes.filter((r) => !r.rule).map((r) => `${r.method} ${r.path}`);
    expect(missing).toEqual([]);
  });

  it('when a route is mounted without a rule, then the listing shows it unruled and route() refuses it', () => {
    const router = express.Router();
    router.get('/bare', (_req, res) => {
      res.end();
    });
    route(router, 'get', '/ruled', publicRoute(), (_req, res) => {
      res.end();
    });
    const listed = listRoutes(router);
    expect(listed.find((r) => r.path === '/bare')!.rule).toBeUndefined();
    expect(listed.find((r) => r.path === '/ruled')!.rule).toEqual({ kind: 'public' });
    expect(() => route(router, 'get', '/x', ((_req: unknown, _res: unknown, next: () => void) => next()) as never)).toThrow(/no access rule/);
  });

  it('when the route list is compared with the role table and the samples, then every route is in both', () => {
    const keys = listRoutes(ctx.app.locals.apiRouter).map((r) => `${r.method} ${r.path}`);
    expect(keys.filter((k) => !SAMPLES[k])).toEqual([]);
    expect(keys.filter((k) => !SPEC[k])).toEqual([]);
  });

  it('when each route\'s declared rule is compared with the role table, then they agree', () => {
    const disagreements = listRoutes(ctx.app.locals.apiRouter)
      .map((r) => {
        const spec = SPEC[`${r.method} ${r.path}`];
        const want = typeof spec === 'string' ? { kind: spec } : { kind: 'permission', permission: spec?.permission };
        return JSON.stringify(r.rule) === JSON.stringify(want) ? null : `${r.method} ${r.path}: ${JSON.stringify(r.rule)}`;
      })
      .filter(Boolean);
    expect(disagreements).toEqual([]);
  });
});

describe('role matrix', () => {
  const WHO: (Role | 'anonymous')[] = ['anonymous', ...ROLES];
  it('when every role calls every route, then exactly the roles the permission table allows get through', async () => {
    const routes = listRoutes(ctx.app.locals.apiRouter);
    const mismatches: string[] = [];
    for (const r of routes) {
      for (const who of WHO) {
        const sample = await SAMPLES[`${r.method} ${r.path}`]();
        const agent = await agentFor(who);
        const method = r.method.toLowerCase() as 'get' | 'post' | 'put' | 'patch' | 'delete';
        let req = agent[method](sample.path).set('X-CSRF-Token', agent.csrf);
        if (sample.photo) req = req.attach('photos', sample.photo, 'matrix.jpg');
        else if (sample.body !== undefined) req = req.send(sample.body as object);
        const res = await req;
        const expected = expectedOutcome(r, who);
        const ok = expected === 'allowed' ? res.status >= 200 && res.status < 300 : res.status === expected;
        if (!ok) mismatches.push(`${r.method} ${r.path} as ${who}: expected ${expected}, got ${res.status} ${JSON.stringify(res.body).slice(0, 200)}`);
        if (expected !== 'allowed') expect(res.body.errors?.[0]?.code).toBe(expected === 401 ? 'UNAUTHENTICATED' : 'FORBIDDEN');
      }
    }
    expect(mismatches).toEqual([]);
  }, 120_000);

  it('when a safety officer edits more than the touch basis, then 403; the touch basis alone is saved', async () => {
    const safety = await agentFor('safety');
    await safety.patch(`/api/v1/sites/${siteId}`).set('X-CSRF-Token', safety.csrf).send({ name: 'Renamed' }).expect(403);
    await safety
      .patch(`/api/v1/sites/${siteId}`)
      .set('X-CSRF-Token', safety.csrf)
      .send({ designBases: { energy: { airTemperatureC: 5 } } })
      .expect(403);
    const ok = await safety
      .patch(`/api/v1/sites/${siteId}`)
      .set('X-CSRF-Token', safety.csrf)
      .send({ designBases: { touch: { airTemperatureC: 41, windSpeedMS: 0 } } })
      .expect(200);
    expect(ok.body.site.designBases.touch).toEqual({ airTemperatureC: 41, windSpeedMS: 0 });
  });

  it('when a contractor lists or opens sites, then only the sites they were invited to exist for them', async () => {
    const other = await freshSite();
    const contractor = await agentFor('contractor');
    const list = await contractor.get('/api/v1/sites').expect(200);
    expect(list.body.sites.map((s: { id: number }) => s.id).sort((a: number, b: number) => a - b)).toEqual([siteId, revSiteId]);
    await contractor.get(`/api/v1/sites/${other}`).expect(404);
    const viewer = await agentFor('viewer');
    const all = await viewer.get('/api/v1/sites').expect(200);
    expect(all.body.sites.map((s: { id: number }) => s.id)).toEqual(expect.arrayContaining([siteId, other]));
  });
});

describe('team isolation', () => {
  it('when another team\'s owner reads or writes this team\'s ids, then 404 and no data', async () => {
    const intruder = await signUpOwner(ctx, { teamName: 'Intruders' });
    const a = intruder.agent;
    const { id: invitationId } = await freshInvitation();
    const attempts = [
      a.get(`/api/v1/sites/${siteId}`),
      a.patch(`/api/v1/sites/${siteId}`).set('X-CSRF-Token', a.csrf).send({ name: 'Taken over' }),
      a.delete(`/api/v1/sites/${siteId}`).set('X-CSRF-Token', a.csrf),
      a.post(`/api/v1/sites/${siteId}/members`).set('X-CSRF-Token', a.csrf).send({ userId: intruder.userId }),
      a.delete(`/api/v1/sites/${siteId}/members/${users.contractor.userId}`).set('X-CSRF-Token', a.csrf),
      a.patch(`/api/v1/team/members/${users.engineer.userId}`).set('X-CSRF-Token', a.csrf).send({ role: 'viewer' }),
      a.delete(`/api/v1/team/members/${users.engineer.userId}`).set('X-CSRF-Token', a.csrf),
      a.delete(`/api/v1/team/invitations/${invitationId}`).set('X-CSRF-Token', a.csrf),
    ];
    for (const attempt of attempts) {
      const res = await attempt;
      expect(res.status).toBe(404);
      expect(JSON.stringify(res.body)).not.toContain('Matrix');
    }
    const list = await a.get('/api/v1/sites').expect(200);
    expect(list.body.sites).toEqual([]);
    const team = await a.get('/api/v1/team').expect(200);
    expect(team.body.members.map((m: { userId: number }) => m.userId)).toEqual([intruder.userId]);
    // Nothing changed on our side.
    const site = await owner.get(`/api/v1/sites/${siteId}`).expect(200);
    expect(site.body.site.name).toBe('Matrix site');
    const engineer = await ctx.db('memberships').where({ team_id: teamId, user_id: users.engineer.userId }).first();
    expect(engineer.role).toBe('engineer');
  });

  it('when a client sends a team id of its own, then it is refused as an unknown field (scope comes from the session)', async () => {
    const res = await owner.post('/api/v1/sites').set('X-CSRF-Token', owner.csrf).send({ name: 'Smuggled', teamId: 999 });
    expect(res.status).toBe(400);
    expect(res.body.errors[0].field).toBe('teamId');
  });

  it('when an id is not a number, then the route answers 404', async () => {
    await owner.get('/api/v1/sites/abc').expect(404);
    await owner.get('/api/v1/sites/99999999999999').expect(404);
    await request(ctx.app).get('/api/v1/no-such-route').expect(404);
  });
});
