/**
 * Built-in outer finishes (jackets and coatings) with their total emissivity.
 *
 * @remarks
 * Emissivity of a metal jacket depends strongly on its state: new and bright, oxidised, dirty or weathered.
 * Each finish carries a typical value and a range. The range matters for design bases: a touch-safety basis
 * takes the *lowest* credible emissivity of a hot metal jacket (a hotter surface), an energy basis the typical
 * one.
 *
 * **Provenance.** Each finish's `source` says where its numbers come from. Where stated as confirmed, the values
 * were checked against the long-standing compilation of total *normal* emissivities of metals and paints
 * (Hottel's table, reproduced in McAdams, *Heat Transmission*, and in Perry's *Chemical Engineers' Handbook*;
 * ref. 1) as it appears in open reproductions: an online engineering reference table of total normal
 * emissivities, an extract of a university heat-transfer course's table of total emittances (EPFL, 2008), and
 * infrared-instrument emissivity tables that cite the CRC Handbook of Chemistry and Physics. For polished and
 * lightly oxidised metals the hemispherical emissivity is somewhat higher than the normal one, so using normal
 * values errs towards a hotter jacket (conservative for touch safety). Values or range ends not confirmed are
 * **from memory** of the handbook tables named (Incropera et al. Table A.11, ASTM C680, VDI 2055 Part 1) and are
 * marked so.
 *
 * References:
 * 1. Hottel, H. C., table of normal total emissivity of various surfaces, in McAdams, W. H., *Heat
 *    Transmission*, 3rd edition, McGraw-Hill, 1954; reproduced in Perry's *Chemical Engineers' Handbook*.
 * 2. Incropera, F. P., DeWitt, D. P., Bergman, T. L., Lavine, A. S., *Fundamentals of Heat and Mass Transfer*,
 *    6th edition, Wiley, 2007, Table A.11 (total, normal or hemispherical emissivity of selected surfaces).
 * 3. ASTM C680, *Standard Practice for Estimate of the Heat Gain or Loss and the Surface Temperatures of Insulated
 *    Flat, Cylindrical, and Spherical Systems by Use of Computer Programs*, appendix table of surface emittances.
 * 4. VDI 2055 Part 1 (2008), *Thermal insulation of heated and refrigerated operational installations*, table of
 *    emissivities of jacketing materials.
 */

import { CalcInputError } from '../errors';

/** A built-in outer finish. */
export type Finish = {
  /** Stable identifier, kebab-case. */
  id: string;
  /** Generic name. */
  name: string;
  /** Typical total emissivity [–] (hemispherical for use in the radiation term; see the provenance note). */
  emissivity: number;
  /** Credible range of emissivity in service [–], [low, high]. */
  emissivityRange: [number, number];
  /** Whether the finish is metallic (low emissivity, and a metal for burn checks). */
  metallic: boolean;
  /** Provenance. */
  source: string;
};

const MEMORY = 'from memory of the handbook tables (Incropera et al. 6th ed. Table A.11; ASTM C680 appendix; VDI 2055-1)';
const CONFIRMED = 'confirmed against open reproductions of the total-normal-emissivity compilation (Hottel, in McAdams)';

/** Built-in finishes. */
export const FINISHES: readonly Finish[] = [
  {
    id: 'aluminium-polished',
    name: 'Aluminium jacket, new, bright or polished',
    emissivity: 0.05,
    emissivityRange: [0.04, 0.09],
    metallic: true,
    source: `aluminium, highly polished plate 0.039–0.057 and commercial sheet 0.09 (range widened from 0.08 to 0.09); ${CONFIRMED}`,
  },
  {
    id: 'aluminium-oxidised',
    name: 'Aluminium jacket, oxidised or dull (in service)',
    emissivity: 0.15,
    emissivityRange: [0.1, 0.31],
    metallic: true,
    source:
      'aluminium, oxidised at 600 °C 0.11–0.19 and heavily oxidised 0.20–0.31 (range widened from 0.20 to 0.31); ' +
      `${CONFIRMED}; the low end 0.10 is kept just below the tabulated 0.11 (conservative for touch safety)`,
  },
  {
    id: 'stainless-steel',
    name: 'Stainless steel jacket',
    emissivity: 0.2,
    emissivityRange: [0.15, 0.3],
    metallic: true,
    source:
      `typical value and range ${MEMORY}; not confirmed. A stainless surface after repeated heating reaches ` +
      '0.5–0.7 (university heat-transfer course table, EPFL 2008), so a discoloured jacket can run well above this range',
  },
  {
    id: 'galvanised-steel-new',
    name: 'Galvanised steel jacket, new',
    emissivity: 0.23,
    emissivityRange: [0.2, 0.3],
    metallic: true,
    source:
      `galvanised sheet iron, fairly bright 0.23 (0.228; typical value corrected from 0.25); ${CONFIRMED}; ` +
      `the range 0.20–0.30 ${MEMORY}`,
  },
  {
    id: 'galvanised-steel-weathered',
    name: 'Galvanised steel jacket, weathered or dirty',
    emissivity: 0.4,
    emissivityRange: [0.28, 0.5],
    metallic: true,
    source:
      `galvanised sheet iron, grey oxidised 0.28 (0.276), taken as the low end (corrected from 0.30); ${CONFIRMED}; ` +
      `the typical 0.40 and high end 0.50 for dirty or weathered sheet ${MEMORY}`,
  },
  {
    id: 'painted-metal',
    name: 'Painted or coated metal jacket',
    emissivity: 0.9,
    emissivityRange: [0.8, 0.96],
    metallic: true,
    source: `lacquers and paints: white lacquer 0.80–0.95, black gloss paint 0.90, oil paints 0.92–0.96 (range widened from 0.85–0.95); ${CONFIRMED}`,
  },
  {
    id: 'pvc-jacket',
    name: 'PVC jacket',
    emissivity: 0.9,
    emissivityRange: [0.85, 0.95],
    metallic: false,
    source: `typical value and range ${MEMORY}; not confirmed (instrument tables give 0.85–0.95 for plastics generally)`,
  },
  {
    id: 'mastic-or-canvas',
    name: 'Mastic or canvas with coating',
    emissivity: 0.9,
    emissivityRange: [0.85, 0.95],
    metallic: false,
    source: `typical value and range ${MEMORY}; not confirmed`,
  },
  {
    id: 'carbon-steel-oxidised',
    name: 'Bare carbon steel, oxidised',
    emissivity: 0.8,
    emissivityRange: [0.69, 0.9],
    metallic: true,
    source:
      'iron and steel, oxidised 0.74–0.82 (100–525 °C), heavily rusted 0.69 (taken as the low end, corrected from ' +
      `0.70), strongly oxidised 0.88; ${CONFIRMED}`,
  },
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
