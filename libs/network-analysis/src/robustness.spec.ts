import fc from 'fast-check';
import cone from '../../../tests/fixtures/cone-spring.json';
import { createNetwork, networkFromJson, withFluxValues, type Network } from './network';
import { informationIndices } from './information-indices';
import { fitnessPosition, robustnessGradient, robustnessOf } from './robustness';
import { balancedWeb } from './testing/arbitraries';

const PEAK = 1 / Math.E;

describe('robustnessOf', () => {
  it('is 0 at a = 0 and a = 1 and peaks at a = 1/e with F = 1/e (Ulanowicz et al. 2009, Ecol. Complexity 6:27-36)', () => {
    expect(robustnessOf(0)).toBe(0);
    expect(robustnessOf(1)).toBe(0);
    expect(robustnessOf(PEAK)).toBeCloseTo(PEAK, 15);
    expect(robustnessOf(0.5)).toBeCloseTo(0.5 * Math.LN2, 15);
  });

  it('agrees with the robustness reported by informationIndices', () => {
    fc.assert(
      fc.property(balancedWeb({ max: 15 }), (web) => {
        const indices = informationIndices(createNetwork(web));
        expect(indices.robustness).toBe(robustnessOf(indices.relativeAscendency));
      }),
    );
  });

  it('never exceeds 1/e on [0, 1]', () => {
    fc.assert(
      fc.property(fc.double({ min: 0, max: 1, noNaN: true }), (a) => {
        const F = robustnessOf(a);
        expect(F).toBeGreaterThanOrEqual(0);
        expect(F).toBeLessThanOrEqual(PEAK + 1e-15);
      }),
    );
  });
});

describe('fitnessPosition', () => {
  it('Cone Spring sits on the constraint side, just past the peak (computed from the table of Finn 1976)', () => {
    const a = informationIndices(networkFromJson(cone)).relativeAscendency;
    const position = fitnessPosition(a);
    expect(position.side).toBe('constraint');
    expect(position.relativeAscendency).toBe(a);
    expect(position.robustness).toBeCloseTo(0.36467, 5);
    expect(position.shareOfPeak).toBeCloseTo(0.36467 * Math.E, 4);
  });

  it('names the side of the peak, and the peak only within 1e-9 of 1/e', () => {
    expect(fitnessPosition(0.2).side).toBe('flexibility');
    expect(fitnessPosition(0.6).side).toBe('constraint');
    expect(fitnessPosition(PEAK).side).toBe('peak');
    expect(fitnessPosition(PEAK).shareOfPeak).toBeCloseTo(1, 15);
    expect(fitnessPosition(PEAK + 5e-10).side).toBe('peak');
    expect(fitnessPosition(PEAK + 2e-9).side).toBe('constraint');
    expect(fitnessPosition(PEAK - 2e-9).side).toBe('flexibility');
  });
});

describe('robustnessGradient', () => {
  it('Cone Spring: nonzero exactly where there is an internal flow', () => {
    const network = networkFromJson(cone);
    const gradient = robustnessGradient(network);
    expect(gradient).toHaveLength(5);
    network.T.forEach((row, i) =>
      row.forEach((t, j) => expect(gradient[i][j] !== 0).toBe(t > 0)),
    );
  });

  it('Cone Spring: matches a central finite difference of F for every flow', () => {
    expectFiniteDifferenceMatch(networkFromJson(cone));
  });

  it('scales as 1/k when every flux is multiplied by k, from 1e-300 to 1e300 (F is dimensionless)', () => {
    const network = networkFromJson(cone);
    const gradient = robustnessGradient(network);
    for (const k of [1e-300, 1e-160, 1e160, 1e300]) {
      const scaled = robustnessGradient(withFluxValues(network, network.fluxes.map((f) => f.value * k)));
      scaled.forEach((row, i) => row.forEach((g, j) => expect(Math.abs(g * k - gradient[i][j])).toBeLessThanOrEqual(1e-9 * Math.abs(gradient[i][j]))));
    }
  });

  it('matches a central finite difference of F on generated webs', () => {
    fc.assert(
      fc.property(balancedWeb({ max: 10 }), (web) => expectFiniteDifferenceMatch(createNetwork(web))),
      { numRuns: 40 },
    );
  });
});

/** Perturbs one internal flow at a time (the web becomes unbalanced, which the indices allow). */
function expectFiniteDifferenceMatch(network: Network): void {
  const gradient = robustnessGradient(network);
  const values = network.fluxes.map((f) => f.value);
  const F = (k: number, value: number) => {
    const perturbed = values.slice();
    perturbed[k] = value;
    return informationIndices(withFluxValues(network, perturbed)).robustness;
  };
  network.fluxes.forEach((flux, k) => {
    if (flux.kind !== 'flow' || flux.value <= 0) return;
    const h = 1e-4 * flux.value;
    const numeric = (F(k, flux.value + h) - F(k, flux.value - h)) / (2 * h);
    const analytic = gradient[flux.from][flux.to];
    expect(Math.abs(analytic - numeric)).toBeLessThanOrEqual(1e-5 * Math.abs(analytic) + 1e-10 / flux.value);
  });
}
