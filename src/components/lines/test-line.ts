import type { Line } from '../../api/types';

/** An invented NPS 4 line of the shape GET /lines/:id answers, for tests of the line-list screens. */
export function testLine(patch: Partial<Line> = {}): Line {
  return {
    id: 1,
    siteId: 1,
    tag: 'L-1',
    service: '',
    sizeGivenAs: 'nps',
    nps: '4',
    dn: 100,
    outerDiameterM: 0.1143,
    orientation: 'horizontal',
    heightM: null,
    lengthM: 80,
    operatingTemperatureC: 250,
    location: 'outdoor',
    purposes: ['personnelProtection', 'heatConservation'],
    purposeParameters: {},
    fittings: { valves: 1, flanges: 2, elbows: 0, tees: 0 },
    fittingsInsulated: true,
    buildUp: null,
    notes: '',
    version: 1,
    createdAt: '2026-12-01T00:00:00Z',
    updatedAt: '2026-12-01T00:00:00Z',
    sizing: null,
    ...patch,
  };
}
