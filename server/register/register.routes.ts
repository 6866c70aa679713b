import type { Router } from 'express';
import {
  commentSchema,
  entryCreateSchema,
  entryPatchSchema,
  REGISTER_TRANSITIONS,
  REGISTER_TRANSITION_NAMES,
  registerSettingsSchema,
  TRANSITION_SCHEMAS,
  type EntryCreateInput,
} from '../../shared/schemas/register';
import type { Caller } from '../auth/auth.service';
import type { Deps } from '../deps';
import { sendCsv } from '../http/csv';
import { authorize, route } from '../http/routes';
import { idParam, validateBody } from '../http/validate';
import { findSettings } from '../me/settings.repository';
import { findSite } from '../sites/sites.repository';
import { findTeam } from '../team/teams.repository';
import { photoPath } from './photos';
import { registerCsv, registerPdf } from './register-export';
import * as register from './register.service';
import { entryBody, photosOf, receivePhotos, validated } from './uploads';

/** The hot-surface register (docs/api.md, "Surface register"). */
export function registerRegisterRoutes(router: Router, deps: Deps, poke: () => void): void {
  const rdeps: register.RegisterDeps = { db: deps.db, config: deps.config, now: deps.now, poke };

  route(router, 'get', '/api/v1/register', authorize('site.read'), async (req, res) => {
    res.json(await register.listRegister(rdeps, req.auth!, req.query as Record<string, unknown>));
  });

  const exportRows = async (query: Record<string, unknown>, caller: Caller) => {
    const q = register.parseRegisterQuery(query, { paged: false });
    const { keyed, counts } = await register.registerRows(rdeps, caller, q);
    return { q, rows: keyed.map((k) => k.r), counts };
  };
  route(router, 'get', '/api/v1/register/export.csv', authorize('site.read'), async (req, res) => {
    const { rows } = await exportRows(req.query as Record<string, unknown>, req.auth!);
    sendCsv(res, `hot-surface-register-${new Date(deps.now()).toISOString().slice(0, 10)}.csv`, registerCsv(rows));
  });
  route(router, 'get', '/api/v1/register/export.pdf', authorize('site.read'), async (req, res) => {
    const caller = req.auth!;
    const { q, rows, counts } = await exportRows(req.query as Record<string, unknown>, caller);
    const [team, settings, site] = await Promise.all([
      findTeam(deps.db, caller.teamId),
      findSettings(deps.db, caller.userId),
      q.siteId ? findSite(deps.db, caller.teamId, q.siteId) : Promise.resolve(undefined),
    ]);
    const pdf = await registerPdf({ rows, counts, filters: q, teamName: team?.name ?? '', siteName: site?.name, unitSystem: settings.unitSystem, generatedAt: new Date(deps.now()) });
    res.setHeader('Content-Type', 'application/pdf');
    res.setHeader('Content-Disposition', `attachment; filename="hot-surface-register-${new Date(deps.now()).toISOString().slice(0, 10)}.pdf"`);
    res.send(pdf);
  });

  route(router, 'get', '/api/v1/register/settings', authorize('site.read'), async (req, res) => {
    res.json({ settings: await register.getRegisterSettings(rdeps, req.auth!) });
  });
  route(router, 'patch', '/api/v1/register/settings', authorize('team.manage'), validateBody(registerSettingsSchema), async (req, res) => {
    res.json({ settings: await register.updateRegisterSettings(rdeps, req.auth!, req.body, req.ip) });
  });

  // JSON, or multipart with the entry as JSON text in field "entry" and up to four files in "photos".
  route(router, 'post', '/api/v1/sites/:siteId/register', authorize('surfaces.create'), receivePhotos, async (req, res) => {
    const siteId = idParam(req.params.siteId, 'The site');
    const input = await validated<EntryCreateInput>(entryCreateSchema, entryBody(req));
    res.status(201).json({ entry: await register.createEntry(rdeps, req.auth!, siteId, input, photosOf(req), req.ip) });
  });

  route(router, 'get', '/api/v1/register/entries/:id', authorize('site.read'), async (req, res) => {
    res.json({ entry: await register.getEntry(rdeps, req.auth!, idParam(req.params.id, 'The register entry')) });
  });
  route(router, 'patch', '/api/v1/register/entries/:id', authorize('surfaces.create'), validateBody(entryPatchSchema), async (req, res) => {
    res.json({ entry: await register.updateEntry(rdeps, req.auth!, idParam(req.params.id, 'The register entry'), req.body, req.ip) });
  });
  for (const name of REGISTER_TRANSITION_NAMES) {
    const t = REGISTER_TRANSITIONS[name];
    route(router, 'post', `/api/v1/register/entries/:id/${t.path}`, authorize(t.permission), validateBody(TRANSITION_SCHEMAS[name]), async (req, res) => {
      res.json({ entry: await register.transition(rdeps, req.auth!, idParam(req.params.id, 'The register entry'), name, req.body, req.ip) });
    });
  }
  route(router, 'post', '/api/v1/register/entries/:id/comments', authorize('surfaces.create'), validateBody(commentSchema), async (req, res) => {
    res.status(201).json({ entry: await register.addComment(rdeps, req.auth!, idParam(req.params.id, 'The register entry'), req.body, req.ip) });
  });
  route(router, 'post', '/api/v1/register/entries/:id/photos', authorize('surfaces.create'), receivePhotos, async (req, res) => {
    const id = idParam(req.params.id, 'The register entry');
    res.status(201).json({ entry: await register.addPhotos(rdeps, req.auth!, id, photosOf(req), req.ip) });
  });

  for (const which of ['image', 'thumbnail'] as const) {
    route(router, 'get', `/api/v1/register/photos/:id/${which}`, authorize('site.read'), async (req, res, next) => {
      const f = await register.photoFile(rdeps, req.auth!, idParam(req.params.id, 'The photo'), which);
      res.setHeader('Cache-Control', 'private, max-age=86400');
      res.setHeader('Content-Disposition', `inline; filename="register-photo-${req.params.id}${which === 'thumbnail' ? '-thumbnail' : ''}.jpg"`);
      res.type(f.contentType);
      // The upload folder may sit under a dot-folder (.uploads/); the file name itself is one we generated.
      res.sendFile(photoPath(deps.config.uploadDir, f.name), { dotfiles: 'allow' }, (err) => {
        if (err && !res.headersSent) next((err as { code?: string }).code === 'ENOENT' ? register.photoMissing() : err);
      });
    });
  }
  route(router, 'delete', '/api/v1/register/photos/:id', authorize('surfaces.assign'), async (req, res) => {
    await register.deletePhoto(rdeps, req.auth!, idParam(req.params.id, 'The photo'), req.ip);
    res.status(204).end();
  });
}
