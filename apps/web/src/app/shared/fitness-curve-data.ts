import type { ChartConfiguration } from 'chart.js';

/**
 * The fitness curve F = −a ln a of relative ascendency a (Ulanowicz, Goerner, Lietaer & Gomez 2009,
 * Ecol. Complexity 6:27-36) with webs placed on it. The engine computes F; this only draws it, so
 * each placed point carries the engine's own (a, F).
 */

export interface PlacedWeb {
  readonly label: string;
  readonly relativeAscendency: number;
  readonly robustness: number;
}

const PEAK = 1 / Math.E;
const CURVE_STEPS = 200;
// Seinework's palette: the curve in the theme's deep cyan, webs in its orange accent.
const CURVE_COLOUR = '#00696d';
const WEB_COLOUR = '#b4530b';
const PEAK_COLOUR = '#5c6b73';

export function fitnessCurveData(webs: readonly PlacedWeb[]): ChartConfiguration<'scatter'>['data'] {
  const curve = Array.from({ length: CURVE_STEPS + 1 }, (_, k) => {
    const a = k / CURVE_STEPS;
    return { x: a, y: a === 0 ? 0 : -a * Math.log(a) };
  });
  return {
    datasets: [
      { label: 'Fitness F = −a ln a', data: curve, showLine: true, pointRadius: 0, borderColor: CURVE_COLOUR, borderWidth: 2 },
      { label: 'Peak (a = 1/e)', data: [{ x: PEAK, y: PEAK }], pointRadius: 4, pointStyle: 'rectRot', backgroundColor: PEAK_COLOUR, borderColor: PEAK_COLOUR },
      ...webs.map((web) => ({
        label: web.label,
        data: [{ x: web.relativeAscendency, y: web.robustness }],
        pointRadius: 7,
        backgroundColor: WEB_COLOUR,
        borderColor: WEB_COLOUR,
      })),
    ],
  };
}

export const fitnessCurveOptions: ChartConfiguration<'scatter'>['options'] = {
  responsive: true,
  maintainAspectRatio: false,
  animation: false,
  scales: {
    x: { min: 0, max: 1, title: { display: true, text: 'Relative ascendency a (constraint →)' } },
    y: { min: 0, max: 0.4, title: { display: true, text: 'Fitness F' } },
  },
  plugins: { legend: { position: 'bottom' } },
};
