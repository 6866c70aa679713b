import fc from 'fast-check';

import { CalcInputError } from './errors';
import { burnCheck, burnThresholdC, CONTACT_MATERIALS } from './burn';
import type { Contact, ContactMaterial } from './types';

describe('burn thresholds', () => {
  it('when the contact lasts longer, then the threshold never rises', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...CONTACT_MATERIALS),
        fc.double({ min: 0.1, max: 1e5, noNaN: true }),
        fc.double({ min: 1, max: 100, noNaN: true }),
        (material: ContactMaterial, seconds, factor) => {
          expect(burnThresholdC(material, seconds * factor)).toBeLessThanOrEqual(burnThresholdC(material, seconds) + 1e-9);
        },
      ),
    );
  });

  it('when materials are compared at the same time, then metal is never above ceramic, plastic or wood', () => {
    for (const s of [1, 3, 10, 30, 60, 300]) {
      const metal = burnThresholdC('uncoatedMetal', s);
      expect(burnThresholdC('ceramicGlassStone', s)).toBeGreaterThanOrEqual(metal);
      expect(burnThresholdC('plastic', s)).toBeGreaterThanOrEqual(burnThresholdC('ceramicGlassStone', s));
      expect(burnThresholdC('wood', s)).toBeGreaterThanOrEqual(burnThresholdC('plastic', s));
    }
  });

  it('when contact is shorter than 1 s, then the 1 s value applies (conservative)', () => {
    expect(burnThresholdC('uncoatedMetal', 0.5)).toBe(burnThresholdC('uncoatedMetal', 1));
  });

  it('when input is invalid, then a CalcInputError names the field', () => {
    expect(() => burnThresholdC('uncoatedMetal', 0)).toThrow(CalcInputError);
    expect(() => burnThresholdC('uncoatedMetal', -1)).toThrow(/contact.seconds/);
    expect(() => burnCheck(60, { material: 'glass', seconds: 5 } as unknown as Contact)).toThrow(/contact.material/);
    expect(() => burnCheck(Number.NaN, { material: 'wood', seconds: 5 })).toThrow(/surfaceTemperatureC/);
  });
});
