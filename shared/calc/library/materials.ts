/**
 * Built-in insulation materials: generic material types with conductivity k(T) fitted to the maximum apparent
 * thermal conductivity tables of their ASTM material specifications.
 *
 * @remarks
 * Each material stores the specification's table points (k at mean temperature, converted to SI) beside the
 * polynomial fitted to them, so any screen can show the published numbers and how closely the curve follows
 * them. As is usual practice, the mean-temperature values are used as point values of k(T), and the
 * layer calculation integrates k over each layer's span (ASTM C680).
 *
 * **Provenance.** Each material's `source` says where its numbers come from and `confidence` how well they are
 * known; each table point says whether it was checked (`confirmed`). Points were checked against secondary
 * publications that reproduce the ASTM tables (a trade-association chart of ASTM specification values, a
 * supplier's technical page quoting the specification); the ASTM documents themselves were not at hand. Points
 * not confirmed are **as recalled from memory** of the specifications, whose editions change the numbers from
 * time to time. Check them against the current edition before relying on them for a guaranteed performance.
 * Specification values are maxima: real product of that type is usually somewhat better, so designs based on
 * them are conservative for heat loss and surface temperature. Beyond the coldest and hottest table point the
 * fitted curve is an extrapolation.
 *
 * References:
 * 1. ASTM C547, *Mineral Fiber Pipe Insulation*. 2. ASTM C533, *Calcium Silicate Block and Pipe Thermal
 *    Insulation*. 3. ASTM C552, *Cellular Glass Thermal Insulation*. 4. ASTM C591, *Unfaced Preformed Rigid
 *    Cellular Polyisocyanurate Thermal Insulation*. 5. ASTM C534/C534M, *Preformed Flexible Elastomeric Cellular
 *    Thermal Insulation in Sheet and Tubular Form*. 6. ASTM C612, *Mineral Fiber Block and Board Thermal
 *    Insulation*. 7. ASTM C610, *Molded Expanded Perlite Block and Pipe Thermal Insulation*. 8. ASTM C1728,
 *    *Flexible Aerogel Insulation*. 9. ASTM C680, *Estimate of the Heat Gain or Loss and the Surface Temperatures
 *    of Insulated Flat, Cylindrical, and Spherical Systems by Use of Computer Programs* (k(T) as a polynomial).
 * 10. National Insulation Association (NIA), *Insulation Materials Specification Chart*, April 2024 revision:
 *    a one-page table of the maximum apparent thermal conductivities stated in the ASTM material specifications
 *    (used here to confirm the C534 and C552 tables and to bound the C591 values).
 */

import { CalcInputError } from '../errors';
import type { Layer } from '../types';
import {
  btuInchPerHourSquareFootFahrenheitToWattsPerMetreKelvin,
  fahrenheitToCelsius,
} from '../units';

/** One tabulated conductivity point. */
export type ConductivityPoint = {
  /** Mean temperature [°C]. */
  meanTemperatureC: number;
  /** Maximum apparent thermal conductivity at that mean temperature [W/(m·K)]. */
  conductivityWPerMK: number;
  /** True where the value was checked against the published source named in the material's `source`. */
  confirmed?: boolean;
};

/** How well the stored table values are known. */
export type TableConfidence =
  /** Every table point checked against the published source named in `source`. */
  | 'confirmed'
  /** Some table points checked (those with `confirmed: true`); the others recalled from memory. */
  | 'partlyConfirmed'
  /** Recalled from the specification with reasonable confidence; still to be checked against the edition. */
  | 'recalled'
  /** Recalled only approximately; treat as indicative until checked. */
  | 'approximate';

/** A built-in insulation material type. */
export type InsulationMaterial = {
  /** Stable identifier, kebab-case. */
  id: string;
  /** Generic name (never a brand). */
  name: string;
  /** Specification and the part of it the values come from. */
  specification: string;
  /** Polynomial coefficients of k(T) [W/(m·K)], T in °C, ascending powers. */
  conductivity: number[];
  /** Table points the polynomial was fitted to, SI. */
  tablePoints: ConductivityPoint[];
  /** Provenance of the table points. */
  source: string;
  confidence: TableConfidence;
  /** Maximum service temperature [°C]. */
  maxServiceTemperatureC: number;
  /** Minimum service temperature [°C]. */
  minServiceTemperatureC: number;
  /** Nominal density [kg/m³], indicative only. */
  densityKgPerM3?: number;
};

