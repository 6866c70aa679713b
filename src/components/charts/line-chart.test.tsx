import { render, screen } from '@testing-library/react';

import { LineChart } from './line-chart';

describe('LineChart', () => {
  it('when drawn, then screen readers get the title and a summary in words', () => {
    render(
      <LineChart
        title="Surface temperature against thickness"
        xLabel="Thickness (mm)"
        yLabel="Surface (°C)"
        series={[{ id: 's', points: [{ x: 20, y: 80 }, { x: 100, y: 40 }] }]}
        limit={{ y: 55, label: 'limit 55.0 °C', tone: 'heat' }}
        marker={{ x: 60, y: 50, label: '60 mm: 50.0 °C' }}
        summary="From 80.0 °C at 20 mm to 40.0 °C at 100 mm."
        testID="chart"
      />,
    );
    expect(screen.getByRole('img').getAttribute('aria-label')).toBe('Surface temperature against thickness. From 80.0 °C at 20 mm to 40.0 °C at 100 mm.');
    expect(screen.getByTestId('chart-summary').textContent).toBe('From 80.0 °C at 20 mm to 40.0 °C at 100 mm.');
  });
});
