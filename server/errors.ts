import type { ErrorRequestHandler } from 'express';
import type { Logger } from './logger';

export type ErrorItem = { code: string; message: string; field?: string };

/** An error meant for the client: a status, a code and a message (optionally naming a field). */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly code: string,
    message: string,
    readonly items: ErrorItem[] = [{ code, message }],
  ) {
    super(message);
  }
}

export const errors = {
  validation: (items: ErrorItem[]) => new AppError(400, 'VALIDATION_FAILED', items[0]?.message ?? 'Invalid input', items),
  badRequest: (code: string, message: string, field?: string) =>
    new AppError(400, code, message, [{ code, message, ...(field ? { field } : {}) }]),
  unauthenticated: () => new AppError(401, 'UNAUTHENTICATED', 'Sign in to continue.'),
  invalidCredentials: () => new AppError(401, 'INVALID_CREDENTIALS', 'The e-mail address or password is not right.'),
  forbidden: (message = 'Your role does not allow this.') => new AppError(403, 'FORBIDDEN', message),
  csrf: (message = 'The request could not be verified; reload the page and try again.') => new AppError(403, 'CSRF_FAILED', message),
  notFound: (what = 'The item') => new AppError(404, 'NOT_FOUND', `${what} was not found.`),
  conflict: (code: string, message: string, field?: string) =>
    new AppError(409, code, message, [{ code, message, ...(field ? { field } : {}) }]),
  tooLarge: (message = 'The request body is too large.') => new AppError(413, 'PAYLOAD_TOO_LARGE', message),
  rateLimited: () => new AppError(429, 'RATE_LIMITED', 'Too many attempts; wait a while and try again.'),
  unavailable: (code: string, message: string) => new AppError(503, code, message),
};

/** Errors that mean the database is unreachable, gone away mid-query or too slow: worth a retry. */
const DB_DOWN_CODES = new Set([
  'ECONNREFUSED',
  'ECONNRESET',
  'ECONNABORTED',
  'EPIPE',
  'ETIMEDOUT',
  'EHOSTUNREACH',
  'ENETUNREACH',
  'ENOTFOUND',
  'EAI_AGAIN',
  'PROTOCOL_CONNECTION_LOST',
  'PROTOCOL_SEQUENCE_TIMEOUT',
  'DB_QUERY_TIMEOUT',
  'ER_ACCESS_DENIED_ERROR',
  'ER_BAD_DB_ERROR',
  'ER_CON_COUNT_ERROR',
  'ER_SERVER_SHUTDOWN',
  'ER_CONNECTION_KILLED',
  'ER_QUERY_INTERRUPTED',
  'ER_LOCK_WAIT_TIMEOUT',
  'ER_LOCK_DEADLOCK',
  'ER_CLIENT_INTERACTION_TIMEOUT',
]);

export function isDatabaseDown(err: unknown): boolean {
  const e = err as { code?: string; name?: string; fatal?: boolean } | null;
  if (!e || typeof e !== 'object') return false;
  // mysql2 flags errors that ended the connection (a lost socket, a closed connection) as fatal.
  return DB_DOWN_CODES.has(e.code ?? '') || e.name === 'KnexTimeoutError' || e.fatal === true;
}

export const serviceUnavailable = () => errors.unavailable('SERVICE_UNAVAILABLE', 'The service is temporarily unavailable; try again shortly.');

/** Body-parser errors carry `type`; map them to our codes. */
function fromParserError(err: { type?: string; status?: number }): AppError | null {
  switch (err.type) {
    case 'entity.parse.failed':
      return errors.badRequest('INVALID_JSON', 'The request body is not valid JSON.');
    case 'entity.too.large':
      return errors.tooLarge();
    case 'encoding.unsupported':
    case 'charset.unsupported':
      return new AppError(415, 'UNSUPPORTED_MEDIA_TYPE', 'Send the body as UTF-8 JSON.');
    case 'request.aborted':
      return errors.badRequest('REQUEST_ABORTED', 'The request was aborted.');
    default:
      if (typeof err.status === 'number' && err.status >= 400 && err.status < 500) {
        return errors.badRequest('BAD_REQUEST', 'The request could not be read.');
      }
      return null;
  }
}

/** The one error handler, mounted last. */
export function errorHandler(logger: Logger): ErrorRequestHandler {
  return (err, req, res, _next) => {
    let appErr: AppError | null = err instanceof AppError ? err : fromParserError(err ?? {});
    if (!appErr && isDatabaseDown(err)) {
      appErr = serviceUnavailable();
      logger.error(`[${req.id}] database unavailable: ${(err as Error).message}`);
    }
    if (!appErr) {
      logger.error(`[${req.id}] unexpected error on ${req.method} ${req.originalUrl}:`, err);
      appErr = new AppError(500, 'INTERNAL', 'An unexpected error occurred.');
    }
    if (appErr.status >= 500) {
      // Nothing of a failed request is saved, touched or destroyed in the session store: the stored
      // session stays as it was, and the answer does not wait on a database that may be down.
      (req as { session?: unknown }).session = undefined;
    }
    if (res.headersSent) {
      res.end();
      return;
    }
    res.status(appErr.status).json({ errors: appErr.items });
  };
}
