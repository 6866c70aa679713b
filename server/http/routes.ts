import type { RequestHandler, Router } from 'express';
import { can, type Permission } from '../../shared/schemas/permissions';
import { errors } from '../errors';

/** Every route declares who may call it. */
export type RouteRule = { kind: 'public' } | { kind: 'signedIn' } | { kind: 'permission'; permission: Permission };

export type RuleHandler = RequestHandler & { rule: RouteRule };

const withRule = (handler: RequestHandler, rule: RouteRule): RuleHandler => Object.assign(handler, { rule });

/** Anyone, signed in or not. */
export const publicRoute = (): RuleHandler => withRule((_req, _res, next) => next(), { kind: 'public' });

/** Any signed-in member of a team. */
export const signedIn = (): RuleHandler =>
  withRule((req, _res, next) => next(req.auth ? undefined : errors.unauthenticated()), { kind: 'signedIn' });

/** A signed-in member whose role holds the permission (see shared/schemas/permissions). */
export const authorize = (permission: Permission): RuleHandler =>
  withRule(
    (req, _res, next) => {
      if (!req.auth) return next(errors.unauthenticated());
      if (!can(req.auth.role, permission)) return next(errors.forbidden());
      next();
    },
    { kind: 'permission', permission },
  );

type Method = 'get' | 'post' | 'put' | 'patch' | 'delete';

/** Registers a route whose first step is its access rule. */
export function route(router: Router, method: Method, path: string, rule: RuleHandler, ...handlers: RequestHandler[]): void {
  if (!rule || !('rule' in rule)) throw new Error(`${method.toUpperCase()} ${path} has no access rule`);
  router[method](path, rule, ...handlers);
}

export type ListedRoute = { method: string; path: string; rule?: RouteRule };

type Layer = { route?: { path: string; methods: Record<string, boolean>; stack: { handle: Partial<RuleHandler> }[] } };

/**
 * Lists the routes actually mounted on a router, each with the rule of its FIRST handler
 * (a rule anywhere else does not count: it would run after other code).
 */
export function listRoutes(router: Router): ListedRoute[] {
  const out: ListedRoute[] = [];
  for (const layer of (router as unknown as { stack: Layer[] }).stack) {
    if (!layer.route) continue;
    const first = layer.route.stack[0]?.handle;
    for (const [method, on] of Object.entries(layer.route.methods)) {
      if (!on || method === '_all') continue;
      out.push({ method: method.toUpperCase(), path: layer.route.path, rule: first?.rule });
    }
  }
  return out;
}
