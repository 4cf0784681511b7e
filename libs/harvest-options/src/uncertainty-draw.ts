import type { ScalarIndicators, Web } from '@seinework/contracts';
import {
  createNetwork,
  isBalanced,
  leastChangeBalance,
  mulberry32,
  normalGenerator,
  scalarIndicators,
  WebError,
  withFluxValues,
  type Network,
} from '@seinework/network-analysis';
import { applyOption, type OptionSpec } from './apply-option';

/**
 * One Monte Carlo draw of METHODS.md §8: every flux times a lognormal factor of mean 1 and the
 * flux's cv (σ² = ln(1 + cv²), μ = −σ²/2, so E[factor] = e^(μ + σ²/2) = 1), the drawn web balanced
 * by least change (§7), the option applied to it, and the scalar indicators of both. Each draw has
 * its own seed derived from (seed, draw index), so a draw is the same whichever worker or chunk runs it.
 */

export interface DrawJob {
  readonly web: Web;
  readonly option: OptionSpec;
  /** Default cv of fluxes that carry none. */
  readonly cv: number;
  readonly seed: number;
  /** Draw indices start ≤ k < end. */
  readonly start: number;
  readonly end: number;
}

export type DrawOutcome =
  | { readonly draw: number; readonly baseline: ScalarIndicators; readonly option: ScalarIndicators }
  | { readonly draw: number; readonly failure: string };

export function runDraws(job: DrawJob): DrawOutcome[] {
  const network = createNetwork(job.web);
  const outcomes: DrawOutcome[] = [];
  for (let draw = job.start; draw < job.end; draw++) outcomes.push(runDraw(network, job, draw));
  return outcomes;
}

export function runDraw(network: Network, job: Pick<DrawJob, 'option' | 'cv' | 'seed'>, draw: number): DrawOutcome {
  try {
    const drawn = withFluxValues(network, lognormalDraw(network, job.cv, drawSeed(job.seed, draw)));
    const baseline = isBalanced(drawn) ? drawn : leastChangeBalance(drawn, { defaultCv: job.cv > 0 ? job.cv : undefined });
    const option = applyOption(baseline, job.option);
    return { draw, baseline: scalarIndicators(baseline), option: scalarIndicators(option) };
  } catch (error) {
    if (error instanceof WebError) return { draw, failure: error.problems[0] ?? error.message };
    throw error;
  }
}

/** Flux values times lognormal factors of mean 1, in flux order (one normal deviate per flux, always). */
export function lognormalDraw(network: Network, defaultCv: number, seed: number): number[] {
  const normal = normalGenerator(mulberry32(seed));
  return network.fluxes.map((f) => {
    const cv = f.cv ?? defaultCv;
    const sigma2 = Math.log1p(cv * cv);
    return f.value * Math.exp(-sigma2 / 2 + Math.sqrt(sigma2) * normal());
  });
}

/** A 32-bit seed for one draw, mixing the run's seed and the draw index (murmur3's finaliser). */
export function drawSeed(seed: number, draw: number): number {
  const high = Math.floor(seed / 2 ** 32);
  return mix(mix(mix(seed >>> 0) ^ (high >>> 0)) ^ Math.imul(draw + 1, 0x9e3779b9));
}

function mix(h: number): number {
  h = Math.imul(h ^ (h >>> 16), 0x85ebca6b);
  h = Math.imul(h ^ (h >>> 13), 0xc2b2ae35);
  return (h ^ (h >>> 16)) >>> 0;
}
