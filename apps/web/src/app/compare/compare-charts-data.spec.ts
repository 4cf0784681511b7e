import { differenceChartData, fitnessCloseUpData, fitnessCloseUpOptions } from './compare-charts-data';
import { INDICATORS } from './test-comparison';

const runs = [
  { runId: 'r2', letter: 'A' },
  { runId: 'r1', letter: 'B' },
];

describe('differenceChartData', () => {
  it("draws each option's band as a floating bar and its change as a mark, in the order of the runs", () => {
    const data = differenceChartData(INDICATORS[1], runs);
    expect(data.labels).toEqual(['Option A', 'Option B']);
    expect(data.datasets[0].data).toEqual([
      [0.09, 0.13],
      [-0.56, -0.4],
    ]);
    expect(data.datasets[1].data).toEqual([0.11, -0.48]);
  });

  it('leaves out the bar of a change that has no band', () => {
    const data = differenceChartData(INDICATORS[3], runs);
    expect(data.datasets[0].data).toEqual([null, null]);
    expect(data.datasets[1].data).toEqual([0.035, -0.027]);
  });
});

describe('fitnessCloseUp', () => {
  const webs = [
    { label: 'Baseline', relativeAscendency: 0.3437, robustness: -0.3437 * Math.log(0.3437) },
    { label: 'Option A', relativeAscendency: 0.3439, robustness: -0.3439 * Math.log(0.3439) },
  ];

  it('frames the placed webs with a margin and draws F = −a ln a across the frame', () => {
    const scales = fitnessCloseUpOptions(webs)!.scales as { x: { min: number; max: number } };
    expect(scales.x.min).toBeLessThan(0.3437);
    expect(scales.x.min).toBeGreaterThan(0.3436);
    expect(scales.x.max).toBeGreaterThan(0.3439);
    expect(scales.x.max).toBeLessThan(0.344);
    const curve = fitnessCloseUpData(webs).datasets[0].data as { x: number; y: number }[];
    expect(curve[0].x).toBeCloseTo(scales.x.min, 12);
    expect(curve.at(-1)!.x).toBeCloseTo(scales.x.max, 12);
    for (const point of curve) expect(point.y).toBeCloseTo(-point.x * Math.log(point.x), 12);
  });

  it("places each web at the engine's own (a, F)", () => {
    const placed = fitnessCloseUpData(webs).datasets.slice(1);
    expect(placed.map((d) => d.label)).toEqual(['Baseline', 'Option A']);
    expect(placed[1].data).toEqual([{ x: 0.3439, y: webs[1].robustness }]);
  });
});
