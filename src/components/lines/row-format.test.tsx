import { render, screen } from '@testing-library/react';

import type { ItemSizingSummary, Line, Vessel } from '../../api/types';

import { StatusMark } from './item-rows';
import { formatRow, listTemperature, rowStatus } from './row-format';
import { testLine } from './test-line';

const sizing = (patch: Partial<ItemSizingSummary> = {}): ItemSizingSummary => ({
  governingPurpose: 'personnelProtection',
  layersM: [0.0508],
  totalThicknessM: 0.0508,
  heatLossWPerM: 43.10843661239554,
  heatLossW: 504.3687083650278,
  surfaceTemperatureC: 56.56,
  burnVerdict: 'pass',
  annualEnergyKWh: 4034.9,
  failing: [],
  stale: false,
  sizedAt: '2026-12-03T11:27:35.220Z',
  ...patch,
});

const line = (patch: Partial<Line> = {}): Line =>
  testLine({
    tag: '1"-BD-2197',
    service: 'Blowdown',
    nps: '1',
    dn: 25,
    outerDiameterM: 0.0334,
    lengthM: 8.7,
    operatingTemperatureC: 190.4,
    location: 'indoor',
    purposes: ['heatConservation', 'personnelProtection'],
    fittings: { valves: 0, flanges: 0, elbows: 0, tees: 0 },
    sizing: sizing(),
    ...patch,
  });

describe('list row formatting', () => {
  it('when a sized line is shown in SI, then temperatures are whole degrees, thickness whole millimetres and heat loss three figures', () => {
    const cells = formatRow(line(), 'line', 'SI');
    expect(cells).toMatchObject({
      size: 'NPS 1',
      length: '8.70 m',
      temperature: '190 °C',
      location: 'Indoor',
      purposes: 'Conservation, Personnel',
      governing: 'Personnel',
      thickness: '51 mm',
      heatLoss: '43.1 W/m',
      surface: '57 °C',
    });
    expect(cells.status).toMatchObject({ state: 'current', word: 'Sized', icon: 'pass' });
  });

  it('when the same line is shown in US units, then thickness is in eighths of an inch and heat loss per foot', () => {
    const cells = formatRow(line(), 'line', 'US');
    expect(cells.temperature).toBe('375 °F');
    expect(cells.thickness).toBe('2 in');
    expect(cells.length).toBe('28.5 ft');
    // 43.108 W/m = 44.8 Btu/(h·ft)
    expect(cells.heatLoss).toBe('44.8 Btu/(h·ft)');
    expect(cells.surface).toBe('134 °F');
    expect(formatRow(line({ sizing: sizing({ totalThicknessM: 0.0381, layersM: [0.0381] }) }), 'line', 'US').thickness).toBe('1½ in');
  });

  it('when a line is given by DN or outside diameter, then its size says so', () => {
    expect(formatRow(line({ sizeGivenAs: 'dn' }), 'line', 'SI').size).toBe('DN 25');
    expect(formatRow(line({ sizeGivenAs: 'od', nps: null, dn: null, outerDiameterM: 0.05 }), 'line', 'SI').size).toBe('OD 50.0 mm');
  });

  it('when the build-up has two layers, then the thickness says so', () => {
    expect(formatRow(line({ sizing: sizing({ totalThicknessM: 0.16, layersM: [0.08, 0.08] }) }), 'line', 'SI').thickness).toBe('160 mm · 2 layers');
  });

  it('when a cold line gains heat, then the row says gain, not a negative loss', () => {
    expect(formatRow(line({ sizing: sizing({ heatLossWPerM: -12.34 }) }), 'line', 'SI').heatLoss).toBe('12.3 W/m gain');
  });

  it('when a vessel is shown, then its heat flow is for the whole vessel and its size is the diameter', () => {
    const v = { ...line(), diameterM: 2.2, headType: 'ellipsoidal2to1', sizing: sizing({ heatLossWPerM: undefined, heatLossW: 5305.1 }) } as unknown as Vessel;
    const cells = formatRow(v, 'vessel', 'SI');
    expect(cells.size).toBe('Ø 2.20 m');
    expect(cells.heatLoss).toBe('5,310 W');
  });

  it('when an item is unsized, stale or failing, then the state is a word and an icon, stale first', () => {
    expect(rowStatus(line({ sizing: null }))).toMatchObject({ state: 'unsized', word: 'Not sized', icon: 'info' });
    expect(rowStatus(line({ sizing: sizing({ stale: true, failing: ['heatConservation'] }) }))).toMatchObject({ state: 'stale', word: 'Stale', icon: 'caution', detail: 'fails conservation' });
    expect(rowStatus(line({ sizing: sizing({ failing: ['personnelProtection', 'heatConservation'] }) }))).toMatchObject({ state: 'failing', word: 'Fails', icon: 'fail', detail: 'personnel, conservation' });
    expect(formatRow(line({ sizing: null }), 'line', 'SI')).toMatchObject({ thickness: '—', heatLoss: '—', surface: '—' });
  });

  it('when the state is drawn, then its word is in the text, not only its colour', () => {
    render(<StatusMark status={rowStatus(line({ sizing: sizing({ stale: true }) }))} testID="mark" />);
    expect(screen.getByTestId('mark').textContent).toBe('Stale');
  });

  it('when a temperature is missing, then a dash stands in', () => {
    expect(listTemperature(null, 'SI')).toBe('—');
    expect(listTemperature(-0.4, 'SI')).toBe('0 °C');
    expect(listTemperature(-10.6, 'SI')).toBe('−11 °C');
  });
});
