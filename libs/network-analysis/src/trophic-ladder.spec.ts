import fc from 'fast-check';
import type { Web } from '@seinework/contracts';
import cone from '../../../tests/fixtures/cone-spring.json';
import { createNetwork, networkFromJson, type Network } from './network';
import { MAX_LEVELS, trophicLadder, type LadderLevel } from './trophic-ladder';
import { trophicLevels } from './trophic-levels';
import { balancedWeb } from './testing/arbitraries';
import { balancedByRespiration } from './testing/balanced-by-respiration';

const TOLERANCE = 1e-9;

const sum = (values: readonly number[]) => values.reduce((s, v) => s + v, 0);
const outputs = (l: LadderLevel) => l.passedOn + l.returnedToDetritus + l.respired + l.exported + l.harvested;

/** A straight chain p → c1 → c2 → c3 → c4 with efficiencies 0.1, 0.1, 0.2, 0.25 and a harvest at c2. */
function chain(): Web {
  const ids = ['p', 'c1', 'c2', 'c3', 'c4'];
  return {
    name: 'chain',
    unit: 'u',
    compartments: ids.map((id, i) => ({ id, name: id, kind: i === 0 ? 'producer' : 'consumer' })),
    flows: [
      { from: 'p', to: 'c1', value: 100 },
      { from: 'c1', to: 'c2', value: 10 },
      { from: 'c2', to: 'c3', value: 2 },
      { from: 'c3', to: 'c4', value: 0.5 },
    ],
    imports: [{ to: 'p', value: 1000 }],
    exports: [{ from: 'c2', value: 3, fleet: 'line' }, { from: 'c1', value: 5 }],
    respiration: [
      { from: 'p', value: 900 },
      { from: 'c1', value: 85 },
      { from: 'c2', value: 5 },
      { from: 'c3', value: 1.5 },
      { from: 'c4', value: 0.5 },
    ],
  };
}

