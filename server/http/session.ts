import type { Request, RequestHandler } from 'express';
import session from 'express-session';
import { ConnectSessionKnexStore } from 'connect-session-knex';
import { isPastAbsoluteTimeout, loadCaller, sessionPayload } from '../auth/auth.service';
import type { Config } from '../config';
import type { Db } from '../db/db';
import { ensureCsrfToken } from './csrf';

export const SESSION_COOKIE = 'lagline.sid';

export function sessionMiddleware(db: Db, config: Config): RequestHandler {
  const store = new ConnectSessionKnexStore({
    knex: db,
    tableName: 'sessions',
    createTable: false,
    cleanupInterval: config.env === 'test' ? 0 : 15 * 60_000,
  });
  // The store checks for its table at construction; a failure surfaces on first use instead.
  (store as unknown as { ready?: Promise<unknown> }).ready?.catch(() => undefined);
  // Its methods report errors to the callback AND reject the promise they return, which nobody awaits:
  // left alone, a database outage would become an unhandled rejection and stop the process.
  const methods = store as unknown as Record<string, unknown>;
  for (const name of ['get', 'set', 'destroy', 'touch', 'clear', 'length', 'all']) {
    const original = methods[name];
    if (typeof original !== 'function') continue;
    methods[name] = (...args: unknown[]) => {
      const result = (original as (...a: unknown[]) => unknown).apply(store, args);
      if (result && typeof (result as Promise<unknown>).catch === 'function') (result as Promise<unknown>).catch(() => undefined);
      return result;
    };
  }
  return session({
    name: SESSION_COOKIE,
    secret: config.sessionSecret,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    unset: 'destroy',
    cookie: { httpOnly: true, sameSite: 'lax', secure: 'auto', maxAge: config.sessionIdleMs, path: '/' },
  });
}

const call = (fn: (cb: (err?: unknown) => void) => void) =>
  new Promise<void>((resolve, reject) => fn((err) => (err ? reject(err) : resolve())));

/** A fresh session id at every sign-in, so an id planted before sign-in is worthless after it. */
async function startSignedInSession(req: Request, userId: number, teamId: number): Promise<string> {
  await call((cb) => req.session.regenerate(cb));
  req.session.userId = userId;
  req.session.teamId = teamId;
  req.session.signedInAt = Date.now();
  const token = ensureCsrfToken(req);
  await call((cb) => req.session.save(cb));
  return token;
}

/** Signs the user in on this request and returns what the client keeps of the new session. */
export async function signInWithPayload(deps: { db: Db }, req: Request, userId: number, teamId: number) {
  const token = await startSignedInSession(req, userId, teamId);
  return sessionPayload(deps, (await loadCaller(deps, userId, teamId)) ?? undefined, token);
}

export async function endSession(req: Request): Promise<void> {
  if (req.session) await call((cb) => req.session.destroy(cb));
}

/**
 * Sets req.auth from the session when the user is still a member of the team and the session is
 * within its absolute lifetime; otherwise starts the visitor afresh (anonymous).
 */
export function loadSessionCaller(deps: { db: Db; config: Config }): RequestHandler {
  return async (req, _res, next) => {
    const s = req.session;
    if (!s || s.userId === undefined) return next();
    const caller = isPastAbsoluteTimeout(s.signedInAt, Date.now(), deps.config.sessionAbsoluteMs)
      ? null
      : await loadCaller(deps, s.userId, s.teamId as number);
    if (!caller) {
      await call((cb) => req.session.regenerate(cb));
      return next();
    }
    req.auth = caller;
    next();
  };
}
