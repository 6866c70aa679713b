/**
 * Standard steel pipe sizes: outside diameters of ASME B36.10M by nominal pipe size (NPS) and their DN
 * equivalents, with the standard (STD) and schedule 40 walls where they exist.
 *
 * @remarks
 * The outside diameter of a given NPS is the same for every wall schedule, which is all the heat-loss model
 * needs. Walls are given for the standing-water volume and pipe mass of frost-protection cases. The US-unit
 * columns are the standard's own; the metric columns are the standard's rounded values (0.1 mm up to NPS 12,
 * whole millimetres above NPS 16) — every value as recalled **from memory** of ASME B36.10M; check against the
 * current edition for any contractual use.
 *
 * Insulation sizing to ASTM C585 (the standard inner and outer diameters of pipe insulation that nest
 * together, so that the actual thickness differs from the nominal one) is not tabulated here.
 *
 * References:
 * 1. ASME B36.10M-2018, *Welded and Seamless Wrought Steel Pipe*, Table 1 (dimensions and weights).
 * 2. ISO 6708:1995, *Pipework components — Definition and selection of DN (nominal size)*.
 */

import { CalcInputError } from './errors';
import { METRES_PER_INCH } from './units';

/** One nominal pipe size of ASME B36.10M. */
export type PipeSize = {
  /** NPS as written in the trade, e.g. `"1-1/2"`. */
  nps: string;
  /** NPS as a number of inches, e.g. 1.5. */
  npsInches: number;
  /** Metric nominal size (DN, ISO 6708). */
  dn: number;
  /** Outside diameter [in], ASME B36.10M. */
  outerDiameterIn: number;
  /** Outside diameter [mm] as listed in ASME B36.10M. */
  outerDiameterMm: number;
  /** Outside diameter [m] (the listed millimetre value / 1000). */
  outerDiameterM: number;
  /** Standard-weight (STD) wall [mm], ASME B36.10M; null where not recalled. */
  standardWallMm: number | null;
  /** Schedule 40 wall [mm], ASME B36.10M; null where the size has no schedule 40. */
  schedule40WallMm: number | null;
};

type Row = [nps: string, npsInches: number, dn: number, odIn: number, odMm: number, stdMm: number | null, s40Mm: number | null];

// From memory of ASME B36.10M Table 1. STD equals Sch 40 up to NPS 10; above it STD is 9.53 mm (0.375 in).
const ROWS: readonly Row[] = [
  ['1/8', 0.125, 6, 0.405, 10.3, 1.73, 1.73],
  ['1/4', 0.25, 8, 0.54, 13.7, 2.24, 2.24],
  ['3/8', 0.375, 10, 0.675, 17.1, 2.31, 2.31],
  ['1/2', 0.5, 15, 0.84, 21.3, 2.77, 2.77],
  ['3/4', 0.75, 20, 1.05, 26.7, 2.87, 2.87],
  ['1', 1, 25, 1.315, 33.4, 3.38, 3.38],
  ['1-1/4', 1.25, 32, 1.66, 42.2, 3.56, 3.56],
  ['1-1/2', 1.5, 40, 1.9, 48.3, 3.68, 3.68],
  ['2', 2, 50, 2.375, 60.3, 3.91, 3.91],
  ['2-1/2', 2.5, 65, 2.875, 73.0, 5.16, 5.16],
  ['3', 3, 80, 3.5, 88.9, 5.49, 5.49],
  ['3-1/2', 3.5, 90, 4.0, 101.6, 5.74, 5.74],
  ['4', 4, 100, 4.5, 114.3, 6.02, 6.02],
  ['5', 5, 125, 5.563, 141.3, 6.55, 6.55],
  ['6', 6, 150, 6.625, 168.3, 7.11, 7.11],
  ['8', 8, 200, 8.625, 219.1, 8.18, 8.18],
  ['10', 10, 250, 10.75, 273.0, 9.27, 9.27],
  ['12', 12, 300, 12.75, 323.8, 9.53, 10.31],
  ['14', 14, 350, 14, 355.6, 9.53, 11.13],
  ['16', 16, 400, 16, 406.4, 9.53, 12.7],
  ['18', 18, 450, 18, 457, 9.53, 14.27],
  ['20', 20, 500, 20, 508, 9.53, 15.09],
  ['22', 22, 550, 22, 559, 9.53, null],
  ['24', 24, 600, 24, 610, 9.53, 17.48],
  ['26', 26, 650, 26, 660, 9.53, null],
  ['28', 28, 700, 28, 711, 9.53, null],
  ['30', 30, 750, 30, 762, 9.53, null],
  ['32', 32, 800, 32, 813, 9.53, 17.48],
  ['34', 34, 850, 34, 864, 9.53, 17.48],
  ['36', 36, 900, 36, 914, 9.53, 19.05],
  ['42', 42, 1050, 42, 1067, 9.53, null],
  ['48', 48, 1200, 48, 1219, 9.53, null],
];

