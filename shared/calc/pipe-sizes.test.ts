import { pipeMassPerMetreKg, pipeSizeByNps } from './pipe-sizes';

// Plain-end masses of schedule 40 pipe as recalled from ASME B36.10M (not confirmed against the standard): pinned
// here so that a change to the mass formula or the wall table is deliberate. They are not reference checks.
describe('schedule 40 masses, pinned', () => {
  it.each([
    ['4', 16.07],
    ['6', 28.26],
    ['8', 42.55],
  ] as [string, number][])('when NPS %s schedule 40 mass is computed, then it is %p kg/m to the last listed place', (nps, listed) => {
    const size = pipeSizeByNps(nps);
    const mass = pipeMassPerMetreKg(size.outerDiameterM, (size.schedule40WallMm as number) / 1000);
    expect(Math.abs(mass - listed)).toBeLessThanOrEqual(0.01);
  });

  it('when the wall is zero or reaches the centre, then the error names the wall', () => {
    expect(() => pipeMassPerMetreKg(0.1143, 0)).toThrow(/wallM/);
    expect(() => pipeMassPerMetreKg(0.1, 0.05)).toThrow(/wallM/);
  });
});
