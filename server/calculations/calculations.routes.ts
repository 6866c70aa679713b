import type { Router } from 'express';
import type { Deps } from '../deps';
import { errors } from '../errors';
import { publicRoute, route } from '../http/routes';

export const MAX_CASES = 10_000;

/**
 * One case → one result; an array → an array in the same order. Only the envelope can fail the
 * request; a bad case becomes `{ error }` in its place.
 */
export function registerCalculationRoutes(router: Router, deps: Deps): void {
  route(router, 'post', '/api/v1/calculations', publicRoute(), deps.limiters.calculations, async (req, res) => {
    const body: unknown = req.body;
    if (body === undefined) throw errors.badRequest('INVALID_PAYLOAD', 'Send a case or an array of cases as JSON (Content-Type: application/json).');
    if (body === null || typeof body !== 'object') throw errors.badRequest('INVALID_PAYLOAD', 'The body must be a case (object) or an array of cases.');
    if (Array.isArray(body)) {
      if (body.length > MAX_CASES) throw errors.badRequest('TOO_MANY_CASES', `A batch holds at most ${MAX_CASES} cases (got ${body.length}).`);
      res.json(body.length ? await deps.calc.run(body) : []);
      return;
    }
    const [result] = (await deps.calc.run([body])) as { error?: { field?: string } }[];
    // A single case's error paths name its fields directly ("layers[0]…", not "[0].layers[0]…").
    if (result?.error && typeof result.error.field === 'string') {
      result.error = { ...result.error, field: result.error.field.replace(/^\[0\]\.?/, '') };
    }
    res.json(result);
  });
}
