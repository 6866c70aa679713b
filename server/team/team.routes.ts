import type { Router } from 'express';
import { memberRoleSchema } from '../../shared/schemas/team';
import type { Role } from '../../shared/schemas/common';
import type { Deps } from '../deps';
import { authorize, route } from '../http/routes';
import { idParam, validateBody } from '../http/validate';
import * as team from './team.service';

export function registerTeamRoutes(router: Router, deps: Deps): void {
  route(router, 'get', '/api/v1/team', authorize('team.read'), async (req, res) => {
    res.json(await team.getTeam(deps, req.auth!));
  });

  route(router, 'patch', '/api/v1/team/members/:userId', authorize('team.manage'), validateBody(memberRoleSchema), async (req, res) => {
    const member = await team.changeMemberRole(deps, req.auth!, idParam(req.params.userId, 'The member'), req.body.role as Role, req.ip);
    res.json({ member });
  });

  route(router, 'delete', '/api/v1/team/members/:userId', authorize('team.manage'), async (req, res) => {
    await team.removeMember(deps, req.auth!, idParam(req.params.userId, 'The member'), req.ip);
    res.status(204).end();
  });
}
