import fc from 'fast-check';
import { SCALAR_INDICATORS } from '@seinework/contracts';
import { comparedIndicators } from './compared-indicators';
import { adjustmentProblems } from './engine-problems';

const finite = fc.double({ noNaN: true, noDefaultInfinity: true, min: -1e6, max: 1e6 });
const sortedBand = fc.tuple(finite, finite, finite).map((xs) => [...xs].sort((a, b) => a - b) as [number, number, number]);

describe('comparedIndicators', () => {
  it('marks a difference exactly when its 5–95 % band excludes zero, and the band is the stored one', () => {
    fc.assert(
      fc.property(fc.array(fc.option(sortedBand, { nil: undefined }), { minLength: 2, maxLength: 6 }), finite, (bands, before) => {
        const results = bands.map((band, i) => ({
          runId: `run-${i}`,
          result: {
            baseline: { totalCatch: before },
            option: { totalCatch: before + i },
            difference: { totalCatch: i },
            ...(band ? { uncertainty: { indicators: { totalCatch: { difference: { p5: band[0], median: band[1], p95: band[2] } } } } } : {}),
          },
        }));
        const totalCatch = comparedIndicators(results).find((c) => c.key === 'totalCatch')!;
        expect(totalCatch.baseline).toBe(before);
        totalCatch.values.forEach((value, i) => {
          const band = bands[i];
          expect(value.runId).toBe(`run-${i}`);
          expect(value.band).toEqual(band ? { p5: band[0], median: band[1], p95: band[2] } : null);
          expect(value.exceedsUncertainty).toBe(band !== undefined && (band[0] > 0 || band[2] < 0));
        });
      }),
    );
  });

  it('lists every scalar indicator of METHODS.md §11 and Fishing-in-Balance, null where a document lacks one', () => {
    const compared = comparedIndicators([
      { runId: 'a', result: {} },
      { runId: 'b', result: { baseline: { tst: 'not a number' }, option: null } },
    ]);
    expect(compared.map((c) => c.key)).toEqual([...SCALAR_INDICATORS, 'fishingInBalance']);
    for (const indicator of compared) {
      expect(indicator.baseline).toBeNull();
      for (const value of indicator.values) expect(value).toMatchObject({ after: null, difference: null, band: null, exceedsUncertainty: false });
    }
  });
});

describe('adjustmentProblems', () => {
  it('places every problem naming adjustments[i] (or the path adjustments.i) against adjustment i, the others against none', () => {
    fc.assert(
      fc.property(fc.nat({ max: 500 }), fc.string(), (i, why) => {
        expect(adjustmentProblems([`adjustments[${i}] (close-fleet "x"): ${why}`])).toEqual([{ adjustment: i, problem: `adjustments[${i}] (close-fleet "x"): ${why}` }]);
        expect(adjustmentProblems([`adjustments.${i}.percent: ${why}`])[0]!.adjustment).toBe(i);
        expect(adjustmentProblems([`option: adjustments.${i}.fleet: ${why}`])[0]!.adjustment).toBe(i);
        expect(adjustmentProblems([`catch of "x" by fleet "y" (kept at its baseline): ${why}`])[0]!.adjustment).toBeNull();
      }),
    );
  });
});
