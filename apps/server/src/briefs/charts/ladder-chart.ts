import type { ChartFigure, ChartShape, LadderLevelRow } from '@seinework/contracts';
import { ACCENT, axes, frame, line, linear, logarithmic, MUTED, text, tickText } from './chart-frame';

/**
 * The trophic ladder (METHODS.md §4) before and after the option: what enters each integer trophic
 * level, on a logarithmic scale (levels span orders of magnitude), with each level's transfer
 * efficiency after the option written under it. The engine gives no draws per level: no bands here.
 */

const ROMAN = ['I', 'II', 'III', 'IV', 'V', 'VI', 'VII', 'VIII', 'IX', 'X'];

export function ladderChart(before: readonly LadderLevelRow[], after: readonly LadderLevelRow[], unit: string, width = 500, height = 240): ChartFigure {
  const f = frame(width, height, { left: 56, right: 16, top: 24, bottom: 56 });
  const levels = Math.min(10, Math.max(before.length, after.length));
  const inputs = [...before, ...after].slice(0).map((row) => row.input).filter((v) => v > 0);
  const lo = 10 ** Math.floor(Math.log10(Math.min(...inputs, 1)));
  const hi = 10 ** Math.ceil(Math.log10(Math.max(...inputs, 10)));
  const y = logarithmic([lo, hi], [f.bottom, f.top]);
  const x = linear([0.5, levels + 0.5], [f.left, f.right]);
  const decades: number[] = [];
  for (let d = lo; d <= hi * 1.0001; d *= 10) decades.push(d);
  const shapes: ChartShape[] = axes(
    f,
    { ticks: Array.from({ length: levels }, (_, k) => ({ at: x(k + 1), label: ROMAN[k]! })), title: 'Trophic level (transfer efficiency after the option below)' },
    { ticks: decades.map((d) => ({ at: y(d), label: tickText(d) })), title: `Input to the level (${unit}, log scale)` },
  );
  const draw = (rows: readonly LadderLevelRow[], offset: number, colour: string) => {
    const points: [number, number][] = [];
    rows.slice(0, levels).forEach((row, k) => {
      if (!(row.input > 0)) return;
      const px = x(k + 1) + offset;
      points.push([px, y(row.input)]);
    });
    if (points.length > 1) shapes.push({ kind: 'polyline', points, stroke: colour, width: 0.75 });
    for (const [px, py] of points) shapes.push({ kind: 'circle', cx: px, cy: py, r: 3, fill: colour });
  };
  draw(before, -5, MUTED);
  draw(after, 5, ACCENT);
  after.slice(0, levels).forEach((row, k) => {
    if (row.efficiency !== null) shapes.push(text(x(k + 1), f.bottom + 24, `${(row.efficiency * 100).toFixed(1)} %`, { size: 7.5, colour: ACCENT }));
  });
  shapes.push({ kind: 'circle', cx: f.right - 150, cy: f.top - 12, r: 3, fill: MUTED }, text(f.right - 144, f.top - 9, 'baseline', { anchor: 'start' }));
  shapes.push({ kind: 'circle', cx: f.right - 90, cy: f.top - 12, r: 3, fill: ACCENT }, text(f.right - 84, f.top - 9, 'with the option', { anchor: 'start' }));
  shapes.push(line(f.left, f.bottom, f.right, f.bottom));
  const description =
    'Trophic ladder: input to each level, baseline then with the option: ' +
    Array.from({ length: levels }, (_, k) => `level ${ROMAN[k]} ${tickText(before[k]?.input ?? 0)} then ${tickText(after[k]?.input ?? 0)}`).join('; ') +
    '.';
  return { title: 'The trophic ladder', description, width, height, shapes };
}
