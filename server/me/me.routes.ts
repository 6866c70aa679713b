import type { Router } from 'express';
import { settingsPatchSchema } from '../../shared/schemas/settings';
import type { UnitSystem } from '../../shared/schemas/common';
import type { Deps } from '../deps';
import { route, signedIn } from '../http/routes';
import { validateBody } from '../http/validate';
import * as settings from './settings.service';

export function registerMeRoutes(router: Router, deps: Deps): void {
  route(router, 'get', '/api/v1/me/settings', signedIn(), async (req, res) => {
    res.json(await settings.getSettings(deps, req.auth!));
  });
  route(router, 'patch', '/api/v1/me/settings', signedIn(), validateBody(settingsPatchSchema), async (req, res) => {
    res.json(await settings.updateSettings(deps, req.auth!, { unitSystem: req.body.unitSystem as UnitSystem }));
  });
}
