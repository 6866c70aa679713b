/**
 * Real roots and extrema of low-degree polynomials on an interval, by derivative-bracketed bisection.
 *
 * The real roots of p′ split an interval into pieces on which p is monotonic; each piece holds at most one
 * root of p, found by safeguarded Newton steps inside a bisection bracket. The roots of p′ come from the
 * same procedure one degree lower, down to the closed forms of degree 1 and 2. Every root is bracketed by
 * a sign change, so none is missed and none is invented; the minimum and maximum of p on the interval are
 * attained at its ends or at the roots of p′, which makes a positivity check over a span exact. Coefficients
 * are ascending, p(x) = Σ cᵢ·xⁱ, as for k(T).
 *
 * References:
 * 1. W. H. Press, S. A. Teukolsky, W. T. Vetterling, B. P. Flannery, *Numerical Recipes*, 3rd ed.,
 *    Cambridge University Press, 2007, §5.6 (stable quadratic roots), §9.4 (Newton–Raphson with bisection),
 *    §9.5 (roots of polynomials).
 * 2. A. Ralston, P. Rabinowitz, *A First Course in Numerical Analysis*, 2nd ed., Dover, 2001, §8.9
 *    (separating real roots of a polynomial by those of its derivative).
 */

/** Highest degree handled (k(T) carries at most 8 coefficients). */
export const MAX_POLYNOMIAL_DEGREE = 7;

/**
 * Value of p(x) = Σ cᵢ·xⁱ by Horner's rule.
 *
 * @param coefficients - [c₀, c₁, …], ascending powers
 * @param x - argument
 * @returns p(x)
 * @example
 * polynomialAt([1, -3, 2], 2); // = 1 − 6 + 8 = 3
 */
export function polynomialAt(coefficients: readonly number[], x: number): number {
  let p = 0;
  for (let i = coefficients.length - 1; i >= 0; i--) p = p * x + coefficients[i];
  return p;
}

/** Coefficients without trailing (highest-power) zeros. */
function trimmed(c: readonly number[]): readonly number[] {
  let n = c.length;
  while (n > 0 && c[n - 1] === 0) n--;
  return n === c.length ? c : c.slice(0, n);
}

function derivative(c: readonly number[]): number[] {
  const d = new Array<number>(c.length - 1);
  for (let i = 1; i < c.length; i++) d[i - 1] = i * c[i];
  return d;
}

/** The single root of p in [a, b] where p(a) and p(b) have opposite signs and p is monotonic. */
function rootInMonotonicBracket(c: readonly number[], dc: readonly number[], a: number, b: number, fa: number): number {
  // Bracket [neg, pos] with p(neg) < 0 < p(pos); neg may lie above pos.
  let neg = fa < 0 ? a : b;
  let pos = fa < 0 ? b : a;
  let x = 0.5 * (a + b);
  let width = Math.abs(b - a);
  let slow = 0;
  for (let it = 0; it < 200; it++) {
    const f = polynomialAt(c, x);
    if (f === 0) return x;
    if (f < 0) neg = x;
    else pos = x;
    const w = Math.abs(pos - neg);
    if (w <= 4 * Number.EPSILON * Math.max(Math.abs(pos), Math.abs(neg))) return f < 0 ? pos : neg;
    // Newton from x; fall back to bisection when the step leaves the bracket or the bracket shrinks slowly.
    slow = w > 0.5 * width ? slow + 1 : 0;
    width = w;
    const d = polynomialAt(dc, x);
    let xn = d !== 0 ? x - f / d : NaN;
    const lo = neg < pos ? neg : pos;
    const hi = neg < pos ? pos : neg;
    if (!(xn > lo && xn < hi) || slow >= 2) {
      xn = 0.5 * (lo + hi);
      slow = 0;
    }
    if (xn === x) return x;
    x = xn;
  }
  return x;
}

