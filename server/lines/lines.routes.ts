import type { Router } from 'express';
import { bulkEditSchema, lineCreateSchema, linePatchSchema, vesselCreateSchema, vesselPatchSchema } from '../../shared/schemas/lines';
import type { Deps } from '../deps';
import { authorize, route } from '../http/routes';
import { idParam, validateBody } from '../http/validate';
import type { ItemKind } from './items.repository';
import * as items from './items.service';

const PLURAL: Record<ItemKind, 'lines' | 'vessels'> = { line: 'lines', vessel: 'vessels' };
const SCHEMAS = {
  line: { create: lineCreateSchema, patch: linePatchSchema },
  vessel: { create: vesselCreateSchema, patch: vesselPatchSchema },
} as const;

/** Lines and vessels: the same routes for each kind (DESIGN §11). */
export function registerLineRoutes(router: Router, deps: Deps): void {
  for (const kind of ['line', 'vessel'] as const) {
    const plural = PLURAL[kind];
    const what = kind === 'line' ? 'The line' : 'The vessel';
    route(router, 'get', `/api/v1/sites/:siteId/${plural}`, authorize('site.read'), async (req, res) => {
      const { items: list, nextCursor } = await items.listItems(deps, req.auth!, idParam(req.params.siteId, 'The site'), kind, req.query as Record<string, unknown>);
      res.json({ [plural]: list, nextCursor });
    });
    route(router, 'post', `/api/v1/sites/:siteId/${plural}`, authorize('lines.edit'), validateBody(SCHEMAS[kind].create), async (req, res) => {
      const item = await items.createItem(deps, req.auth!, idParam(req.params.siteId, 'The site'), kind, req.body, req.ip);
      res.status(201).json({ [kind]: item });
    });
    route(router, 'post', `/api/v1/sites/:siteId/${plural}/bulk`, authorize('lines.edit'), validateBody(bulkEditSchema), async (req, res) => {
      res.json(await items.bulkEdit(deps, req.auth!, idParam(req.params.siteId, 'The site'), kind, req.body, req.ip));
    });
    route(router, 'get', `/api/v1/${plural}/:id`, authorize('site.read'), async (req, res) => {
      res.json({ [kind]: await items.getItem(deps, req.auth!, idParam(req.params.id, what), kind, { withResult: true }) });
    });
    route(router, 'patch', `/api/v1/${plural}/:id`, authorize('lines.edit'), validateBody(SCHEMAS[kind].patch), async (req, res) => {
      res.json({ [kind]: await items.updateItem(deps, req.auth!, idParam(req.params.id, what), kind, req.body, req.ip) });
    });
    route(router, 'delete', `/api/v1/${plural}/:id`, authorize('lines.edit'), async (req, res) => {
      await items.deleteItem(deps, req.auth!, idParam(req.params.id, what), kind, req.ip);
      res.status(204).end();
    });
  }
}
