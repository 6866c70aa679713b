import { QueryClient, QueryClientProvider } from '@tanstack/react-query';
import { act, fireEvent, render, screen } from '@testing-library/react';

import { fitTeamConductivity } from '../../../shared/calc/sizing/library';
import type { TeamMaterial } from '../../api/types';

import { MaterialForm } from './material-form';
import { emptyMaterialForm, fitPreview, materialFormToInput, materialToForm, type MaterialFormValues } from './material-form-model';

const datasheet: MaterialFormValues = {
  ...emptyMaterialForm(),
  name: 'Aerogel blanket, grade 10',
  source: 'Supplier datasheet AB-10, rev. C, table 2',
  points: [
    { t: '0', k: '0.0175' },
    { t: '100', k: '0.0205' },
    { t: '200', k: '0.0255' },
    { t: '', k: '' },
  ],
  minService: '-40',
  maxService: '650',
};

describe('team material fit preview', () => {
  it('when a datasheet table is typed, then the fit is the one the server stores, with its error', () => {
    const p = fitPreview(datasheet, 'SI');
    if (p.kind !== 'ok') throw new Error(`expected a fit, got ${JSON.stringify(p)}`);
    const server = fitTeamConductivity(
      [
        { meanTemperatureC: 0, conductivityWPerMK: 0.0175 },
        { meanTemperatureC: 100, conductivityWPerMK: 0.0205 },
        { meanTemperatureC: 200, conductivityWPerMK: 0.0255 },
      ],
      [-40, 650],
    );
    expect(p.fit).toEqual(server);
    // Three points on a parabola: the quadratic fit passes through them.
    expect(p.fit.degree).toBe(2);
    expect(p.fit.maxErrorPct).toBeLessThan(1e-6);
    expect(p.serviceRangeC).toEqual([-40, 650]);
  });

  it('when the same table is typed in US units, then the fit is the same in SI', () => {
    // 0, 100, 200 °C = 32, 212, 392 °F; 1 W/(m·K) = 6.93347 Btu·in/(h·ft²·°F)
    const us: MaterialFormValues = {
      ...datasheet,
      points: [
        { t: '32', k: String(0.0175 * 6.933471799) },
        { t: '212', k: String(0.0205 * 6.933471799) },
        { t: '392', k: String(0.0255 * 6.933471799) },
      ],
      minService: '-40',
      maxService: '1202',
    };
    const a = fitPreview(datasheet, 'SI');
    const b = fitPreview(us, 'US');
    if (a.kind !== 'ok' || b.kind !== 'ok') throw new Error('expected fits');
    b.fit.conductivity.forEach((c, i) => expect(c).toBeCloseTo(a.fit.conductivity[i], 9));
  });

  it('when fewer than two points are typed, then the preview says what it needs', () => {
    expect(fitPreview({ ...datasheet, points: [{ t: '20', k: '0.03' }] }, 'SI')).toEqual({ kind: 'incomplete', message: 'Type at least two points of the datasheet’s table to see the fit.' });
  });

  it('when a row is half filled or not a number, then the error names the point and the cell', () => {
    expect(fitPreview({ ...datasheet, points: [{ t: '0', k: '0.02' }, { t: '100', k: '' }] }, 'SI')).toEqual({ kind: 'error', field: 'points[1].k', message: 'Point 2: give its conductivity' });
    expect(fitPreview({ ...datasheet, points: [{ t: 'warm', k: '0.02' }, { t: '100', k: '0.03' }] }, 'SI')).toMatchObject({ kind: 'error', field: 'points[0].t' });
  });

  it('when two points share a temperature, then the fit is refused with the reason', () => {
    expect(fitPreview({ ...datasheet, points: [{ t: '50', k: '0.02' }, { t: '50', k: '0.03' }] }, 'SI')).toEqual({ kind: 'error', field: 'points', message: 'Two points have the same mean temperature.' });
  });

  it('when the body is built, then it is SI with the datasheet as its source, and the schema checks the names', () => {
    const { input, errors } = materialFormToInput(datasheet, 'SI');
    expect(errors).toEqual({});
    expect(input).toEqual({
      name: 'Aerogel blanket, grade 10',
      source: 'Supplier datasheet AB-10, rev. C, table 2',
      tablePoints: [
        { meanTemperatureC: 0, conductivityWPerMK: 0.0175 },
        { meanTemperatureC: 100, conductivityWPerMK: 0.0205 },
        { meanTemperatureC: 200, conductivityWPerMK: 0.0255 },
      ],
      minServiceTemperatureC: -40,
      maxServiceTemperatureC: 650,
    });
    expect(materialFormToInput({ ...datasheet, source: 'x' }, 'SI').errors.source).toBe('Name the datasheet the values come from');
    expect(materialFormToInput({ ...datasheet, minService: '700' }, 'SI').errors.minService).toBe('Minimum service temperature must be below the maximum');
  });

  it('when a stored material is saved untouched in US units, then its SI points go back exactly', () => {
    const stored: TeamMaterial = {
      id: 1,
      materialId: 'team-material-1',
      name: 'Aerogel blanket, grade 10',
      source: 'Supplier datasheet AB-10',
      tablePoints: [
        { meanTemperatureC: 0, conductivityWPerMK: 0.0175 },
        { meanTemperatureC: 100, conductivityWPerMK: 0.0205 },
      ],
      conductivity: [0.0175, 0.00003],
      fitMaxErrorPct: 0,
      maxServiceTemperatureC: 650,
      minServiceTemperatureC: -40,
      densityKgPerM3: null,
      notes: '',
      createdAt: '',
      updatedAt: '',
      origin: 'team',
    };
    const start = { values: materialToForm(stored, 'US'), material: stored };
    const { input } = materialFormToInput(start.values, 'US', start);
    expect(input?.tablePoints).toEqual(stored.tablePoints);
    expect(input?.maxServiceTemperatureC).toBe(650);
  });
});

describe('MaterialForm', () => {
  it('when points are typed, then the fit and its error show as they are typed', async () => {
    const client = new QueryClient({ defaultOptions: { queries: { retry: false }, mutations: { retry: false } } });
    render(
      <QueryClientProvider client={client}>
        <MaterialForm system="SI" onDone={jest.fn()} />
      </QueryClientProvider>,
    );
    expect(screen.getByTestId('fit-preview').textContent).toMatch(/at least two points/);
    const type = async (id: string, value: string) => {
      await act(async () => {
        fireEvent.change(screen.getByTestId(id), { target: { value } });
      });
    };
    await type('material-point-0-t', '0');
    await type('material-point-0-k', '0.035');
    await type('material-point-1-t', '100');
    await type('material-point-1-k', '0.05');
    expect(screen.getByTestId('fit-quality').textContent).toBe('Close fit: a straight line in temperature, largest error 0.0 %, root mean square 0.0 %.');
    await type('material-point-2-t', '200');
    await type('material-point-2-k', '0.09');
    const quality = screen.getByTestId('fit-quality').textContent ?? '';
    expect(quality).toMatch(/^Close fit: a quadratic/);
    await type('material-point-2-t', '100');
    expect(screen.getByTestId('fit-preview').textContent).toContain('Two points have the same mean temperature.');
  });
});
