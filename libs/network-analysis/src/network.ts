import { webSchema, describeIssues, type CompartmentKind, type Web } from '@seinework/contracts';
import { WebError } from './web-error';
import { zeros } from './linear-algebra';

/**
 * A web turned into the matrices of METHODS.md §0, once.
 *
 * Every number of the web is one *flux*: an internal flow T_ij, an import z_j, an export entry
 * (possibly a harvest tagged with a fleet) or a respiration entry. Balancing and harvest options
 * change flux values (and may add harvest fluxes) and rebuild the matrices with `withFluxes`;
 * the structure and the order of fluxes are kept so that a flux index means the same thing before
 * and after.
 */

/** Index used for "outside the web" on the import or export side of a flux. */
export const OUTSIDE = -1;

export type FluxKind = 'flow' | 'import' | 'export' | 'respiration';

export interface Flux {
  readonly kind: FluxKind;
  /** Donor compartment index, or OUTSIDE for an import. */
  readonly from: number;
  /** Recipient compartment index, or OUTSIDE for an export or respiration. */
  readonly to: number;
  readonly value: number;
  /** Coefficient of variation of this flux, when the web gives one. */
  readonly cv?: number;
  /** Fleet that lands this export: the export is a harvest (catch). */
  readonly fleet?: string;
  /** Currency per tonne landed. */
  readonly price?: number;
}

export interface Network {
  readonly name: string;
  readonly unit: string;
  readonly areaKm2?: number;
  readonly tonnesPerUnit?: number;
  readonly n: number;
  readonly ids: readonly string[];
  readonly names: readonly string[];
  readonly kinds: readonly CompartmentKind[];
  readonly biomass: readonly (number | undefined)[];
  readonly index: ReadonlyMap<string, number>;
  readonly fluxes: readonly Flux[];
  /** T[i][j]: flow from compartment i to compartment j. */
  readonly T: readonly number[][];
  /** z[j]: imports into j (primary production for producers). */
  readonly z: readonly number[];
  /** e[i]: all exports from i, harvest included. */
  readonly e: readonly number[];
  /** r[i]: respiration of i. */
  readonly r: readonly number[];
  /** Fleet names in order of first appearance. */
  readonly fleets: readonly string[];
  /** catches[f][i]: catch of compartment i by fleet f. */
  readonly catches: readonly number[][];
  /** Throughflow T_j = z_j + Σ_i T_ij (the input side of §0). */
  readonly throughflow: readonly number[];
  /** Output side: e_j + r_j + Σ_k T_jk. Equal to `throughflow` in a balanced web. */
  readonly outflow: readonly number[];
}

/** Parses and checks an unknown value (e.g. a JSON file) as a web; throws WebError. */
export function parseWeb(input: unknown): Web {
  const parsed = webSchema.safeParse(input);
  if (!parsed.success) throw new WebError('invalid', describeIssues(parsed.error));
  return parsed.data;
}

/** Builds the network of a shape-checked web; throws WebError naming every problem found. */
export function createNetwork(web: Web): Network {
  const problems: string[] = [];
  const index = new Map<string, number>();
  web.compartments.forEach((c, i) => {
    if (index.has(c.id)) problems.push(`compartments[${i}]: duplicate compartment id "${c.id}"`);
    else index.set(c.id, i);
  });
  const at = (id: string, where: string): number => {
    const i = index.get(id);
    if (i === undefined) {
      problems.push(`${where}: unknown compartment "${id}"`);
      return OUTSIDE;
    }
    return i;
  };

  const fluxes: Flux[] = [];
  const seen = new Map<string, string>();
  const once = (key: string, where: string, what: string) => {
    const first = seen.get(key);
    if (first !== undefined) problems.push(`${where}: duplicate ${what} (first given at ${first})`);
    else seen.set(key, where);
  };

  web.flows.forEach((f, k) => {
    const where = `flows[${k}]`;
    const from = at(f.from, where);
    const to = at(f.to, where);
    once(`flow ${f.from} ${f.to}`, where, `flow ${f.from} → ${f.to}`);
    fluxes.push({ kind: 'flow', from, to, value: f.value, cv: f.cv });
  });
  web.imports.forEach((f, k) => {
    const where = `imports[${k}]`;
    const to = at(f.to, where);
    once(`import ${f.to}`, where, `import into ${f.to}`);
    fluxes.push({ kind: 'import', from: OUTSIDE, to, value: f.value, cv: f.cv });
  });
  web.exports.forEach((f, k) => {
    const where = `exports[${k}]`;
    const from = at(f.from, where);
    if (f.fleet !== undefined) once(`harvest ${f.fleet} ${f.from}`, where, `catch of ${f.from} by fleet ${f.fleet}`);
    else once(`export ${f.from}`, where, `export from ${f.from}`);
    if (f.price !== undefined && f.fleet === undefined) problems.push(`${where}: a price is given for an export with no fleet`);
    // fleets are rows and columns of the mixed trophic impact table beside the compartments
    if (f.fleet !== undefined && index.has(f.fleet)) problems.push(`${where}: fleet "${f.fleet}" has the name of a compartment; give the fleet another name`);
    fluxes.push({ kind: 'export', from, to: OUTSIDE, value: f.value, cv: f.cv, fleet: f.fleet, price: f.price });
  });
  web.respiration.forEach((f, k) => {
    const where = `respiration[${k}]`;
    const from = at(f.from, where);
    once(`respiration ${f.from}`, where, `respiration of ${f.from}`);
    fluxes.push({ kind: 'respiration', from, to: OUTSIDE, value: f.value, cv: f.cv });
  });
  if (problems.length > 0) throw new WebError('invalid', problems);

  return assemble(
    {
      name: web.name,
      unit: web.unit,
      areaKm2: web.areaKm2,
      tonnesPerUnit: web.tonnesPerUnit,
      n: web.compartments.length,
      ids: web.compartments.map((c) => c.id),
      names: web.compartments.map((c) => c.name),
      kinds: web.compartments.map((c) => c.kind),
      biomass: web.compartments.map((c) => c.biomass),
      index,
    },
    fluxes,
  );
}

