import { jobProgress } from './jobs';
import { lineKeys, listPath, normaliseFilters } from './lines';

describe('line-list requests', () => {
  it('when filters are given, then the path carries each of them and the sort with its direction', () => {
    expect(listPath(3, 'line', { q: ' HS ', purpose: 'personnelProtection', location: 'indoor', status: 'stale', sort: 'heatLoss', descending: true }, 'abc')).toBe(
      '/sites/3/lines?limit=500&cursor=abc&q=HS&purpose=personnelProtection&location=indoor&status=stale&sort=-heatLoss',
    );
    expect(listPath(3, 'vessel', {})).toBe('/sites/3/vessels?limit=500');
  });

  it('when filters differ only in blanks and defaults, then they share one cache entry', () => {
    expect(normaliseFilters({ q: '  ', sort: 'tag', descending: false })).toEqual({});
    expect(lineKeys.list(1, 'line', { q: 'x ' })).toEqual(lineKeys.list('1', 'line', { q: 'x', sort: 'tag' }));
    expect(lineKeys.list(1, 'line', {}).slice(0, 3)).toEqual(lineKeys.site(1));
  });

  it('when a job reports progress, then the bar is its share done', () => {
    expect(jobProgress({ status: 'running', done: 250, total: 1000 })).toBe(0.25);
    expect(jobProgress({ status: 'queued', done: 0, total: 0 })).toBe(0);
    expect(jobProgress({ status: 'done', done: 0, total: 0 })).toBe(1);
  });
});
