/**
 * Reference checks of pipe dimensions.
 *
 * Source: ASME B36.10M-2018, Welded and Seamless Wrought Steel Pipe, Table 1: outside diameters in
 * inches (exact, 3 decimals) and millimetres (rounded by the standard to 0.1 mm, whole mm above NPS 16), DN per
 * ISO 6708, walls of schedule 40 / STD, plain-end masses (lb/ft to 2 decimals, kg/m to 2 decimals).
 * Tolerances: listed values are asserted exactly; the mm column against inches × 25.4 within half the
 * standard's rounding step (0.05 mm, or 0.5 mm where whole millimetres are listed); masses within ±0.01 of the
 * listed 2-decimal value (a unit in the last place: the standard rounds its formula result).
 */
import {
  PIPE_SIZES,
  parseNps,
  pipeInnerDiameterM,
  pipeMassPerMetreKg,
  pipeSizeByDn,
  pipeSizeByNps,
} from '../../shared/calc/pipe-sizes';
import { kilogramsPerMetreToPoundsPerFoot } from '../../shared/calc/units';

// Source: ASME B36.10M as tabulated (metric outside diameters and STD / schedule 40 walls, mm) in the
// open-source fluids library, C. Bell, "fluids: Fluid dynamics component of the Chemical Engineering Design
// Library", module fluids/piping.py (arrays NPSSTD, STDo, STDt, NPS40, S40t). Values as listed there;
// asserted exactly because both sides quote the standard's printed figures.
const B36_10M_STD: [number, number, number][] = [
  // [NPS in, OD mm, STD wall mm]
  [0.5, 21.3, 2.77], [0.75, 26.7, 2.87], [1, 33.4, 3.38], [1.25, 42.2, 3.56], [1.5, 48.3, 3.68],
  [2, 60.3, 3.91], [2.5, 73, 5.16], [3, 88.9, 5.49], [3.5, 101.6, 5.74], [4, 114.3, 6.02], [5, 141.3, 6.55],
  [6, 168.3, 7.11], [8, 219.1, 8.18], [10, 273, 9.27], [12, 323.8, 9.53], [14, 355.6, 9.53], [16, 406.4, 9.53],
  [18, 457, 9.53], [20, 508, 9.53], [24, 610, 9.53], [30, 762, 9.53], [32, 813, 9.53], [34, 864, 9.53],
  [36, 914, 9.53],
];
const B36_10M_SCHEDULE_40: [number, number][] = [
  [0.5, 2.77], [1, 3.38], [2, 3.91], [4, 6.02], [6, 7.11], [8, 8.18], [10, 9.27], [12, 10.31], [14, 11.13],
  [16, 12.7], [18, 14.27], [20, 15.09], [24, 17.48],
];

describe('ASME B36.10M as tabulated by an independent open-source library', () => {
  it.each(B36_10M_STD)('when NPS %p is looked up, then OD is %p mm and the STD wall %p mm', (nps, odMm, wallMm) => {
    const size = PIPE_SIZES.find((p) => p.npsInches === nps);
    expect(size).toBeDefined();
    expect(size?.outerDiameterMm).toBe(odMm);
    expect(size?.standardWallMm).toBe(wallMm);
  });

  it.each(B36_10M_SCHEDULE_40)('when NPS %p schedule 40 is looked up, then the wall is %p mm', (nps, wallMm) => {
    const size = PIPE_SIZES.find((p) => p.npsInches === nps);
    expect(size?.schedule40WallMm).toBe(wallMm);
  });
});

