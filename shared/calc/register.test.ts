import fc from 'fast-check';

import { burnThresholdWithSource, COLD_CONTACT_NOTE, CONTACT_MATERIALS } from './burn';
import { CalcInputError } from './errors';
import { COLD_CONTACT_BELOW_C, LOW_EMISSIVITY_FINISHES, registerVerdict, type RegisterReading } from './register';
import type { ContactMaterial } from './types';

const metal = (over: Partial<RegisterReading> = {}): RegisterReading => ({
  temperatureC: 40,
  method: 'contact',
  surfaceMaterial: 'uncoatedMetal',
  withinReach: true,
  ...over,
});

describe('register verdict: the limit', () => {
  // ISO 13732-1:2006 burn threshold for 1 min contact with uncoated metal, 51 °C (lower bound; confirmed against the
  // EN 563:1994 table, see burn.ts).
  it('when uncoated metal is read above the 1 min threshold within reach, then it fails against 51 °C', () => {
    const v = registerVerdict(metal({ temperatureC: 52, contactSeconds: 60 }));
    expect(v).toMatchObject({ verdict: 'fail', basis: 'hot', limitC: 51, governs: 'burnThreshold', contactSeconds: 60 });
    expect(v.marginK).toBeCloseTo(1, 9);
    expect(v.source).toMatch(/ISO 13732-1/);
  });

  it('when a reading is shown at the limit (0.1 °C), then it meets it, as sizing does; a tenth above fails', () => {
    expect(registerVerdict(metal({ temperatureC: 51.04, contactSeconds: 60 })).verdict).toBe('pass');
    expect(registerVerdict(metal({ temperatureC: 51, contactSeconds: 60 })).verdict).toBe('pass');
    expect(registerVerdict(metal({ temperatureC: 51.06, contactSeconds: 60 })).verdict).toBe('fail');
  });

  it("when the entry gives no contact time, then the site's applies; with neither, the ASTM C1055 5 s basis", () => {
    // ISO 13732-1:2006, 8 h and longer: 43 °C for every material (EN 563:1994 table).
    expect(registerVerdict(metal({ temperatureC: 45 }), { contactSeconds: 8 * 3600 })).toMatchObject({ verdict: 'fail', limitC: 43, contactSeconds: 28800 });
    expect(registerVerdict(metal({ temperatureC: 45, contactSeconds: 60 }), { contactSeconds: 8 * 3600 }).limitC).toBe(51);
    const astm = registerVerdict(metal({ temperatureC: 45 }));
    expect(astm).toMatchObject({ verdict: 'pass', limitC: burnThresholdWithSource('uncoatedMetal').thresholdC, contactSeconds: 5 });
    expect(astm.source).toMatch(/ASTM C1055/);
  });

  it("when the site's touch limit is below the burn threshold, then it governs and says so; above it, it does not", () => {
    const low = registerVerdict(metal({ temperatureC: 47, contactSeconds: 60 }), { maxSurfaceC: 45 });
    expect(low).toMatchObject({ verdict: 'fail', limitC: 45, governs: 'touchLimit' });
    expect(low.source).toMatch(/site's touch limit/);
    const high = registerVerdict(metal({ temperatureC: 47, contactSeconds: 60 }), { maxSurfaceC: 70 });
    expect(high).toMatchObject({ verdict: 'pass', limitC: 51, governs: 'burnThreshold' });
  });

  it('when plastic is touched for 1 min, then its own threshold (60 °C) applies, not the metal one', () => {
    // ISO 13732-1:2006, 1 min contact, plastics: 60 °C (EN 563:1994 table).
    expect(registerVerdict(metal({ temperatureC: 55, surfaceMaterial: 'plastic', contactSeconds: 60 }))).toMatchObject({ verdict: 'pass', limitC: 60 });
  });

  it('when a surface above the limit is out of reach, then it is a caution that says why, not a pass', () => {
    const v = registerVerdict(metal({ temperatureC: 120, withinReach: false }));
    expect(v.verdict).toBe('caution');
    expect(v.cautions.map((c) => c.code)).toEqual(['OUT_OF_REACH']);
  });

  it('when a reading is above the limit and within reach, then the verdict is never pass or caution', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(...CONTACT_MATERIALS),
        fc.double({ min: 0.5, max: 1e5, noNaN: true }),
        fc.double({ min: 0.2, max: 500, noNaN: true }),
        fc.constantFrom('contact', 'infrared', 'calculated'),
        (material: ContactMaterial, seconds, excess, method) => {
          const limit = burnThresholdWithSource(material, seconds).thresholdC;
          const v = registerVerdict({ temperatureC: limit + excess, method: method as RegisterReading['method'], surfaceMaterial: material, withinReach: true, contactSeconds: seconds });
          expect(v.verdict).toBe('fail');
        },
      ),
    );
  });
});

