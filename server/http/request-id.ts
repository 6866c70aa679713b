import crypto from 'node:crypto';
import type { RequestHandler } from 'express';

/** Accepts a sane incoming X-Request-Id or makes one, and echoes it. */
export const requestId: RequestHandler = (req, res, next) => {
  const incoming = req.get('x-request-id');
  req.id = incoming && /^[A-Za-z0-9._:-]{1,100}$/.test(incoming) ? incoming : crypto.randomUUID();
  res.setHeader('X-Request-Id', req.id);
  next();
};
