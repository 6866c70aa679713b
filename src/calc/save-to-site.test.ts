import { sizingLibrary } from '../../shared/calc/sizing/library';
import { toSizingSettings } from '../../shared/calc/sizing/settings';
import { sizeItem } from '../../shared/calc/sizing/size-item';
import type { SizingContext, SizingItem } from '../../shared/calc/sizing/types';
import type { LineCreateInput, VesselCreateInput } from '../../shared/schemas/lines';

import { materialById, pipeSizes } from './library';
import { defaultDraft, PURPOSE_TRADE_TERMS, type Draft, type PurposeId } from './quick-case';
import { LINE_LIST_PURPOSE, nearestLibraryFinish, nearestLibraryMaterial, saveFieldOf, saveToSiteBody, saveableKind } from './save-to-site';

const draft = (patch: Partial<Draft> = {}): Draft => ({ ...defaultDraft(), ...patch });
const choices = { tag: 'QS-100', service: 'LP steam', lengthM: 80 };
const MINERAL = 'mineral-fibre-pipe-c547-type-i';
const CALSIL = 'calcium-silicate-c533-type-i';

/** A custom layer: a library curve whose service limit was edited, so it no longer matches the library entry. */
function customLayer(id: string, thicknessM: number | null = 0.05) {
  const m = materialById(id)!;
  return { materialId: 'custom', conductivity: [...m.conductivity], maxServiceTemperatureC: 400, thicknessM };
}

describe('quick-sizing purposes as line-list purposes', () => {
  it('when each quick-sizing purpose is mapped, then it is the line list’s name of the same trade term', () => {
    expect(LINE_LIST_PURPOSE).toEqual({
      personnel: 'personnelProtection',
      conservation: 'heatConservation',
      condensation: 'condensationControl',
      holding: 'temperatureHolding',
      frost: 'frostProtection',
    });
    const camel = (s: string) => s.replace(/ (\w)/g, (_, c: string) => c.toUpperCase());
    // "process temperature holding" is the line list's temperatureHolding; the other trade terms read alike.
    for (const id of ['personnel', 'conservation', 'condensation', 'frost'] as PurposeId[]) expect(LINE_LIST_PURPOSE[id]).toBe(camel(PURPOSE_TRADE_TERMS[id]));
  });
});

describe('saveToSiteBody: geometry', () => {
  it('when a pipe given by NPS is saved, then the body names the NPS, not a diameter, and the schema accepts it', () => {
    const m = saveToSiteBody(draft(), choices);
    expect(m.problems).toEqual([]);
    expect(m.itemKind).toBe('line');
    expect(m.body).toEqual({
      tag: 'QS-100',
      service: 'LP steam',
      nps: '4',
      orientation: 'horizontal',
      lengthM: 80,
      operatingTemperatureC: 180,
      location: 'indoor',
      purposes: ['personnelProtection'],
      buildUp: { layers: [{ materialId: MINERAL }], finishId: 'aluminium-oxidised' },
    });
  });

  it('when a pipe is given by DN, then the body names the DN of that size', () => {
    const dn150 = pipeSizes.find((p) => p.dn === 150)!;
    const body = saveToSiteBody(draft({ pipeSizeBy: 'dn', pipeOuterDiameterM: dn150.outerDiameterM }), choices).body as LineCreateInput;
    expect(body.dn).toBe(150);
    expect(body).not.toHaveProperty('nps');
    expect(body).not.toHaveProperty('outerDiameterM');
  });

  it('when a pipe is given by its outside diameter, then the body carries that diameter in metres', () => {
    const body = saveToSiteBody(draft({ pipeSizeBy: 'od', pipeOuterDiameterM: 0.2 }), choices).body as LineCreateInput;
    expect(body.outerDiameterM).toBe(0.2);
    expect(body).not.toHaveProperty('nps');
    expect(body).not.toHaveProperty('dn');
  });

  it('when the pipe runs vertically, then its vertical run goes with it', () => {
    const body = saveToSiteBody(draft({ pipeOrientation: 'vertical', pipeHeightM: 12 }), choices).body as LineCreateInput;
    expect(body).toMatchObject({ orientation: 'vertical', heightM: 12 });
  });

  it('when a vessel is saved, then it carries the shell diameter, shell length, axis and heads, and needs no length choice', () => {
    const m = saveToSiteBody(draft({ kind: 'vessel', vesselDiameterM: 2.5, vesselLengthM: 7, vesselOrientation: 'horizontal', headType: 'hemispherical' }), { tag: 'V-1' });
    expect(m.problems).toEqual([]);
    expect(m.itemKind).toBe('vessel');
    expect(m.body).toEqual({
      tag: 'V-1',
      diameterM: 2.5,
      lengthM: 7,
      orientation: 'horizontal',
      headType: 'hemispherical',
      operatingTemperatureC: 180,
      location: 'indoor',
      purposes: ['personnelProtection'],
      buildUp: { layers: [{ materialId: MINERAL }], finishId: 'aluminium-oxidised' },
    });
  });

  it('when the case is a wall, then nothing is saved and the reason is that walls are not line-list items', () => {
    const m = saveToSiteBody(draft({ kind: 'wall' }), choices);
    expect(m.itemKind).toBeNull();
    expect(m.body).toBeNull();
    expect(m.problems).toEqual([expect.objectContaining({ field: 'kind', code: 'NOT_A_LINE_LIST_ITEM' })]);
    expect(saveableKind('wall')).toMatchObject({ itemKind: null, reason: expect.stringMatching(/not a line-list item/) });
    expect(saveableKind('pipe')).toEqual({ itemKind: 'line' });
  });
});

