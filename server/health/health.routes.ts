import type { Router } from 'express';
import type { Deps } from '../deps';
import { publicRoute, route } from '../http/routes';
import { checkHealth } from './health.service';

export function registerHealthRoutes(router: Router, deps: Deps): void {
  route(router, 'get', '/api/v1/health', publicRoute(), async (_req, res) => {
    const { ok, body } = await checkHealth(deps);
    res.status(ok ? 200 : 503).set('Cache-Control', 'no-store').json(body);
  });
}
