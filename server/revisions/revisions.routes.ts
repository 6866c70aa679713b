import type { Router } from 'express';
import { revisionPatchSchema, revisionPrepareSchema, revisionSchemeSchema, revisionSignSchema } from '../../shared/schemas/revisions';
import type { Deps } from '../deps';
import { toCsv, sendCsv } from '../http/csv';
import { authorize, route } from '../http/routes';
import { idParam, validateBody } from '../http/validate';
import * as revisions from './revisions.service';

/** Revisions of a site's line list: history, readiness, prepare → check → approve, comparison, numbering. */
export function registerRevisionRoutes(router: Router, deps: Deps): void {
  const site = (v: unknown) => idParam(v, 'The site');
  const revision = (v: unknown) => idParam(v, 'The revision');

  route(router, 'get', '/api/v1/sites/:siteId/revisions', authorize('site.read'), async (req, res) => {
    res.json({ revisions: await revisions.listRevisions(deps, req.auth!, site(req.params.siteId)) });
  });
  route(router, 'get', '/api/v1/sites/:siteId/revisions/readiness', authorize('site.read'), async (req, res) => {
    res.json({ readiness: await revisions.readiness(deps, req.auth!, site(req.params.siteId)) });
  });
  route(router, 'post', '/api/v1/sites/:siteId/revisions', authorize('revisions.issue'), validateBody(revisionPrepareSchema), async (req, res) => {
    res.status(201).json({ revision: await revisions.prepareRevision(deps, req.auth!, site(req.params.siteId), req.body, req.ip) });
  });
  route(router, 'get', '/api/v1/sites/:siteId/revisions/compare', authorize('site.read'), async (req, res) => {
    res.json({ comparison: await revisions.compare(deps, req.auth!, site(req.params.siteId), req.query as Record<string, unknown>) });
  });
  route(router, 'get', '/api/v1/sites/:siteId/revisions/compare.csv', authorize('site.read'), async (req, res) => {
    const c = await revisions.compareCsv(deps, req.auth!, site(req.params.siteId), req.query as Record<string, unknown>);
    sendCsv(res, c.fileName, toCsv(c.header, c.rows));
  });
  route(router, 'get', '/api/v1/sites/:siteId/revision-scheme', authorize('site.read'), async (req, res) => {
    res.json({ scheme: await revisions.getScheme(deps, req.auth!, site(req.params.siteId)) });
  });
  route(router, 'put', '/api/v1/sites/:siteId/revision-scheme', authorize('revisions.issue'), validateBody(revisionSchemeSchema), async (req, res) => {
    res.json({ scheme: await revisions.updateScheme(deps, req.auth!, site(req.params.siteId), req.body, req.ip) });
  });
  route(router, 'get', '/api/v1/revisions/:id', authorize('site.read'), async (req, res) => {
    res.json({ revision: await revisions.getRevision(deps, req.auth!, revision(req.params.id)) });
  });
  route(router, 'patch', '/api/v1/revisions/:id', authorize('revisions.issue'), validateBody(revisionPatchSchema), async (req, res) => {
    res.json({ revision: await revisions.updateRevision(deps, req.auth!, revision(req.params.id), req.body, req.ip) });
  });
  route(router, 'delete', '/api/v1/revisions/:id', authorize('revisions.issue'), async (req, res) => {
    await revisions.withdrawRevision(deps, req.auth!, revision(req.params.id), req.ip);
    res.status(204).end();
  });
  route(router, 'post', '/api/v1/revisions/:id/check', authorize('revisions.issue'), validateBody(revisionSignSchema), async (req, res) => {
    res.json({ revision: await revisions.checkRevision(deps, req.auth!, revision(req.params.id), req.body, req.ip) });
  });
  route(router, 'post', '/api/v1/revisions/:id/approve', authorize('revisions.issue'), validateBody(revisionSignSchema), async (req, res) => {
    res.json({ revision: await revisions.approveRevision(deps, req.auth!, revision(req.params.id), req.body, req.ip) });
  });
}
