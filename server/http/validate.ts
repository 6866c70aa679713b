import type { RequestHandler } from 'express';
import { ValidationError, type Schema } from 'yup';
import { errors, type ErrorItem } from '../errors';

function describeType(type: unknown): string {
  switch (type) {
    case 'number':
      return 'a number';
    case 'string':
      return 'text';
    case 'boolean':
      return 'true or false';
    case 'object':
      return 'an object';
    case 'array':
      return 'a list';
    default:
      return String(type);
  }
}

/** Turns a yup error into items that each name their field. */
export function validationItems(err: ValidationError): ErrorItem[] {
  const leaves = err.inner.length ? err.inner : [err];
  const items: ErrorItem[] = [];
  for (const e of leaves) {
    if (e.type === 'noUnknown') {
      const unknown = String((e.params as { unknown?: string } | undefined)?.unknown ?? '')
        .split(',')
        .map((s) => s.trim())
        .filter(Boolean);
      for (const key of unknown) {
        const field = e.path ? `${e.path}.${key}` : key;
        items.push({ code: 'VALIDATION_FAILED', field, message: `Unknown field "${field}".` });
      }
      continue;
    }
    const field = e.path || undefined;
    const message =
      e.type === 'typeError'
        ? `${field ?? 'The body'} must be ${describeType((e.params as { type?: string } | undefined)?.type)}.`
        : e.message;
    items.push({ code: 'VALIDATION_FAILED', message, ...(field ? { field } : {}) });
  }
  return items;
}

/** Validates req.body against a strict schema (unknown fields and wrong types refused). */
export function validateBody(schema: Schema): RequestHandler {
  return async (req, _res, next) => {
    const body = req.body === undefined ? {} : req.body;
    if (body === null || typeof body !== 'object' || Array.isArray(body)) {
      return next(errors.badRequest('VALIDATION_FAILED', 'Send a JSON object (Content-Type: application/json).'));
    }
    try {
      req.body = await schema.validate(body, { abortEarly: false, strict: true });
      next();
    } catch (e) {
      if (e instanceof ValidationError) return next(errors.validation(validationItems(e)));
      next(e);
    }
  };
}

/** Route ids are positive integers; anything else cannot exist, so it is a 404. */
export function idParam(value: unknown, what = 'The item'): number {
  const s = String(value ?? '');
  if (!/^[1-9][0-9]{0,9}$/.test(s) || Number(s) > 2_147_483_647) throw errors.notFound(what);
  return Number(s);
}
