import type { PreferenceSummary } from './options-api';
import type { ResponseRule } from './option';

/**
 * Briefs: what `GET /api/options/:id/brief` and `GET /api/comparisons/brief?runs=…` answer, the one
 * document both the PDF (`…/brief.pdf`, drawn on the server) and the print page in the browser lay
 * out. The charts travel as vector shapes in their own coordinate space (y down, text at its
 * baseline), so the PDF and the page's inline SVG draw the same picture.
 */

export interface BriefBand {
  p5: number;
  median: number;
  p95: number;
}

export interface BriefIndicator {
  key: string;
  label: string;
  baseline: number | null;
  option: number | null;
  difference: number | null;
  /** The 5–95 % band of the difference, where draws were run. */
  band: BriefBand | null;
  /** The difference has one sign in at least 90 % of draws; null without draws. */
  robust: boolean | null;
}

export type ChartShape =
  | { kind: 'line'; x1: number; y1: number; x2: number; y2: number; stroke: string; width: number; dash?: boolean }
  | { kind: 'polyline'; points: [number, number][]; stroke: string; width: number }
  | { kind: 'circle'; cx: number; cy: number; r: number; fill: string }
  | { kind: 'rect'; x: number; y: number; w: number; h: number; fill: string }
  | { kind: 'text'; x: number; y: number; text: string; size: number; anchor: 'start' | 'middle' | 'end'; bold?: boolean; colour: string };

export interface ChartFigure {
  title: string;
  /** What the chart shows, in words (the image's text alternative). */
  description: string;
  width: number;
  height: number;
  shapes: ChartShape[];
}

export interface BriefRun {
  id: string;
  engineVersion: string;
  seed: number;
  draws: number;
  cv: number;
  /** Draws that succeeded, where draws were run. */
  succeeded: number | null;
  finishedAt: string;
}

export interface BriefWeb {
  id: string;
  name: string;
  versionId: string;
  versionNumber: number;
  unit: string;
}

export interface DependenceChange {
  from: string;
  to: string;
  before: number;
  after: number;
  change: number;
}

export interface BriefFleet {
  fleet: string;
  catchBefore: number;
  catchAfter: number;
  valueBefore: number | null;
  valueAfter: number | null;
  meanTrophicLevelBefore: number | null;
  meanTrophicLevelAfter: number | null;
  pprBefore: number;
  pprAfter: number;
  /** Mixed trophic impact of the fleet on each of the brief's main compartments, in the option web. */
  impacts: (number | null)[];
}

export interface CommentCounts {
  /** Comments and replies on the option, hidden ones excluded. */
  total: number;
  replies: number;
  /** Per anchor (an indicator or a compartment), most commented first. */
  byAnchor: { kind: 'indicator' | 'compartment'; key: string; label: string; count: number }[];
}

export interface OptionBrief {
  option: { id: string; name: string; purpose: string; response: ResponseRule; responseInWords: string; adjustments: string[] };
  web: BriefWeb;
  run: BriefRun;
  indicators: BriefIndicator[];
  fitnessCurve: ChartFigure;
  trophicLadder: ChartFigure;
  /** The ten largest changes in indirect diet dependence (total dependency), by compartment name. */
  dependence: DependenceChange[];
  /** The compartments the fleet effects are shown on (names), in the order of `BriefFleet.impacts`. */
  mainCompartments: string[];
  fleets: BriefFleet[];
  preferences: PreferenceSummary[];
  comments: CommentCounts;
  caution: string;
  /** The brief's date: the run's finish time (the same run gives the same brief). */
  dated: string;
}

export interface ComparedOption {
  runId: string;
  optionId: string;
  optionName: string;
  purpose: string;
  responseInWords: string;
  adjustments: string[];
  engineVersion: string;
  seed: number;
  draws: number;
  finishedAt: string;
}

export interface ComparisonBrief {
  web: BriefWeb;
  options: ComparedOption[];
  indicators: {
    key: string;
    label: string;
    baseline: number | null;
    values: { runId: string; after: number | null; difference: number | null; band: BriefBand | null; exceedsUncertainty: boolean }[];
  }[];
  fitnessCurve: ChartFigure;
  preferences: PreferenceSummary[];
  caution: string;
  /** The newest finish time of the compared runs. */
  dated: string;
}

/** How briefs write numbers and dates, the same in the PDF and on the print page. */

/** A number for reading: four significant figures, no exponent for everyday sizes. */
export function formatNumber(value: number | null | undefined, digits = 4): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  if (value === 0) return '0';
  const size = Math.abs(value);
  if (size >= 1e10 || size < 1e-4) return value.toExponential(digits - 1).replace('-', '−');
  const text = Number(value.toPrecision(digits)).toLocaleString('en-GB', { maximumFractionDigits: 8 });
  return text.replace('-', '−');
}

export function formatSigned(value: number | null | undefined, digits = 4): string {
  if (value === null || value === undefined || !Number.isFinite(value)) return '—';
  return value > 0 ? `+${formatNumber(value, digits)}` : formatNumber(value, digits);
}

/** A date for reading, in UTC so the brief is the same wherever it is made. */
export function formatDate(iso: string): string {
  const date = new Date(iso);
  return `${date.toLocaleDateString('en-GB', { day: 'numeric', month: 'long', year: 'numeric', timeZone: 'UTC' })}, ${date.toISOString().slice(11, 16)} UTC`;
}
