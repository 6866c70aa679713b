import type { Router } from 'express';
import type { Deps } from '../deps';
import { authorize, route } from '../http/routes';
import { listTeamMail } from '../mail/dev-mail.service';

/** A development aid: exists only while the local mail catcher runs (otherwise the path is a 404). */
export function registerDevMailRoutes(router: Router, deps: Deps): void {
  if (!deps.config.mailCatcher) return;
  route(router, 'get', '/api/v1/dev/mail', authorize('dev.mail'), async (req, res) => {
    res.json({ messages: await listTeamMail(deps, req.auth!) });
  });
}
