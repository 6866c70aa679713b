/**
 * Annual energy, fuel, cost and CO₂ of a heat flow, savings against a bare surface, and the allowance for
 * valves and flanges by equivalent length.
 *
 * @remarks
 * Heat flow keeps its sign convention (positive = loss to the surroundings, negative = gain on a cold service);
 * energy is computed on its magnitude. A loss is made up by the heat source (fuel, its efficiency and emission
 * factor); a gain is removed by a chiller when a cooling basis is given (electricity, the chiller's coefficient of
 * performance and electricity's emission factor). Money is computed with decimal arithmetic and rounded once, at the end, to the currency's minor unit.
 */

import Decimal from 'decimal.js';

import { requireFinite, requireNonNegativeFinite, requirePositiveFinite } from './checks';
import { CalcInputError } from './errors';
import { JOULES_PER_BTU_IT, JOULES_PER_KWH, BTU_PER_THERM } from './units';

// A private Decimal constructor, so the package never changes the global configuration others rely on.
const Money = Decimal.clone({ precision: 40, rounding: Decimal.ROUND_HALF_UP });

/** Hours in a (non-leap) year of continuous operation. */
export const HOURS_PER_YEAR = 8760;

/** Annual heat as energy, in the two units reports use. */
export type AnnualEnergy = {
  /** Energy per year [kWh]. */
  kWh: number;
  /** Energy per year [GJ]. */
  GJ: number;
};

/**
 * Annual heat from a steady heat flow: E = |Q| · hours / 1000 [kWh]; E_GJ = E_kWh · 0.0036.
 *
 * @param heatFlowW - heat flow [W] (sign ignored: a gain is energy too)
 * @param operatingHoursPerYear - hours per year the service is at temperature [h], 0 to 8784
 * @returns annual energy [kWh] and [GJ]
 * @example annualHeatEnergy(1000, 8760) // { kWh: 8760, GJ: 31.536 }
 */
export function annualHeatEnergy(heatFlowW: number, operatingHoursPerYear: number): AnnualEnergy {
  requireFinite(heatFlowW, 'heatFlowW');
  requireNonNegativeFinite(operatingHoursPerYear, 'operatingHoursPerYear');
  if (operatingHoursPerYear > 8784) {
    throw new CalcInputError('operatingHoursPerYear', 'operatingHoursPerYear cannot exceed 8784 (a leap year)');
  }
  const kWh = (Math.abs(heatFlowW) * operatingHoursPerYear) / 1000;
  return { kWh, GJ: (kWh * JOULES_PER_KWH) / 1e9 };
}

/**
 * Energy bought to supply a heat: E_fuel = E_heat / η.
 *
 * @param heatEnergyKWh - heat delivered or removed [kWh], ≥ 0
 * @param heatSourceEfficiency - η of the heat source, > 0 (boiler 0.8–0.95; a chiller's COP may exceed 1)
 * @returns purchased energy [kWh]
 * @example fuelEnergyKWh(8760, 0.85) // ≈ 10305.9
 */
export function fuelEnergyKWh(heatEnergyKWh: number, heatSourceEfficiency: number): number {
  requireNonNegativeFinite(heatEnergyKWh, 'heatEnergyKWh');
  requirePositiveFinite(heatSourceEfficiency, 'heatSourceEfficiency');
  return heatEnergyKWh / heatSourceEfficiency;
}

/** Energy unit a price is quoted per. */
export type PriceUnit = 'kWh' | 'MWh' | 'GJ' | 'MMBtu' | 'therm';

/** A price of purchased energy in some currency. */
export type EnergyPrice = {
  /** Price per unit, as a decimal string (preferred, exact) or a number. */
  amount: string | number;
  per: PriceUnit;
  /** Digits of the currency's minor unit (2 for cents, 0 for yen); default 2. */
  currencyDecimals?: number;
};

/** A money amount rounded to the currency's minor unit. */
export type MoneyAmount = {
  /** The rounded amount as a decimal. */
  amount: Decimal;
  /** The rounded amount as text with exactly `currencyDecimals` decimals, e.g. `"1234.50"`. */
  text: string;
};

