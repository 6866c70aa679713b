/**
 * Argument checks shared by the package's direct-call helpers (conversions, energy); each throws
 * {@link CalcInputError} naming the field. Internal: not re-exported from the package index.
 */

import { CalcInputError } from './errors';

/**
 * Throws unless `value` is a finite number.
 * @internal
 */
export function requireFinite(value: number, field: string): void {
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new CalcInputError(field, `${field} must be a finite number`);
  }
}

/**
 * Throws unless `value` is a finite number above zero.
 * @internal
 */
export function requirePositiveFinite(value: number, field: string): void {
  if (typeof value !== 'number' || !Number.isFinite(value) || value <= 0) {
    throw new CalcInputError(field, `${field} must be a positive number`);
  }
}

/**
 * Throws unless `value` is a finite number of zero or more.
 * @internal
 */
export function requireNonNegativeFinite(value: number, field: string): void {
  if (typeof value !== 'number' || !Number.isFinite(value) || value < 0) {
    throw new CalcInputError(field, `${field} must be zero or a positive number`);
  }
}
