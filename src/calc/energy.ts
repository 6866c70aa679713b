/**
 * Annual energy, cost and CO₂ for the quick-sizing screen: a thin adapter over shared/calc/energy with
 * the assumptions the screen shows. The basis follows the geometry (per metre of pipe, per m² of wall,
 * per vessel); a heat loss is made up by the heat source (fuel), a heat gain on cold service is removed by a
 * chiller (electricity at its coefficient of performance).
 */
import { annualEnergyAssessment, savingVersusBare, type EnergyBasis } from '../../shared/calc/energy';

import type { EnergyAssumptions } from './quick-case';

export type EnergyFigures = {
  /** `heating`: fuel for the heat source makes up a loss; `cooling`: electricity for a chiller removes a gain. */
  service: 'heating' | 'cooling';
  /** Heat through the surface in a year [kWh]. */
  heatKWh: number;
  /** Purchased energy [kWh]: fuel after the heat-source efficiency, or chiller electricity after the COP. */
  fuelKWh: number;
  /** Money in the assumptions' currency, rounded to cents. */
  cost: number;
  /** [kg CO₂] */
  co2Kg: number;
  bareFuelKWh: number | null;
  bareCost: number | null;
  savingFuelKWh: number | null;
  savingCost: number | null;
  savingCo2Kg: number | null;
  /** Fraction of the bare heat flow saved. */
  savingFraction: number | null;
};

/** The assumptions as an energy basis; a gain needs the cooling assumptions, a loss the heat-source ones. */
function basisOf(a: EnergyAssumptions, gain: boolean): EnergyBasis | null {
  if (a.operatingHoursPerYear === null) return null;
  if (gain) {
    if (a.coolingCop === null || a.electricityPricePerKWh === null || a.electricityCo2KgPerKWh === null) return null;
    return {
      operatingHoursPerYear: a.operatingHoursPerYear,
      // Not used for a gain; the shared basis needs one.
      heatSourceEfficiency: a.efficiency ?? 1,
      price: { amount: String(a.pricePerKWh ?? 0), per: 'kWh', currencyDecimals: 2 },
      emissionFactor: { kgCo2PerKWh: a.co2KgPerKWh ?? 0, basis: a.co2Basis.trim() || 'not stated' },
      cooling: {
        coefficientOfPerformance: a.coolingCop,
        electricityPrice: { amount: String(a.electricityPricePerKWh), per: 'kWh', currencyDecimals: 2 },
        electricityEmissionFactor: { kgCo2PerKWh: a.electricityCo2KgPerKWh, basis: a.electricityCo2Basis.trim() || 'not stated' },
      },
    };
  }
  if (a.efficiency === null || a.pricePerKWh === null || a.co2KgPerKWh === null) return null;
  return {
    operatingHoursPerYear: a.operatingHoursPerYear,
    heatSourceEfficiency: a.efficiency,
    price: { amount: String(a.pricePerKWh), per: 'kWh', currencyDecimals: 2 },
    emissionFactor: { kgCo2PerKWh: a.co2KgPerKWh, basis: a.co2Basis.trim() || 'not stated' },
  };
}

/**
 * Annual figures for a heat flow (W/m, W/m² or W) and its bare-surface counterpart; null when an assumption is
 * missing. A gain (negative flow) is costed as chiller electricity.
 */
export function annualEnergy(heatFlowW: number, bareHeatFlowW: number | null, a: EnergyAssumptions): EnergyFigures | null {
  const basis = basisOf(a, heatFlowW < 0);
  if (!basis || !Number.isFinite(heatFlowW)) return null;
  try {
    if (bareHeatFlowW === null || !Number.isFinite(bareHeatFlowW)) {
      const x = annualEnergyAssessment(heatFlowW, basis);
      return {
        service: x.service,
        heatKWh: x.heat.kWh,
        fuelKWh: x.purchasedKWh,
        cost: x.cost.amount.toNumber(),
        co2Kg: x.co2.kg,
        bareFuelKWh: null,
        bareCost: null,
        savingFuelKWh: null,
        savingCost: null,
        savingCo2Kg: null,
        savingFraction: null,
      };
    }
    const s = savingVersusBare(bareHeatFlowW, heatFlowW, basis);
    return {
      service: s.insulated.service,
      heatKWh: s.insulated.heat.kWh,
      fuelKWh: s.insulated.purchasedKWh,
      cost: s.insulated.cost.amount.toNumber(),
      co2Kg: s.insulated.co2.kg,
      bareFuelKWh: s.bare.purchasedKWh,
      bareCost: s.bare.cost.amount.toNumber(),
      savingFuelKWh: s.purchasedKWhSaved,
      savingCost: s.costSaved.amount.toNumber(),
      savingCo2Kg: s.co2KgSaved,
      savingFraction: s.fraction,
    };
  } catch {
    return null;
  }
}
