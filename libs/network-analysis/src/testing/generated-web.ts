import type { Web } from '@seinework/contracts';
import { identityMinus, solve, transpose } from '../linear-algebra';
import { mulberry32 } from '../random';

/**
 * Generates a balanced, plausible-shaped web for property tests and benchmarks (never for the demo):
 * producers fed by imports, one or two detritus pools, consumers each with at least one prey,
 * returns to detritus, respiration from every compartment and some harvest by fleets.
 * Balance comes by construction: pick output fractions F, solve x = (I − Fᵀ)⁻¹ z, set T_ij = F_ij x_i.
 */
export interface GeneratedWebOptions {
  readonly compartments: number;
  readonly seed: number;
  /** Chance that a possible link exists (default 0.3). */
  readonly density?: number;
  /** Allow consumer → consumer links to earlier consumers too, making cycles beyond detritus (default true). */
  readonly cycles?: boolean;
  /** Number of fleets (default 2). */
  readonly fleets?: number;
}

export function generateWeb(options: GeneratedWebOptions): Web {
  const n = Math.max(3, options.compartments);
  const random = mulberry32(options.seed);
  const density = options.density ?? 0.3;
  const fleetCount = options.fleets ?? 2;
  const producers = Math.max(1, Math.round(n * 0.15));
  const detritusPools = n >= 8 ? 2 : 1;
  const kinds = Array.from({ length: n }, (_, i) =>
    i < producers ? 'producer' : i < producers + detritusPools ? 'detritus' : 'consumer',
  ) as Web['compartments'][number]['kind'][];
  const ids = kinds.map((k, i) => `${k[0]}${i}`);

  // weights[i][j]: relative share of i's output going to j; exits get their own weights.
  const weights = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  const respirationWeight = new Array<number>(n).fill(0);
  const exportWeight = new Array<number>(n).fill(0);
  const harvestFleet = new Array<number>(n).fill(-1);
  const firstDetritus = producers;
  for (let j = 0; j < n; j++) {
    if (kinds[j] === 'producer') continue;
    // every non-producer gets at least one donor earlier in the list, so every compartment is fed
    const donor = kinds[j] === 'detritus' ? Math.floor(random() * producers) : Math.floor(random() * j);
    weights[donor][j] += 0.2 + random();
  }
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      if (i === j || kinds[j] === 'producer') continue;
      const backward = j < i && kinds[j] === 'consumer';
      if (backward && options.cycles === false) continue;
      if (random() < density * (backward ? 0.3 : 1)) weights[i][j] += random();
    }
    if (kinds[i] !== 'detritus' && (options.cycles ?? true)) {
      weights[i][firstDetritus + Math.floor(random() * detritusPools)] += 0.2 + random();
    } else if (kinds[i] !== 'detritus') {
      // without cycles, nothing returns to detritus from downstream of it
      if (kinds[i] === 'producer') weights[i][firstDetritus] += 0.2 + random();
    }
    respirationWeight[i] = 0.3 + random();
    if (random() < 0.3) exportWeight[i] = 0.05 + 0.2 * random();
    if (kinds[i] === 'consumer' && fleetCount > 0 && random() < 0.4) harvestFleet[i] = Math.floor(random() * fleetCount);
  }
  const harvestWeight = harvestFleet.map((f) => (f >= 0 ? 0.05 + 0.2 * random() : 0));
  if (options.cycles === false) {
    // keep the graph acyclic: only links from lower to higher index survive
    for (let i = 0; i < n; i++) for (let j = 0; j <= i; j++) weights[i][j] = 0;
  }

  const fractions = weights.map((row, i) => {
    const total = row.reduce((s, w) => s + w, 0) + respirationWeight[i] + exportWeight[i] + harvestWeight[i];
    return { flows: row.map((w) => w / total), r: respirationWeight[i] / total, e: exportWeight[i] / total, h: harvestWeight[i] / total };
  });
  const z = kinds.map((k) => (k === 'producer' ? 100 + 900 * random() : k === 'detritus' && random() < 0.5 ? 10 + 90 * random() : 0));
  const x = solve(identityMinus(transpose(fractions.map((f) => f.flows))), z);

  const web: Web = {
    name: `Generated web (${n} compartments, seed ${options.seed})`,
    unit: 'g C m-2 y-1',
    compartments: ids.map((id, i) => ({ id, name: `Compartment ${id}`, kind: kinds[i], biomass: 1 + 50 * random() })),
    flows: [],
    imports: [],
    exports: [],
    respiration: [],
  };
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      const value = fractions[i].flows[j] * x[i];
      if (value > 0) web.flows.push({ from: ids[i], to: ids[j], value });
    }
    if (z[i] > 0) web.imports.push({ to: ids[i], value: z[i] });
    if (fractions[i].e > 0) web.exports.push({ from: ids[i], value: fractions[i].e * x[i] });
    if (fractions[i].h > 0) web.exports.push({ from: ids[i], value: fractions[i].h * x[i], fleet: `fleet-${harvestFleet[i] + 1}`, price: 500 + Math.round(2000 * random()) });
    web.respiration.push({ from: ids[i], value: fractions[i].r * x[i] });
  }
  return web;
}
