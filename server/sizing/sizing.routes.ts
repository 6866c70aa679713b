import type { Router } from 'express';
import * as yup from 'yup';
import { sizingSettingsSchema } from '../../shared/schemas/lines';
import type { Deps } from '../deps';
import { authorize, route, signedIn } from '../http/routes';
import { idParam, validateBody } from '../http/validate';
import * as sizing from './sizing.service';

const startSchema = yup.object({}).noUnknown().strict();

export function registerSizingRoutes(router: Router, deps: Deps & { jobs: { poke: () => void } }): void {
  route(router, 'post', '/api/v1/sites/:siteId/sizing', authorize('lines.edit'), validateBody(startSchema), async (req, res) => {
    const { job } = await sizing.startSiteSizing(deps, req.auth!, idParam(req.params.siteId, 'The site'), req.ip);
    deps.jobs.poke();
    res.status(202).json({ job });
  });
  route(router, 'get', '/api/v1/jobs/:id', signedIn(), async (req, res) => {
    res.json({ job: await sizing.getJob(deps, req.auth!, idParam(req.params.id, 'The job')) });
  });
  route(router, 'get', '/api/v1/sites/:siteId/overview', authorize('site.read'), async (req, res) => {
    res.json({ overview: await sizing.siteOverview(deps, req.auth!, idParam(req.params.siteId, 'The site')) });
  });
  route(router, 'get', '/api/v1/sites/:siteId/sizing-settings', authorize('site.read'), async (req, res) => {
    res.json({ settings: await sizing.getSizingSettings(deps, req.auth!, idParam(req.params.siteId, 'The site')) });
  });
  route(router, 'patch', '/api/v1/sites/:siteId/sizing-settings', authorize('site.edit'), validateBody(sizingSettingsSchema), async (req, res) => {
    res.json({ settings: await sizing.updateSizingSettings(deps, req.auth!, idParam(req.params.siteId, 'The site'), req.body, req.ip) });
  });
}
