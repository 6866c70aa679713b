/**
 * The never-throwing public edge: untrusted JSON in, a result or an error item out.
 */

import { analyse } from './analyse';
import { CalcInputError, EnergyBalanceError, ImpossibleTargetError } from './errors';
import type { CalcErrorItem, CalcOutcome } from './types';

/**
 * Most cases one batch may hold, at every entry point (the API answers more with 400 TOO_MANY_CASES, the
 * command line exits 2): a bound on the work and the answer's size of one request.
 */
export const MAX_CASES = 10_000;

function errorItem(e: unknown, prefix: string): CalcErrorItem {
  if (e instanceof CalcInputError || e instanceof ImpossibleTargetError || e instanceof EnergyBalanceError) {
    const field = e.field === '(case)' ? prefix.replace(/\.$/, '') || '(case)' : `${prefix}${e.field}`;
    return { error: { code: e.code, field, message: e.message } };
  }
  return {
    error: {
      code: 'CALCULATION_FAILED',
      field: prefix.replace(/\.$/, ''),
      message: 'The calculation failed for this case; please report it with the input.',
    },
  };
}

/**
 * Validates and analyses one untrusted case.
 *
 * @param input - parsed JSON of one case
 * @returns a result, or `{ error: { code, field, message } }`; never throws
 * @remarks Codes: INVALID_INPUT, REQUIRED, OUT_OF_RANGE, UNKNOWN_FIELD, CONDUCTIVITY_NOT_POSITIVE,
 * CONDUCTIVITY_OUT_OF_RANGE, TARGET_NOT_REACHABLE, SERIES_TOO_THIN, ENERGY_BALANCE_FAILED, CALCULATION_FAILED.
 * @example
 * runCase({ geometry: { type: 'pipe', outerDiameterM: 0.1143, orientation: 'horizontal' }, layers: [] });
 * // → { error: { code: 'REQUIRED', field: 'processTemperatureC', message: 'processTemperatureC is required.' } }
 */
export function runCase(input: unknown): CalcOutcome {
  try {
    return analyse(input as never);
  } catch (e) {
    return errorItem(e, '');
  }
}

/**
 * Validates and analyses many cases, in order; field paths are prefixed with the item index (`[12].layers[0]`).
 *
 * @param inputs - parsed JSON array of cases
 * @returns one outcome per case; never throws
 * @example
 * runCases([{}, 1]);
 * // → [{ error: { code: 'REQUIRED', field: '[0].geometry', … } }, { error: { code: 'INVALID_INPUT', field: '[1]', … } }]
 */
export function runCases(inputs: unknown[]): CalcOutcome[] {
  const out = new Array<CalcOutcome>(inputs.length);
  for (let i = 0; i < inputs.length; i++) {
    try {
      out[i] = analyse(inputs[i] as never);
    } catch (e) {
      out[i] = errorItem(e, `[${i}].`);
    }
  }
  return out;
}
