/**
 * Built-in outer finishes (jackets and coatings) with their total hemispherical emissivity.
 *
 * @remarks
 * Emissivity of a metal jacket depends strongly on its state: new and bright, oxidised, dirty or weathered.
 * Each finish carries a typical value and a range. The range matters for design bases: a touch-safety basis
 * takes the *lowest* credible emissivity of a hot metal jacket (a hotter surface), an energy basis the typical
 * one. Values are **from memory** of the handbook tables named in each source, rounded as the trade uses them;
 * they are consistent with the ranges tabulated in Incropera et al. (Table A.11) and in the appendix of
 * ASTM C680 and VDI 2055 Part 1, to the recollection of the author.
 *
 * References:
 * 1. Incropera, F. P., DeWitt, D. P., Bergman, T. L., Lavine, A. S., *Fundamentals of Heat and Mass Transfer*,
 *    6th edition, Wiley, 2007, Table A.11 (total, normal or hemispherical emissivity of selected surfaces).
 * 2. ASTM C680, *Standard Practice for Estimate of the Heat Gain or Loss and the Surface Temperatures of Insulated
 *    Flat, Cylindrical, and Spherical Systems by Use of Computer Programs*, appendix table of surface emittances.
 * 3. VDI 2055 Part 1 (2008), *Thermal insulation of heated and refrigerated operational installations*, table of
 *    emissivities of jacketing materials.
 */

import { CalcInputError } from '../errors';

/** A built-in outer finish. */
export type Finish = {
  /** Stable identifier, kebab-case. */
  id: string;
  /** Generic name. */
  name: string;
  /** Typical total hemispherical emissivity [–]. */
  emissivity: number;
  /** Credible range of emissivity in service [–], [low, high]. */
  emissivityRange: [number, number];
  /** Whether the finish is metallic (low emissivity, and a metal for burn checks). */
  metallic: boolean;
  /** Provenance. */
  source: string;
};

const HANDBOOK = 'typical handbook value (Incropera et al. 6th ed. Table A.11; ASTM C680 appendix; VDI 2055-1), from memory';

/** Built-in finishes. */
export const FINISHES: readonly Finish[] = [
  { id: 'aluminium-polished', name: 'Aluminium jacket, new, bright or polished', emissivity: 0.05, emissivityRange: [0.04, 0.08], metallic: true, source: HANDBOOK },
  { id: 'aluminium-oxidised', name: 'Aluminium jacket, oxidised or dull (in service)', emissivity: 0.15, emissivityRange: [0.1, 0.2], metallic: true, source: HANDBOOK },
  { id: 'stainless-steel', name: 'Stainless steel jacket', emissivity: 0.2, emissivityRange: [0.15, 0.3], metallic: true, source: HANDBOOK },
  { id: 'galvanised-steel-new', name: 'Galvanised steel jacket, new', emissivity: 0.25, emissivityRange: [0.2, 0.3], metallic: true, source: HANDBOOK },
  { id: 'galvanised-steel-weathered', name: 'Galvanised steel jacket, weathered or dirty', emissivity: 0.4, emissivityRange: [0.3, 0.5], metallic: true, source: HANDBOOK },
  { id: 'painted-metal', name: 'Painted or coated metal jacket', emissivity: 0.9, emissivityRange: [0.85, 0.95], metallic: true, source: HANDBOOK },
  { id: 'pvc-jacket', name: 'PVC jacket', emissivity: 0.9, emissivityRange: [0.85, 0.95], metallic: false, source: HANDBOOK },
  { id: 'mastic-or-canvas', name: 'Mastic or canvas with coating', emissivity: 0.9, emissivityRange: [0.85, 0.95], metallic: false, source: HANDBOOK },
  { id: 'carbon-steel-oxidised', name: 'Bare carbon steel, oxidised', emissivity: 0.8, emissivityRange: [0.7, 0.9], metallic: true, source: HANDBOOK },
];

/**
 * Looks up a built-in finish by id.
 *
 * @param id - finish id, e.g. `'aluminium-oxidised'`
 * @returns the finish
 * @example finishById('pvc-jacket').emissivity // 0.9
 */
export function finishById(id: string): Finish {
  const finish = FINISHES.find((f) => f.id === id);
  if (!finish) throw new CalcInputError('finish', `no built-in finish "${id}"`);
  return finish;
}

/**
 * Emissivity of a finish for a design basis: the low end of its range for touch safety (a low-emissivity hot
 * jacket runs hotter), the typical value otherwise.
 *
 * @param finish - finish or its id
 * @param basis - `'touchSafety'` | `'energy'` | `'condensation'`
 * @returns emissivity [–]
 * @remarks For condensation control the low end is also the conservative choice: a low-emissivity cold jacket
 *   receives less radiation and runs colder. Common practice.
 * @example finishEmissivityForBasis('aluminium-oxidised', 'touchSafety') // 0.1
 */
export function finishEmissivityForBasis(finish: Finish | string, basis: 'touchSafety' | 'energy' | 'condensation'): number {
  const f = typeof finish === 'string' ? finishById(finish) : finish;
  return basis === 'energy' ? f.emissivity : f.emissivityRange[0];
}
