/**
 * Reference checks of contact-burn thresholds.
 *
 * Source: ISO 13732-1:2006, Ergonomics of the thermal environment — Hot surfaces, clause 4.2: burn thresholds
 * for 1 min contact (uncoated and coated metal 51 °C, ceramics/glass/stone 56 °C, plastics 60 °C, wood 60 °C),
 * 10 min (48 °C, all materials) and 8 h (43 °C, all materials), and the figures for 1 s and 10 s (lower bounds:
 * uncoated metal 65 / 55 °C, ceramics 80 / 66 °C, plastics 85 / 70 °C, wood 110 / 89 °C). All recalled
 * **from memory** of the standard. The standard states whole degrees, so exact equality (to 1e-9) is asserted
 * at tabulated times; interpolated values are only bounded.
 * Source: ASTM C1055-20, 5 s industrial contact, metal ≈ 60 °C (140 °F), from memory; whole degree, exact.
 */
import { burnCheck, burnThresholdC, burnThresholdWithSource } from '../../shared/calc/burn';
import type { ContactMaterial } from '../../shared/calc/types';

const TABLE: [ContactMaterial, number, number][] = [
  ['uncoatedMetal', 1, 65],
  ['uncoatedMetal', 10, 55],
  ['uncoatedMetal', 60, 51],
  ['coatedMetal', 60, 51],
  ['ceramicGlassStone', 1, 80],
  ['ceramicGlassStone', 10, 66],
  ['ceramicGlassStone', 60, 56],
  ['plastic', 1, 85],
  ['plastic', 10, 70],
  ['plastic', 60, 60],
  ['wood', 1, 110],
  ['wood', 10, 89],
  ['wood', 60, 60],
];

describe('ISO 13732-1:2006 burn thresholds (from memory)', () => {
  it.each(TABLE)('when %s is touched for %p s, then the threshold is %p °C', (material, seconds, expected) => {
    expect(burnThresholdC(material, seconds)).toBeCloseTo(expected, 9);
  });

  it.each(['uncoatedMetal', 'coatedMetal', 'ceramicGlassStone', 'plastic', 'wood'] as ContactMaterial[])(
    'when %s is touched for 10 min or 8 h, then the threshold is 48 °C or 43 °C',
    (material) => {
      expect(burnThresholdC(material, 600)).toBeCloseTo(48, 9);
      expect(burnThresholdC(material, 8 * 3600)).toBeCloseTo(43, 9);
      expect(burnThresholdC(material, 24 * 3600)).toBeCloseTo(43, 9);
    },
  );

  it('when the contact time lies between tabulated times, then the value lies between the neighbours', () => {
    // Log-time interpolation is our assumption; the standard's curves fall monotonically between its points.
    const t4 = burnThresholdC('uncoatedMetal', 4);
    expect(t4).toBeLessThan(65);
    expect(t4).toBeGreaterThan(55);
    // log10(4) = 0.602 of the way from 1 s to 10 s: 65 − 10 × 0.602 = 58.98 °C.
    expect(t4).toBeCloseTo(58.98, 2);
    const source = burnThresholdWithSource('plastic', 30).source;
    expect(source).toMatch(/interpolat/);
    expect(source).toMatch(/assumption/);
  });
});

describe('ASTM C1055 default basis (from memory)', () => {
  it('when no contact time is given for metal, then the 5 s basis gives 60 °C', () => {
    expect(burnThresholdC('uncoatedMetal')).toBe(60);
    expect(burnThresholdC('coatedMetal')).toBe(60);
    expect(burnThresholdWithSource('uncoatedMetal').source).toMatch(/ASTM C1055/);
  });

  it('when a metal surface at 65 °C is checked on the default basis, then it is above the threshold', () => {
    const result = burnCheck(65, { material: 'uncoatedMetal' });
    expect(result.verdict).toBe('aboveThreshold');
    expect(result.thresholdC).toBe(60);
  });

  it('when a surface is exactly at the threshold, then it counts as above', () => {
    expect(burnCheck(51, { material: 'uncoatedMetal', seconds: 60 }).verdict).toBe('aboveThreshold');
    expect(burnCheck(50.9, { material: 'uncoatedMetal', seconds: 60 }).verdict).toBe('belowThreshold');
  });
});
