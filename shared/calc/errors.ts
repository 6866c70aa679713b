/**
 * Typed errors of the calculation package.
 *
 * @remarks
 * Both carry a machine-readable `code` and the `field` path of the input that caused them, so the public
 * edge can turn them into `{ error: { code, field, message } }` items without parsing messages.
 */

/** Bad input: a value of the wrong type, out of range, missing, or unknown. */
export class CalcInputError extends Error {
  readonly code: string;
  readonly field: string;
  constructor(field: string, message: string, code = 'INVALID_INPUT') {
    super(message);
    this.name = 'CalcInputError';
    this.field = field;
    this.code = code;
    // Keeps `instanceof` working when compiled to ES5-style classes.
    Object.setPrototypeOf(this, CalcInputError.prototype);
  }
}

/** A sizing target that no thickness up to the allowed maximum can reach (physically not possible). */
export class ImpossibleTargetError extends Error {
  readonly code: string;
  readonly field: string;
  constructor(message: string, field = 'solveFor', code = 'TARGET_NOT_REACHABLE') {
    super(message);
    this.name = 'ImpossibleTargetError';
    this.field = field;
    this.code = code;
    Object.setPrototypeOf(this, ImpossibleTargetError.prototype);
  }
}

/**
 * A result that failed its own energy-balance check (conduction through the layers against convection and
 * radiation at the surface): no number is given rather than a wrong one.
 */
export class EnergyBalanceError extends Error {
  readonly code: string;
  readonly field: string;
  constructor(message: string, field = '(case)', code = 'ENERGY_BALANCE_FAILED') {
    super(message);
    this.name = 'EnergyBalanceError';
    this.field = field;
    this.code = code;
    Object.setPrototypeOf(this, EnergyBalanceError.prototype);
  }
}
