import type { CalcCase } from '../../shared/calc/types';

import { CONTRACT_EXAMPLE_CASE } from '../../tests/helpers/contract-case';

import { caseToParam, decodeCaseParams, decodeCaseQuery, encodeCaseQuery } from './case-url';
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
