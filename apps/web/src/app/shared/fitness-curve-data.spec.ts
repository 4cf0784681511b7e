import { fitnessCurveData } from './fitness-curve-data';

describe('fitnessCurveData', () => {
  const data = fitnessCurveData([{ label: 'Baseline', relativeAscendency: 0.344, robustness: 0.367 }]);
  const [curve, peak, baseline] = data.datasets.map((d) => d.data as { x: number; y: number }[]);

  it('draws F = −a ln a from a = 0 to 1, highest at a = 1/e where F = 1/e', () => {
    expect(curve[0]).toEqual({ x: 0, y: 0 });
    expect(curve.at(-1)!.x).toBe(1);
    expect(curve.at(-1)!.y).toBeCloseTo(0, 12);
    const highest = curve.reduce((best, p) => (p.y > best.y ? p : best));
    expect(highest.x).toBeCloseTo(1 / Math.E, 2);
    expect(peak).toEqual([{ x: 1 / Math.E, y: 1 / Math.E }]);
  });

  it('places each web at the engine’s own (a, F)', () => {
    expect(baseline).toEqual([{ x: 0.344, y: 0.367 }]);
    expect(data.datasets[2].label).toBe('Baseline');
  });
});
