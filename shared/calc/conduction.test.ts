import { assertConductivityPositive, conductivityIntegral, innerTemperatureFromKirchhoffDrop } from './conduction';
import { CalcInputError } from './errors';

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
});
