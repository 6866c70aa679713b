import * as fc from 'fast-check';
import {
  assertConductivityInRange,
  assertConductivityPositive,
  conductivityAt,
  conductivityIntegral,
  innerTemperatureFromKirchhoffDrop,
  kirchhoffBracket,
} from './conduction';
import { CalcInputError } from './errors';
import { insulationMaterialById } from './library';

describe('Kirchhoff inversion', () => {
  it.each([
    [[0.04]],
    [[0.035, 0.00015]],
    [[0.05, -0.00002]],
    [[0.03, 5e-5, 2e-7]],
    [[0.03, 5e-5, 2e-7, 1e-10]],
  ])('when k = %p, then K(T_in) − K(T_out) recovers the requested drop', (k) => {
    for (const [Tout, dK] of [
      [30, 5],
      [50, 40],
      [-20, -3],
      [-150, 2],
    ]) {
      const Tin = innerTemperatureFromKirchhoffDrop(k, Tout, dK);
      expect(conductivityIntegral(k, Tin) - conductivityIntegral(k, Tout)).toBeCloseTo(dK, 7);
    }
  });

  it('when k falls to zero before the drop is carried, then the inversion reports NaN', () => {
    // k = 0.03 − 0.0001·T is zero at 300 °C: K can rise by at most 0.03·(300−20) − 0.0001·(300²−20²)/2 from 20 °C.
    expect(innerTemperatureFromKirchhoffDrop([0.03, -0.0001], 20, 10)).toBeNaN();
    expect(innerTemperatureFromKirchhoffDrop([0.03, -0.0001, 0], 20, 10)).toBeNaN();
  });

  it('when k ≤ 0 inside a span, then a CalcInputError names the field', () => {
    expect(() => assertConductivityPositive([0.03, -0.0001], 0, 400, 'layers[0].conductivity')).toThrow(CalcInputError);
    expect(() => assertConductivityPositive([0.05, -0.001, 0.000004], 0, 300, 'x')).toThrow(/k\(125/);
    expect(() => assertConductivityPositive([0.03, 0.0001], -200, 600, 'x')).not.toThrow();
  });

  it('when a cubic k(T) carries a cold drop to −183 °C but turns negative below −250 °C, then the inverse finds the temperature', () => {
    // The library's polyisocyanurate cubic: k > 0 above about −214 °C. A doubling bracket grown from 20 °C
    // steps past that root and used to give NaN although the root exists.
    const k = insulationMaterialById('polyisocyanurate-c591-type-iv').conductivity;
    for (const Tin of [-183, -162, -200, -100]) {
      const dK = conductivityIntegral(k, Tin) - conductivityIntegral(k, 20);
      expect(innerTemperatureFromKirchhoffDrop(k, 20, dK)).toBeCloseTo(Tin, 9);
      expect(innerTemperatureFromKirchhoffDrop(k, 20, dK, kirchhoffBracket(k, -205, 30))).toBeCloseTo(Tin, 9);
    }
  });

  it('when any drop is asked inside the interval where k > 0, then the inverse recovers it, never stepping out', () => {
    const curves = [
      insulationMaterialById('polyisocyanurate-c591-type-iv').conductivity,
      insulationMaterialById('flexible-elastomeric-c534-grade-1-type-i').conductivity,
      [0.03, 2e-5, -4e-7, 1e-9, 1e-12],
    ];
    fc.assert(
      fc.property(fc.constantFrom(...curves), fc.double({ min: 0, max: 1, noNaN: true }), fc.double({ min: 0, max: 1, noNaN: true }), (k, u, v) => {
        // Temperatures where this k is positive (each curve is positive on −195…300 °C).
        const Tout = -195 + 495 * u;
        const Tin = -195 + 495 * v;
        fc.pre(conductivityAt(k, Tout) > 0 && conductivityAt(k, Tin) > 0);
        const dK = conductivityIntegral(k, Tin) - conductivityIntegral(k, Tout);
        const got = innerTemperatureFromKirchhoffDrop(k, Tout, dK);
        expect(Math.abs(got - Tin)).toBeLessThan(1e-8 * (1 + Math.abs(Tin)));
      }),
      { numRuns: 500 },
    );
  });

  it('when the drop asks for more than the domain holds, then K is continued past the domain end, increasing', () => {
    const k = [0.03, 5e-5, 2e-7];
    const br = kirchhoffBracket(k, -50, 300);
    const a = innerTemperatureFromKirchhoffDrop(k, 20, 200, br);
    const b = innerTemperatureFromKirchhoffDrop(k, 20, 201, br);
    expect(a).toBeGreaterThan(300);
    expect(b).toBeGreaterThan(a);
  });

  it('when four or more coefficients leave a negative band narrower than 32 sample points would see, then it is refused', () => {
    // k = −5e-5 + 2e-5·x² + 1e-12·x⁴ + 1e-14·x⁵ about x = T − 102.3 °C: negative only within ±1.6 K of it.
    const T0 = 102.3;
    const shifted = [-5e-5, 0, 2e-5, 0, 1e-12, 1e-14];
    const binom = [[1], [1, 1], [1, 2, 1], [1, 3, 3, 1], [1, 4, 6, 4, 1], [1, 5, 10, 10, 5, 1]];
    const k = [0, 0, 0, 0, 0, 0];
    shifted.forEach((sj, j) => {
      for (let i = 0; i <= j; i++) k[i] += sj * binom[j][i] * (-T0) ** (j - i);
    });
    expect(() => assertConductivityPositive(k, 20, 250, 'layers[1].conductivity')).toThrow(/k\(102\.3 °C\)/);
    expect(() => assertConductivityPositive(k, 20, 250, 'x')).toThrow(CalcInputError);
    expect(() => assertConductivityPositive(k, 110, 250, 'x')).not.toThrow();
  });

  it('when k leaves 0.001–500 W/(m·K) over the span, then CONDUCTIVITY_OUT_OF_RANGE names the field; k ≤ 0 keeps its own code', () => {
    const code = (k: number[], a: number, b: number) => {
      try {
        assertConductivityInRange(k, a, b, 'layers[2].conductivity');
        return 'ok';
      } catch (e) {
        expect((e as CalcInputError).field).toBe('layers[2].conductivity');
        return (e as CalcInputError).code;
      }
    };
    expect(code([1e200], 20, 250)).toBe('CONDUCTIVITY_OUT_OF_RANGE');
    expect(code([0.0005], 20, 250)).toBe('CONDUCTIVITY_OUT_OF_RANGE');
    expect(code([0.04, 2], 20, 250)).toBe('CONDUCTIVITY_OUT_OF_RANGE');
    expect(code([0.03, -0.0001], 0, 400)).toBe('CONDUCTIVITY_NOT_POSITIVE');
    expect(code([0.035, 0.00015], -180, 650)).toBe('ok');
    expect(code([401], 20, 30)).toBe('ok');
  });
});

