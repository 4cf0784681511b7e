import type { Adjustment } from '@seinework/contracts';
import { OUTSIDE, WebError, withFluxes, withFluxValues, type Flux, type Network } from '@seinework/network-analysis';

/**
 * Turns an option's adjustments (METHODS.md §8) into targets on the baseline web: the catch every
 * harvest flux must land (adjusted ones at their target, the others at their baseline amount) and
 * the new primary production of scaled producers. New fisheries become appended harvest fluxes, so
 * that a flux index means the same in the baseline and in the option. Every refusal names the
 * adjustment by position and content.
 */

export interface CatchTarget {
  /** Index of the harvest flux in `OptionPlan.network.fluxes`. */
  readonly flux: number;
  readonly fleet: string;
  readonly compartment: number;
  readonly amount: number;
  /** Names the catch in messages: the adjustment that set it, or the catch kept at baseline. */
  readonly label: string;
}

export interface OptionPlan {
  /** The baseline web plus a zero harvest flux for every new fishery: still balanced. */
  readonly network: Network;
  /** One target per harvest flux of `network`, in flux order. */
  readonly catches: readonly CatchTarget[];
  /** New value of every import flux into a scaled producer, by flux index. */
  readonly imports: ReadonlyMap<number, number>;
}

export function describeAdjustment(adjustment: Adjustment, position: number): string {
  const where = `adjustments[${position}]`;
  switch (adjustment.type) {
    case 'scale-catch':
      return `${where} (scale-catch fleet "${adjustment.fleet}" on "${adjustment.compartment}" by ${adjustment.percent} %)`;
    case 'set-catch':
      return `${where} (set-catch fleet "${adjustment.fleet}" on "${adjustment.compartment}" to ${adjustment.amount})`;
    case 'close-fleet':
      return `${where} (close-fleet "${adjustment.fleet}")`;
    case 'open-fishery':
      return `${where} (open-fishery fleet "${adjustment.fleet}" on "${adjustment.compartment}" at ${adjustment.amount})`;
    case 'scale-production':
      return `${where} (scale-production of "${adjustment.compartment}" by ${adjustment.percent} %)`;
  }
}

interface Claim {
  readonly amount: number;
  readonly label: string;
  readonly position: number;
}

