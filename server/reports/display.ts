/**
 * Numbers of reports and comparisons in the reader's units, with the precision the app shows (src/calc):
 * temperatures whole degrees in lists and to 0.1° for results, thickness in whole millimetres or eighths of
 * an inch, heat flow and energy to three significant figures, money to the cent. Every function has a text
 * form (with its unit) for PDFs and a number form (in the unit its column header names) for CSV.
 */
import { METRES_PER_FOOT } from '../../shared/calc/units';
import type { UnitSystem } from '../../shared/schemas/common';
import { fixed, formatMoney, formatThickness, significant } from '../../src/calc/format';
import { toDisplay, unitOf, type Quantity } from '../../src/calc/units';

export type { UnitSystem };

const round = (x: number, decimals: number) => {
  const f = 10 ** decimals;
  const r = Math.round(x * f) / f;
  return Object.is(r, -0) ? 0 : r;
};
const sig = (x: number, n = 3) => (x === 0 || !Number.isFinite(x) ? 0 : Number(x.toPrecision(n)));

/** Units of the quantities reports print that src/calc does not carry (areas, volumes). */
const EXTRA = {
  SI: { area: { suffix: 'm²', perSI: 1 }, volume: { suffix: 'm³', perSI: 1 } },
  US: { area: { suffix: 'ft²', perSI: 1 / (METRES_PER_FOOT * METRES_PER_FOOT) }, volume: { suffix: 'ft³', perSI: 1 / METRES_PER_FOOT ** 3 } },
} as const;

/** Display helpers bound to one unit system. */
export function displayUnits(system: UnitSystem) {
  const u = (q: Quantity) => unitOf(q, system).suffix;
  const d = (q: Quantity, si: number) => toDisplay(q, system, si);
  const withUnit = (value: string, unit: string) => (unit ? `${value} ${unit}` : value);
  return {
    system,
    unit: u,
    areaUnit: EXTRA[system].area.suffix,
    volumeUnit: EXTRA[system].volume.suffix,
    /** Heat flow of whole items and totals: kW (SI) or Btu/h (US). */
    bigHeatFlowUnit: system === 'SI' ? 'kW' : 'Btu/h',
    /** Annual energy of totals: MWh (SI) or MMBtu (US). */
    bigEnergyUnit: system === 'SI' ? 'MWh' : 'MMBtu',

    /** List temperature: whole degrees. */
    temperatureList: (c: number) => withUnit(fixed(d('temperature', c), 0), u('temperature')),
    temperatureListNumber: (c: number) => round(d('temperature', c), 0),
    /** Result temperature: 0.1°. */
    temperature: (c: number) => withUnit(fixed(d('temperature', c), 1), u('temperature')),
    temperatureNumber: (c: number) => round(d('temperature', c), 1),
    temperatureDelta: (k: number) => withUnit(fixed(d('temperatureDelta', k), 1), u('temperatureDelta')),

    thickness: (m: number) => formatThickness(m, system).text,
    thicknessValue: (m: number) => formatThickness(m, system).value,
    /** Whole millimetres, or inches to the eighth as a decimal number. */
    thicknessNumber: (m: number) => (system === 'SI' ? round(m * 1000, 0) : Math.round((m / 0.0254) * 8) / 8),

    diameter: (m: number) => withUnit(system === 'SI' ? fixed(m * 1000, m < 1 ? 1 : 0) : fixed(d('diameter', m), 2), u('diameter')),
    diameterNumber: (m: number) => (system === 'SI' ? round(m * 1000, 1) : round(d('diameter', m), 3)),

    length: (m: number) => withUnit(fixed(d('length', m), 1), u('length')),
    lengthNumber: (m: number) => round(d('length', m), 2),

    heatLossPerLength: (wPerM: number) => withUnit(significant(d('heatLossPerLength', wPerM)), u('heatLossPerLength')),
    heatLossPerLengthNumber: (wPerM: number) => sig(d('heatLossPerLength', wPerM)),
    heatFlow: (w: number) => withUnit(significant(d('heatFlow', w)), u('heatFlow')),
    heatFlowNumber: (w: number) => sig(d('heatFlow', w)),
    /** Totals: kW or Btu/h, three significant figures. */
    bigHeatFlow: (w: number) => withUnit(significant(system === 'SI' ? w / 1000 : d('heatFlow', w)), system === 'SI' ? 'kW' : 'Btu/h'),
    bigHeatFlowNumber: (w: number) => sig(system === 'SI' ? w / 1000 : d('heatFlow', w)),
    /** Annual energy from kWh: MWh or MMBtu, three significant figures. */
    bigEnergy: (kWh: number) => withUnit(significant(system === 'SI' ? kWh / 1000 : d('energy', kWh)), system === 'SI' ? 'MWh' : 'MMBtu'),
    bigEnergyNumber: (kWh: number) => sig(system === 'SI' ? kWh / 1000 : d('energy', kWh)),
    co2: (tonnes: number) => withUnit(significant(d('co2Mass', tonnes * 1000)), u('co2Mass')),
    co2Number: (tonnes: number) => sig(d('co2Mass', tonnes * 1000)),
    co2Factor: (kgPerKWh: number) => withUnit(significant(d('co2Factor', kgPerKWh)), u('co2Factor')),
    price: (perKWh: number, currency: string) => `${String(sig(d('pricePerEnergy', perKWh), 4))} ${currency}${u('pricePerEnergy')}`,
    money: (amount: number, currency: string) => formatMoney(amount, currency).text,
    speed: (ms: number) => withUnit(fixed(d('speed', ms), 1), u('speed')),

    area: (m2: number) => withUnit(significant(m2 * EXTRA[system].area.perSI, 4), EXTRA[system].area.suffix),
    areaNumber: (m2: number) => sig(m2 * EXTRA[system].area.perSI, 4),
    volume: (m3: number) => withUnit(significant(m3 * EXTRA[system].volume.perSI, 4), EXTRA[system].volume.suffix),
    volumeNumber: (m3: number) => sig(m3 * EXTRA[system].volume.perSI, 4),

    percent: (x: number) => `${fixed(x, 0)} %`,
  };
}

export type DisplayUnits = ReturnType<typeof displayUnits>;

/** Short names of the purposes for narrow columns, with the legend printed under the method. */
export const PURPOSE_SHORT = {
  personnelProtection: 'PP',
  heatConservation: 'HC',
  condensationControl: 'CC',
  temperatureHolding: 'TH',
  frostProtection: 'FP',
} as const;

export const PURPOSE_NAMES = {
  personnelProtection: 'personnel protection',
  heatConservation: 'heat conservation',
  condensationControl: 'condensation control',
  temperatureHolding: 'process temperature holding',
  frostProtection: 'frost protection',
} as const;
