/** Site totals in the user's units, three significant figures: kW and MWh in SI, Btu/h and MMBtu in US units. */
import { formatMoney, formatSignificant, significant, type Formatted } from '../../calc/format';
import { formatInputNumber, toDisplay, unitOf, type UnitSystem } from '../../calc/units';

const pack = (value: string, unit: string, spoken: string): Formatted => ({ value, unit, text: `${value} ${unit}`, spoken: `${value.replace('−', 'minus ')} ${spoken}` });

/** A site's heat flow [W]: kilowatts in SI, million Btu per hour in US units. */
export function totalHeatFlow(watts: number, system: UnitSystem): Formatted {
  const v = heatFlowValue(watts, system);
  return system === 'SI' ? pack(significant(v), 'kW', 'kilowatts') : pack(significant(v), 'MMBtu/h', 'million Btu per hour');
}

/** The number {@link totalHeatFlow} shows, unrounded (for chart bars). */
export function heatFlowValue(watts: number, system: UnitSystem): number {
  return system === 'SI' ? watts / 1000 : toDisplay('heatFlow', system, watts) / 1e6;
}

/** The energy basis's price and CO₂ factor in the user's units ("0.045 EUR/kWh", "13.2 EUR/MMBtu"). */
export function basisPrice(pricePerKWh: number, currency: string, system: UnitSystem): string {
  return `${formatInputNumber(toDisplay('pricePerEnergy', system, pricePerKWh), 4)} ${currency}${unitOf('pricePerEnergy', system).suffix}`;
}

export function basisCo2Factor(kgPerKWh: number, system: UnitSystem): string {
  return formatSignificant('co2Factor', kgPerKWh, system).text;
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
