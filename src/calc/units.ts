/**
 * Display units for forms and results. SI (the calculation contract's units) is always the source of
 * truth: a field stores its SI value and is shown through one of these converters, so switching the unit
 * system back and forth never drifts.
 */

import {
  JOULES_PER_BTU_IT,
  JOULES_PER_KWH,
  KELVIN_PER_FAHRENHEIT_DEGREE,
  KILOGRAMS_PER_POUND,
  METRES_PER_FOOT,
  METRES_PER_INCH,
  METRES_PER_SECOND_PER_MPH,
  SECONDS_PER_HOUR,
} from '../../shared/calc/units';

export type UnitSystem = 'SI' | 'US';

export type Quantity =
  | 'temperature'
  | 'temperatureDelta'
  | 'thickness'
  | 'diameter'
  | 'length'
  | 'speed'
  | 'heatLossPerLength'
  | 'heatFlux'
  | 'heatFlow'
  | 'conductivity'
  | 'filmCoefficient'
  | 'massFlow'
  | 'specificHeat'
  | 'massPerLength'
  | 'energy'
  | 'co2Factor'
  | 'co2Mass'
  | 'percent'
  | 'fraction'
  | 'pricePerEnergy'
  | 'ratio'
  | 'hours'
  | 'seconds';

export type UnitDef = {
  /** Short suffix shown after the number. */
  suffix: string;
  /** Spoken form for accessible labels ("millimetres"). */
  spoken: string;
  /** Display value → SI value. */
  toSI: (x: number) => number;
  /** SI value → display value. */
  fromSI: (x: number) => number;
  /** Fixed decimals for an input drawn from SI (money to the cent); otherwise significant figures. */
  inputDecimals?: number;
};


// Conversion constants come from shared/calc so the app, the server and the CLI agree to the last digit.
const FT_M = METRES_PER_FOOT;
const IN_M = METRES_PER_INCH;
const LB_KG = KILOGRAMS_PER_POUND;
const BTU_J = JOULES_PER_BTU_IT;
const HOUR_S = SECONDS_PER_HOUR;
const DEGF_K = KELVIN_PER_FAHRENHEIT_DEGREE;
const KWH_J = JOULES_PER_KWH;
const MMBTU_J = 1e6 * BTU_J;

const linear = (suffix: string, spoken: string, siPerUnit: number): UnitDef => ({
  suffix,
  spoken,
  toSI: (x) => x * siPerUnit,
  fromSI: (x) => x / siPerUnit,
});

const identity = (suffix: string, spoken: string): UnitDef => linear(suffix, spoken, 1);

const SI_UNITS: Record<Quantity, UnitDef> = {
  temperature: identity('°C', 'degrees Celsius'),
  temperatureDelta: identity('K', 'kelvin'),
  thickness: linear('mm', 'millimetres', 1e-3),
  diameter: linear('mm', 'millimetres', 1e-3),
  length: identity('m', 'metres'),
  speed: identity('m/s', 'metres per second'),
  heatLossPerLength: identity('W/m', 'watts per metre'),
  heatFlux: identity('W/m²', 'watts per square metre'),
  heatFlow: identity('W', 'watts'),
  conductivity: identity('W/(m·K)', 'watts per metre kelvin'),
  filmCoefficient: identity('W/(m²·K)', 'watts per square metre kelvin'),
  massFlow: identity('kg/s', 'kilograms per second'),
  specificHeat: linear('kJ/(kg·K)', 'kilojoules per kilogram kelvin', 1e3),
  massPerLength: identity('kg/m', 'kilograms per metre'),
  // Energy is carried in kWh (not J) at the form edge: energy prices are quoted per kWh.
  energy: identity('kWh', 'kilowatt hours'),
  co2Factor: identity('kg CO₂/kWh', 'kilograms of CO2 per kilowatt hour'),
  co2Mass: linear('t CO₂', 'tonnes of CO2', 1e3),
  percent: identity('%', 'percent'),
  fraction: linear('%', 'percent', 0.01),
  pricePerEnergy: identity('/kWh', 'per kilowatt hour'),
  ratio: identity('', ''),
  hours: identity('h', 'hours'),
  seconds: identity('s', 'seconds'),
};

const MMBTU_PER_KWH = KWH_J / MMBTU_J;

