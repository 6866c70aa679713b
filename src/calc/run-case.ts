/**
 * One case → one outcome, never throwing: the result, or the contract's `{ error: { code, field, message } }`
 * item (the same shape POST /api/v1/calculations answers).
 */
import { analyse } from '../../shared/calc/analyse';
import { CalcInputError, ImpossibleTargetError } from '../../shared/calc/errors';
import type { CalcCase, CalcOutcome } from '../../shared/calc/types';

export { analyse };

export function runCaseInBrowser(c: CalcCase): CalcOutcome {
  try {
    return analyse(c);
  } catch (e) {
    if (e instanceof CalcInputError || e instanceof ImpossibleTargetError) {
      return { error: { code: e.code, field: e.field, message: e.message } };
    }
    return { error: { code: 'CALCULATION_FAILED', field: '', message: e instanceof Error ? e.message : String(e) } };
  }
}