/**
 * Least-squares polynomial fit of k(T) minimising the *relative* error: min Σ ((p(T_i) − k_i) / k_i)².
 *
 * @param points - table points (at least degree + 1)
 * @param degree - polynomial degree, 1 to 3 (default 2)
 * @returns coefficients [c0, c1, (c2, c3)] for k in W/(m·K), T in °C
 * @remarks Relative weighting makes the low-temperature points, where k is smallest, fit as well as the hot
 *   ones. Solved by the normal equations with Gaussian elimination and partial pivoting on temperatures
 *   scaled by 100 °C to keep them well conditioned.
 * @example fitConductivityPolynomial([{ meanTemperatureC: 0, conductivityWPerMK: 0.035 }, { meanTemperatureC: 100, conductivityWPerMK: 0.05 }], 1) // ≈ [0.035, 0.00015]
 */
export function fitConductivityPolynomial(points: readonly ConductivityPoint[], degree: 1 | 2 | 3 = 2): number[] {
  const n = degree + 1;
  if (points.length < n) throw new CalcInputError('tablePoints', `a degree-${degree} fit needs at least ${n} points`);
  const scale = 100;
  const a: number[][] = Array.from({ length: n }, () => new Array<number>(n + 1).fill(0));
  for (const p of points) {
    const x = p.meanTemperatureC / scale;
    const w = 1 / (p.conductivityWPerMK * p.conductivityWPerMK);
    const powers = Array.from({ length: n }, (_, i) => x ** i);
    for (let r = 0; r < n; r += 1) {
      for (let c = 0; c < n; c += 1) a[r][c] += w * powers[r] * powers[c];
      a[r][n] += w * powers[r] * p.conductivityWPerMK;
    }
  }
  for (let col = 0; col < n; col += 1) {
    let pivot = col;
    for (let r = col + 1; r < n; r += 1) if (Math.abs(a[r][col]) > Math.abs(a[pivot][col])) pivot = r;
    [a[col], a[pivot]] = [a[pivot], a[col]];
    if (Math.abs(a[col][col]) < 1e-300) throw new CalcInputError('tablePoints', 'table points do not determine a fit');
    for (let r = 0; r < n; r += 1) {
      if (r === col) continue;
      const f = a[r][col] / a[col][col];
      for (let c = col; c <= n; c += 1) a[r][c] -= f * a[col][c];
    }
  }
  return Array.from({ length: n }, (_, i) => a[i][n] / a[i][i] / scale ** i);
}

// Table rows in the specifications' own units: [mean temperature °F, k Btu·in/(h·ft²·°F)], with a third
// element CONFIRMED where the value was checked against the published source named in the material's `source`.
const CONFIRMED = 'confirmed';
type UsRow = readonly [number, number] | readonly [number, number, typeof CONFIRMED];

function fromUsTable(rows: readonly UsRow[]): ConductivityPoint[] {
  return rows.map(([f, k, mark]) => ({
    meanTemperatureC: fahrenheitToCelsius(f),
    conductivityWPerMK: btuInchPerHourSquareFootFahrenheitToWattsPerMetreKelvin(k),
    ...(mark === CONFIRMED ? { confirmed: true } : {}),
  }));
}

type MaterialDefinition = Omit<InsulationMaterial, 'conductivity' | 'tablePoints'> & {
  usTable: readonly UsRow[];
  fitDegree: 1 | 2 | 3;
};

const RECALLED = 'values as recalled from memory; check against the current edition';
const NOT_FOUND = 'no published reproduction of this table was found when the sources were audited';
const NIA_2024 =
  'confirmed against the National Insulation Association Insulation Materials Specification Chart (April 2024), ' +
  'which tabulates the ASTM maxima';

