import type { Web } from '@seinework/contracts';

/**
 * Each compartment's balance while the web is being edited (METHODS.md §0): inputs z_j + Σ_i T_ij
 * against outputs e_j + r_j + Σ_k T_jk. Unlike the engine's check this never throws: a half-typed
 * web (an empty id, a flow to a compartment not yet added) still gets a panel, and rows that name
 * no compartment of the web are simply not counted.
 */

/** The engine's relative tolerance (1e-6 of throughflow): publishing refuses anything beyond it. */
export const IMBALANCE_TOLERANCE = 1e-6;

export interface CompartmentBalance {
  readonly id: string;
  readonly name: string;
  readonly inputs: number;
  readonly outputs: number;
  /** inputs − outputs */
  readonly imbalance: number;
  /** imbalance as a share of the larger side; 0 for a compartment carrying nothing. */
  readonly relative: number;
  readonly overTolerance: boolean;
}

export function compartmentBalances(web: Web, tolerance = IMBALANCE_TOLERANCE): CompartmentBalance[] {
  const inputs = new Map<string, number>();
  const outputs = new Map<string, number>();
  for (const c of web.compartments) {
    inputs.set(c.id, 0);
    outputs.set(c.id, 0);
  }
  const add = (side: Map<string, number>, id: string, value: number) => {
    const current = side.get(id);
    if (current !== undefined && Number.isFinite(value)) side.set(id, current + value);
  };
  for (const f of web.flows) {
    add(outputs, f.from, f.value);
    add(inputs, f.to, f.value);
  }
  for (const i of web.imports) add(inputs, i.to, i.value);
  for (const e of web.exports) add(outputs, e.from, e.value);
  for (const r of web.respiration) add(outputs, r.from, r.value);

  const seen = new Set<string>();
  return web.compartments
    .filter((c) => !seen.has(c.id) && seen.add(c.id))
    .map((c) => {
      const into = inputs.get(c.id)!;
      const out = outputs.get(c.id)!;
      const scale = Math.max(Math.abs(into), Math.abs(out));
      const imbalance = into - out;
      const relative = scale === 0 ? 0 : imbalance / scale;
      return { id: c.id, name: c.name, inputs: into, outputs: out, imbalance, relative, overTolerance: Math.abs(relative) > tolerance };
    });
}