describe('saveToSiteBody: every purpose with its limit', () => {
  it('when the purpose is personnel protection, then no limit is sent and the typed limit is reported as left to the site’s touch basis', () => {
    const m = saveToSiteBody(draft({ purpose: 'personnel', maxSurfaceC: 50 }), choices);
    expect(m.body).not.toHaveProperty('purposeParameters');
    expect(m.leftBehind).toEqual(expect.arrayContaining([{ code: 'touchLimit', valueSI: 50 }, { code: 'contact' }, { code: 'conditions' }, { code: 'series' }]));
    expect(m.leftBehind).not.toContainEqual({ code: 'coldPersonnel' });
  });

  it('when personnel protection is saved for a cold service, then it says the line list does not size it there', () => {
    const m = saveToSiteBody(draft({ purpose: 'personnel', processTemperatureC: -20 }), choices);
    expect(m.leftBehind).toContainEqual({ code: 'coldPersonnel' });
  });

  it('when the purpose is heat conservation of a pipe, then its limit per metre goes with it', () => {
    const m = saveToSiteBody(draft({ purpose: 'conservation', maxHeatLossWPerM: 42 }), choices);
    expect(m.body).toMatchObject({ purposes: ['heatConservation'], purposeParameters: { heatConservation: { maxHeatLossWPerM: 42 } } });
  });

  it('when the purpose is heat conservation of a vessel, then its limit for the whole vessel goes with it', () => {
    const m = saveToSiteBody(draft({ kind: 'vessel', purpose: 'conservation', maxHeatLossW: 3000 }), { tag: 'V-2' });
    expect(m.body).toMatchObject({ purposes: ['heatConservation'], purposeParameters: { heatConservation: { maxHeatLossW: 3000 } } });
    expect((m.body as VesselCreateInput).purposeParameters?.heatConservation).not.toHaveProperty('maxHeatLossWPerM');
  });

  it('when the choices are not made yet, then what would be saved is still there to show, limit included', () => {
    const m = saveToSiteBody(draft({ purpose: 'conservation', maxHeatLossWPerM: 42 }), { tag: '' });
    expect(m.body).toBeNull();
    expect(m.proposed).toMatchObject({ nps: '4', purposes: ['heatConservation'], purposeParameters: { heatConservation: { maxHeatLossWPerM: 42 } } });
  });

  it('when heat conservation has no limit, then the site’s rule applies and it says so', () => {
    const m = saveToSiteBody(draft({ purpose: 'conservation', maxHeatLossWPerM: null }), choices);
    expect(m.body).not.toHaveProperty('purposeParameters');
    expect(m.leftBehind).toContainEqual({ code: 'heatLimitRule' });
  });

  it('when the purpose is condensation control, then the margin is left to the site’s condensation basis', () => {
    const m = saveToSiteBody(draft({ purpose: 'condensation', processTemperatureC: 5, condensationMarginK: 3 }), choices);
    expect(m.body).toMatchObject({ purposes: ['condensationControl'], operatingTemperatureC: 5 });
    expect(m.body).not.toHaveProperty('purposeParameters');
    expect(m.leftBehind).toContainEqual({ code: 'condensationMargin', valueSI: 3 });
  });

  it('when the purpose is process temperature holding, then the run’s flow, specific heat and drop go with it and the run’s length is the line’s', () => {
    const m = saveToSiteBody(draft({ purpose: 'holding', runLengthM: 350, massFlowKgPerS: 0.8, specificHeatJPerKgK: 2100, maxChangeK: 4 }), { ...choices, lengthM: 80 });
    expect(m.problems).toEqual([]);
    expect(m.body).toMatchObject({
      lengthM: 350,
      purposes: ['temperatureHolding'],
      purposeParameters: { temperatureHolding: { massFlowKgPerS: 0.8, specificHeatJPerKgK: 2100, maxChangeK: 4 } },
    });
  });

  it('when the purpose is frost protection, then the minimum hours and the standing-water data go with it', () => {
    const m = saveToSiteBody(draft({ purpose: 'frost', processTemperatureC: 10, minHours: 8, innerDiameterM: 0.0525, pipeMassKgPerM: 5.44 }), choices);
    expect(m.body).toMatchObject({
      operatingTemperatureC: 10,
      purposes: ['frostProtection'],
      purposeParameters: { frostProtection: { minHours: 8, innerDiameterM: 0.0525, pipeMassKgPerM: 5.44 } },
    });
  });

  it('when a vessel carries a purpose worked out along a pipe, then it is refused at the purpose', () => {
    const m = saveToSiteBody(draft({ kind: 'vessel', purpose: 'holding' }), { tag: 'V-3' });
    expect(m.body).toBeNull();
    expect(m.problems.map((p) => p.code)).toEqual(['PURPOSE_LINES_ONLY']);
  });
});

