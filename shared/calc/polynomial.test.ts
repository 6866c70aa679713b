import * as fc from 'fast-check';
import { polynomialAt, polynomialRange, polynomialRealRoots } from './polynomial';

/** Ascending coefficients of Π (x − rᵢ) scaled by `lead`. */
function fromRoots(roots: readonly number[], lead = 1): number[] {
  let c = [lead];
  for (const r of roots) {
    const next = new Array<number>(c.length + 1).fill(0);
    for (let i = 0; i < c.length; i++) {
      next[i + 1] += c[i];
      next[i] -= r * c[i];
    }
    c = next;
  }
  return c;
}

describe('real roots of a polynomial on an interval', () => {
  it('when the roots are known, then every one inside the interval is found, in order, and none outside', () => {
    const c = fromRoots([-150, -40, 0.5, 20, 90, 310, 700], 1e-12);
    expect(c).toHaveLength(8);
    const roots = polynomialRealRoots(c, -200, 300);
    expect(roots).toHaveLength(5);
    [-150, -40, 0.5, 20, 90].forEach((r, i) => expect(roots[i]).toBeCloseTo(r, 6));
  });

  it('when two roots are close, then both are separated by the derivative and found', () => {
    const roots = polynomialRealRoots(fromRoots([100, 100.001, -50, 400]), -273.15, 1000);
    expect(roots).toHaveLength(4);
    expect(roots[1]).toBeCloseTo(100, 7);
    expect(roots[2]).toBeCloseTo(100.001, 7);
  });

  it('when the polynomial has no real root or is constant, then none is reported', () => {
    expect(polynomialRealRoots([1, 0, 1], -10, 10)).toEqual([]);
    expect(polynomialRealRoots([0.04, 0, 0, 0, 1e-12], -273, 1000)).toEqual([]);
    expect(polynomialRealRoots([0.04], -273, 1000)).toEqual([]);
    expect(polynomialRealRoots([0.04, 0, 0], -273, 1000)).toEqual([]);
  });

  it('when the degree is 1 or 2, then the closed forms answer (trailing zeros ignored)', () => {
    expect(polynomialRealRoots([0.03, -0.0001, 0, 0], 0, 1000)).toEqual([300]);
    const q = polynomialRealRoots([2, -3, 1], -10, 10);
    expect(q[0]).toBeCloseTo(1, 14);
    expect(q[1]).toBeCloseTo(2, 14);
  });

  it('when random roots are planted, then each is recovered and p vanishes there', () => {
    fc.assert(
      fc.property(
        fc.uniqueArray(fc.integer({ min: -2500, max: 9000 }), { minLength: 1, maxLength: 7 }),
        fc.double({ min: 1e-12, max: 1, noNaN: true }),
        (tenths, lead) => {
          const planted = tenths.map((t) => t / 10).sort((a, b) => a - b);
          const roots = polynomialRealRoots(fromRoots(planted, lead), -273.15, 1000);
          expect(roots).toHaveLength(planted.length);
          roots.forEach((r, i) => expect(Math.abs(r - planted[i])).toBeLessThan(1e-6 * (1 + Math.abs(planted[i]))));
        },
      ),
      { numRuns: 300 },
    );
  });
});

describe('range of a polynomial on an interval', () => {
  it('when a quartic dips below zero in a band narrower than a 32-point sampling step, then the minimum is found', () => {
    // p = −5e-5 + 2e-5·x² + 1e-12·x⁴ with x = T − 102.3: negative only for |x| < 1.58 K.
    const T0 = 102.3;
    const shifted = [-5e-5, 0, 2e-5, 0, 1e-12];
    const c = [0, 0, 0, 0, 0];
    // Expand Σ sⱼ·(T − T0)ʲ into powers of T.
    const binom = [[1], [1, 1], [1, 2, 1], [1, 3, 3, 1], [1, 4, 6, 4, 1]];
    shifted.forEach((sj, j) => {
      for (let i = 0; i <= j; i++) c[i] += sj * binom[j][i] * (-T0) ** (j - i);
    });
    const r = polynomialRange(c, 20, 250);
    expect(r.min).toBeCloseTo(-5e-5, 9);
    expect(r.argMin).toBeCloseTo(T0, 4);
    // Sampling the span at 33 points misses it.
    const samples = Array.from({ length: 33 }, (_, i) => polynomialAt(c, 20 + (230 * i) / 32));
    expect(Math.min(...samples)).toBeGreaterThan(0);
  });

  it('when the extremes lie at the ends or inside, then both are reported with where they are', () => {
    const r = polynomialRange([0.05, -0.001, 0.000004], 0, 300);
    expect(r.argMin).toBeCloseTo(125, 9);
    expect(r.min).toBeCloseTo(-0.0125, 12);
    expect(r.max).toBeCloseTo(0.11, 12);
    expect(r.argMax).toBe(300);
  });

  it('when p overflows, then the range says so (not finite) rather than giving a wrong number', () => {
    expect(Number.isFinite(polynomialRange([1, 0, 0, 0, 0, 0, 0, 1e300], 0, 1e10).max)).toBe(false);
    expect(Number.isFinite(polynomialRange([1, -1e300, 1e300, 0, 0, 0, 0, 1e300], -1e10, 1e10).min)).toBe(false);
  });
});
