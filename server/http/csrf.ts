import crypto from 'node:crypto';
import type { Request, RequestHandler } from 'express';
import { errors } from '../errors';

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

/** The session's synchronizer token, created on first use. */
export function ensureCsrfToken(req: Request): string {
  if (!req.session.csrfToken) req.session.csrfToken = crypto.randomBytes(32).toString('base64url');
  return req.session.csrfToken;
}

function sameToken(a: string, b: string): boolean {
  const x = Buffer.from(a);
  const y = Buffer.from(b);
  return x.length === y.length && crypto.timingSafeEqual(x, y);
}

/**
 * Refuses state-changing requests without the session's X-CSRF-Token, and cross-site ones
 * (Origin or Sec-Fetch-Site) outright.
 */
export function csrfProtection(opts: { appOrigin: string; exempt: (req: Request) => boolean }): RequestHandler {
  return (req, _res, next) => {
    if (SAFE.has(req.method) || opts.exempt(req)) return next();
    const fetchSite = req.get('sec-fetch-site');
    if (fetchSite && fetchSite !== 'same-origin' && fetchSite !== 'none') return next(errors.csrf('Cross-site requests are refused.'));
    const origin = req.get('origin');
    if (origin && origin !== 'null') {
      const own = `${req.protocol}://${req.get('host')}`;
      if (origin !== opts.appOrigin && origin !== own) return next(errors.csrf('Cross-site requests are refused.'));
    } else if (origin === 'null') {
      return next(errors.csrf('Cross-site requests are refused.'));
    }
    const sent = req.get('x-csrf-token');
    const expected = req.session?.csrfToken;
    if (!sent || !expected || !sameToken(sent, expected)) return next(errors.csrf());
    next();
  };
}
