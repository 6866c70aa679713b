import type { Router } from 'express';
import { teamFinishCreateSchema, teamFinishPatchSchema, teamMaterialCreateSchema, teamMaterialPatchSchema } from '../../shared/schemas/lines';
import type { Deps } from '../deps';
import { authorize, route } from '../http/routes';
import { idParam, validateBody } from '../http/validate';
import * as library from './library.service';

export function registerLibraryRoutes(router: Router, deps: Deps): void {
  route(router, 'get', '/api/v1/library', authorize('site.read'), async (req, res) => {
    res.json(await library.getLibrary(deps, req.auth!));
  });
  route(router, 'post', '/api/v1/library/materials', authorize('library.edit'), validateBody(teamMaterialCreateSchema), async (req, res) => {
    res.status(201).json(await library.createMaterial(deps, req.auth!, req.body, req.ip));
  });
  route(router, 'patch', '/api/v1/library/materials/:id', authorize('library.edit'), validateBody(teamMaterialPatchSchema), async (req, res) => {
    res.json(await library.updateMaterial(deps, req.auth!, idParam(req.params.id, 'The material'), req.body, req.ip));
  });
  route(router, 'delete', '/api/v1/library/materials/:id', authorize('library.edit'), async (req, res) => {
    await library.deleteMaterial(deps, req.auth!, idParam(req.params.id, 'The material'), req.ip);
    res.status(204).end();
  });
  route(router, 'post', '/api/v1/library/finishes', authorize('library.edit'), validateBody(teamFinishCreateSchema), async (req, res) => {
    res.status(201).json({ finish: await library.createFinish(deps, req.auth!, req.body, req.ip) });
  });
  route(router, 'patch', '/api/v1/library/finishes/:id', authorize('library.edit'), validateBody(teamFinishPatchSchema), async (req, res) => {
    res.json({ finish: await library.updateFinish(deps, req.auth!, idParam(req.params.id, 'The finish'), req.body, req.ip) });
  });
  route(router, 'delete', '/api/v1/library/finishes/:id', authorize('library.edit'), async (req, res) => {
    await library.deleteFinish(deps, req.auth!, idParam(req.params.id, 'The finish'), req.ip);
    res.status(204).end();
  });
}
