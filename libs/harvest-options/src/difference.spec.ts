import { difference } from './difference';

describe('difference (option − baseline, METHODS.md §11)', () => {
  it('subtracts every number, key by key, through maps and arrays', () => {
    expect(difference({ tst: 10, levels: [1, 2], map: { a: { b: 3 } } }, { tst: 12.5, levels: [0.5, 4], map: { a: { b: 1 } } })).toEqual({
      tst: 2.5,
      levels: [-0.5, 2],
      map: { a: { b: -2 } },
    });
  });

  it('counts a key present on one side only as 0 there: a new fleet, a flow that disappears', () => {
    const before = { fleets: { trawl: { catch: 5, value: 10 } }, flows: { a: { b: 2 } } };
    const after = { fleets: { trawl: { catch: 4, value: 8 }, line: { catch: 3, value: 6 } }, flows: {} };
    expect(difference(before, after)).toEqual({
      fleets: { trawl: { catch: -1, value: -2 }, line: { catch: 3, value: 6 } },
      flows: { a: { b: -2 } },
    });
  });

  it('gives null where a side is null, and for the mean trophic level of a fleet present on one side only', () => {
    const before = { meanTrophicLevelOfCatch: null, fleets: { trawl: { catch: 2, meanTrophicLevelOfCatch: 3.1 } } };
    const after = { meanTrophicLevelOfCatch: 2.5, fleets: { line: { catch: 1, meanTrophicLevelOfCatch: 2 } } };
    expect(difference(before, after)).toEqual({
      meanTrophicLevelOfCatch: null,
      fleets: { trawl: { catch: -2, meanTrophicLevelOfCatch: null }, line: { catch: 1, meanTrophicLevelOfCatch: null } },
    });
  });

  it('leaves out non-numeric fields and cycle listings', () => {
    const before = { unit: 'g', fitness: { side: 'constraint', shareOfPeak: 0.9 }, warnings: ['x'], cycles: { capped: false, count: 5, nexuses: [{ weakArc: { value: 1 } }] } };
    const after = { unit: 'g', fitness: { side: 'flexibility', shareOfPeak: 0.95 }, warnings: [], cycles: { capped: true, count: 4, nexuses: [] } };
    const d = difference(before, after);
    expect(d).toEqual({ fitness: { shareOfPeak: expect.closeTo(0.05, 12) }, cycles: { count: -1 } });
  });
});
