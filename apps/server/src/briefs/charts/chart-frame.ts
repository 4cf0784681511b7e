import type { ChartShape } from '@seinework/contracts';

/**
 * A chart's frame in the brief's coordinate space (points, y down): the plot area, linear or
 * logarithmic scales, and the axes with ticks and labels as shapes. Both brief renderers (pdfkit
 * paths and inline SVG) draw these shapes as they are.
 */

export const INK = '#1b1b1f';
export const GRID = '#c4c7c7';
export const MUTED = '#5c6b73';
export const CURVE = '#00696d';
export const ACCENT = '#b4530b';

export interface Frame {
  readonly width: number;
  readonly height: number;
  readonly left: number;
  readonly right: number;
  readonly top: number;
  readonly bottom: number;
}

export function frame(width: number, height: number, margins = { left: 56, right: 16, top: 24, bottom: 44 }): Frame {
  return { width, height, left: margins.left, right: width - margins.right, top: margins.top, bottom: height - margins.bottom };
}

export function linear(domain: [number, number], range: [number, number]): (value: number) => number {
  const [d0, d1] = domain;
  const [r0, r1] = range;
  return (value) => r0 + ((value - d0) / (d1 - d0 || 1)) * (r1 - r0);
}

export function logarithmic(domain: [number, number], range: [number, number]): (value: number) => number {
  const scale = linear([Math.log10(domain[0]), Math.log10(domain[1])], range);
  return (value) => scale(Math.log10(Math.max(value, domain[0])));
}

/** About `count` round ticks between lo and hi. */
export function niceTicks(lo: number, hi: number, count = 5): number[] {
  const span = hi - lo;
  if (!(span > 0)) return [lo];
  const raw = span / count;
  const magnitude = 10 ** Math.floor(Math.log10(raw));
  const step = [1, 2, 2.5, 5, 10].map((m) => m * magnitude).find((s) => s >= raw) ?? raw;
  const ticks: number[] = [];
  for (let t = Math.ceil(lo / step - 1e-9) * step; t <= hi + step * 1e-9; t += step) ticks.push(Number(t.toPrecision(12)));
  return ticks;
}

export function tickText(value: number): string {
  if (value === 0) return '0';
  const size = Math.abs(value);
  if (size >= 1e5 || size < 1e-3) return value.toExponential(0).replace('-', '−');
  return Number(value.toPrecision(6)).toString().replace('-', '−');
}

export function text(x: number, y: number, content: string, options: { size?: number; anchor?: 'start' | 'middle' | 'end'; bold?: boolean; colour?: string } = {}): ChartShape {
  return { kind: 'text', x, y, text: content, size: options.size ?? 8, anchor: options.anchor ?? 'middle', bold: options.bold, colour: options.colour ?? INK };
}

export function line(x1: number, y1: number, x2: number, y2: number, stroke = INK, width = 0.75, dash = false): ChartShape {
  return dash ? { kind: 'line', x1, y1, x2, y2, stroke, width, dash } : { kind: 'line', x1, y1, x2, y2, stroke, width };
}

/** Both axes with their ticks, tick labels and titles. */
export function axes(f: Frame, x: { ticks: { at: number; label: string }[]; title: string }, y: { ticks: { at: number; label: string }[]; title: string }): ChartShape[] {
  const shapes: ChartShape[] = [];
  for (const tick of y.ticks) shapes.push(line(f.left, tick.at, f.right, tick.at, GRID, 0.5));
  shapes.push(line(f.left, f.bottom, f.right, f.bottom), line(f.left, f.top, f.left, f.bottom));
  for (const tick of x.ticks) {
    shapes.push(line(tick.at, f.bottom, tick.at, f.bottom + 4), text(tick.at, f.bottom + 13, tick.label));
  }
  for (const tick of y.ticks) {
    shapes.push(line(f.left - 4, tick.at, f.left, tick.at), text(f.left - 6, tick.at + 3, tick.label, { anchor: 'end' }));
  }
  shapes.push(text((f.left + f.right) / 2, f.height - 8, x.title, { size: 8.5 }));
  shapes.push(text(f.left, f.top - 4, y.title, { size: 8.5, anchor: 'start' }));
  return shapes;
}
