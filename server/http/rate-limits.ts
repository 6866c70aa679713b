import type { RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import type { Config, RateLimitRule } from '../config';
import { errors } from '../errors';

function limiter(rule: RateLimitRule, opts: { skipSuccessfulRequests?: boolean; skipFailedRequests?: boolean } = {}): RequestHandler {
  return rateLimit({
    windowMs: rule.windowMs,
    limit: rule.limit,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    skipSuccessfulRequests: opts.skipSuccessfulRequests ?? false,
    skipFailedRequests: opts.skipFailedRequests ?? false,
    keyGenerator: (req) => ipKeyGenerator(req.ip ?? '0.0.0.0'),
    handler: (_req, _res, next) => next(errors.rateLimited()),
  });
}

export type Limiters = {
  signin: RequestHandler;
  signup: RequestHandler;
  signupAttempts: RequestHandler;
  passwordReset: RequestHandler;
  passwordResetConfirm: RequestHandler;
  invite: RequestHandler;
  calculations: RequestHandler;
};

/** One set per app instance (memory store: per process). */
export function createLimiters(config: Pick<Config, 'rateLimits'>): Limiters {
  return {
    // Failed attempts count, so a user who signs in correctly is not locked out by their own successes.
    signin: limiter(config.rateLimits.signin, { skipSuccessfulRequests: true }),
    // Successes count (each makes a team); a refused sign-up is not held against the address.
    signup: limiter(config.rateLimits.signup, { skipFailedRequests: true }),
    // Every attempt costs a strength check and a bcrypt hash; its own counter, never sign-in's.
    signupAttempts: limiter(config.rateLimits.signupAttempts),
    passwordReset: limiter(config.rateLimits.passwordReset),
    passwordResetConfirm: limiter(config.rateLimits.passwordReset),
    invite: limiter(config.rateLimits.invite),
    calculations: limiter(config.rateLimits.calculations),
  };
}
