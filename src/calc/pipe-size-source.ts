/**
 * Pipe sizes for the form, from shared/calc's ASME B36.10M table: NPS, DN, outside diameter, and the
 * standard-wall inside diameter and mass per metre (defaults for frost protection).
 */
import { PIPE_SIZES, pipeInnerDiameterM, pipeMassPerMetreKg } from '../../shared/calc/pipe-sizes';

import type { PipeSize } from './library';

export const pipeSizes: PipeSize[] = PIPE_SIZES.map((p) => {
  const id = pipeInnerDiameterM(p, 'standard');
  const wallM = p.standardWallMm === null ? null : p.standardWallMm / 1000;
  return {
    nps: p.nps,
    dn: p.dn,
    outerDiameterM: p.outerDiameterM,
    innerDiameterM: id,
    massPerMetreKg: wallM === null ? null : pipeMassPerMetreKg(p.outerDiameterM, wallM),
  };
});
