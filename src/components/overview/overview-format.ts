/** Site totals in the user's units, three significant figures: kW and MWh in SI, Btu/h and MMBtu in US units. */
import { formatMoney, formatSignificant, significant, type Formatted } from '../../calc/format';
import type { UnitSystem } from '../../calc/units';

const pack = (value: string, unit: string, spoken: string): Formatted => ({ value, unit, text: `${value} ${unit}`, spoken: `${value.replace('−', 'minus ')} ${spoken}` });

/** A site's heat flow [W]: kilowatts in SI. */
export function totalHeatFlow(watts: number, system: UnitSystem): Formatted {
  if (system === 'SI') return pack(significant(watts / 1000), 'kW', 'kilowatts');
  return formatSignificant('heatFlow', watts, system);
}

/** A year's energy [kWh]: megawatt hours in SI. */
export function totalEnergy(kWh: number, system: UnitSystem): Formatted {
  if (system === 'SI') return pack(significant(kWh / 1000), 'MWh', 'megawatt hours');
  return formatSignificant('energy', kWh, system);
}

/** CO₂ [kg] in tonnes (SI) or short tons (US). */
export function totalCo2(kg: number, system: UnitSystem): Formatted {
  return formatSignificant('co2Mass', kg, system);
}

/** Money the API sends as decimal text to the cent. */
export function totalMoney(amount: string | null, currency: string | null): Formatted | null {
  if (amount === null || !currency || !Number.isFinite(Number(amount))) return null;
  return formatMoney(Number(amount), currency);
}
