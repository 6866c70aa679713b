/**
 * Public types of the calculation contract (all SI, temperatures in °C at this edge).
 * Heat flow is positive from the process to the surroundings (loss), negative for a gain.
 */

export type PipeGeometry = {
  type: 'pipe';
  /** Bare pipe outside diameter [m]. */
  outerDiameterM: number;
  orientation: 'horizontal' | 'vertical';
  /** Continuous vertical run [m]; required when vertical. */
  heightM?: number;
};

export type FlatGeometry = {
  type: 'flat';
  orientation: 'vertical' | 'faceUp' | 'faceDown';
  /** Height of a vertical wall [m]. */
  heightM?: number;
  /** Area / perimeter of a horizontal face [m]. */
  characteristicLengthM?: number;
  /** Length of the surface along the wind [m]; defaults to heightM or characteristicLengthM. */
  lengthAlongWindM?: number;
};

export type VesselGeometry = {
  type: 'vessel';
  /** Shell outside diameter [m]. */
  diameterM: number;
  /** Shell length, tangent to tangent [m]. */
  lengthM: number;
  orientation: 'horizontal' | 'vertical';
  headType: 'flat' | 'ellipsoidal2to1' | 'hemispherical';
};

export type Geometry = PipeGeometry | FlatGeometry | VesselGeometry;

export type Layer = {
  /** Layer thickness [m]. */
  thicknessM: number;
  /** Polynomial coefficients of k(T) [W/(m·K)], T in °C: k = c0 + c1·T + c2·T² + … */
  conductivity: number[];
  /** Maximum service temperature [°C]; a warning when exceeded. */
  maxServiceTemperatureC?: number;
  /** Minimum service temperature [°C]; a warning when the layer gets colder. */
  minServiceTemperatureC?: number;
  /**
   * Mean temperatures [°C] between which k(T) rests on measured or tabulated data, `[lowest, highest]`;
   * a warning when the layer's mean temperature lies outside (the curve is then an extrapolation).
   */
  conductivityDataRangeC?: [number, number];
};

export type Ambient = {
  airTemperatureC: number;
  /** Temperature of the radiating surroundings [°C]; defaults to the air temperature. */
  radiantTemperatureC?: number;
  /** Wind speed [m/s]; 0 = still air. */
  windSpeedMS?: number;
  /** Relative humidity [%], 0–100. */
  relativeHumidityPct?: number;
};

export type Criterion =
  | { criterion: 'surfaceTemperature'; maxC: number }
  | { criterion: 'heatLoss'; maxWPerM?: number; maxWPerM2?: number; maxW?: number }
  | { criterion: 'condensation'; marginK: number }
  | { criterion: 'temperatureChange'; maxChangeK: number }
  | { criterion: 'freezeTime'; minHours: number };

export type SolveFor = Criterion & {
  /** Largest thickness considered for the solved layer [m]; default 0.5. */
  maxThicknessM?: number;
};

export type Rounding = {
  /** Standard thicknesses [m], ascending. */
  seriesM: number[];
  /** Above this a solved layer is split into two layers of series thicknesses [m]. */
  maxSingleLayerM?: number;
};

export type Run = { lengthM: number; massFlowKgPerS: number; specificHeatJPerKgK: number };

export type Stagnant = {
  innerDiameterM: number;
  pipeMassKgPerM: number;
  pipeSpecificHeatJPerKgK?: number;
};

export type ContactMaterial = 'uncoatedMetal' | 'coatedMetal' | 'ceramicGlassStone' | 'plastic' | 'wood';

export type Contact = { material: ContactMaterial; seconds: number };

export type CalcCase = {
  geometry: Geometry;
  processTemperatureC: number;
  layers: Layer[];
  surfaceEmissivity: number;
  ambient: Ambient;
  solveFor?: SolveFor;
  round?: Rounding;
  insideFilmWPerM2K?: number;
  pipeWall?: { innerDiameterM: number; conductivityWPerMK: number };
  run?: Run;
  stagnant?: Stagnant;
  contact?: Contact;
};

export type Warning = { code: string; message: string };

export type VesselPart = {
  name: 'shell' | 'head1' | 'head2';
  areaM2: number;
  heatLossW: number;
  surfaceTemperatureC: number;
};

export type BurnResult = {
  thresholdC: number;
  verdict: 'belowThreshold' | 'aboveThreshold';
  source: string;
};

export type CalcResult = {
  /** Pipes: heat flow per metre of run [W/m]. */
  heatLossWPerM?: number;
  /** Flat surfaces: heat flux per m² of surface [W/m²]. */
  heatFluxWPerM2?: number;
  /** Vessels: total heat flow [W]. */
  heatLossW?: number;
  surfaceTemperatureC: number;
  interfaceTemperaturesC: number[];
  convectionCoefficientWPerM2K: number;
  radiationCoefficientWPerM2K: number;
  thicknessM?: number;
  roundedLayersM?: number[];
  totalThicknessM: number;
  dewPointC?: number;
  outletTemperatureC?: number;
  runHeatLossW?: number;
  hoursToZeroC?: number | null;
  burn?: BurnResult;
  parts?: VesselPart[];
  /** Correlations and methods used, for the method panel. */
  method?: string[];
  warnings: Warning[];
};

export type CalcErrorItem = { error: { code: string; field: string; message: string } };

export type CalcOutcome = CalcResult | CalcErrorItem;
