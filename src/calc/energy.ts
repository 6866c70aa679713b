/**
 * Annual energy, cost and CO₂ for the quick-sizing screen: a thin adapter over shared/calc/energy with
 * the assumptions the screen shows. The basis follows the geometry (per metre of pipe, per m² of wall,
 * per vessel); a heat gain on cold service counts by its magnitude.
 */
import { annualEnergyAssessment, savingVersusBare, type EnergyBasis } from '../../shared/calc/energy';

import type { EnergyAssumptions } from './quick-case';

export type EnergyFigures = {
  /** Heat through the surface in a year [kWh]. */
  heatKWh: number;
  /** Purchased (fuel) energy after the heat-source efficiency [kWh]. */
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

function basisOf(a: EnergyAssumptions): EnergyBasis | null {
  if (a.operatingHoursPerYear === null || a.efficiency === null || a.pricePerKWh === null || a.co2KgPerKWh === null) return null;
  return {
    operatingHoursPerYear: a.operatingHoursPerYear,
    heatSourceEfficiency: a.efficiency,
    price: { amount: String(a.pricePerKWh), per: 'kWh', currencyDecimals: 2 },
    emissionFactor: { kgCo2PerKWh: a.co2KgPerKWh, basis: a.co2Basis.trim() || 'not stated' },
  };
}

/** Annual figures for a heat flow (W/m, W/m² or W) and its bare-surface counterpart; null when an assumption is missing. */
export function annualEnergy(heatFlowW: number, bareHeatFlowW: number | null, a: EnergyAssumptions): EnergyFigures | null {
  const basis = basisOf(a);
  if (!basis || !Number.isFinite(heatFlowW)) return null;
  try {
    if (bareHeatFlowW === null || !Number.isFinite(bareHeatFlowW)) {
      const x = annualEnergyAssessment(heatFlowW, basis);
      return {
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