// kWh in one price unit, as exact decimals where the definition is exact.
function kWhPerUnit(per: PriceUnit): Decimal {
  switch (per) {
    case 'kWh':
      return new Money(1);
    case 'MWh':
      return new Money(1000);
    case 'GJ':
      return new Money(1e9).div(JOULES_PER_KWH);
    case 'MMBtu':
      return new Money(String(JOULES_PER_BTU_IT)).times(1e6).div(JOULES_PER_KWH);
    case 'therm':
      return new Money(String(JOULES_PER_BTU_IT)).times(BTU_PER_THERM).div(JOULES_PER_KWH);
    default:
      throw new CalcInputError('price.per', 'price.per must be one of kWh, MWh, GJ, MMBtu, therm');
  }
}

function parsePrice(price: EnergyPrice): { perKWh: Decimal; decimals: number } {
  if (price === null || typeof price !== 'object') throw new CalcInputError('price', 'price must be an object');
  let amount: Decimal;
  try {
    amount = new Money(price.amount);
  } catch {
    throw new CalcInputError('price.amount', 'price.amount must be a decimal number');
  }
  if (!amount.isFinite() || amount.isNegative()) {
    throw new CalcInputError('price.amount', 'price.amount must be zero or a positive number');
  }
  const decimals = price.currencyDecimals ?? 2;
  if (!Number.isInteger(decimals) || decimals < 0 || decimals > 6) {
    throw new CalcInputError('price.currencyDecimals', 'price.currencyDecimals must be an integer from 0 to 6');
  }
  return { perKWh: amount.div(kWhPerUnit(price.per)), decimals };
}

/**
 * Cost of purchased energy: C = E · p / (kWh per price unit), rounded half-up to the currency's minor unit.
 *
 * @param purchasedEnergyKWh - purchased (fuel) energy [kWh], ≥ 0
 * @param price - price per unit of energy
 * @returns cost in the price's currency, rounded once at the end
 * @remarks Floating-point energies enter as their shortest decimal representation; the price is exact when
 *   given as a string. Rounding is half away from zero.
 * @example energyCost(10305.88, { amount: '0.045', per: 'kWh' }).text // "463.76"
 */
export function energyCost(purchasedEnergyKWh: number, price: EnergyPrice): MoneyAmount {
  requireNonNegativeFinite(purchasedEnergyKWh, 'purchasedEnergyKWh');
  const { perKWh, decimals } = parsePrice(price);
  const amount = new Money(purchasedEnergyKWh).times(perKWh).toDecimalPlaces(decimals, Money.ROUND_HALF_UP);
  return { amount, text: amount.toFixed(decimals) };
}

/** An emission factor with the basis it was published on (fuel, scope, net or gross calorific value). */
export type EmissionFactor = {
  /** kg CO₂ (or CO₂e, as the basis states) per kWh of purchased energy. */
  kgCo2PerKWh: number;
  /** What the factor covers and where it comes from, as stated by whoever supplied it. */
  basis: string;
};

/**
 * An example factor for natural gas, combustion only. The value is **from memory** of published national
 * factors (≈ 0.18 kg/kWh on gross CV, ≈ 0.20 on net CV); a site should state its own factor and basis.
 */
export const EXAMPLE_NATURAL_GAS_EMISSION_FACTOR: EmissionFactor = {
  kgCo2PerKWh: 0.202,
  basis: 'natural gas, combustion only, ~0.202 kg CO₂/kWh (net CV); example value from memory — use your published factor',
};

/** Annual CO₂ with the basis of its factor. */
export type AnnualCo2 = {
  /** CO₂ per year [kg]. */
  kg: number;
  /** CO₂ per year [t]. */
  tonnes: number;
  /** The basis of the factor used, carried through for the report. */
  basis: string;
};

/**
 * Annual CO₂ of purchased energy: m = E_fuel · f.
 *
 * @param purchasedEnergyKWh - purchased (fuel) energy per year [kWh], ≥ 0
 * @param factor - emission factor [kg CO₂/kWh] with its stated basis
 * @returns CO₂ per year [kg] and [t], with the basis
 * @example annualCo2(10305.88, EXAMPLE_NATURAL_GAS_EMISSION_FACTOR).kg // ≈ 2081.8
 */
export function annualCo2(purchasedEnergyKWh: number, factor: EmissionFactor): AnnualCo2 {
  requireNonNegativeFinite(purchasedEnergyKWh, 'purchasedEnergyKWh');
  if (factor === null || typeof factor !== 'object') throw new CalcInputError('emissionFactor', 'emissionFactor must be an object');
  requireNonNegativeFinite(factor.kgCo2PerKWh, 'emissionFactor.kgCo2PerKWh');
  if (typeof factor.basis !== 'string' || factor.basis.trim() === '') {
    throw new CalcInputError('emissionFactor.basis', 'emissionFactor.basis must state what the factor covers');
  }
  const kg = purchasedEnergyKWh * factor.kgCo2PerKWh;
  return { kg, tonnes: kg / 1000, basis: factor.basis };
}