describe('saveToSiteBody: build-up', () => {
  it('when the outer layer is sized, then inner layers keep their thickness and the outer one has none', () => {
    const layers = [
      { ...customLayer(CALSIL, 0.04), materialId: CALSIL, maxServiceTemperatureC: materialById(CALSIL)!.maxServiceTemperatureC ?? null },
      { ...defaultDraft().layers[0], thicknessM: 0.05 },
    ];
    const body = saveToSiteBody(draft({ layers, finishId: 'stainless-steel' }), choices).body as LineCreateInput;
    expect(body.buildUp).toEqual({ layers: [{ materialId: CALSIL, thicknessM: 0.04 }, { materialId: MINERAL }], finishId: 'stainless-steel' });
  });

  it('when the case checks a build-up, then the whole build-up is saved as existing insulation with every thickness', () => {
    const m = saveToSiteBody(draft({ mode: 'check' }), choices);
    expect(m.fixed).toBe(true);
    expect((m.body as LineCreateInput).buildUp).toEqual({ layers: [{ materialId: MINERAL, thicknessM: 0.05 }], finishId: 'aluminium-oxidised', fixed: true });
  });

  it('when a layer has a custom k(T), then it is refused at that layer until a library or team material stands in', () => {
    const d = draft({ layers: [customLayer(CALSIL)] });
    const refused = saveToSiteBody(d, choices);
    expect(refused.body).toBeNull();
    expect(refused.problems).toEqual([expect.objectContaining({ field: 'layers[0].materialId', code: 'CUSTOM_MATERIAL' })]);
    expect(refused.problems[0].message).toMatch(/custom k\(T\).*library.*team material/);
    // A made-up id is no stand-in.
    expect(saveToSiteBody(d, { ...choices, materialFor: { 0: 'made-up' } }).problems.map((p) => p.code)).toEqual(['CUSTOM_MATERIAL']);
    const library = saveToSiteBody(d, { ...choices, materialFor: { 0: CALSIL } });
    expect((library.body as LineCreateInput).buildUp?.layers).toEqual([{ materialId: CALSIL }]);
    const team = saveToSiteBody(d, { ...choices, materialFor: { 0: 'team-material-7' } });
    expect((team.body as LineCreateInput).buildUp?.layers).toEqual([{ materialId: 'team-material-7' }]);
  });

  it('when the finish has a custom emissivity, then it is refused until a library or team finish stands in', () => {
    const d = draft({ finishId: 'custom', emissivity: 0.85 });
    expect(saveToSiteBody(d, choices).problems).toEqual([expect.objectContaining({ field: 'finishId', code: 'CUSTOM_FINISH' })]);
    expect((saveToSiteBody(d, { ...choices, finishFor: 'painted-metal' }).body as LineCreateInput).buildUp?.finishId).toBe('painted-metal');
    expect((saveToSiteBody(d, { ...choices, finishFor: 'team-finish-2' }).body as LineCreateInput).buildUp?.finishId).toBe('team-finish-2');
  });

  it('when a custom curve is a library curve with another service limit, then that library material is the nearest', () => {
    const d = draft({ processTemperatureC: 300 });
    expect(nearestLibraryMaterial(customLayer(CALSIL), d)?.id).toBe(CALSIL);
    expect(nearestLibraryMaterial({ conductivity: [0.04, null] }, d)).toBeUndefined();
  });

  it('when a custom emissivity is given, then the finish with the nearest typical emissivity is offered', () => {
    expect(nearestLibraryFinish(0.16)?.id).toBe('aluminium-oxidised');
    expect(nearestLibraryFinish(0.78)?.id).toBe('carbon-steel-oxidised');
    expect(nearestLibraryFinish(null)).toBeUndefined();
  });
});