describe('register verdict: infrared on low-emissivity surfaces', () => {
  it('when the library is read, then the low-emissivity finishes are the bright and dull aluminium, stainless and galvanised ones', () => {
    expect(LOW_EMISSIVITY_FINISHES.map((f) => f.id).sort()).toEqual(
      ['aluminium-oxidised', 'aluminium-polished', 'galvanised-steel-new', 'galvanised-steel-weathered', 'stainless-steel'].sort(),
    );
  });

  it('when oxidised aluminium is read by infrared at ε 0.95 below the limit, then the pass becomes a caution that it reads low', () => {
    const v = registerVerdict(metal({ temperatureC: 45, method: 'infrared', emissivitySetting: 0.95, surfaceFinishId: 'aluminium-oxidised' }));
    expect(v.verdict).toBe('caution');
    expect(v.cautions).toHaveLength(1);
    expect(v.cautions[0].code).toBe('INFRARED_LOW_EMISSIVITY');
    expect(v.cautions[0].message).toMatch(/reads low.*0\.1–0\.31.*much hotter than read/);
  });

  it('when such a reading is already above the limit, then it fails and still carries the caution', () => {
    const v = registerVerdict(metal({ temperatureC: 70, method: 'infrared', emissivitySetting: 0.95, surfaceFinishId: 'stainless-steel' }));
    expect(v.verdict).toBe('fail');
    expect(v.cautions.map((c) => c.code)).toEqual(['INFRARED_LOW_EMISSIVITY']);
  });

  it('when the emissivity setting itself is low, then the reading is a caution whatever the surface was called', () => {
    const v = registerVerdict(metal({ temperatureC: 40, method: 'infrared', emissivitySetting: 0.2, surfaceMaterial: 'coatedMetal' }));
    expect(v.verdict).toBe('caution');
    expect(v.cautions[0]).toMatchObject({ code: 'INFRARED_LOW_EMISSIVITY' });
    expect(v.cautions[0].message).toMatch(/ε 0\.2/);
  });

  it('when bare metal of an unstated kind is read by infrared, then a caution asks which surface it is', () => {
    const v = registerVerdict(metal({ temperatureC: 40, method: 'infrared', emissivitySetting: 0.95 }));
    expect(v.verdict).toBe('caution');
    expect(v.cautions.map((c) => c.code)).toEqual(['INFRARED_BARE_METAL_UNSTATED']);
  });

  it('when a painted surface is read by infrared, or aluminium by a contact probe, then nothing is cautioned', () => {
    expect(registerVerdict(metal({ method: 'infrared', emissivitySetting: 0.95, surfaceMaterial: 'coatedMetal', surfaceFinishId: 'painted-metal' }))).toMatchObject({ verdict: 'pass', cautions: [] });
    expect(registerVerdict(metal({ method: 'contact', surfaceFinishId: 'aluminium-polished' }))).toMatchObject({ verdict: 'pass', cautions: [] });
    expect(registerVerdict(metal({ method: 'calculated', surfaceFinishId: 'aluminium-polished' }))).toMatchObject({ verdict: 'pass', cautions: [] });
  });
});

describe('register verdict: cold surfaces', () => {
  it('when a surface is below −10 °C, then it is not judged by the hot thresholds and carries the cold-contact note', () => {
    const v = registerVerdict(metal({ temperatureC: -25 }));
    expect(v).toMatchObject({ verdict: 'caution', basis: 'cold', limitC: null, governs: null, marginK: null, source: COLD_CONTACT_NOTE });
    expect(v.cautions).toEqual([{ code: 'COLD_CONTACT', message: COLD_CONTACT_NOTE }]);
  });

  it('when a surface is at −10 °C exactly, then the hot comparison applies (and passes)', () => {
    expect(registerVerdict(metal({ temperatureC: COLD_CONTACT_BELOW_C }))).toMatchObject({ verdict: 'pass', basis: 'hot' });
  });
});

describe('register verdict: input', () => {
  it.each([
    [{ temperatureC: Number.NaN }, 'temperatureC'],
    [{ method: 'thermocouple' }, 'method'],
    [{ surfaceMaterial: 'glass' }, 'surfaceMaterial'],
    [{ emissivitySetting: 0 }, 'emissivitySetting'],
    [{ emissivitySetting: 1.2 }, 'emissivitySetting'],
    [{ contactSeconds: -5 }, 'contactSeconds'],
  ])('when %p is given, then a CalcInputError names %s', (over, field) => {
    let caught: unknown;
    try {
      registerVerdict(metal(over as Partial<RegisterReading>));
    } catch (e) {
      caught = e;
    }
    expect(caught).toBeInstanceOf(CalcInputError);
    expect((caught as CalcInputError).field).toBe(field);
  });
});