/**
 * How a heat gain on cold service is paid for: a chiller (or refrigeration plant) removes it, driven by electricity.
 */
export type CoolingBasis = {
  /** Coefficient of performance: heat removed per unit of electricity [–], > 0 (electric chillers typically 2.5–6). */
  coefficientOfPerformance: number;
  /** Price of electricity. */
  electricityPrice: EnergyPrice;
  /** Emission factor of electricity [kg CO₂/kWh of electricity], with its stated basis. */
  electricityEmissionFactor: EmissionFactor;
};

/**
 * The energy basis of a site: hours, heat-source efficiency, price and emission factor, and optionally how a heat
 * gain is removed on cold service.
 */
export type EnergyBasis = {
  operatingHoursPerYear: number;
  heatSourceEfficiency: number;
  price: EnergyPrice;
  emissionFactor: EmissionFactor;
  /** Cold service: a heat gain is costed with the chiller's COP and electricity's price and CO₂ factor. */
  cooling?: CoolingBasis;
};

/** Annual consequences of one heat flow. */
export type AnnualEnergyAssessment = {
  /**
   * `cooling` when a heat gain was costed as electricity for a chiller (negative heat flow and a cooling basis);
   * `heating` when the heat flow was costed as energy for the heat source.
   */
  service: 'heating' | 'cooling';
  heat: AnnualEnergy;
  /** Purchased energy [kWh]: fuel for the heat source, or electricity for the chiller. */
  purchasedKWh: number;
  cost: MoneyAmount;
  co2: AnnualCo2;
};

/**
 * Electricity a chiller uses to remove a heat: E_el = E_heat / COP.
 *
 * @param heatEnergyKWh - heat removed [kWh], ≥ 0
 * @param coefficientOfPerformance - COP of the chiller [–], > 0
 * @returns electricity [kWh]
 * @remarks The COP is the plant's seasonal figure; a nameplate COP at design conditions overstates it.
 * @example chillerElectricityKWh(8760, 4) // 2190
 */
export function chillerElectricityKWh(heatEnergyKWh: number, coefficientOfPerformance: number): number {
  requireNonNegativeFinite(heatEnergyKWh, 'heatEnergyKWh');
  requirePositiveFinite(coefficientOfPerformance, 'cooling.coefficientOfPerformance');
  return heatEnergyKWh / coefficientOfPerformance;
}

/**
 * Annual heat, purchased energy, cost and CO₂ of a steady heat flow on an energy basis.
 *
 * A loss (Q ≥ 0) is made up by the heat source: E_fuel = |Q|·h / η, costed at the energy price with its emission
 * factor. A gain (Q < 0) with `basis.cooling` is removed by a chiller: E_el = |Q|·h / COP, costed at the electricity
 * price with electricity's emission factor. A gain without `basis.cooling` is charged to the heat source as a loss
 * of the same size (the older behaviour, kept for callers that give no cooling basis).
 *
 * @param heatFlowW - heat flow [W], positive = loss, negative = gain
 * @param basis - hours, efficiency, price, emission factor, and optionally the cooling basis
 * @returns the service costed, heat [kWh, GJ], purchased energy [kWh], cost (rounded), CO₂ [kg, t]
 * @example annualEnergyAssessment(1000, { operatingHoursPerYear: 8760, heatSourceEfficiency: 1, price: { amount: '0.1', per: 'kWh' }, emissionFactor: EXAMPLE_NATURAL_GAS_EMISSION_FACTOR }).cost.text // "876.00"
 * @example annualEnergyAssessment(-1000, { …, cooling: { coefficientOfPerformance: 4, electricityPrice: { amount: '0.2', per: 'kWh' }, electricityEmissionFactor: { kgCo2PerKWh: 0.3, basis: '…' } } })
 *   // → service 'cooling', purchasedKWh 2190, cost "438.00", CO₂ 657 kg
 */