/**
 * Sorted real roots of p in the closed interval [lo, hi]; a root of even multiplicity (p touching zero)
 * appears only where p evaluates to exactly 0 there.
 *
 * @param coefficients - [c₀, c₁, …], ascending powers, degree ≤ {@link MAX_POLYNOMIAL_DEGREE}
 * @param lo - lower end of the interval
 * @param hi - upper end (≥ lo)
 * @returns roots in ascending order, each once
 * @remarks Derivative-bracketed bisection with Newton acceleration; degrees 1 and 2 in closed form
 * (the quadratic in its cancellation-free form, [1] §5.6). A polynomial that is identically zero has no
 * isolated roots and gives []. Accurate to a few units in the last place of the root.
 * @example
 * polynomialRealRoots([2, -3, 1], -10, 10); // → [1, 2]
 *
 * References: [1] §5.6, §9.4; [2] §8.9.
 */
export function polynomialRealRoots(coefficients: readonly number[], lo: number, hi: number): number[] {
  const c = trimmed(coefficients);
  const n = c.length - 1;
  const out: number[] = [];
  if (n < 1 || !(hi >= lo)) return out;
  if (n === 1) {
    const x = -c[0] / c[1];
    if (x >= lo && x <= hi) out.push(x);
    return out;
  }
  if (n === 2) {
    const [c0, c1, c2] = c;
    const D = c1 * c1 - 4 * c2 * c0;
    if (D < 0) return out;
    const q = -0.5 * (c1 + (c1 >= 0 ? Math.sqrt(D) : -Math.sqrt(D)));
    const r1 = q / c2;
    const r2 = q !== 0 ? c0 / q : r1;
    const a = Math.min(r1, r2);
    const b = Math.max(r1, r2);
    if (a >= lo && a <= hi) out.push(a);
    if (b !== a && b >= lo && b <= hi) out.push(b);
    return out;
  }
  const dc = derivative(c);
  const crit = polynomialRealRoots(dc, lo, hi);
  let x0 = lo;
  let f0 = polynomialAt(c, lo);
  if (f0 === 0) out.push(lo);
  for (let i = 0; i <= crit.length; i++) {
    const x1 = i < crit.length ? crit[i] : hi;
    if (x1 <= x0) continue;
    const f1 = polynomialAt(c, x1);
    if ((f0 < 0 && f1 > 0) || (f0 > 0 && f1 < 0)) out.push(rootInMonotonicBracket(c, dc, x0, x1, f0));
    if (f1 === 0) out.push(x1);
    x0 = x1;
    f0 = f1;
  }
  return out;
}

/** Extremes of a polynomial on an interval and where they are reached. */
export type PolynomialRange = { min: number; argMin: number; max: number; argMax: number };

/**
 * Minimum and maximum of p over [lo, hi] (at the ends or at real roots of p′).
 *
 * @param coefficients - [c₀, c₁, …], ascending powers, degree ≤ {@link MAX_POLYNOMIAL_DEGREE}
 * @param lo - lower end
 * @param hi - upper end (≥ lo)
 * @returns the least and greatest value and their arguments; NaN values when p overflows there
 * @remarks Exact up to rounding: a continuous p reaches its extremes on a closed interval at an end or a
 * stationary point, and {@link polynomialRealRoots} finds every stationary point inside.
 * @example
 * polynomialRange([0.05, -0.001, 0.000004], 0, 300); // min ≈ -0.0125 at 125, max 0.11 at 300
 *
 * References: [2] §8.9.
 */
export function polynomialRange(coefficients: readonly number[], lo: number, hi: number): PolynomialRange {
  const c = trimmed(coefficients);
  const fLo = polynomialAt(c, lo);
  const fHi = polynomialAt(c, hi);
  const r: PolynomialRange =
    fLo <= fHi ? { min: fLo, argMin: lo, max: fHi, argMax: hi } : { min: fHi, argMin: hi, max: fLo, argMax: lo };
  if (Number.isNaN(fLo) || Number.isNaN(fHi)) return { min: NaN, argMin: lo, max: NaN, argMax: lo };
  if (c.length > 2 && hi > lo) {
    for (const x of polynomialRealRoots(derivative(c), lo, hi)) {
      const f = polynomialAt(c, x);
      if (Number.isNaN(f)) return { min: NaN, argMin: x, max: NaN, argMax: x };
      if (f < r.min) {
        r.min = f;
        r.argMin = x;
      }
      if (f > r.max) {
        r.max = f;
        r.argMax = x;
      }
    }
  }
  return r;
}