/** ASME B36.10M sizes NPS 1/8 to 48, ascending (values from memory of the standard). */
export const PIPE_SIZES: readonly PipeSize[] = ROWS.map(([nps, npsInches, dn, odIn, odMm, stdMm, s40Mm]) => ({
  nps,
  npsInches,
  dn,
  outerDiameterIn: odIn,
  outerDiameterMm: odMm,
  outerDiameterM: odMm / 1000,
  standardWallMm: stdMm,
  schedule40WallMm: s40Mm,
}));

const FRACTION_GLYPHS: Record<string, string> = { '⅛': '1/8', '¼': '1/4', '⅜': '3/8', '½': '1/2', '¾': '3/4' };

/**
 * Parses an NPS designation to inches: `"2"`, `"1-1/2"`, `"1 1/2"`, `"1½"`, `"1.5"`, `"1/2"`, `"NPS 2"`, `2"`.
 *
 * @param text - NPS designation
 * @returns nominal size [in], or null when the text is not an NPS
 * @example parseNps('1 1/2') // 1.5
 */
export function parseNps(text: string): number | null {
  if (typeof text !== 'string') return null;
  let s = text.trim().replace(/^nps\s*/i, '').replace(/(″|"|in\.?|inch(es)?)$/i, '').trim();
  for (const [glyph, ascii] of Object.entries(FRACTION_GLYPHS)) s = s.replace(glyph, ` ${ascii}`);
  s = s.trim();
  const mixed = /^(\d+)(?:\s*-\s*|\s+)(\d+)\s*\/\s*(\d+)$/.exec(s);
  if (mixed) {
    const denominator = Number(mixed[3]);
    return denominator === 0 ? null : Number(mixed[1]) + Number(mixed[2]) / denominator;
  }
  const fraction = /^(\d+)\s*\/\s*(\d+)$/.exec(s);
  if (fraction) {
    const denominator = Number(fraction[2]);
    return denominator === 0 ? null : Number(fraction[1]) / denominator;
  }
  if (/^\d+(\.\d+)?$/.test(s)) return Number(s);
  return null;
}

/**
 * Looks up an ASME B36.10M pipe size by NPS designation.
 *
 * @param nps - NPS designation (see {@link parseNps}) or a number of inches
 * @returns the pipe size
 * @remarks Throws `CalcInputError` (field `nps`) for text that is not an NPS or a size not in the table.
 * @example pipeSizeByNps('4').outerDiameterMm // 114.3 (ASME B36.10M)
 * References: 1. ASME B36.10M-2018, Table 1.
 */
export function pipeSizeByNps(nps: string | number): PipeSize {
  const inches = typeof nps === 'number' ? nps : parseNps(nps);
  if (inches === null || !Number.isFinite(inches)) {
    throw new CalcInputError('nps', `"${String(nps)}" is not a nominal pipe size (e.g. "2", "1-1/2", "1 1/2")`);
  }
  const size = PIPE_SIZES.find((p) => Math.abs(p.npsInches - inches) < 1e-9);
  if (!size) throw new CalcInputError('nps', `NPS ${String(nps)} is not a standard ASME B36.10M size`);
  return size;
}

/**
 * Looks up an ASME B36.10M pipe size by its DN equivalent.
 *
 * @param dn - nominal size DN (a number, or text such as `"DN 50"`)
 * @returns the pipe size
 * @example pipeSizeByDn(50).outerDiameterMm // 60.3
 * References: 1. ASME B36.10M-2018, Table 1. 2. ISO 6708:1995.
 */
export function pipeSizeByDn(dn: number | string): PipeSize {
  const value = typeof dn === 'number' ? dn : Number(String(dn).trim().replace(/^dn\s*/i, ''));
  const size = Number.isFinite(value) ? PIPE_SIZES.find((p) => p.dn === value) : undefined;
  if (!size) throw new CalcInputError('dn', `DN ${String(dn)} is not a standard size with an ASME B36.10M equivalent`);
  return size;
}

/**
 * Inner diameter of a pipe from its size and wall: d_i = D_o − 2·t.
 *
 * @param size - pipe size
 * @param wall - `'standard'` (STD) or `'schedule40'`
 * @returns inner diameter [m], or null when that wall is not tabulated for the size
 * @example pipeInnerDiameterM(pipeSizeByNps('2'), 'schedule40') // 0.05248 (52.5 mm, ASME B36.10M)
 */
export function pipeInnerDiameterM(size: PipeSize, wall: 'standard' | 'schedule40' = 'standard'): number | null {
  const wallMm = wall === 'standard' ? size.standardWallMm : size.schedule40WallMm;
  if (wallMm === null) return null;
  return (size.outerDiameterMm - 2 * wallMm) / 1000;
}

/** Density of carbon steel used by the ASME B36.10M plain-end mass formula [kg/m³] (≈ 0.2836 lb/in³). */
export const CARBON_STEEL_DENSITY_KG_PER_M3 = 7850;

/**
 * Plain-end mass per metre of a steel pipe, ASME B36.10M formula: m = 0.0246615 · (D − t) · t [kg/m], D and t in mm.
 *
 * @param outerDiameterM - outside diameter [m]
 * @param wallM - wall thickness [m], 0 < t < D/2
 * @returns mass per length [kg/m] of carbon steel
 * @remarks 0.0246615 = π · 7850 kg/m³ · 1e-6 (rounded as printed in the standard, from memory); the US form is
 *   10.69 · (D − t) · t lb/ft with D and t in inches.
 * @example pipeMassPerMetreKg(0.0603, 0.00391) // ≈ 5.44 kg/m (NPS 2 Sch 40, listed 5.44 kg/m)
 * References: 1. ASME B36.10M-2018, clause on weights (plain-end mass formula).
 */
export function pipeMassPerMetreKg(outerDiameterM: number, wallM: number): number {
  if (!Number.isFinite(outerDiameterM) || outerDiameterM <= 0) {
    throw new CalcInputError('outerDiameterM', 'outerDiameterM must be a positive number');
  }
  if (!Number.isFinite(wallM) || wallM <= 0 || wallM >= outerDiameterM / 2) {
    throw new CalcInputError('wallM', 'wallM must be positive and less than half the outside diameter');
  }
  const dMm = outerDiameterM * 1000;
  const tMm = wallM * 1000;
  return 0.0246615 * (dMm - tMm) * tMm;
}

/**
 * Outside diameter of a pipe from the US column of ASME B36.10M, converted exactly: D = D_in · 0.0254.
 *
 * @param size - pipe size
 * @returns outside diameter [m] from the inch value (unrounded)
 * @example outerDiameterFromInchesM(pipeSizeByNps('4')) // 0.1143
 */
export function outerDiameterFromInchesM(size: PipeSize): number {
  return size.outerDiameterIn * METRES_PER_INCH;
}