export function annualEnergyAssessment(heatFlowW: number, basis: EnergyBasis): AnnualEnergyAssessment {
  const heat = annualHeatEnergy(heatFlowW, basis.operatingHoursPerYear);
  if (heatFlowW < 0 && basis.cooling !== undefined) {
    const cooling = basis.cooling;
    if (cooling === null || typeof cooling !== 'object') throw new CalcInputError('cooling', 'cooling must be an object');
    const purchasedKWh = chillerElectricityKWh(heat.kWh, cooling.coefficientOfPerformance);
    return {
      service: 'cooling',
      heat,
      purchasedKWh,
      cost: energyCost(purchasedKWh, cooling.electricityPrice),
      co2: annualCo2(purchasedKWh, cooling.electricityEmissionFactor),
    };
  }
  const purchasedKWh = fuelEnergyKWh(heat.kWh, basis.heatSourceEfficiency);
  return {
    service: 'heating',
    heat,
    purchasedKWh,
    cost: energyCost(purchasedKWh, basis.price),
    co2: annualCo2(purchasedKWh, basis.emissionFactor),
  };
}

/** Annual saving of an insulated build-up against the bare surface. */
export type SavingVersusBare = {
  /** Heat-flow reduction |Q_bare| − |Q_insulated| [W]. */
  heatFlowReductionW: number;
  /** Reduction as a fraction of the bare heat flow [–] (null when the bare flow is zero). */
  fraction: number | null;
  bare: AnnualEnergyAssessment;
  insulated: AnnualEnergyAssessment;
  /** Heat saved per year [kWh, GJ] (negative when insulating increases the flow, below the critical radius). */
  heatSaved: AnnualEnergy;
  /** Purchased energy saved per year [kWh]. */
  purchasedKWhSaved: number;
  /** Cost saved per year: the difference of the two rounded costs, so the columns of a report add up. */
  costSaved: MoneyAmount;
  /** CO₂ saved per year [kg]. */
  co2KgSaved: number;
};

function moneyDecimals(a: AnnualEnergyAssessment, basis: EnergyBasis): number {
  const price = a.service === 'cooling' && basis.cooling ? basis.cooling.electricityPrice : basis.price;
  return price.currencyDecimals ?? 2;
}

/**
 * Saving of insulation against the bare surface: ΔE = (|Q_bare| − |Q_ins|) · hours, and the same for fuel,
 * cost and CO₂.
 *
 * @param bareHeatFlowW - heat flow of the bare surface [W]
 * @param insulatedHeatFlowW - heat flow of the insulated surface [W]
 * @param basis - energy basis
 * @returns both assessments and the differences
 * @remarks A thin layer on a small pipe can increase the heat flow (critical radius); the saving is then
 *   negative, not clipped to zero.
 * @example savingVersusBare(500, 50, basis).fraction // 0.9
 */
export function savingVersusBare(bareHeatFlowW: number, insulatedHeatFlowW: number, basis: EnergyBasis): SavingVersusBare {
  const bare = annualEnergyAssessment(bareHeatFlowW, basis);
  const insulated = annualEnergyAssessment(insulatedHeatFlowW, basis);
  const reduction = Math.abs(bareHeatFlowW) - Math.abs(insulatedHeatFlowW);
  const decimals = Math.max(moneyDecimals(bare, basis), moneyDecimals(insulated, basis));
  const costSaved = bare.cost.amount.minus(insulated.cost.amount);
  return {
    heatFlowReductionW: reduction,
    fraction: bareHeatFlowW === 0 ? null : reduction / Math.abs(bareHeatFlowW),
    bare,
    insulated,
    heatSaved: { kWh: bare.heat.kWh - insulated.heat.kWh, GJ: bare.heat.GJ - insulated.heat.GJ },
    purchasedKWhSaved: bare.purchasedKWh - insulated.purchasedKWh,
    costSaved: { amount: costSaved, text: costSaved.toFixed(decimals) },
    co2KgSaved: bare.co2.kg - insulated.co2.kg,
  };
}

// ---------------------------------------------------------------------------------------------------------
// Valves, flanges and fittings

/** Counts of the components on a line that are not straight pipe. */
export type LineComponentCounts = {
  valves?: number;
  /** Flange pairs (a flanged joint). */
  flangePairs?: number;
  /** Elbows, tees, reducers: already within the line's centreline length. */
  fittings?: number;
};

/** Equivalent lengths of straight pipe of the same size charged for each component [m]. */
export type EquivalentLengths = {
  valveM: number;
  flangePairM: number;
  fittingM: number;
  source: string;
};

