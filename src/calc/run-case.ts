/**
 * The calculation entry points the screen uses, from shared/calc: `runCase` never throws and answers
 * the same `{ error: { code, field, message } }` items as POST /api/v1/calculations.
 */
export { analyse } from '../../shared/calc/analyse';
export { runCase } from '../../shared/calc/run-case';
