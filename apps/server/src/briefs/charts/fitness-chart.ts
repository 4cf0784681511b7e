import type { BriefBand, ChartFigure, ChartShape } from '@seinework/contracts';
import { FITNESS_PEAK_A as PEAK, robustnessOf as fitness } from '@seinework/network-analysis';
import { ACCENT, axes, CURVE, frame, GRID, line, linear, MUTED, niceTicks, text, tickText } from './chart-frame';

/**
 * Where webs sit on the fitness curve F = −a ln a of relative ascendency a (Ulanowicz et al. 2009),
 * with the 5–95 % bands of a and F where draws were run. The window is zoomed around the webs (a
 * harvest option moves a web little); the peak at a = 1/e is marked, or pointed at when outside.
 */

export interface PlacedPoint {
  label: string;
  relativeAscendency: number;
  robustness: number;
  bandA: BriefBand | null;
  bandF: BriefBand | null;
  baseline?: boolean;
}

const POINT_COLOURS = [ACCENT, '#6750a4', '#386a20', '#8c1d18', '#00538a', '#7d5260'];

export function fitnessChart(points: readonly PlacedPoint[], width = 500, height = 250): ChartFigure {
  const f = frame(width, height);
  const xs = points.flatMap((p) => [p.relativeAscendency, p.bandA?.p5 ?? p.relativeAscendency, p.bandA?.p95 ?? p.relativeAscendency]);
  const span = Math.max(...xs) - Math.min(...xs);
  const pad = Math.max(0.04, span * 0.6);
  const a0 = Math.max(0, Math.min(...xs) - pad);
  const a1 = Math.min(1, Math.max(...xs) + pad);
  const curve = Array.from({ length: 121 }, (_, k) => a0 + ((a1 - a0) * k) / 120);
  const fs = [...curve.map(fitness), ...points.flatMap((p) => [p.robustness, p.bandF?.p5 ?? p.robustness, p.bandF?.p95 ?? p.robustness])];
  const fPad = Math.max(0.005, (Math.max(...fs) - Math.min(...fs)) * 0.1);
  const f0 = Math.max(0, Math.min(...fs) - fPad);
  const f1 = Math.max(...fs) + fPad;
  const x = linear([a0, a1], [f.left, f.right]);
  const y = linear([f0, f1], [f.bottom, f.top]);
  const shapes: ChartShape[] = axes(
    f,
    { ticks: niceTicks(a0, a1, 6).map((t) => ({ at: x(t), label: tickText(t) })), title: 'Relative ascendency a (left: more flexibility; right: more constraint)' },
    { ticks: niceTicks(f0, f1, 4).map((t) => ({ at: y(t), label: tickText(t) })), title: 'Fitness F = −a ln a' },
  );
  shapes.push({ kind: 'polyline', points: curve.map((a) => [x(a), y(fitness(a))]), stroke: CURVE, width: 1.5 });
  if (PEAK >= a0 && PEAK <= a1) {
    shapes.push(line(x(PEAK), f.top, x(PEAK), f.bottom, GRID, 0.75, true), text(x(PEAK) + 3, f.top + 9, 'peak (a = 1/e)', { anchor: 'start', colour: MUTED }));
  } else {
    const right = PEAK > a1;
    shapes.push(text(right ? f.right - 2 : f.left + 4, f.top + 9, right ? 'the peak (a = 0.368) lies to the right' : 'the peak (a = 0.368) lies to the left', { anchor: right ? 'end' : 'start', colour: MUTED }));
  }
  let colour = 0;
  // the legend above the plot, right-aligned (the y axis title is on the left)
  let legendX = f.right - points.reduce((sum, p) => sum + 14 + p.label.length * 4.6, 0) + 4;
  for (const point of points) {
    const fill = point.baseline ? MUTED : POINT_COLOURS[colour++ % POINT_COLOURS.length]!;
    const px = x(point.relativeAscendency);
    const py = y(point.robustness);
    if (point.bandA) shapes.push(line(x(point.bandA.p5), py, x(point.bandA.p95), py, fill, 1), line(x(point.bandA.p5), py - 3, x(point.bandA.p5), py + 3, fill, 1), line(x(point.bandA.p95), py - 3, x(point.bandA.p95), py + 3, fill, 1));
    if (point.bandF) shapes.push(line(px, y(point.bandF.p5), px, y(point.bandF.p95), fill, 1), line(px - 3, y(point.bandF.p5), px + 3, y(point.bandF.p5), fill, 1), line(px - 3, y(point.bandF.p95), px + 3, y(point.bandF.p95), fill, 1));
    // the baseline larger and first: an option that barely moves the web leaves it showing as a ring
    shapes.push({ kind: 'circle', cx: px, cy: py, r: point.baseline ? 5 : 3, fill });
    // a legend rather than labels at the points, which often lie closer together than a label is wide
    shapes.push({ kind: 'circle', cx: legendX, cy: f.top - 7, r: 3, fill }, text(legendX + 6, f.top - 4, point.label, { anchor: 'start', bold: true, colour: fill }));
    legendX += 14 + point.label.length * 4.6;
  }
  const description =
    'Fitness curve: ' +
    points
      .map((p) => `${p.label} at relative ascendency ${p.relativeAscendency.toFixed(4)}, fitness ${p.robustness.toFixed(4)}${p.bandA ? ` (5–95 % of a: ${p.bandA.p5.toFixed(4)} to ${p.bandA.p95.toFixed(4)})` : ''}`)
      .join('; ') +
    '.';
  return { title: 'Where the web sits on the fitness curve', description, width, height, shapes };
}