type Frame = Pick<Network, 'name' | 'unit' | 'areaKm2' | 'tonnesPerUnit' | 'n' | 'ids' | 'names' | 'kinds' | 'biomass' | 'index'>;

/** The same compartments with new fluxes (same order plus any appended harvest fluxes). */
export function withFluxes(network: Network, fluxes: readonly Flux[]): Network {
  const { name, unit, areaKm2, tonnesPerUnit, n, ids, names, kinds, biomass, index } = network;
  return assemble({ name, unit, areaKm2, tonnesPerUnit, n, ids, names, kinds, biomass, index }, fluxes);
}

/** The same fluxes with new values, in flux order. */
export function withFluxValues(network: Network, values: readonly number[]): Network {
  const { fluxes } = network;
  const changed: Flux[] = new Array(fluxes.length);
  // every key spelled out rather than spread: one object shape for every flux, built fast (each
  // Monte Carlo draw rebuilds its webs several times)
  for (let k = 0; k < fluxes.length; k++) {
    const f = fluxes[k];
    changed[k] = { kind: f.kind, from: f.from, to: f.to, value: values[k], cv: f.cv, fleet: f.fleet, price: f.price };
  }
  return withFluxes(network, changed);
}

function assemble(frame: Frame, fluxes: readonly Flux[]): Network {
  const n = frame.n;
  const T = zeros(n, n);
  const z = new Array<number>(n).fill(0);
  const e = new Array<number>(n).fill(0);
  const r = new Array<number>(n).fill(0);
  const fleets: string[] = [];
  const fleetIndex = new Map<string, number>();
  for (const f of fluxes) {
    if (f.fleet !== undefined && !fleetIndex.has(f.fleet)) {
      fleetIndex.set(f.fleet, fleets.length);
      fleets.push(f.fleet);
    }
  }
  const catches = zeros(fleets.length, n);
  for (const f of fluxes) {
    switch (f.kind) {
      case 'flow':
        T[f.from][f.to] += f.value;
        break;
      case 'import':
        z[f.to] += f.value;
        break;
      case 'export':
        e[f.from] += f.value;
        if (f.fleet !== undefined) catches[fleetIndex.get(f.fleet)!][f.from] += f.value;
        break;
      case 'respiration':
        r[f.from] += f.value;
        break;
    }
  }
  const throughflow = z.slice();
  const outflow = new Array<number>(n).fill(0);
  for (let i = 0; i < n; i++) {
    outflow[i] += e[i] + r[i];
    for (let j = 0; j < n; j++) {
      throughflow[j] += T[i][j];
      outflow[i] += T[i][j];
    }
  }
  const { name, unit, areaKm2, tonnesPerUnit, ids, names, kinds, biomass, index } = frame;
  return { name, unit, areaKm2, tonnesPerUnit, n, ids, names, kinds, biomass, index, fluxes, T, z, e, r, fleets, catches, throughflow, outflow };
}

/** Back to WEB.json: compartments unchanged, every flux with its (possibly new) value. */
export function toWeb(network: Network, name = network.name): Web {
  const id = (i: number) => network.ids[i];
  const keep = <T extends object>(o: T): T =>
    Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) as T;
  return keep({
    name,
    unit: network.unit,
    areaKm2: network.areaKm2,
    tonnesPerUnit: network.tonnesPerUnit,
    compartments: network.ids.map((cid, i) =>
      keep({ id: cid, name: network.names[i], kind: network.kinds[i], biomass: network.biomass[i] }),
    ),
    flows: network.fluxes.filter((f) => f.kind === 'flow').map((f) => keep({ from: id(f.from), to: id(f.to), value: f.value, cv: f.cv })),
    imports: network.fluxes.filter((f) => f.kind === 'import').map((f) => keep({ to: id(f.to), value: f.value, cv: f.cv })),
    exports: network.fluxes
      .filter((f) => f.kind === 'export')
      .map((f) => keep({ from: id(f.from), value: f.value, fleet: f.fleet, price: f.price, cv: f.cv })),
    respiration: network.fluxes.filter((f) => f.kind === 'respiration').map((f) => keep({ from: id(f.from), value: f.value, cv: f.cv })),
  });
}

/** Parses, checks and builds in one step. */
export function networkFromJson(input: unknown): Network {
  return createNetwork(parseWeb(input));
}