describe('trophicLadder', () => {
  describe('Cone Spring', () => {
    const network = networkFromJson(cone);
    const ladder = trophicLadder(network);
    const share = (id: string) => ladder.shares[network.index.get(id)!];

    // [check] METHODS.md §4 — regression targets computed from the published Cone Spring table
    // (Tilly 1968; Finn 1976, J. theor. Biol. 56:363-380) with the Lindeman aggregation of
    // Ulanowicz & Kemp 1979 (Am. Nat. 114:871-883); not published results.
    it('TE = 0.545, 0.0577, 0.0269 for levels I–III (computed from the table)', () => {
      expect(ladder.levels[0].efficiency).toBeCloseTo(0.545, 3);
      expect(ladder.levels[1].efficiency).toBeCloseTo(0.0577, 4);
      expect(ladder.levels[2].efficiency).toBeCloseTo(0.0269, 4);
    });

    it('detritivores are 96.854 % at level II (computed from the table)', () => {
      expect(share('detritivores')[1]).toBeCloseTo(0.96854, 5);
    });

    it('level I takes imports 11,819 plus returns 1,967 and passes on what detritus feeds consumers', () => {
      const [one, two] = ladder.levels;
      expect(one.input).toBeCloseTo(11184 + 635 + 1600 + 200 + 167, 9);
      expect(one.passedOn).toBeCloseTo(5205 + 2309, 9);
      // plants → detritus stays inside level I
      expect(one.returnedToDetritus).toBe(0);
      expect(one.respired).toBeCloseTo(2003 + 3109, 9);
      expect(one.exported).toBeCloseTo(300 + 860, 9);
      expect(two.input).toBeCloseTo(one.passedOn, 9);
    });

    it('has four levels, the top passing nothing on; level IV efficiency 0 makes the mean null', () => {
      expect(ladder.levels.map((l) => l.level)).toEqual([1, 2, 3, 4]);
      expect(ladder.levels[3].passedOn).toBe(0);
      expect(ladder.levels[3].efficiency).toBe(0);
      expect(ladder.meanEfficiency).toBeNull();
      expect(share('plants')).toEqual([1, 0, 0, 0]);
      expect(share('bacteria')).toEqual([0, 1, 0, 0]);
    });

    it('every level budget adds up', () => {
      for (const level of ladder.levels) expect(outputs(level)).toBeCloseTo(level.input, 9);
    });
  });

  it('a chain gives its efficiencies per level and their geometric mean over II–IV', () => {
    const ladder = trophicLadder(createNetwork(chain()));
    expect(ladder.levels.map((l) => l.efficiency)).toEqual([0.1, 0.1, 0.2, 0.25, 0]);
    expect(ladder.meanEfficiency).toBeCloseTo(Math.cbrt(0.1 * 0.2 * 0.25), 15);
    expect(ladder.levels[1].exported).toBe(5);
    expect(ladder.levels[2].harvested).toBe(3);
    expect(ladder.levels[2].exported).toBe(0);
  });

  it('a consumer fed only by imports sits at level II and its import is input to level II', () => {
    const web = chain();
    web.compartments.push({ id: 'migrant', name: 'Migrant', kind: 'consumer' });
    web.imports.push({ to: 'migrant', value: 7 });
    web.respiration.push({ from: 'migrant', value: 7 });
    const network = createNetwork(web);
    const ladder = trophicLadder(network);
    expect(ladder.shares[5]).toEqual([0, 1, 0, 0, 0]);
    expect(ladder.levels[1].input).toBe(107);
    expect(ladder.levels[1].respired).toBe(92);
  });

  it('a strong consumer cycle is cut at 20 levels, the top holding every level above', () => {
    // a takes 100 from p and 900 from b; b eats only a: TL_a = 20, TL_b = 21
    const web = balancedByRespiration('loop', { p: 'producer', a: 'consumer', b: 'consumer' }, [['p', 'a', 100], ['a', 'b', 900], ['b', 'a', 900]], { p: 200 });
    const network = createNetwork(web);
    const ladder = trophicLadder(network);
    const TL = trophicLevels(network).levels;
    expect(TL[1]).toBeCloseTo(20, 9);
    expect(ladder.levels).toHaveLength(MAX_LEVELS);
    const a = ladder.shares[1];
    expect(sum(a)).toBeCloseTo(1, 12);
    // a's share at level 2k is 0.1 · 0.9^(k−1); the top (level 20) holds 0.9^9
    expect(a[3]).toBeCloseTo(0.09, 15);
    expect(a[19]).toBeCloseTo(0.9 ** 9, 12);
    expect(sum(a.map((L, k) => (k + 1) * L))).toBeLessThan(TL[1]);
    expect(ladder.levels[19].passedOn).toBe(0);
    for (const level of ladder.levels) expect(outputs(level)).toBeCloseTo(level.input, 9);
  });

  describe('on generated webs', () => {
    const property = (check: (network: Network) => void) =>
      fc.assert(fc.property(balancedWeb({ max: 25 }), (web) => check(createNetwork(web))));

    it('Σ_k L_jk = 1, and Σ_k k·L_jk = TL_j where the shares converge within 20 levels', () => {
      property((network) => {
        const { shares, levels } = trophicLadder(network);
        const TL = trophicLevels(network).levels;
        shares.forEach((L, j) => {
          expect(Math.abs(sum(L) - 1)).toBeLessThan(TOLERANCE);
          const mean = sum(L.map((share, k) => (k + 1) * share));
          if (levels.length < MAX_LEVELS) expect(Math.abs(mean - TL[j])).toBeLessThan(TOLERANCE);
          else expect(mean).toBeLessThan(TL[j] + TOLERANCE);
        });
      });
    });

    it('each level budget adds up: input = passedOn + returned + respired + exported + harvested', () => {
      property((network) => {
        const scale = Math.max(...network.throughflow);
        for (const level of trophicLadder(network).levels) {
          expect(Math.abs(outputs(level) - level.input)).toBeLessThan(TOLERANCE * scale);
        }
      });
    });

    it('the levels together respire, export and harvest what the web does', () => {
      property((network) => {
        const { levels } = trophicLadder(network);
        const harvest = sum(network.catches.map(sum));
        const scale = Math.max(...network.throughflow);
        expect(Math.abs(sum(levels.map((l) => l.respired)) - sum(network.r))).toBeLessThan(TOLERANCE * scale);
        expect(Math.abs(sum(levels.map((l) => l.harvested)) - harvest)).toBeLessThan(TOLERANCE * scale);
        expect(Math.abs(sum(levels.map((l) => l.exported)) - (sum(network.e) - harvest))).toBeLessThan(TOLERANCE * scale);
      });
    });

    it('efficiencies lie in [0, 1] and the mean is the geometric mean of levels II–IV', () => {
      property((network) => {
        const { levels, meanEfficiency } = trophicLadder(network);
        for (const l of levels) {
          if (l.efficiency === null) continue;
          expect(l.efficiency).toBeGreaterThanOrEqual(0);
          expect(l.efficiency).toBeLessThanOrEqual(1 + TOLERANCE);
        }
        const TE = levels.slice(1, 4).map((l) => l.efficiency ?? 0);
        if (meanEfficiency === null) expect(TE.length < 3 || TE.some((e) => e <= 0)).toBe(true);
        else expect(meanEfficiency ** 3).toBeCloseTo(TE[0] * TE[1] * TE[2], 12);
      });
    });
  });
});
