/**
 * Types of whole-item sizing: a line or vessel of a site, its purposes and build-up, the site's design bases
 * and thickness series, and the outcome stored for the line list. All SI, temperatures in °C.
 */

import type { ContactMaterial, Warning } from '../types';

/** Insulation purposes an item can carry (trade terms). */
export const PURPOSES = [
  'personnelProtection',
  'heatConservation',
  'condensationControl',
  'temperatureHolding',
  'frostProtection',
] as const;
export type Purpose = (typeof PURPOSES)[number];

/** Purposes that need a flowing or standing-water pipe: not available on vessels. */
export const PIPE_ONLY_PURPOSES: readonly Purpose[] = ['temperatureHolding', 'frostProtection'];

/** Parameters a purpose needs beyond the site's design bases. */
export type PurposeParameters = {
  /** Limit on |heat flow|; without one the site's rule (a fraction of the bare item's heat flow) applies. */
  heatConservation?: { maxHeatLossWPerM?: number; maxHeatLossW?: number };
  /** The drop along the line's length at this flow must stay within `maxChangeK`. */
  temperatureHolding?: { massFlowKgPerS: number; specificHeatJPerKgK: number; maxChangeK: number };
  /**
   * Water standing in the pipe must stay above 0 °C for `minHours`. The bore and the steel's mass default to
   * the NPS's standard wall (ASME B36.10M) when the line is given by NPS or DN.
   */
  frostProtection?: { minHours: number; innerDiameterM?: number; pipeMassKgPerM?: number; startTemperatureC?: number };
};

/** One insulation layer of a build-up: a library material and, except for the sized layer, its thickness. */
export type BuildUpLayer = { materialId: string; thicknessM?: number };

/**
 * Insulation layers inside out and the outer finish. The outermost layer is the one sized (its thickness is
 * ignored); with `fixed` the whole build-up is taken as given (existing insulation, or `layers: []` for a bare
 * item) and only checked against the purposes.
 */
export type BuildUp = { layers: BuildUpLayer[]; finishId: string; fixed?: boolean };

export type Fittings = {
  valves: number;
  /** Flanged joints (flange pairs). */
  flanges: number;
  elbows: number;
  tees: number;
};

/** The physical item as sizing sees it (no tag, service or notes: those never change a number). */
export type SizingItem = {
  kind: 'line' | 'vessel';
  /** Line: bare pipe outside diameter; vessel: shell outside diameter [m]. */
  outerDiameterM: number;
  /** NPS as written (lines given by NPS or DN), for the standard wall of frost cases. */
  nps?: string | null;
  /** Line: run length; vessel: shell length tangent to tangent (height when vertical) [m]. */
  lengthM: number;
  orientation: 'horizontal' | 'vertical';
  /** Continuous vertical run of a vertical line [m] (defaults to its length). */
  heightM?: number | null;
  headType?: 'flat' | 'ellipsoidal2to1' | 'hemispherical' | null;
  location: 'indoor' | 'outdoor';
  operatingTemperatureC: number;
  purposes: Purpose[];
  purposeParameters: PurposeParameters;
  fittings: Fittings;
  /** Valves and flanges carry insulating covers (else they count as bare pipe). */
  fittingsInsulated: boolean;
};

/** Design bases of a site (the shapes of shared/schemas/sites, restated so this package stands alone). */
export type SizingBases = {
  touch?: {
    airTemperatureC: number;
    radiantTemperatureC?: number;
    windSpeedMS?: number;
    surfaceEmissivity?: number;
    contactSeconds?: number;
    maxSurfaceC?: number;
  };
  energy?: {
    airTemperatureC: number;
    windSpeedMS?: number;
    operatingHoursPerYear?: number;
  };
  condensation?: { airTemperatureC: number; relativeHumidityPct: number; marginK?: number };
  winter?: { airTemperatureC: number; windSpeedMS?: number };
};

