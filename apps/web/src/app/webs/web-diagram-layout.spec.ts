import type { Web } from '@seinework/contracts';
import { MAX_LINK_WIDTH, MIN_LINK_WIDTH, layoutWeb, linkWidth } from './web-diagram-layout';

const web: Web = {
  name: 'Three levels',
  unit: 'g C m-2 y-1',
  compartments: [
    { id: 'p', name: 'Plankton', kind: 'producer' },
    { id: 'd', name: 'Detritus', kind: 'detritus' },
    { id: 'z', name: 'Zooplankton', kind: 'consumer' },
    { id: 'f', name: 'Fish', kind: 'consumer' },
  ],
  flows: [
    { from: 'p', to: 'z', value: 100 },
    { from: 'z', to: 'f', value: 1 },
    { from: 'z', to: 'nobody', value: 5 },
  ],
  imports: [],
  exports: [],
  respiration: [],
};
const levels = { p: 1, d: 1, z: 2, f: 3.2 };

describe('layoutWeb', () => {
  const layout = layoutWeb(web, levels, 800, 500);
  const at = (id: string) => layout.nodes.find((n) => n.id === id)!;

  it('puts higher trophic levels higher up, and compartments of one level side by side', () => {
    expect(at('f').y).toBeLessThan(at('z').y);
    expect(at('z').y).toBeLessThan(at('p').y);
    expect(at('p').y).toBe(at('d').y);
    expect(at('p').x).not.toBe(at('d').x);
    for (const node of layout.nodes) {
      expect(node.x).toBeGreaterThan(0);
      expect(node.x).toBeLessThan(800);
    }
  });

  it('draws a flow only between compartments of the web, thickest first, widths by square root', () => {
    expect(layout.links.map((l) => `${l.from}→${l.to}`)).toEqual(['p→z', 'z→f']);
    expect(layout.links[0].width).toBe(MAX_LINK_WIDTH);
    expect(layout.links[1].width).toBeCloseTo(MIN_LINK_WIDTH + (MAX_LINK_WIDTH - MIN_LINK_WIDTH) * Math.sqrt(1 / 100), 12);
    expect(linkWidth(25, 100) - MIN_LINK_WIDTH).toBeCloseTo((MAX_LINK_WIDTH - MIN_LINK_WIDTH) / 2, 12);
  });

  it('marks every whole trophic level up to the highest compartment, which sits at the top', () => {
    expect(layout.ticks.map((t) => t.level)).toEqual([1, 2, 3]);
    expect(at('f').y).toBeLessThan(layout.ticks[2].y);
    expect(Math.min(...layout.nodes.map((n) => n.y))).toBe(at('f').y);
  });
});
