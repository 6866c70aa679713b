import { MAX_CASES } from '../../shared/calc';
import type { Request, Response, Router } from 'express';
import type { Deps } from '../deps';
import { AppError, errors } from '../errors';
import { publicRoute, route } from '../http/routes';
import type { RunOptions } from './calc-pool';


/** Arrays up to this size are answered in the interactive lane, like a single case; larger ones are batches. */
export const INTERACTIVE_MAX_CASES = 20;

/** The lane and owner of a request's work, and a signal that fires if the client goes away first. */
function runOptions(req: Request, res: Response, caseCount: number, single: boolean): RunOptions {
  const abort = new AbortController();
  res.on('close', () => {
    if (!res.writableFinished) abort.abort();
  });
  return {
    lane: single || caseCount <= INTERACTIVE_MAX_CASES ? 'interactive' : 'batch',
    owner: `ip:${req.ip ?? 'unknown'}`,
    signal: abort.signal,
  };
}

const isCancelled = (e: unknown) => e instanceof AppError && e.code === 'CANCELLED';

/**
 * One case → one result; an array → an array in the same order. Only the envelope can fail the
 * request; a bad case becomes `{ error }` in its place.
 */
export function registerCalculationRoutes(router: Router, deps: Deps): void {
  route(router, 'post', '/api/v1/calculations', publicRoute(), deps.limiters.calculations, async (req, res) => {
    const body: unknown = req.body;
    if (body === undefined) throw errors.badRequest('INVALID_PAYLOAD', 'Send a case or an array of cases as JSON (Content-Type: application/json).');
    if (body === null || typeof body !== 'object') throw errors.badRequest('INVALID_PAYLOAD', 'The body must be a case (object) or an array of cases.');
    try {
      if (Array.isArray(body)) {
        if (body.length > MAX_CASES) throw errors.badRequest('TOO_MANY_CASES', `A batch holds at most ${MAX_CASES} cases (got ${body.length}).`);
        res.json(body.length ? await deps.calc.run(body, runOptions(req, res, body.length, false)) : []);
        return;
      }
      const [result] = (await deps.calc.run([body], runOptions(req, res, 1, true))) as { error?: { field?: string } }[];
      // A single case's error paths name its fields directly ("layers[0]…", not "[0].layers[0]…").
      if (result?.error && typeof result.error.field === 'string') {
        result.error = { ...result.error, field: result.error.field.replace(/^\[0\]\.?/, '') };
      }
      res.json(result);
    } catch (e) {
      // The client left before its answer: there is nobody to tell.
      if (isCancelled(e) && res.destroyed) return;
      throw e;
    }
  });
}