/** A site's thickness series, multi-layer rule and defaults. */
export type SizingSettings = {
  /** Standard thicknesses [m], ascending. */
  seriesM: number[];
  /** Above this the sized layer is applied as two series layers [m]. */
  maxSingleLayerM: number;
  /** Largest sized-layer thickness considered [m]. */
  maxThicknessM: number;
  /** Heat conservation without an item limit: |q| at most this fraction of the bare item's. */
  heatConservationMaxFractionOfBare: number;
  /** Build-ups of items that have none of their own: hot and cold service. */
  defaultBuildUps: { hot: BuildUp; cold: BuildUp };
};

/** A material as sizing uses it. */
export type SizingMaterial = {
  id: string;
  name: string;
  conductivity: number[];
  maxServiceTemperatureC?: number;
  minServiceTemperatureC?: number;
  conductivityDataRangeC?: [number, number];
};

/** A finish as sizing uses it. */
export type SizingFinish = {
  id: string;
  name: string;
  emissivity: number;
  emissivityRange: [number, number];
  /** Surface group of ISO 13732-1 for the burn check. */
  contactMaterial: ContactMaterial;
};

/** Materials and finishes sizing may use: the built-in library plus a team's own. */
export type SizingLibraryData = { materials: SizingMaterial[]; finishes: SizingFinish[] };

/** Which design basis a purpose is sized against. */
export type BasisName = 'touch' | 'energy' | 'condensation' | 'winter';

export type PurposeStatus =
  /** Sized: the thickness meets the purpose. */
  | 'sized'
  /** A fixed build-up that meets the purpose. */
  | 'met'
  /** A fixed build-up that does not meet the purpose. */
  | 'notMet'
  /** Nothing up to the largest thickness meets it. */
  | 'impossible'
  /** The purpose does not apply to this service (e.g. personnel protection on cold service). */
  | 'notApplicable'
  /** Missing data (a design basis, a parameter) or an invalid input. */
  | 'error';

export type PurposeOutcome = {
  purpose: Purpose;
  basis: BasisName;
  status: PurposeStatus;
  /** What the purpose asks, in words (°C, W/m, K, h). */
  target: string;
  /** Continuous thickness of the sized layer [m]. */
  thicknessM?: number;
  /** Sized layer after rounding, one or two series layers [m]. */
  roundedLayersM?: number[];
  /** Whole build-up this purpose needs [m]. */
  totalThicknessM?: number;
  message?: string;
  error?: { code: string; field: string; message: string };
};

/** The governing build-up evaluated at one design basis. */
export type BasisEvaluation = {
  basis: BasisName;
  /** Pipes: W/m; vessels: W. */
  heatFlow: number;
  surfaceTemperatureC: number;
  interfaceTemperaturesC: number[];
  dewPointC?: number;
  warnings: Warning[];
};

export type BurnVerdict = 'pass' | 'fail' | 'notApplicable';

/** The stored outcome of sizing one item. */
export type ItemSizing = {
  service: 'hot' | 'cold';
  buildUpSource: 'item' | 'siteDefault';
  purposes: PurposeOutcome[];
  governingPurpose: Purpose | null;
  /** Governing build-up, inside out. */
  layers: { materialId: string; thicknessM: number }[];
  layersM: number[];
  totalThicknessM: number;
  finishId: string;
  /** Lines: per metre at the energy basis [W/m]. */
  heatLossWPerM?: number;
  bareHeatLossWPerM?: number;
  /** Whole item at the energy basis, valves and flanges included for lines [W]. */
  heatLossW?: number;
  bareHeatLossW?: number;
  /** Hot service: at the touch basis; cold service: at the condensation basis (else the energy basis). */
  surfaceTemperatureC: number | null;
  surfaceBasis: BasisName | null;
  burnVerdict: BurnVerdict;
  burn?: { limitC: number; source: string };
  /** Heat lost or gained per year at the energy basis [kWh] (heat, not fuel). */
  annualEnergyKWh: number | null;
  bareAnnualEnergyKWh: number | null;
  failing: Purpose[];
  evaluations: BasisEvaluation[];
  warnings: Warning[];
};

/** Everything one item's sizing depends on. */
export type SizingTask = {
  item: SizingItem;
  /** The item's own build-up, or null for the site default. */
  buildUp: BuildUp | null;
};

export type SizingContext = { bases: SizingBases; settings: SizingSettings; library: SizingLibraryData };
