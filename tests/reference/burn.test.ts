/**
 * Reference checks of contact-burn thresholds.
 *
 * Source A (confirmed): the burn-threshold table of EN 563:1994, *Safety of machinery — Temperatures of touchable
 * surfaces*, the predecessor of ISO 13732-1:2006, as reproduced in the implementing notes to § 12 of DGUV
 * Vorschrift 79 (BG BAU). Contact up to 1 s, lower bound of each band: uncoated metal 65 (65–70), metal with a
 * 50 µm coating 75 (75–80), ceramics/glass/stone 80 (80–86), plastics 86 (86–93), wood 110 (110–140) °C;
 * 1 min: metals 51, ceramics 56, plastics 60, wood 60 °C; 10 min: 48 °C and 8 h: 43 °C for all materials.
 * The 1 min, 10 min and 8 h values are also quoted for DIN EN ISO 13732-1 by a jacketing supplier's page.
 * Source B (**from memory**, not confirmed): ISO 13732-1:2006 figures, lower bound of the band at 10 s: uncoated
 * metal 55, ceramics 66, plastics 70, wood 89 °C.
 * Source C: ASTM C1055 (C1055-03 clause 1.4, C1055-20 clause 1.3), probable industrial contact time 5 s
 * (confirmed); metal limit ≈ 60 °C (140 °F) at 5 s (**from memory**, not confirmed).
 * The tables state whole degrees, so exact equality (to 1e-9) is asserted at tabulated times; interpolated values
 * are only bounded.
 */
import { burnCheck, burnThresholdC, burnThresholdWithSource, ISO_13732_1_BURN_THRESHOLDS } from '../../shared/calc/burn';
import type { ContactMaterial } from '../../shared/calc/types';

// Source A (EN 563:1994 table; confirmed).
const CONFIRMED: [ContactMaterial, number, number][] = [
  ['uncoatedMetal', 1, 65],
  ['uncoatedMetal', 60, 51],
  ['coatedMetal', 60, 51],
  ['ceramicGlassStone', 1, 80],
  ['ceramicGlassStone', 60, 56],
  ['plastic', 1, 86],
  ['plastic', 60, 60],
  ['wood', 1, 110],
  ['wood', 60, 60],
];

// Source B (ISO 13732-1:2006 figures at 10 s; from memory).
const FROM_MEMORY: [ContactMaterial, number, number][] = [
  ['uncoatedMetal', 10, 55],
  ['ceramicGlassStone', 10, 66],
  ['plastic', 10, 70],
  ['wood', 10, 89],
];

describe('ISO 13732-1:2006 burn thresholds confirmed against the EN 563:1994 table', () => {
  it.each(CONFIRMED)('when %s is touched for %p s, then the threshold is %p °C', (material, seconds, expected) => {
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

  it('when coated metal is touched for 1 s, then the uncoated 65 °C is used, below the published 75–80 °C band', () => {
    // Source A: 50 µm coating, 75–80 °C at 1 s; the coating thickness is unknown, so the lower uncoated value is kept.
    expect(burnThresholdC('coatedMetal', 1)).toBe(65);
    expect(burnThresholdC('coatedMetal', 1)).toBeLessThan(75);
  });

  it('when the stored points are listed, then the points checked against the table say so and the others say from memory', () => {
    for (const points of Object.values(ISO_13732_1_BURN_THRESHOLDS)) {
      for (const p of points) {
        if (p.seconds === 10) expect(p.provenance).toMatch(/from memory/);
        else expect(p.provenance).toMatch(/confirmed against the EN 563:1994/);
      }
    }
    expect(burnThresholdWithSource('wood', 60).source).toMatch(/rests only on confirmed points/);
    expect(burnThresholdWithSource('wood', 30).source).toMatch(/10 s point, which is from memory/);
  });
});

describe('ISO 13732-1:2006 burn thresholds at 10 s (from memory)', () => {
  it.each(FROM_MEMORY)('when %s is touched for %p s, then the threshold is %p °C', (material, seconds, expected) => {
    expect(burnThresholdC(material, seconds)).toBeCloseTo(expected, 9);
  });

  it('when the contact time lies between tabulated times, then the value lies between the neighbours', () => {
    // Log-time interpolation is our assumption; the standard's curves fall monotonically between its points.
    // Bounds: 65 °C at 1 s (Source A) and 55 °C at 10 s (Source B, from memory).
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

describe('ASTM C1055 default basis (5 s confirmed, 60 °C from memory)', () => {
  it('when no contact time is given for metal, then the 5 s basis gives 60 °C', () => {
    const basis = burnThresholdWithSource('uncoatedMetal');
    expect(basis.seconds).toBe(5);
    expect(burnThresholdC('uncoatedMetal')).toBe(60);
    expect(burnThresholdC('coatedMetal')).toBe(60);
    expect(basis.source).toMatch(/ASTM C1055/);
    expect(basis.source).toMatch(/from memory/);
  });

  it('when a metal surface at 65 °C is checked on the default basis, then it is above the threshold', () => {
    const result = burnCheck(65, { material: 'uncoatedMetal' });
    expect(result.verdict).toBe('aboveThreshold');
    expect(result.thresholdC).toBe(60);
  });

  it('when a surface is exactly at the threshold, then it counts as above', () => {
    // Source A: uncoated metal, 1 min, 51 °C.
    expect(burnCheck(51, { material: 'uncoatedMetal', seconds: 60 }).verdict).toBe('aboveThreshold');
    expect(burnCheck(50.9, { material: 'uncoatedMetal', seconds: 60 }).verdict).toBe('belowThreshold');
  });
});
