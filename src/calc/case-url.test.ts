import type { CalcCase } from '../../shared/calc/types';

import { CONTRACT_EXAMPLE_CASE } from '../../tests/helpers/contract-case';

import { caseToParam, decodeCaseParams, decodeCaseQuery, encodeCaseQuery } from './case-url';
import { materialById } from './library';
import { defaultDraft, draftFromCase, draftOptions, draftToCase } from './quick-case';

const example: CalcCase = CONTRACT_EXAMPLE_CASE;

describe('shared links', () => {
  it('when a case is encoded and decoded, then the same SI case comes back', () => {
    const decoded = decodeCaseQuery(`?${encodeCaseQuery(example, { mode: 'size' })}`);
    expect(decoded).toEqual({ kind: 'ok', case: example, options: { mode: 'size' } });
  });

  it('when a case is encoded, then the JSON is compact and every number reads back exactly', () => {
    const c = { ...example, processTemperatureC: 0.1 + 0.2, geometry: { ...example.geometry, heightM: undefined } };
    const p = caseToParam(c);
    expect(p).not.toMatch(/\s/);
    expect(p).not.toContain('heightM');
    expect((JSON.parse(p) as CalcCase).processTemperatureC).toBe(0.1 + 0.2);
  });

  it('when there is no case parameter, then nothing is decoded', () => {
    expect(decodeCaseQuery('?foo=1')).toEqual({ kind: 'none' });
  });

  it('when the case is not JSON, then the reader is told', () => {
    expect(decodeCaseParams('{oops')).toEqual({ kind: 'invalid', message: expect.stringContaining('not valid JSON') });
  });

  it('when a field has the wrong type, then the message names the field', () => {
    const bad = JSON.stringify({ ...example, processTemperatureC: 'hot' });
    const r = decodeCaseParams(bad);
    expect(r.kind).toBe('invalid');
    expect(r.kind === 'invalid' && r.message).toContain('processTemperatureC');
  });

  it('when the geometry type is unknown, then the message names it', () => {
    const bad = JSON.stringify({ ...example, geometry: { type: 'cone' } });
    const r = decodeCaseParams(bad);
    expect(r.kind === 'invalid' && r.message).toContain('geometry.type');
  });

  it('when every geometry and purpose goes draft → case → link → draft → case, then the case is unchanged', () => {
    for (const kind of ['pipe', 'vessel', 'wall'] as const) {
      for (const purpose of ['personnel', 'conservation', 'condensation', 'holding', 'frost'] as const) {
        for (const mode of ['size', 'check'] as const) {
          const d = { ...defaultDraft(), kind, purpose, mode };
          const c = draftToCase(d);
          const decoded = decodeCaseQuery(encodeCaseQuery(c, draftOptions(d)));
          if (decoded.kind !== 'ok') throw new Error('decode failed');
          const again = draftFromCase(decoded.case, decoded.options);
          expect(draftToCase(again)).toEqual(c);
          expect(again.purpose).toBe(purpose);
          expect(again.mode).toBe(mode);
          expect(again.kind).toBe(kind);
        }
      }
    }
  });
});

describe('library materials in a case', () => {
  it('when a draft uses a library material as chosen, then the case carries its lower limit and table range, and a link brings the material back', () => {
    const d = defaultDraft();
    const c = draftToCase(d);
    const layer = c.layers[0];
    expect(layer.minServiceTemperatureC).toBe(-18);
    expect(layer.conductivityDataRangeC?.[0]).toBeCloseTo(37.78, 2); // 100 °F, the table's first row
    const back = decodeCaseQuery(`?${encodeCaseQuery(c, draftOptions(d))}`);
    expect(back.kind).toBe('ok');
    if (back.kind === 'ok') expect(draftFromCase(back.case, back.options).layers[0].materialId).toBe(d.layers[0].materialId);
  });

  it('when the curve of a library material is edited, then the case no longer claims the material’s table range', () => {
    const d = defaultDraft();
    d.layers[0] = { ...d.layers[0], conductivity: [0.05, 0.0001] };
    const layer = draftToCase(d).layers[0];
    expect(layer.conductivityDataRangeC).toBeUndefined();
    expect(layer.minServiceTemperatureC).toBeUndefined();
  });

  it('when a link carries a malformed table range, then the message names the field', () => {
    const bad = JSON.stringify({ ...example, layers: [{ ...example.layers[0], conductivityDataRangeC: [1, 2, 3] }] });
    const r = decodeCaseParams(bad);
    expect(r.kind === 'invalid' && r.message).toContain('conductivityDataRangeC');
  });
});

describe('material provenance line', () => {
  it('when a material is offered, then its line names the specification and says whether the table was checked', () => {
    expect(materialById('cellular-glass-c552-grade-6')?.provenance).toMatch(/^k\(T\) from ASTM C552.*checked against a published chart/);
    expect(materialById('mineral-fibre-pipe-c547-type-i')?.provenance).toMatch(/recalled, not checked/);
  });
});
