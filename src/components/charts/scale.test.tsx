import { linearScale, niceDomain, niceStep, tickFormatter } from './scale';

describe('chart scales', () => {
  it('when a span is divided into ticks, then steps are 1, 2, 2.5 or 5 times a power of ten', () => {
    expect(niceStep(100, 5)).toBe(20);
    expect(niceStep(7, 5)).toBe(2);
    expect(niceStep(0.3, 4)).toBeCloseTo(0.1, 12);
    expect(niceStep(12, 5)).toBe(2.5);
  });

  it('when a domain is widened, then it covers the data with whole steps', () => {
    const d = niceDomain(21.3, 76.4, 5);
    expect(d.min).toBeLessThanOrEqual(21.3);
    expect(d.max).toBeGreaterThanOrEqual(76.4);
    expect(d.ticks[0]).toBe(d.min);
    expect(d.ticks[d.ticks.length - 1]).toBe(d.max);
  });

  it('when all values are equal, then the domain still has a span', () => {
    const d = niceDomain(50, 50);
    expect(d.max).toBeGreaterThan(d.min);
  });

  it('when ticks are labelled, then they carry only the decimals their step needs', () => {
    expect(tickFormatter([0, 50, 100])(50)).toBe('50');
    expect(tickFormatter([0, 2.5, 5])(2.5)).toBe('2.5');
    expect(tickFormatter([0, 0.5, 1])(1)).toBe('1.0');
    expect(tickFormatter([-10, 0, 10])(-10)).toBe('−10');
  });

  it('when a value is scaled, then the ends map to the range ends', () => {
    const s = linearScale(0, 10, 100, 200);
    expect(s(0)).toBe(100);
    expect(s(10)).toBe(200);
    expect(s(5)).toBe(150);
  });
});
