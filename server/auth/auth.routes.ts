import type { Router } from 'express';
import { passwordResetConfirmSchema, passwordResetRequestSchema, signInSchema, signUpSchema } from '../../shared/schemas/auth';
import type { Deps } from '../deps';
import { issueCsrfToken } from '../http/csrf';
import { publicRoute, route } from '../http/routes';
import { SESSION_COOKIE, endSession, signInWithPayload } from '../http/session';
import { validateBody } from '../http/validate';
import * as auth from './auth.service';

export function registerAuthRoutes(router: Router, deps: Deps): void {
  route(router, 'get', '/api/v1/auth/session', publicRoute(), async (req, res) => {
    // A visitor's token lives in a signed cookie: looking at the sign-in form stores nothing.
    const token = issueCsrfToken(req, res, { secret: deps.config.sessionSecret, secureCookies: deps.secureCookies });
    res.json(await auth.sessionPayload(deps, req.auth, token));
  });

  // Sign-up has limits of its own: refused sign-ups never count against sign-in, and successful ones
  // (each a new team) are limited per client.
  route(router, 'post', '/api/v1/auth/signup', publicRoute(), deps.limiters.signupAttempts, deps.limiters.signup, validateBody(signUpSchema), async (req, res) => {
    const { userId, teamId } = await auth.signUp(deps, req.body, req.ip);
    res.status(201).json(await signInWithPayload(deps, req, userId, teamId));
  });

  route(router, 'post', '/api/v1/auth/signin', publicRoute(), deps.limiters.signin, validateBody(signInSchema), async (req, res) => {
    const { userId, teamId } = await auth.signIn(deps, req.body, req.ip);
    res.json(await signInWithPayload(deps, req, userId, teamId));
  });

  route(router, 'post', '/api/v1/auth/signout', publicRoute(), async (req, res) => {
    await endSession(req);
    res.clearCookie(SESSION_COOKIE, { path: '/', httpOnly: true, sameSite: 'lax', secure: deps.secureCookies || req.secure });
    res.status(204).end();
  });

  route(
    router,
    'post',
    '/api/v1/auth/password-reset',
    publicRoute(),
    deps.limiters.passwordReset,
    validateBody(passwordResetRequestSchema),
    async (req, res) => {
      await auth.requestPasswordReset(deps, req.body.email, req.ip);
      res.status(202).json({ message: 'If the address has an account, a reset link is on its way.' });
    },
  );

  route(
    router,
    'post',
    '/api/v1/auth/password-reset/confirm',
    publicRoute(),
    deps.limiters.passwordResetConfirm,
    validateBody(passwordResetConfirmSchema),
    async (req, res) => {
      await auth.confirmPasswordReset(deps, req.body.token, req.body.password, req.ip);
      res.status(204).end();
    },
  );
}