/**
 * Default equivalent lengths, **common practice, from memory**: a valve counts as 1.0 m and a flange pair as
 * 0.5 m of straight pipe of the same NPS — of *bare* pipe when the component is bare, of *insulated* pipe when it
 * has an insulating cover. Elbows, tees and reducers add nothing beyond the centreline length they already
 * occupy in the run. Rules of thumb of this size are widespread in energy-audit guidance; a site can set its own.
 */
export const DEFAULT_EQUIVALENT_LENGTHS: EquivalentLengths = {
  valveM: 1.0,
  flangePairM: 0.5,
  fittingM: 0,
  source:
    'equivalent-length method, common practice (from memory): valve = 1.0 m, flange pair = 0.5 m of straight pipe of ' +
    'the same size, bare or insulated as the component is; fittings within the centreline length',
};

function count(value: number | undefined, field: string): number {
  if (value === undefined) return 0;
  if (!Number.isInteger(value) || value < 0) throw new CalcInputError(field, `${field} must be a whole number ≥ 0`);
  return value;
}

/**
 * Total equivalent length of a line's components: L_eq = n_v · L_v + n_f · L_f + n_fit · L_fit.
 *
 * @param counts - numbers of valves, flange pairs and fittings
 * @param lengths - equivalent length per component [m] (default {@link DEFAULT_EQUIVALENT_LENGTHS})
 * @returns equivalent length [m]
 * @example componentsEquivalentLengthM({ valves: 2, flangePairs: 4 }) // 4
 */
export function componentsEquivalentLengthM(counts: LineComponentCounts, lengths: EquivalentLengths = DEFAULT_EQUIVALENT_LENGTHS): number {
  const valves = count(counts.valves, 'valves');
  const flangePairs = count(counts.flangePairs, 'flangePairs');
  const fittings = count(counts.fittings, 'fittings');
  return valves * lengths.valveM + flangePairs * lengths.flangePairM + fittings * lengths.fittingM;
}

/** Heat flow of a whole line with its valves and flanges. */
export type LineHeatFlow = {
  /** Straight run [W]. */
  runW: number;
  /** Valves, flanges and fittings by equivalent length [W]. */
  componentsW: number;
  /** Total [W]. */
  totalW: number;
  /** Equivalent length charged [m]. */
  equivalentLengthM: number;
  method: string;
};

/**
 * Heat flow of a line: Q = q′_ins · L + q′_c · L_eq, where q′_c is the bare or the insulated heat flow per metre
 * depending on whether the valves and flanges are insulated.
 *
 * @param input.heatLossWPerM - insulated heat flow per metre [W/m]
 * @param input.bareHeatLossWPerM - bare heat flow per metre of the same pipe [W/m] (needed when components are bare)
 * @param input.lengthM - straight length [m], ≥ 0
 * @param input.counts - valves, flange pairs, fittings
 * @param input.componentsInsulated - true when valves and flanges have insulating covers
 * @param input.lengths - equivalent lengths (default {@link DEFAULT_EQUIVALENT_LENGTHS})
 * @returns run, component and total heat flow [W]
 * @example lineHeatFlowW({ heatLossWPerM: 50, bareHeatLossWPerM: 500, lengthM: 100, counts: { valves: 2 }, componentsInsulated: false }).totalW // 6000
 */
export function lineHeatFlowW(input: {
  heatLossWPerM: number;
  bareHeatLossWPerM?: number;
  lengthM: number;
  counts: LineComponentCounts;
  componentsInsulated: boolean;
  lengths?: EquivalentLengths;
}): LineHeatFlow {
  requireFinite(input.heatLossWPerM, 'heatLossWPerM');
  requireNonNegativeFinite(input.lengthM, 'lengthM');
  const lengths = input.lengths ?? DEFAULT_EQUIVALENT_LENGTHS;
  const equivalentLengthM = componentsEquivalentLengthM(input.counts, lengths);
  let perMetre = input.heatLossWPerM;
  if (!input.componentsInsulated && equivalentLengthM > 0) {
    if (input.bareHeatLossWPerM === undefined) {
      throw new CalcInputError('bareHeatLossWPerM', 'bareHeatLossWPerM is needed when valves or flanges are bare');
    }
    requireFinite(input.bareHeatLossWPerM, 'bareHeatLossWPerM');
    perMetre = input.bareHeatLossWPerM;
  }
  const runW = input.heatLossWPerM * input.lengthM;
  const componentsW = perMetre * equivalentLengthM;
  return { runW, componentsW, totalW: runW + componentsW, equivalentLengthM, method: lengths.source };
}