describe('ASME B36.10M outside diameters and DN', () => {
  it.each([
    ['1/2', 15, 0.84, 21.3],
    ['3/4', 20, 1.05, 26.7],
    ['1', 25, 1.315, 33.4],
    ['1-1/4', 32, 1.66, 42.2],
    ['1-1/2', 40, 1.9, 48.3],
    ['2', 50, 2.375, 60.3],
    ['2-1/2', 65, 2.875, 73.0],
    ['3', 80, 3.5, 88.9],
    ['3-1/2', 90, 4.0, 101.6],
    ['4', 100, 4.5, 114.3],
    ['5', 125, 5.563, 141.3],
    ['6', 150, 6.625, 168.3],
    ['8', 200, 8.625, 219.1],
    ['10', 250, 10.75, 273.0],
    ['12', 300, 12.75, 323.8],
    ['14', 350, 14, 355.6],
    ['16', 400, 16, 406.4],
    ['18', 450, 18, 457],
    ['20', 500, 20, 508],
    ['24', 600, 24, 610],
    ['30', 750, 30, 762],
    ['32', 800, 32, 813],
    ['34', 850, 34, 864],
    ['36', 900, 36, 914],
  ] as [string, number, number, number][])('when NPS %s is looked up, then DN %p, OD %p in, %p mm', (nps, dn, odIn, odMm) => {
    const size = pipeSizeByNps(nps);
    expect(size.dn).toBe(dn);
    expect(size.outerDiameterIn).toBe(odIn);
    expect(size.outerDiameterMm).toBe(odMm);
    expect(size.outerDiameterM).toBeCloseTo(odMm / 1000, 12);
    expect(pipeSizeByDn(dn)).toBe(size);
  });

  it('when the metric column is compared with inches × 25.4, then it is the standard rounding of it', () => {
    for (const size of PIPE_SIZES) {
      const exactMm = size.outerDiameterIn * 25.4;
      const step = size.npsInches > 16 ? 0.5 : 0.05;
      expect(Math.abs(size.outerDiameterMm - exactMm)).toBeLessThanOrEqual(step + 1e-9);
    }
  });

  it('when sizes are listed, then NPS and DN both ascend', () => {
    for (let i = 1; i < PIPE_SIZES.length; i += 1) {
      expect(PIPE_SIZES[i].npsInches).toBeGreaterThan(PIPE_SIZES[i - 1].npsInches);
      expect(PIPE_SIZES[i].dn).toBeGreaterThan(PIPE_SIZES[i - 1].dn);
    }
  });
});

describe('bores and masses', () => {
  it('when NPS 2 schedule 40 is taken, then its bore is 52.5 mm: the OD and wall of the independent tabulation', () => {
    // Source: the fluids tabulation above, OD 60.3 mm and wall 3.91 mm: 60.3 − 2 × 3.91 = 52.48 mm.
    expect(pipeInnerDiameterM(pipeSizeByNps('2'), 'schedule40')).toBeCloseTo(0.05248, 5);
  });

  it('when NPS 2 schedule 40 mass is computed, then it is the 5.44 kg/m (3.66 lb/ft) listed in B36.10M (from memory)', () => {
    // Source: ASME B36.10M Table 1, plain-end mass of NPS 2 schedule 40, as recalled; ± 0.01 (last place listed).
    const size = pipeSizeByNps('2');
    const mass = pipeMassPerMetreKg(size.outerDiameterM, (size.schedule40WallMm as number) / 1000);
    expect(Math.abs(mass - 5.44)).toBeLessThanOrEqual(0.01);
    expect(Math.abs(kilogramsPerMetreToPoundsPerFoot(mass) - 3.66)).toBeLessThanOrEqual(0.01);
  });

  it('when a size above NPS 10 is taken, then STD (9.53 mm) and schedule 40 (10.31 mm) differ', () => {
    // Source: the fluids tabulation above (STDt and S40t at NPS 12).
    const size = pipeSizeByNps('12');
    expect(size.standardWallMm).toBe(9.53);
    expect(size.schedule40WallMm).toBe(10.31);
  });
});

describe('NPS and DN parsing', () => {
  it.each([
    ['2', 2],
    ['1-1/2', 1.5],
    ['1 1/2', 1.5],
    ['1½', 1.5],
    ['1.5', 1.5],
    ['1/2', 0.5],
    ['½', 0.5],
    ['NPS 2-1/2', 2.5],
    ['3"', 3],
    [' 36 ', 36],
  ] as [string, number][])('when "%s" is parsed, then it is %p in', (text, inches) => {
    expect(parseNps(text)).toBe(inches);
  });

  it('when the text is not an NPS or not a standard size, then lookup throws with the field', () => {
    expect(parseNps('two')).toBeNull();
    expect(() => pipeSizeByNps('2-3/4')).toThrow(/NPS|nominal pipe size/i);
    expect(() => pipeSizeByNps('abc')).toThrow(/NPS|nominal pipe size/i);
    expect(() => pipeSizeByDn(55)).toThrow(/DN/);
    expect(pipeSizeByDn('DN 100').nps).toBe('4');
  });
});
