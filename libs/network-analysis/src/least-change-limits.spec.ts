import fc from 'fast-check';
import { FLOW_CV_LIMITS, type Web } from '@seinework/contracts';
import cone from '../../../tests/fixtures/cone-spring.json';
import { isBalanced } from './balance-check';
import { leastChangeBalance } from './least-change';
import { createNetwork, parseWeb, withFluxValues, type Network } from './network';
import { mulberry32 } from './random';
import { balancedWeb } from './testing/arbitraries';
import { catchWebError } from './testing/catch-web-error';
import { WebError } from './web-error';

/**
 * Least change at the edges of double precision: cvs the schema refuses (given to the engine
 * directly, as a program could), and the extremes the schema still accepts. Each is either
 * balanced to finite values or refused with a WebError naming the fluxes or compartments.
 */

type Entry = { cv?: number };
const tables = (web: Web): Entry[][] => [web.flows, web.imports, web.exports, web.respiration];

/** Cone Spring (Finn 1976) with `change` applied to its entries, unbalanced by +20 % on every third flux. */
function unbalancedCone(change: (web: Web) => void): Network {
  const web = structuredClone(cone) as Web;
  change(web);
  const network = createNetwork(web);
  return withFluxValues(network, network.fluxes.map((f, k) => (k % 3 === 0 ? f.value * 1.2 : f.value)));
}

const everyCv = (cv: number) => (web: Web) => tables(web).forEach((entries) => entries.forEach((e) => (e.cv = cv)));

function expectFinite(network: Network): void {
  for (const f of network.fluxes) expect(Number.isFinite(f.value)).toBe(true);
}

describe('least change at the limits of double precision', () => {
  it('cv 1e154 on every flow (schema refuses it): a WebError naming each flow, not NaN values', () => {
    const error = catchWebError(() => leastChangeBalance(unbalancedCone((web) => web.flows.forEach((f) => (f.cv = 1e154)))));
    expect(error.kind).toBe('infeasible');
    expect(error.problems).toHaveLength(cone.flows.length);
    expect(error.problems[0]).toMatch(/^least-change balancing cannot weigh flow "plants" → "detritus": cv × value = .* is too large/);
  });

  it('cv 1e8 on one flow (schema refuses it): a WebError naming the compartment and that flow, not a bare linear-algebra error', () => {
    const error = catchWebError(() => leastChangeBalance(unbalancedCone((web) => (web.flows[0].cv = 1e8))));
    expect(error.problems).toHaveLength(1);
    expect(error.problems[0]).toMatch(/^least-change balancing cannot solve for compartment "detritus": .* from 1\.07e\+12 \(flow "plants" → "detritus", value [\d.]+\) to /);
  });

  it('cv 1e-300 on every flux (schema refuses it): each variance underflows, every flux is held, and the web is refused as unbalanceable', () => {
    const error = catchWebError(() => leastChangeBalance(unbalancedCone(everyCv(1e-300))));
    expect(error.problems.join('\n')).toMatch(/cannot balance .* with the held fluxes \(pinned, zero, or with cv 0 or a cv × value too small to weigh\)/);
  });

  it('the schema refuses each of these cvs before the engine sees them', () => {
    const web = (change: (w: Web) => void) => {
      const w = structuredClone(cone) as Web;
      change(w);
      return w;
    };
    expect(catchWebError(() => parseWeb(web((w) => w.flows.forEach((f) => (f.cv = 1e154)))))).toMatchObject({ kind: 'invalid' });
    expect(catchWebError(() => parseWeb(web((w) => (w.flows[0].cv = 1e8)))).problems).toEqual(['flows[0].cv: cv must be at most 10']);
    expect(catchWebError(() => parseWeb(web(everyCv(1e-300)))).problems[0]).toBe('flows[0].cv: cv must be 0 (the flow held exactly) or at least 0.000001');
    expect(catchWebError(() => parseWeb(web((w) => (w.flows[0].cv = 1e6)))).problems).toEqual(['flows[0].cv: cv must be at most 10']);
  });

  it('within the bounds: cv 10 on one flow, or 1e-6 on every flux, balances to finite values', () => {
    for (const change of [(web: Web) => (web.flows[0].cv = FLOW_CV_LIMITS.max), everyCv(FLOW_CV_LIMITS.min)]) {
      const balanced = leastChangeBalance(unbalancedCone(change));
      expect(isBalanced(balanced)).toBe(true);
      expectFinite(balanced);
    }
  });

  it('within the bounds: cv 10 on one flow and 1e-6 on the rest is refused, naming the compartments and the fluxes of widest spread', () => {
    const error = catchWebError(() =>
      leastChangeBalance(
        unbalancedCone((web) => {
          everyCv(FLOW_CV_LIMITS.min)(web);
          web.flows[0].cv = FLOW_CV_LIMITS.max;
        }),
      ),
    );
    expect(error.problems.length).toBeGreaterThan(0);
    for (const problem of error.problems) expect(problem).toMatch(/compartment "(plants|detritus)".* from .*\(flow "plants" → "detritus", value [\d.]+\) to /);
  });

  it('any cvs the schema accepts, on perturbed generated webs: balanced and finite, or a WebError', () => {
    const cv = fc.oneof(fc.constantFrom(0, FLOW_CV_LIMITS.min, FLOW_CV_LIMITS.max), fc.double({ min: FLOW_CV_LIMITS.min, max: FLOW_CV_LIMITS.max, noNaN: true }));
    let balancedCount = 0;
    fc.assert(
      fc.property(balancedWeb({ max: 10 }), fc.array(cv, { minLength: 1, maxLength: 60 }), fc.nat(), (web, cvs, seed) => {
        let k = 0;
        tables(web).forEach((entries) => entries.forEach((e) => (e.cv = cvs[k++ % cvs.length])));
        const network = createNetwork(parseWeb(web));
        const random = mulberry32(seed);
        const unbalanced = withFluxValues(network, network.fluxes.map((f) => (random() < 0.4 ? f.value * 2 ** (2 * random() - 1) : f.value)));
        try {
          const balanced = leastChangeBalance(unbalanced);
          expect(isBalanced(balanced)).toBe(true);
          expectFinite(balanced);
          balancedCount++;
        } catch (error) {
          if (!(error instanceof WebError)) throw error;
          expect(error.problems.length).toBeGreaterThan(0);
        }
      }),
      { numRuns: 60 },
    );
    // most draws must reach the real check, not the refusal
    expect(balancedCount).toBeGreaterThan(30);
  });
});
