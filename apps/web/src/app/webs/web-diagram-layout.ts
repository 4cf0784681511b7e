import type { CompartmentKind, Web } from '@seinework/contracts';

/**
 * Where the diagram draws each compartment and flow: height by trophic level (the engine's
 * effective trophic levels, producers and detritus at 1, rising upwards), compartments of about the
 * same level spread across the width, and flow widths by the square root of magnitude so that the
 * few large flows into detritus do not drown the many small ones between consumers.
 */

export interface DiagramNode {
  readonly id: string;
  readonly name: string;
  readonly kind: CompartmentKind;
  readonly level: number;
  readonly x: number;
  readonly y: number;
}

export interface DiagramLink {
  readonly from: string;
  readonly to: string;
  readonly fromName: string;
  readonly toName: string;
  readonly value: number;
  readonly width: number;
  /** SVG path from the donor's edge to the recipient's edge, bowed so that opposite flows stay apart. */
  readonly path: string;
}

export interface DiagramLayout {
  readonly width: number;
  readonly height: number;
  readonly nodes: DiagramNode[];
  readonly links: DiagramLink[];
  /** Trophic levels to mark on the vertical axis, with their height. */
  readonly ticks: { level: number; y: number }[];
  readonly maxValue: number;
}

export const NODE_RADIUS = 18;
export const MIN_LINK_WIDTH = 1;
export const MAX_LINK_WIDTH = 14;
const MARGIN = { top: 40, right: 40, bottom: 56, left: 64 };
const KIND_ORDER: Record<CompartmentKind, number> = { producer: 0, detritus: 1, consumer: 2 };

/** Width of a flow line: √ scale between the thinnest and thickest line. */
export function linkWidth(value: number, maxValue: number): number {
  if (maxValue <= 0 || value <= 0) return MIN_LINK_WIDTH;
  return MIN_LINK_WIDTH + (MAX_LINK_WIDTH - MIN_LINK_WIDTH) * Math.sqrt(value / maxValue);
}

export function layoutWeb(web: Web, trophicLevels: Record<string, number>, width = 960, height = 560): DiagramLayout {
  const levelOf = (id: string) => trophicLevels[id] ?? 1;
  const top = Math.max(2, ...web.compartments.map((c) => levelOf(c.id)));
  const plotHeight = height - MARGIN.top - MARGIN.bottom;
  const yOf = (level: number) => MARGIN.top + ((top - level) / (top - 1)) * plotHeight;

  // Compartments within half a level share a band and are spread evenly across it.
  const bands = new Map<number, Web['compartments']>();
  for (const c of web.compartments) {
    const band = Math.round(levelOf(c.id) * 2) / 2;
    bands.set(band, [...(bands.get(band) ?? []), c]);
  }
  const plotWidth = width - MARGIN.left - MARGIN.right;
  const nodes: DiagramNode[] = [];
  [...bands.entries()]
    .sort(([a], [b]) => a - b)
    .forEach(([, members], bandIndex) => {
      const ordered = [...members].sort((a, b) => KIND_ORDER[a.kind] - KIND_ORDER[b.kind] || levelOf(a.id) - levelOf(b.id) || a.name.localeCompare(b.name));
      // alternate bands are shifted by a quarter slot so that labels of neighbouring bands do not stack
      const shift = bandIndex % 2 === 0 ? 0 : 0.25;
      ordered.forEach((c, k) => {
        const slot = (k + 0.5 + (ordered.length > 1 ? shift : 0)) / ordered.length;
        nodes.push({ id: c.id, name: c.name, kind: c.kind, level: levelOf(c.id), x: MARGIN.left + Math.min(slot, 0.97) * plotWidth, y: yOf(levelOf(c.id)) });
      });
    });

  const at = new Map(nodes.map((n) => [n.id, n]));
  const maxValue = Math.max(0, ...web.flows.map((f) => f.value));
  const links: DiagramLink[] = [];
  for (const f of web.flows) {
    const source = at.get(f.from);
    const target = at.get(f.to);
    if (!source || !target || source === target || !(f.value > 0)) continue;
    links.push({ from: f.from, to: f.to, fromName: source.name, toName: target.name, value: f.value, width: linkWidth(f.value, maxValue), path: bowedPath(source, target) });
  }
  // thick flows first so that thin ones stay visible on top
  links.sort((a, b) => b.value - a.value);

  const ticks = Array.from({ length: Math.floor(top) }, (_, k) => ({ level: k + 1, y: yOf(k + 1) }));
  return { width, height, nodes, links, ticks, maxValue };
}

/** A quadratic curve between two nodes, ending at the edge of each circle, bowed to its right. */
function bowedPath(source: DiagramNode, target: DiagramNode): string {
  const dx = target.x - source.x;
  const dy = target.y - source.y;
  const length = Math.hypot(dx, dy);
  const ux = dx / length;
  const uy = dy / length;
  const bow = Math.min(60, length * 0.2);
  const cx = (source.x + target.x) / 2 - uy * bow;
  const cy = (source.y + target.y) / 2 + ux * bow;
  // leave the circles along the tangent towards the control point
  const start = towards(source, cx, cy, NODE_RADIUS);
  const end = towards(target, cx, cy, NODE_RADIUS + 4);
  return `M${round(start.x)},${round(start.y)} Q${round(cx)},${round(cy)} ${round(end.x)},${round(end.y)}`;
}

function towards(node: DiagramNode, x: number, y: number, distance: number): { x: number; y: number } {
  const length = Math.hypot(x - node.x, y - node.y) || 1;
  return { x: node.x + ((x - node.x) / length) * distance, y: node.y + ((y - node.y) / length) * distance };
}

function round(v: number): number {
  return Math.round(v * 10) / 10;
}
