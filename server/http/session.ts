import type { Request, RequestHandler } from 'express';
import session, { type Store } from 'express-session';
import { ConnectSessionKnexStore } from 'connect-session-knex';
import { isPastAbsoluteTimeout, loadCaller, sessionPayload } from '../auth/auth.service';
import type { Config } from '../config';
import type { Db } from '../db/db';
import { serviceUnavailable } from '../errors';
import type { Logger } from '../logger';
import { ensureCsrfToken } from './csrf';

export const SESSION_COOKIE = 'lagline.sid';

type Callback = (err?: unknown, ...rest: unknown[]) => void;
type StoreInternals = { ready?: Promise<unknown>; dbCleanup?: () => Promise<void>; nextDbCleanup?: NodeJS.Timeout };

/**
 * connect-session-knex reports an error to the callback AND rejects the promise it returns (which
 * nobody awaits), and its touch() never calls back on failure, which would hold a response's last
 * byte for ever. Every method here calls back exactly once, and no rejection escapes.
 */
function guardStore(store: Store, logger: Logger): void {
  const methods = store as unknown as Record<string, unknown>;
  for (const name of ['get', 'set', 'destroy', 'touch', 'clear', 'length', 'all']) {
    const original = methods[name];
    if (typeof original !== 'function') continue;
    methods[name] = (...args: unknown[]) => {
      const last = args.length - 1;
      const cb = typeof args[last] === 'function' ? (args[last] as Callback) : undefined;
      let called = false;
      const once: Callback = (err, ...rest) => {
        if (called) return;
        called = true;
        // A failed touch only loses the idle-timeout extension of one request; it is not worth an error.
        if (err && name === 'touch') {
          logger.error(`session store: touch failed: ${(err as Error).message}`);
          cb?.();
          return;
        }
        cb?.(err, ...rest);
      };
      if (cb) args[last] = once;
      let result: unknown;
      try {
        result = (original as (...a: unknown[]) => unknown).apply(store, args);
      } catch (e) {
        once(e);
        return undefined;
      }
      if (result && typeof (result as Promise<unknown>).then === 'function') {
        (result as Promise<unknown>).then(
          () => undefined,
          (e: unknown) => once(e),
        );
      }
      return result;
    };
  }
}

/**
 * The store checks its table once, at construction. Left alone, a database that is down at that
 * moment would make every later session call fail even after it is back; the table comes from the
 * migrations, so a failed check is forgotten and the expiry sweep started later instead.
 */
function keepStoreUsable(store: Store, cleanupMs: number): void {
  const internals = store as unknown as StoreInternals;
  const first = (internals.ready ?? Promise.resolve()).then(
    () => true,
    () => false,
  );
  internals.ready = first.then(() => undefined);
  void first.then((ok) => {
    if (!ok && cleanupMs > 0) void internals.dbCleanup?.();
  });
}

export type SessionLayer = { middleware: RequestHandler; close: () => void };

/**
 * express-session over MariaDB. A visitor gets no session row until there is something to keep
 * (a sign-in); expired rows are swept every `sessionCleanupMs`.
 */
export function sessionMiddleware(
  deps: { db: Db; config: Config; logger: Logger },
  opts: { secureCookies: boolean },
): SessionLayer {
  const { config, logger } = deps;
  const store = new ConnectSessionKnexStore({
    knex: deps.db,
    tableName: 'sessions',
    createTable: false,
    cleanupInterval: config.sessionCleanupMs,
    onDbCleanupError: (e: unknown) => logger.error(`session store: expiry sweep failed: ${(e as Error).message}`),
  });
  keepStoreUsable(store, config.sessionCleanupMs);
  guardStore(store, logger);
  const express = session({
    name: SESSION_COOKIE,
    secret: config.sessionSecret,
    store,
    resave: false,
    saveUninitialized: false,
    rolling: true,
    // A session is destroyed only on purpose (sign-out, timeouts, removal), never because a request
    // that failed left req.session unset.
    unset: 'keep',
    cookie: { httpOnly: true, sameSite: 'lax', secure: opts.secureCookies ? true : 'auto', maxAge: config.sessionIdleMs, path: '/' },
  });
  const middleware: RequestHandler = (req, res, next) => {
    if (opts.secureCookies) {
      // APP_URL is https: browsers reach us over TLS, directly or through a proxy that ends it, whether
      // or not that proxy is trusted. express-session sets a Secure cookie only on a secure request.
      Object.defineProperty(req, 'secure', { value: true, configurable: true });
    }
    let forwarded = false;
    express(req, res, (err?: unknown) => {
      if (forwarded) {
        // A save, touch or destroy that failed after the answer was sent: forwarding it would run the
        // error handling a second time and reset the client's keep-alive socket.
        if (err) logger.error(`[${req.id}] session store after the answer: ${(err as Error).message ?? err}`);
        return;
      }
      forwarded = true;
      if (err) {
        logger.error(`[${req.id}] session store unavailable: ${(err as Error).message ?? err}`);
        return next(serviceUnavailable());
      }
      next();
    });
  };
  return {
    middleware,
    close: () => {
      const timer = (store as unknown as StoreInternals).nextDbCleanup;
      if (timer) clearTimeout(timer);
      (store as unknown as { options: { cleanupInterval: number } }).options.cleanupInterval = 0;
    },
  };
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

/** Ends the session on purpose: its row goes from the store. A visitor has no row to remove. */
export async function endSession(req: Request): Promise<void> {
  if (req.session?.userId !== undefined) await call((cb) => req.session.destroy(cb));
}

/**
 * Sets req.auth from the session when the user is still a member of the team and the session is
 * within its absolute lifetime; otherwise starts the visitor afresh (anonymous). A database error
 * answers 503 and leaves the session as it is.
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