const DEFINITIONS: readonly MaterialDefinition[] = [
  {
    id: 'mineral-fibre-pipe-c547-type-i',
    name: 'Mineral-fibre pipe insulation, up to 454 °C',
    specification: 'ASTM C547, Type I',
    source: `ASTM C547 (e.g. C547-17), Table 1, maximum apparent thermal conductivity, Type I; ${RECALLED}; ${NOT_FOUND}`,
    confidence: 'recalled',
    maxServiceTemperatureC: 454,
    minServiceTemperatureC: -18,
    densityKgPerM3: 100,
    usTable: [
      [100, 0.25],
      [200, 0.29],
      [300, 0.34],
      [400, 0.4],
    ],
    fitDegree: 2,
  },
  {
    id: 'mineral-fibre-pipe-c547-type-ii',
    name: 'Mineral-fibre pipe insulation, up to 650 °C',
    specification: 'ASTM C547, Type II',
    source: `ASTM C547 (e.g. C547-17), Table 1, maximum apparent thermal conductivity, Type II; ${RECALLED}; ${NOT_FOUND}`,
    confidence: 'recalled',
    maxServiceTemperatureC: 650,
    minServiceTemperatureC: -18,
    densityKgPerM3: 130,
    usTable: [
      [100, 0.25],
      [200, 0.29],
      [300, 0.34],
      [400, 0.4],
      [500, 0.47],
      [600, 0.55],
      [700, 0.64],
    ],
    fitDegree: 2,
  },
  {
    id: 'calcium-silicate-c533-type-i',
    name: 'Calcium silicate pipe and block insulation, up to 650 °C',
    specification: 'ASTM C533, Type I',
    source:
      'ASTM C533, Table 1, maximum apparent thermal conductivity, Type I: the 100 °F (37.8 °C) value of 0.41 ' +
      'Btu·in/(h·ft²·°F) confirmed against a supplier technical page quoting the C533 Type I limit (which also ' +
      `gives 0.50 at 100 °F for Types IA and II); the points from 200 °F to 700 °F ${RECALLED}`,
    confidence: 'partlyConfirmed',
    maxServiceTemperatureC: 650,
    minServiceTemperatureC: 0,
    densityKgPerM3: 240,
    usTable: [
      [100, 0.41, CONFIRMED],
      [200, 0.44],
      [300, 0.47],
      [400, 0.51],
      [500, 0.55],
      [600, 0.59],
      [700, 0.64],
    ],
    fitDegree: 2,
  },
  {
    id: 'cellular-glass-c552-grade-6',
    name: 'Cellular glass insulation',
    specification: 'ASTM C552, Grade 6, Type II (pipe and tubing)',
    source:
      'ASTM C552 (edition current in 2024, e.g. C552-22), Table 1, maximum apparent thermal conductivity, ' +
      `Grade 6, Type II (pipe and tubing), at -100, 0, 75, 200 and 400 °F; ${NIA_2024}. The Type II (pipe) column ` +
      'is used because it is the higher, conservative one (Type I block: 0.21, 0.27, 0.31, 0.40, 0.58). The ' +
      'table ends at 400 °F (204 °C) and the curve is extrapolated above it and below -100 °F (-73 °C)',
    confidence: 'confirmed',
    maxServiceTemperatureC: 430,
    minServiceTemperatureC: -268,
    densityKgPerM3: 120,
    usTable: [
      [-100, 0.23, CONFIRMED],
      [0, 0.29, CONFIRMED],
      [75, 0.34, CONFIRMED],
      [200, 0.43, CONFIRMED],
      [400, 0.63, CONFIRMED],
    ],
    fitDegree: 2,
  },
  {
    id: 'polyisocyanurate-c591-type-iv',
    name: 'Rigid polyisocyanurate foam pipe insulation',
    specification: 'ASTM C591, Type IV (aged values)',
    source:
      `ASTM C591 (e.g. C591-20), Table 1, maximum apparent thermal conductivity (aged), Type IV; ${RECALLED}. ` +
      'Not confirmed type by type: the NIA chart (April 2024) gives only ranges over the C591 types (Grade 2) of ' +
      '0.17–0.19 at -100 °F, 0.19–0.22 at 0 °F and 75 °F and 0.26–0.30 at 200 °F; the stored -100, 0 and 75 °F ' +
      'values lie in those ranges, and the 200 °F value was raised from a recalled 0.25 to 0.26, the low end of its ' +
      "range. Fitted with a cubic, as the foam's curve flattens where its cell gas condenses",
    confidence: 'approximate',
    maxServiceTemperatureC: 149,
    minServiceTemperatureC: -183,
    densityKgPerM3: 32,
    usTable: [
      [-150, 0.16],
      [-100, 0.17],
      [-50, 0.18],
      [0, 0.19],
      [75, 0.2],
      [100, 0.21],
      [200, 0.26],
    ],
    fitDegree: 3,
  },
  {
    id: 'flexible-elastomeric-c534-grade-1-type-i',
    name: 'Flexible elastomeric cellular tube insulation',
    specification: 'ASTM C534/C534M, Grade 1, Type I (tubular)',
    source:
      'ASTM C534/C534M, table of maximum apparent thermal conductivity, Grade 1, at -100, 0 and 75 °F ' +
      `(no value required at 200 °F); ${NIA_2024}. A quadratic passes through the three points; outside ` +
      '-73 °C to 24 °C it is an extrapolation that falls steeply towards -183 °C (about 0.005 W/(m·K)) and ' +
      'flattens above 58 °C, so cryogenic and hot results for this material need a check against product data',
    confidence: 'confirmed',
    maxServiceTemperatureC: 105,
    minServiceTemperatureC: -183,
    densityKgPerM3: 60,
    usTable: [
      [-100, 0.21, CONFIRMED],
      [0, 0.26, CONFIRMED],
      [75, 0.28, CONFIRMED],
    ],
    fitDegree: 2,
  },
  {
    id: 'mineral-fibre-board-c612-type-iva',
    name: 'Mineral-fibre board and block insulation, up to 538 °C',
    specification: 'ASTM C612, Type IVA',
    source: `ASTM C612 (e.g. C612-14), Table 1, maximum apparent thermal conductivity, Type IVA; ${RECALLED}; ${NOT_FOUND}`,
    confidence: 'approximate',
    maxServiceTemperatureC: 538,
    minServiceTemperatureC: 0,
    densityKgPerM3: 130,
    usTable: [
      [75, 0.24],
      [100, 0.25],
      [200, 0.29],
      [300, 0.34],
      [400, 0.4],
      [500, 0.47],
    ],
    fitDegree: 2,
  },
  {
    id: 'expanded-perlite-c610',
    name: 'Expanded perlite pipe and block insulation',
    specification: 'ASTM C610',
    source: `ASTM C610 (e.g. C610-17), Table 1, maximum apparent thermal conductivity; ${RECALLED}; ${NOT_FOUND}`,
    confidence: 'approximate',
    maxServiceTemperatureC: 650,
    minServiceTemperatureC: 0,
    densityKgPerM3: 200,
    usTable: [
      [100, 0.48],
      [200, 0.52],
      [300, 0.56],
      [400, 0.6],
      [500, 0.65],
      [600, 0.7],
      [700, 0.76],
    ],
    fitDegree: 2,
  },
  {
    id: 'aerogel-blanket-c1728-type-iii',
    name: 'Flexible aerogel blanket insulation, high temperature',
    specification: 'ASTM C1728, Type III',
    source: `ASTM C1728 (e.g. C1728-17), table of maximum apparent thermal conductivity, Type III; ${RECALLED}; ${NOT_FOUND}`,
    confidence: 'approximate',
    maxServiceTemperatureC: 650,
    minServiceTemperatureC: -40,
    densityKgPerM3: 200,
    usTable: [
      [100, 0.16],
      [200, 0.18],
      [300, 0.21],
      [400, 0.25],
      [500, 0.29],
      [600, 0.34],
    ],
    fitDegree: 2,
  },
];

