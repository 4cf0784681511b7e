import { createNetwork, imbalances } from '@seinework/network-analysis';
import type { Web } from '@seinework/contracts';
import demo from '../../../../../seeds/brannock-bay.json';
import { compartmentBalances } from './imbalance';

const small: Web = {
  name: 'Two boxes',
  unit: 'g C m-2 y-1',
  compartments: [
    { id: 'p', name: 'Plankton', kind: 'producer' },
    { id: 'f', name: 'Fish', kind: 'consumer' },
  ],
  flows: [{ from: 'p', to: 'f', value: 40 }],
  imports: [{ to: 'p', value: 100 }],
  exports: [{ from: 'f', value: 5, fleet: 'Seine' }],
  respiration: [
    { from: 'p', value: 60 },
    { from: 'f', value: 30 },
  ],
};

describe('compartmentBalances', () => {
  it('adds imports and inflows against exports, respiration and outflows', () => {
    const [plankton, fish] = compartmentBalances(small);
    expect(plankton).toMatchObject({ id: 'p', inputs: 100, outputs: 100, imbalance: 0, relative: 0, overTolerance: false });
    expect(fish).toMatchObject({ id: 'f', inputs: 40, outputs: 35, imbalance: 5, overTolerance: true });
    expect(fish.relative).toBeCloseTo(5 / 40, 12);
  });

  it('follows an edit: raising a flow moves both ends', () => {
    const edited = { ...small, flows: [{ from: 'p', to: 'f', value: 35 }] };
    const [plankton, fish] = compartmentBalances(edited);
    expect(plankton.imbalance).toBe(5);
    expect(fish.imbalance).toBe(0);
    expect(fish.overTolerance).toBe(false);
  });

  it('agrees with the engine on which compartments are out of balance', () => {
    const unbalanced: Web = { ...demo, flows: demo.flows.map((f, k) => (k === 3 ? { ...f, value: f.value * 1.5 } : f)) } as Web;
    for (const web of [demo as Web, unbalanced]) {
      const engine = imbalances(createNetwork(web));
      const ours = compartmentBalances(web).filter((b) => b.overTolerance);
      expect(ours.map((b) => b.id)).toEqual(engine.map((u) => u.id));
      ours.forEach((b, k) => expect(b.imbalance).toBeCloseTo(engine[k].imbalance, 9));
    }
  });

  it('keeps going through a half-typed web: unknown ids and blank numbers count for nothing', () => {
    const typing: Web = { ...small, flows: [...small.flows, { from: 'f', to: 'nobody', value: 3 }, { from: 'p', to: 'f', value: Number.NaN }] };
    const [, fish] = compartmentBalances(typing);
    expect(fish.outputs).toBe(38);
    expect(fish.inputs).toBe(40);
  });
});