describe('saveToSiteBody: choices and the server’s rules', () => {
  it('when the case has wind, then the location must be chosen; in still air the item is indoor', () => {
    const windy = draft({ windSpeedMS: 4 });
    expect(saveToSiteBody(windy, choices).problems).toEqual([expect.objectContaining({ field: 'location', code: 'REQUIRED' })]);
    expect(saveToSiteBody(windy, { ...choices, location: 'outdoor' }).body).toMatchObject({ location: 'outdoor' });
    expect(saveToSiteBody(windy, { ...choices, location: 'indoor' }).body).toMatchObject({ location: 'indoor' });
    expect(saveToSiteBody(draft({ windSpeedMS: 0 }), { ...choices, location: 'outdoor' }).body).toMatchObject({ location: 'indoor' });
  });

  it('when the tag or the length is missing, then each is a problem at its field', () => {
    const m = saveToSiteBody(draft(), { tag: '  ', lengthM: null });
    expect(m.body).toBeNull();
    expect(m.problems.map((p) => [saveFieldOf(p.field), p.message])).toEqual([
      ['length', expect.stringMatching(/line’s length/)],
      ['tag', 'Tag is required'],
    ]);
  });

  it('when a case value is outside what a line list accepts, then the shared schema’s message names it and it belongs to the case', () => {
    const m = saveToSiteBody(draft({ processTemperatureC: 1100 }), choices);
    expect(m.problems).toEqual([{ field: 'operatingTemperatureC', code: 'VALIDATION_FAILED', message: 'Operating temperature must be at most 1000 °C' }]);
    expect(saveFieldOf('operatingTemperatureC')).toBe('case');
  });

  it('when the server names a field, then it lands at the choice it is about', () => {
    expect(saveFieldOf('tag')).toBe('tag');
    expect(saveFieldOf('lengthM')).toBe('length');
    expect(saveFieldOf('buildUp.layers[1].materialId')).toBe('material-1');
    expect(saveFieldOf('buildUp.finishId')).toBe('finish');
    expect(saveFieldOf('purposeParameters.heatConservation.maxHeatLossWPerM')).toBe('case');
  });
});

describe('the saved item sizes for the same purpose', () => {
  const ctx: SizingContext = {
    bases: {
      touch: { airTemperatureC: 30, windSpeedMS: 0, contactSeconds: 5 },
      energy: { airTemperatureC: 10, windSpeedMS: 3, operatingHoursPerYear: 8000 },
      condensation: { airTemperatureC: 30, relativeHumidityPct: 80, marginK: 1 },
      winter: { airTemperatureC: -15, windSpeedMS: 5 },
    },
    settings: toSizingSettings({}),
    library: sizingLibrary(),
  };
  const itemOf = (b: LineCreateInput): SizingItem => ({
    kind: 'line',
    outerDiameterM: b.outerDiameterM ?? pipeSizes.find((p) => p.nps === b.nps)!.outerDiameterM,
    nps: b.nps ?? null,
    lengthM: b.lengthM,
    orientation: b.orientation ?? 'horizontal',
    location: b.location ?? 'outdoor',
    operatingTemperatureC: b.operatingTemperatureC,
    purposes: b.purposes,
    purposeParameters: (b.purposeParameters ?? {}) as SizingItem['purposeParameters'],
    fittings: { valves: 0, flanges: 0, elbows: 0, tees: 0 },
    fittingsInsulated: true,
  });

  it.each([
    ['personnel', { processTemperatureC: 250 }],
    ['conservation', { processTemperatureC: 250, maxHeatLossWPerM: 80 }],
    ['condensation', { processTemperatureC: 4 }],
    ['holding', { processTemperatureC: 150 }],
    ['frost', { processTemperatureC: 10 }],
  ] as [PurposeId, Partial<Draft>][])('when a %s case is saved and sized against a site, then its purpose governs', (purpose, patch) => {
    const m = saveToSiteBody(draft({ purpose, ...patch }), choices);
    expect(m.problems).toEqual([]);
    const b = m.body as LineCreateInput;
    const sized = sizeItem({ item: itemOf(b), buildUp: b.buildUp ?? null }, ctx);
    expect(sized.governingPurpose).toBe(LINE_LIST_PURPOSE[purpose]);
  });
});
