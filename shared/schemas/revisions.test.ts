import { revisionNumber, revisionSchemeSchema, revisionSeries } from './revisions';

describe('revision numbers', () => {
  it('when issues for review follow one another, then they are lettered A, B … without I and O, then AA', () => {
    const trade = { kind: 'trade' } as const;
    expect([1, 2, 8, 9, 13, 14, 24].map((n) => revisionNumber(trade, 'review', n))).toEqual(['A', 'B', 'H', 'J', 'N', 'P', 'Z']);
    expect(revisionNumber(trade, 'review', 25)).toBe('AA');
    expect(revisionNumber(trade, 'review', 48)).toBe('AZ');
    expect(revisionNumber(trade, 'review', 49)).toBe('BA');
  });

  it('when issues for construction follow one another, then they count from 0, in their own series', () => {
    const trade = { kind: 'trade' } as const;
    expect([1, 2, 11].map((n) => revisionNumber(trade, 'construction', n))).toEqual(['0', '1', '10']);
    expect(revisionSeries(trade, 'review')).not.toBe(revisionSeries(trade, 'construction'));
  });

  it("when the site uses its own counter, then every issue shares it, with the prefix and padding", () => {
    const own = { kind: 'counter', prefix: 'P-', start: 1, digits: 2 } as const;
    expect(revisionNumber(own, 'review', 1)).toBe('P-01');
    expect(revisionNumber(own, 'construction', 12)).toBe('P-12');
    expect(revisionNumber({ kind: 'counter', prefix: '', start: 100, digits: 1 }, 'review', 3)).toBe('102');
    expect(revisionSeries(own, 'review')).toBe(revisionSeries(own, 'construction'));
  });

  it('when a scheme is validated, then a counter needs its prefix, start and digits, within bounds', () => {
    expect(revisionSchemeSchema.isValidSync({ kind: 'trade' })).toBe(true);
    expect(revisionSchemeSchema.isValidSync({ kind: 'counter', prefix: '', start: 0, digits: 1 })).toBe(true);
    expect(revisionSchemeSchema.isValidSync({ kind: 'counter', start: 1, digits: 2 })).toBe(false);
    expect(revisionSchemeSchema.isValidSync({ kind: 'counter', prefix: 'P-', start: 1, digits: 9 })).toBe(false);
    expect(revisionSchemeSchema.isValidSync({ kind: 'letters' })).toBe(false);
  });
});