/** Built-in insulation material types (generic names, ASTM specifications). */
export const INSULATION_MATERIALS: readonly InsulationMaterial[] = DEFINITIONS.map(({ usTable, fitDegree, ...rest }) => {
  const tablePoints = fromUsTable(usTable);
  return { ...rest, tablePoints, conductivity: fitConductivityPolynomial(tablePoints, fitDegree) };
});

/**
 * Looks up a built-in material by id.
 *
 * @param id - material id, e.g. `'calcium-silicate-c533-type-i'`
 * @returns the material
 * @example insulationMaterialById('cellular-glass-c552-grade-6').maxServiceTemperatureC // 430
 */
export function insulationMaterialById(id: string): InsulationMaterial {
  const material = INSULATION_MATERIALS.find((m) => m.id === id);
  if (!material) throw new CalcInputError('material', `no built-in material "${id}"`);
  return material;
}

/**
 * A calculation layer of a built-in material.
 *
 * @param material - material or its id
 * @param thicknessM - layer thickness [m], ≥ 0
 * @returns the layer for a case, with the material's k(T), service temperature limits and the mean-temperature
 *   range of its table (so a result warns where the curve is extrapolated)
 * @example layerOf('mineral-fibre-pipe-c547-type-i', 0.05).maxServiceTemperatureC // 454
 */
export function layerOf(material: InsulationMaterial | string, thicknessM: number): Layer {
  const m = typeof material === 'string' ? insulationMaterialById(material) : material;
  if (!Number.isFinite(thicknessM) || thicknessM < 0) {
    throw new CalcInputError('thicknessM', 'thicknessM must be zero or a positive number');
  }
  return {
    thicknessM,
    conductivity: [...m.conductivity],
    maxServiceTemperatureC: m.maxServiceTemperatureC,
    minServiceTemperatureC: m.minServiceTemperatureC,
    conductivityDataRangeC: conductivityDataRange(m),
  };
}

/**
 * The mean temperatures a material's k(T) was fitted over: its coldest and hottest table point.
 *
 * @param material - a built-in material
 * @returns `[lowest, highest]` mean temperature [°C]
 * @example conductivityDataRange(insulationMaterialById('cellular-glass-c552-grade-6')) // ≈ [-73.3, 204.4]
 */
export function conductivityDataRange(material: InsulationMaterial): [number, number] {
  const t = material.tablePoints.map((p) => p.meanTemperatureC);
  return [Math.min(...t), Math.max(...t)];
}