export function planOption(baseline: Network, adjustments: readonly Adjustment[]): OptionPlan {
  const problems: string[] = [];
  const labels = adjustments.map(describeAdjustment);
  const refuse = (position: number, why: string): void => {
    problems.push(`${labels[position]}: ${why}`);
  };
  const harvestFlux = new Map<string, number>();
  baseline.fluxes.forEach((f, k) => {
    if (f.fleet !== undefined) harvestFlux.set(key(f.fleet, f.from), k);
  });
  const fleets = new Set(baseline.fleets);
  const compartment = (position: number, id: string): number | undefined => {
    const i = baseline.index.get(id);
    if (i === undefined) refuse(position, `unknown compartment "${id}"`);
    return i;
  };

  const closedBy = new Map<string, number>();
  adjustments.forEach((a, position) => {
    if (a.type !== 'close-fleet') return;
    if (!fleets.has(a.fleet)) refuse(position, `unknown fleet "${a.fleet}" (fleets: ${listed(baseline.fleets)})`);
    else if (closedBy.has(a.fleet)) refuse(position, `fleet "${a.fleet}" is already closed by adjustments[${closedBy.get(a.fleet)}]`);
    else closedBy.set(a.fleet, position);
  });

  const claims = new Map<string, Claim>();
  const appended: Flux[] = [];
  const production = new Map<number, { factor: number; position: number }>();
  adjustments.forEach((a, position) => {
    if (a.type === 'close-fleet') return;
    if (a.type === 'scale-production') {
      const i = compartment(position, a.compartment);
      if (!validPercent(a.percent, (why) => refuse(position, why)) || i === undefined) return;
      if (baseline.kinds[i] !== 'producer') return refuse(position, `"${a.compartment}" is a ${baseline.kinds[i]}, not a producer`);
      if (!(baseline.z[i] > 0)) return refuse(position, `producer "${a.compartment}" has no import (primary production) to scale`);
      const earlier = production.get(i);
      if (earlier) return refuse(position, `contradicts adjustments[${earlier.position}], which already scales "${a.compartment}"`);
      production.set(i, { factor: 1 + a.percent / 100, position });
      return;
    }
    const i = compartment(position, a.compartment);
    const isNewFleet = !fleets.has(a.fleet);
    if (isNewFleet && a.type !== 'open-fishery') {
      return refuse(position, `unknown fleet "${a.fleet}" (fleets: ${listed(baseline.fleets)}); use open-fishery for a new fleet`);
    }
    // fleets are rows and columns of the mixed trophic impact table beside the compartments
    if (isNewFleet && baseline.index.has(a.fleet)) return refuse(position, `fleet "${a.fleet}" has the name of a compartment; give the new fleet another name`);
    if (closedBy.has(a.fleet)) return refuse(position, `contradicts adjustments[${closedBy.get(a.fleet)}], which closes fleet "${a.fleet}"`);
    if (i === undefined) return;
    const earlier = claims.get(key(a.fleet, i));
    if (earlier) {
      return refuse(position, `contradicts adjustments[${earlier.position}], which already sets the catch of fleet "${a.fleet}" on "${a.compartment}"`);
    }
    const k = harvestFlux.get(key(a.fleet, i));
    const baselineCatch = k === undefined ? 0 : baseline.fluxes[k].value;
    let amount: number;
    if (a.type === 'open-fishery') {
      if (baselineCatch > 0) {
        return refuse(position, `fleet "${a.fleet}" already catches "${a.compartment}" (${baselineCatch}); use set-catch or scale-catch`);
      }
      if (!validAmount(a.amount, (why) => refuse(position, why))) return;
      amount = a.amount;
    } else if (k === undefined) {
      return refuse(position, `fleet "${a.fleet}" does not catch "${a.compartment}"; use open-fishery for a new fishery`);
    } else if (a.type === 'scale-catch') {
      if (!validPercent(a.percent, (why) => refuse(position, why))) return;
      amount = baselineCatch * (1 + a.percent / 100);
    } else {
      if (!validAmount(a.amount, (why) => refuse(position, why))) return;
      amount = a.amount;
    }
    claims.set(key(a.fleet, i), { amount, label: labels[position], position });
    if (k === undefined) appended.push({ kind: 'export', from: i, to: OUTSIDE, value: 0, fleet: a.fleet });
  });
  if (problems.length > 0) throw new WebError('invalid', problems);

  const network = appended.length === 0 ? baseline : withFluxes(baseline, [...baseline.fluxes, ...appended]);
  const catches: CatchTarget[] = [];
  network.fluxes.forEach((f, k) => {
    if (f.fleet === undefined) return;
    const closed = closedBy.get(f.fleet);
    const claim = claims.get(key(f.fleet, f.from));
    const id = network.ids[f.from];
    const target: Claim =
      closed !== undefined
        ? { amount: 0, label: labels[closed], position: closed }
        : (claim ?? { amount: f.value, label: `catch of "${id}" by fleet "${f.fleet}" (kept at its baseline ${f.value})`, position: -1 });
    catches.push({ flux: k, fleet: f.fleet, compartment: f.from, amount: target.amount, label: target.label });
  });
  const imports = new Map<number, number>();
  network.fluxes.forEach((f, k) => {
    const change = f.kind === 'import' ? production.get(f.to) : undefined;
    if (change) imports.set(k, f.value * change.factor);
  });
  return { network, catches, imports };
}

/** Flux values of the plan's network with every catch at its target and producers' imports scaled (not balanced). */
export function targetValues(plan: OptionPlan): number[] {
  const values = plan.network.fluxes.map((f) => f.value);
  for (const c of plan.catches) values[c.flux] = c.amount;
  for (const [k, value] of plan.imports) values[k] = value;
  return values;
}

/** The plan's network with the targets in place: the starting point of the least-change response. */
export function withTargets(plan: OptionPlan): Network {
  return withFluxValues(plan.network, targetValues(plan));
}

function key(fleet: string, compartment: number): string {
  return `${compartment}\u0000${fleet}`;
}

function listed(names: readonly string[]): string {
  return names.length === 0 ? 'none' : names.map((n) => `"${n}"`).join(', ');
}

function validPercent(percent: number, refuse: (why: string) => void): boolean {
  if (!Number.isFinite(percent)) refuse('percent must be a finite number');
  else if (percent < -100) refuse(`percent ${percent} is below -100 (a catch or production cannot fall below zero)`);
  else return true;
  return false;
}

function validAmount(amount: number, refuse: (why: string) => void): boolean {
  if (!(Number.isFinite(amount) && amount >= 0)) refuse(`amount ${amount} must be a finite number ≥ 0`);
  else return true;
  return false;
}
