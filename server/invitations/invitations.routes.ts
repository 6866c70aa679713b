import type { Router } from 'express';
import { invitationAcceptSchema, invitationCreateSchema } from '../../shared/schemas/team';
import type { Deps } from '../deps';
import { errors } from '../errors';
import { authorize, publicRoute, route } from '../http/routes';
import { signInWithPayload } from '../http/session';
import { idParam, validateBody } from '../http/validate';
import * as invitations from './invitations.service';

const tokenParam = (v: unknown): string => {
  const s = String(v ?? '');
  if (!/^[A-Za-z0-9_-]{16,200}$/.test(s)) throw errors.notFound('The invitation');
  return s;
};

export function registerInvitationRoutes(router: Router, deps: Deps): void {
  route(router, 'get', '/api/v1/invitations/:token', publicRoute(), async (req, res) => {
    res.json(await invitations.describeInvitation(deps, tokenParam(req.params.token)));
  });

  route(router, 'post', '/api/v1/invitations/:token/accept', publicRoute(), validateBody(invitationAcceptSchema), async (req, res) => {
    const { userId, teamId } = await invitations.acceptInvitation(deps, tokenParam(req.params.token), req.body, req.auth, req.ip);
    res.status(201).json(await signInWithPayload(deps, req, userId, teamId));
  });

  route(
    router,
    'post',
    '/api/v1/team/invitations',
    authorize('team.manage'),
    deps.limiters.invite,
    validateBody(invitationCreateSchema),
    async (req, res) => {
      res.status(201).json({ invitation: await invitations.createInvitation(deps, req.auth!, req.body, req.ip) });
    },
  );

  route(router, 'delete', '/api/v1/team/invitations/:id', authorize('team.manage'), async (req, res) => {
    await invitations.revokeInvitation(deps, req.auth!, idParam(req.params.id, 'The invitation'), req.ip);
    res.status(204).end();
  });
}
