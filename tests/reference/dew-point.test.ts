import psychrolib from 'psychrolib';
import { analyse, dewPointC } from '../../shared/calc';

// Reference: the psychrolib package (D. Meyer, D. Thevenard, "PsychroLib: a library of psychrometric
// functions to calculate thermodynamic properties of air", J. Open Source Software 4(33), 1137, 2019,
// doi:10.21105/joss.01137), which solves the ASHRAE Handbook—Fundamentals (2017) ch. 1 saturation-pressure
// equations for the dew point. Magnus with the Alduchov & Eskridge constants differs from the ASHRAE
// formulation by under ~0.35 % in vapour pressure over −40…50 °C, i.e. a few hundredths of a kelvin, so
// the tolerance is 0.05 K. Only dew points above 0 °C are compared, because psychrolib takes
// the vapour pressure over frozen water below 0 °C, whereas our Magnus formula is taken over liquid water.
psychrolib.SetUnitSystem(psychrolib.SI);

describe('dew point, Magnus (Alduchov & Eskridge 1996), against psychrolib', () => {
  it('when air is 30 °C at 60 % RH, then the dew point is 21.388 °C', () => {
    // Source: psychrolib 1.1.1, GetTDewPointFromRelHum(30, 0.6) = 21.388 °C (value published with the library's
    // SI examples; 3 decimals → 0.05 K covers the formulation difference).
    expect(Math.abs(dewPointC(30, 60) - 21.388)).toBeLessThan(0.05);
  });

  const cases: [number, number][] = [
    [5, 90],
    [10, 80],
    [20, 50],
    [25, 40],
    [40, 30],
    [50, 90],
  ];
  it.each(cases)('when air is %p °C at %p %% RH, then Magnus agrees with psychrolib within 0.05 K', (T, rh) => {
    // Source: psychrolib 1.1.1 GetTDewPointFromRelHum (ASHRAE Handbook—Fundamentals 2017, ch. 1, Eqs. 5–6).
    const expected = psychrolib.GetTDewPointFromRelHum(T, rh / 100);
    expect(Math.abs(dewPointC(T, rh) - expected)).toBeLessThan(0.05);
  });

  it('when a case gives relative humidity, then the result reports the dew point', () => {
    const r = analyse({
      geometry: { type: 'flat', orientation: 'vertical', heightM: 1 },
      processTemperatureC: 5,
      layers: [{ thicknessM: 0.03, conductivity: [0.035] }],
      surfaceEmissivity: 0.9,
      ambient: { airTemperatureC: 30, relativeHumidityPct: 60 },
    });
    // Source: psychrolib 1.1.1 GetTDewPointFromRelHum(30, 0.6) = 21.388 °C.
    expect(Math.abs((r.dewPointC as number) - 21.388)).toBeLessThan(0.05);
  });
});
