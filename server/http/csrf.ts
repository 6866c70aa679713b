import crypto from 'node:crypto';
import type { Request, RequestHandler, Response } from 'express';
import { errors } from '../errors';

const SAFE = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Visitors without a session get their token in a signed cookie (a signed double-submit token), so
 * the sign-in form works without a session row for every anonymous visit.
 */
export const VISITOR_CSRF_COOKIE = 'lagline.csrf';

const newToken = () => crypto.randomBytes(32).toString('base64url');

/** The session's synchronizer token, created on first use. */
export function ensureCsrfToken(req: Request): string {
  if (!req.session.csrfToken) req.session.csrfToken = newToken();
  return req.session.csrfToken;
}

function sameToken(a: string, b: string): boolean {
  const x = Buffer.from(a);
  const y = Buffer.from(b);
  return x.length === y.length && crypto.timingSafeEqual(x, y);
}

const mac = (secret: string, token: string) => crypto.createHmac('sha256', secret).update(`visitor-csrf:${token}`).digest('base64url');

function readCookie(req: Request, name: string): string | undefined {
  const header = req.headers.cookie;
  if (!header) return undefined;
  for (const part of header.split(';')) {
    const eq = part.indexOf('=');
    if (eq > 0 && part.slice(0, eq).trim() === name) {
      try {
        return decodeURIComponent(part.slice(eq + 1).trim());
      } catch {
        return undefined;
      }
    }
  }
  return undefined;
}

/** The visitor token from a cookie whose signature holds, else undefined. */
function visitorToken(req: Request, secret: string): string | undefined {
  const raw = readCookie(req, VISITOR_CSRF_COOKIE);
  const dot = raw?.indexOf('.') ?? -1;
  if (!raw || dot <= 0) return undefined;
  const token = raw.slice(0, dot);
  return sameToken(raw.slice(dot + 1), mac(secret, token)) ? token : undefined;
}

export type CsrfOptions = {
  appOrigin: string;
  secret: string;
  /** Mark the visitor cookie Secure regardless of how the request reached us (APP_URL is https). */
  secureCookies: boolean;
  exempt: (req: Request) => boolean;
};

/**
 * The token a client sends back as X-CSRF-Token: the session's when there is a stored session
 * (signed in), otherwise the visitor cookie's, set here when missing. Nothing is stored server-side
 * for a visitor.
 */
export function issueCsrfToken(req: Request, res: Response, opts: Pick<CsrfOptions, 'secret' | 'secureCookies'>): string {
  if (req.session?.csrfToken) return req.session.csrfToken;
  const existing = visitorToken(req, opts.secret);
  if (existing) return existing;
  const token = newToken();
  res.cookie(VISITOR_CSRF_COOKIE, `${token}.${mac(opts.secret, token)}`, {
    httpOnly: true,
    sameSite: 'lax',
    secure: opts.secureCookies || req.secure,
    path: '/',
  });
  return token;
}

/**
 * Refuses state-changing requests without the right X-CSRF-Token, and cross-site ones (Origin or
 * Sec-Fetch-Site) outright. A stored session's token is the only one that counts for it; a visitor's
 * token must match their signed cookie.
 */
export function csrfProtection(opts: CsrfOptions): RequestHandler {
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
    const expected = req.session?.csrfToken ?? visitorToken(req, opts.secret);
    if (!sent || !expected || !sameToken(sent, expected)) return next(errors.csrf());
    next();
  };
}
