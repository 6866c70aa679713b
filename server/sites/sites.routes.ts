import type { Router } from 'express';
import { siteCreateSchema, siteMemberAddSchema, sitePatchSchema } from '../../shared/schemas/sites';
import type { Deps } from '../deps';
import { authorize, route } from '../http/routes';
import { idParam, validateBody } from '../http/validate';
import * as sites from './sites.service';

export function registerSiteRoutes(router: Router, deps: Deps): void {
  route(router, 'get', '/api/v1/sites', authorize('site.read'), async (req, res) => {
    res.json({ sites: await sites.listSites(deps, req.auth!) });
  });
  route(router, 'post', '/api/v1/sites', authorize('site.create'), validateBody(siteCreateSchema), async (req, res) => {
    res.status(201).json({ site: await sites.createSite(deps, req.auth!, req.body, req.ip) });
  });
  route(router, 'get', '/api/v1/sites/:id', authorize('site.read'), async (req, res) => {
    res.json({ site: await sites.getSite(deps, req.auth!, idParam(req.params.id, 'The site')) });
  });
  // The narrower permission opens the route; the service refuses more than the touch basis to it.
  route(router, 'patch', '/api/v1/sites/:id', authorize('site.editTouchBasis'), validateBody(sitePatchSchema), async (req, res) => {
    res.json({ site: await sites.updateSite(deps, req.auth!, idParam(req.params.id, 'The site'), req.body, req.ip) });
  });
  route(router, 'delete', '/api/v1/sites/:id', authorize('site.delete'), async (req, res) => {
    await sites.deleteSite(deps, req.auth!, idParam(req.params.id, 'The site'), req.ip);
    res.status(204).end();
  });
  route(router, 'post', '/api/v1/sites/:id/members', authorize('site.members'), validateBody(siteMemberAddSchema), async (req, res) => {
    const members = await sites.addSiteMember(deps, req.auth!, idParam(req.params.id, 'The site'), req.body.userId, req.ip);
    res.status(201).json({ members });
  });
  route(router, 'delete', '/api/v1/sites/:id/members/:userId', authorize('site.members'), async (req, res) => {
    await sites.removeSiteMember(deps, req.auth!, idParam(req.params.id, 'The site'), idParam(req.params.userId, 'The site member'), req.ip);
    res.status(204).end();
  });
}
