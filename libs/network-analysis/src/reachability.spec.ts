import fc from 'fast-check';
import { transpose } from './linear-algebra';
import { downstreamOf, upstreamOf } from './reachability';

// 0 → 1 → 2, 3 → 2, 4 alone
const T = [
  [0, 5, 0, 0, 0],
  [0, 0, 5, 0, 0],
  [0, 0, 0, 0, 0],
  [0, 0, 1, 0, 0],
  [0, 0, 0, 0, 0],
];

describe('reachability along positive flows', () => {
  it('downstream of 0 is 0, 1 and 2; upstream of 2 is everything but 4', () => {
    expect(downstreamOf(T, [true, false, false, false, false])).toEqual([true, true, true, false, false]);
    expect(upstreamOf(T, [false, false, true, false, false])).toEqual([true, true, true, true, false]);
  });

  it('upstream along T is downstream along Tᵀ, seeds always included, and reaching is closed under flows', () => {
    const square = fc.integer({ min: 1, max: 8 }).chain((n) =>
      fc.tuple(
        fc.array(fc.array(fc.constantFrom(0, 0, 1), { minLength: n, maxLength: n }), { minLength: n, maxLength: n }),
        fc.array(fc.boolean(), { minLength: n, maxLength: n }),
      ),
    );
    fc.assert(
      fc.property(square, ([flows, seeds]) => {
        const down = downstreamOf(flows, seeds);
        expect(upstreamOf(flows, seeds)).toEqual(downstreamOf(transpose(flows), seeds));
        seeds.forEach((seed, i) => seed && expect(down[i]).toBe(true));
        flows.forEach((row, i) => row.forEach((t, j) => down[i] && t > 0 && expect(down[j]).toBe(true)));
      }),
    );
  });
});
