import type { ChartConfiguration, ChartDataset, Plugin } from 'chart.js';
import type { ComparedIndicator } from '@seinework/contracts';
import type { PlacedWeb } from '../shared/fitness-curve-data';
import { formatChange } from './indicator-names';

// the close-up spans a few ten-thousandths of a: its ticks need more figures than the tables
const closeUpTick = new Intl.NumberFormat('en-GB', { maximumSignificantDigits: 6 });

/**
 * The comparison's charts: each key indicator's difference per option with its 5–95 % band, and
 * where the baseline and each option sit on the fitness curve F = −a ln a. Options differ by
 * letter, colour and point shape, so the charts do not rely on colour alone.
 */

// Seinework's palette for compared options (deep cyan, buoy orange, kelp green, plum, slate, sand).
export const OPTION_COLOURS = ['#00696d', '#b4530b', '#4c7a2a', '#7b4f8c', '#3f5a78', '#8a6d1f'];
export const OPTION_POINTS = ['circle', 'rect', 'triangle', 'rectRot', 'star', 'rectRounded'] as const;
const BASELINE_COLOUR = '#5c6b73';
const CURVE_COLOUR = '#9aa8ae';

export interface ChartedRun {
  readonly runId: string;
  readonly letter: string;
}

type DifferenceChart = ChartConfiguration<'bar' | 'line', (number | [number, number] | null)[]>;

/** One indicator: a floating bar for each option's 5–95 % band and a mark at its difference. */
export function differenceChartData(indicator: ComparedIndicator, runs: readonly ChartedRun[]): DifferenceChart['data'] {
  const values = runs.map((run) => indicator.values.find((v) => v.runId === run.runId));
  return {
    labels: runs.map((run) => `Option ${run.letter}`),
    datasets: [
      {
        type: 'bar',
        label: '5–95 % band of the difference',
        data: values.map((v) => (v?.band ? [v.band.p5, v.band.p95] : null)),
        backgroundColor: runs.map((_, i) => `${OPTION_COLOURS[i % OPTION_COLOURS.length]}55`),
        borderColor: runs.map((_, i) => OPTION_COLOURS[i % OPTION_COLOURS.length]),
        borderWidth: 1,
        barPercentage: 0.5,
      },
      {
        type: 'line',
        label: 'Difference from the baseline',
        data: values.map((v) => v?.difference ?? null),
        showLine: false,
        pointRadius: 7,
        pointStyle: runs.map((_, i) => OPTION_POINTS[i % OPTION_POINTS.length]),
        pointBackgroundColor: runs.map((_, i) => OPTION_COLOURS[i % OPTION_COLOURS.length]),
        pointBorderColor: '#1b1f20',
      },
    ],
  };
}

export const differenceChartOptions: DifferenceChart['options'] = {
  indexAxis: 'y',
  responsive: true,
  maintainAspectRatio: false,
  animation: false,
  scales: {
    x: {
      title: { display: true, text: 'Difference from the baseline (0 = no change)' },
      ticks: { maxRotation: 0, autoSkipPadding: 12, callback: (value) => tickOfChange(Number(value)) },
    },
  },
  // the options are named on the axis and the bars explained beside the charts; a legend would repeat one colour per series
  plugins: { legend: { display: false } },
};

/** The line of no change, drawn at zero whether or not the axis has a tick there. */
export const zeroLine: Plugin<'bar'> = {
  id: 'swZeroLine',
  afterDatasetsDraw(chart) {
    const x = chart.scales['x'];
    if (!x || x.min > 0 || x.max < 0) return;
    const at = x.getPixelForValue(0);
    const { ctx, chartArea } = chart;
    ctx.save();
    ctx.strokeStyle = '#1b1f20';
    ctx.lineWidth = 2;
    ctx.beginPath();
    ctx.moveTo(at, chartArea.top);
    ctx.lineTo(at, chartArea.bottom);
    ctx.stroke();
    ctx.restore();
  },
};

/** A tick of a difference axis: numerical noise around zero reads as 0. */
function tickOfChange(value: number): string {
  return Math.abs(value) < 1e-15 ? '0' : formatChange(value);
}

/**
 * The fitness curve close up around the placed webs: the differences options make are small
 * beside the whole curve from a = 0 to 1, where they would sit on one spot.
 */
export function fitnessCloseUpData(webs: readonly PlacedWeb[]): ChartConfiguration<'scatter'>['data'] {
  const [low, high] = windowOf(webs.map((w) => w.relativeAscendency));
  const steps = 100;
  const curve = Array.from({ length: steps + 1 }, (_, k) => {
    const a = low + ((high - low) * k) / steps;
    return { x: a, y: a <= 0 ? 0 : -a * Math.log(a) };
  });
  const datasets: ChartDataset<'scatter'>[] = [
    { label: 'Fitness F = −a ln a', data: curve, showLine: true, pointRadius: 0, borderColor: CURVE_COLOUR, borderWidth: 2 },
    ...webs.map((web, i) => {
      const colour = i === 0 ? BASELINE_COLOUR : OPTION_COLOURS[(i - 1) % OPTION_COLOURS.length];
      return {
        label: web.label,
        data: [{ x: web.relativeAscendency, y: web.robustness }],
        pointRadius: i === 0 ? 9 : 8,
        pointStyle: i === 0 ? ('crossRot' as const) : OPTION_POINTS[(i - 1) % OPTION_POINTS.length],
        borderWidth: i === 0 ? 3 : 1,
        backgroundColor: colour,
        borderColor: i === 0 ? colour : '#1b1f20',
      };
    }),
  ];
  return { datasets };
}

export function fitnessCloseUpOptions(webs: readonly PlacedWeb[]): ChartConfiguration<'scatter'>['options'] {
  const [low, high] = windowOf(webs.map((w) => w.relativeAscendency));
  const fitness = (a: number) => (a <= 0 ? 0 : -a * Math.log(a));
  const ys = [fitness(low), fitness(high), ...webs.map((w) => w.robustness)];
  const [yLow, yHigh] = windowOf(ys);
  return {
    responsive: true,
    maintainAspectRatio: false,
    animation: false,
    scales: {
      x: { min: low, max: high, ticks: { includeBounds: false, callback: (value) => closeUpTick.format(Number(value)) }, title: { display: true, text: 'Relative ascendency a (constraint →)' } },
      y: { min: yLow, max: yHigh, ticks: { includeBounds: false }, title: { display: true, text: 'Fitness F' } },
    },
    plugins: { legend: { position: 'bottom', labels: { usePointStyle: true } } },
  };
}

/** The range of the values with a margin of a fifth on each side (and never of zero width). */
function windowOf(values: readonly number[]): [number, number] {
  const low = Math.min(...values);
  const high = Math.max(...values);
  const margin = Math.max((high - low) / 5, Math.abs(high) * 1e-5, 1e-9);
  return [low - margin, high + margin];
}
