import { OUTSIDE, type Flux, type Network } from './network';

/** A flux as a reader names it in a message: `flow "a" → "b"`, `catch of "b" by fleet "nets"`. */
export function describeFlux(network: Network, f: Flux): string {
  const id = (i: number) => (i === OUTSIDE ? 'outside' : `"${network.ids[i]}"`);
  switch (f.kind) {
    case 'flow':
      return `flow ${id(f.from)} → ${id(f.to)}`;
    case 'import':
      return `import into ${id(f.to)}`;
    case 'export':
      return f.fleet === undefined ? `export from ${id(f.from)}` : `catch of ${id(f.from)} by fleet "${f.fleet}"`;
    case 'respiration':
      return `respiration of ${id(f.from)}`;
  }
}