const US_UNITS: Record<Quantity, UnitDef> = {
  temperature: {
    suffix: '°F',
    spoken: 'degrees Fahrenheit',
    toSI: (f) => (f - 32) * DEGF_K,
    fromSI: (c) => c / DEGF_K + 32,
  },
  temperatureDelta: linear('°F', 'degrees Fahrenheit difference', DEGF_K),
  thickness: linear('in', 'inches', IN_M),
  diameter: linear('in', 'inches', IN_M),
  length: linear('ft', 'feet', FT_M),
  speed: linear('mph', 'miles per hour', METRES_PER_SECOND_PER_MPH),
  heatLossPerLength: linear('Btu/(h·ft)', 'Btu per hour foot', BTU_J / HOUR_S / FT_M),
  heatFlux: linear('Btu/(h·ft²)', 'Btu per hour square foot', BTU_J / HOUR_S / (FT_M * FT_M)),
  heatFlow: linear('Btu/h', 'Btu per hour', BTU_J / HOUR_S),
  conductivity: linear('Btu·in/(h·ft²·°F)', 'Btu inch per hour square foot degree Fahrenheit', (BTU_J * IN_M) / (HOUR_S * FT_M * FT_M * DEGF_K)),
  filmCoefficient: linear('Btu/(h·ft²·°F)', 'Btu per hour square foot degree Fahrenheit', BTU_J / (HOUR_S * FT_M * FT_M * DEGF_K)),
  massFlow: linear('lb/h', 'pounds per hour', LB_KG / HOUR_S),
  specificHeat: linear('Btu/(lb·°F)', 'Btu per pound degree Fahrenheit', BTU_J / (LB_KG * DEGF_K)),
  massPerLength: linear('lb/ft', 'pounds per foot', LB_KG / FT_M),
  energy: linear('MMBtu', 'million Btu', 1 / MMBTU_PER_KWH),
  co2Factor: linear('lb CO₂/MMBtu', 'pounds of CO2 per million Btu', LB_KG * MMBTU_PER_KWH),
  co2Mass: linear('short t CO₂', 'short tons of CO2', 2000 * LB_KG),
  percent: identity('%', 'percent'),
  fraction: linear('%', 'percent', 0.01),
  // A price converted to MMBtu is money per unit: shown to the cent.
  pricePerEnergy: { ...linear('/MMBtu', 'per million Btu', MMBTU_PER_KWH), inputDecimals: 2 },
  ratio: identity('', ''),
  hours: identity('h', 'hours'),
  seconds: identity('s', 'seconds'),
};

/** The display unit for a quantity in a unit system. */
export function unitOf(quantity: Quantity, system: UnitSystem): UnitDef {
  return (system === 'US' ? US_UNITS : SI_UNITS)[quantity];
}

/** SI value → display value. */
export function toDisplay(quantity: Quantity, system: UnitSystem, si: number): number {
  return unitOf(quantity, system).fromSI(si);
}

/** Display value → SI value. */
export function fromDisplay(quantity: Quantity, system: UnitSystem, display: number): number {
  return unitOf(quantity, system).toSI(display);
}

/**
 * Coefficients of p(a + b·x) given those of p(y) (ascending powers). Used to carry a k(T) polynomial
 * between °C and °F: k_US(T_F) = s · k_SI((T_F − 32)·5/9).
 */
export function composeLinear(coeffs: readonly number[], a: number, b: number): number[] {
  const out = new Array<number>(coeffs.length).fill(0);
  // (a + b x)^n expanded with the binomial theorem.
  for (let n = 0; n < coeffs.length; n++) {
    let binom = 1;
    for (let k = 0; k <= n; k++) {
      out[k] += coeffs[n] * binom * Math.pow(a, n - k) * Math.pow(b, k);
      binom = (binom * (n - k)) / (k + 1);
    }
  }
  return out;
}

/** k(T) coefficients in SI (W/(m·K), T in °C) → display (US: Btu·in/(h·ft²·°F), T in °F). */
export function conductivityCoefficientsToDisplay(system: UnitSystem, si: readonly number[]): number[] {
  if (system === 'SI') return [...si];
  const s = 1 / US_UNITS.conductivity.toSI(1);
  // T_C = (T_F − 32)·5/9 = −160/9 + (5/9)·T_F
  return composeLinear(si, -32 * DEGF_K, DEGF_K).map((c) => c * s);
}

/** Inverse of {@link conductivityCoefficientsToDisplay}. */
export function conductivityCoefficientsFromDisplay(system: UnitSystem, display: readonly number[]): number[] {
  if (system === 'SI') return [...display];
  const s = US_UNITS.conductivity.toSI(1);
  // T_F = 32 + 1.8·T_C
  return composeLinear(display, 32, 1 / DEGF_K).map((c) => c * s);
}

/**
 * An SI value as an input shows it in a unit system: to the cent for money per unit (a converted price reads
 * 14.65 $/MMBtu, not 14.6536), else up to six significant figures.
 */
export function formatInputValue(quantity: Quantity, system: UnitSystem, si: number): string {
  const u = unitOf(quantity, system);
  const v = u.fromSI(si);
  if (!Number.isFinite(v)) return '';
  return u.inputDecimals !== undefined ? v.toFixed(u.inputDecimals) : formatInputNumber(v);
}

/**
 * Parse what a person typed into a number field: accepts a decimal comma, surrounding spaces and a
 * leading plus; returns null for anything that is not one finite number.
 */
export function parseNumber(text: string): number | null {
  const t = text.trim().replace(/\s+/g, '').replace(',', '.');
  if (t === '' || !/^[+-]?(\d+\.?\d*|\.\d+)(e[+-]?\d+)?$/i.test(t)) return null;
  const n = Number(t);
  return Number.isFinite(n) ? n : null;
}

/**
 * A number as it should appear in an input after a unit switch: up to `sig` significant figures, no
 * trailing zeros, no exponent for everyday magnitudes.
 */
export function formatInputNumber(x: number, sig = 6): string {
  if (!Number.isFinite(x)) return '';
  if (x === 0) return '0';
  const abs = Math.abs(x);
  if (abs >= 1e-6 && abs < 1e12) {
    const digits = Math.max(0, sig - 1 - Math.floor(Math.log10(abs)));
    const s = x.toFixed(Math.min(digits, 12));
    return s.includes('.') ? s.replace(/0+$/, '').replace(/\.$/, '') : s;
  }
  return String(Number(x.toPrecision(sig)));
}
