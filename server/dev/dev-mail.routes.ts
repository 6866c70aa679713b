import type { Router } from 'express';
import type { Deps } from '../deps';
import { errors } from '../errors';
import { authorize, route } from '../http/routes';
import { listTeamMail } from '../mail/dev-mail.service';

export function registerDevMailRoutes(router: Router, deps: Deps): void {
  route(router, 'get', '/api/v1/dev/mail', authorize('dev.mail'), async (req, res) => {
    if (!deps.config.mailCatcher) throw errors.notFound('The development mail box');
    res.json({ messages: await listTeamMail(deps, req.auth!) });
  });
}
