import type { Adjustment, AdjustmentProblem, StoredOptionBody, Web } from '@seinework/contracts';

/**
 * An adjustment as the option form holds it while it is typed: every field of every kind, numbers
 * possibly empty, so that changing the kind keeps what was already chosen.
 */
export interface AdjustmentDraft {
  type: Adjustment['type'];
  fleet: string;
  compartment: string;
  percent: number | null;
  amount: number | null;
}

/** What each kind of adjustment asks for. */
export function fieldsOf(type: Adjustment['type']): { fleet: boolean; compartment: boolean; percent: boolean; amount: boolean } {
  return {
    fleet: type !== 'scale-production',
    compartment: type !== 'close-fleet',
    percent: type === 'scale-catch' || type === 'scale-production',
    amount: type === 'set-catch' || type === 'open-fishery',
  };
}

export function newAdjustment(): AdjustmentDraft {
  return { type: 'scale-catch', fleet: '', compartment: '', percent: null, amount: null };
}

export function toDraft(adjustment: Adjustment): AdjustmentDraft {
  return {
    type: adjustment.type,
    fleet: 'fleet' in adjustment ? adjustment.fleet : '',
    compartment: 'compartment' in adjustment ? adjustment.compartment : '',
    percent: 'percent' in adjustment ? adjustment.percent : null,
    amount: 'amount' in adjustment ? adjustment.amount : null,
  };
}

/** The adjustment in OPTION.json form, or what is still missing before the engine can be asked. */
export function toAdjustment(draft: AdjustmentDraft): Adjustment | string {
  const needs = fieldsOf(draft.type);
  const fleet = draft.fleet.trim();
  if (needs.fleet && !fleet) return 'Choose a fleet.';
  if (needs.compartment && !draft.compartment) return 'Choose a compartment.';
  if (needs.percent && (draft.percent === null || !Number.isFinite(draft.percent))) return 'Give the change in per cent.';
  if (needs.amount && (draft.amount === null || !Number.isFinite(draft.amount))) return 'Give the amount.';
  switch (draft.type) {
    case 'scale-catch':
      return { type: draft.type, fleet, compartment: draft.compartment, percent: draft.percent! };
    case 'set-catch':
    case 'open-fishery':
      return { type: draft.type, fleet, compartment: draft.compartment, amount: draft.amount! };
    case 'close-fleet':
      return { type: draft.type, fleet };
    case 'scale-production':
      return { type: draft.type, compartment: draft.compartment, percent: draft.percent! };
  }
}

/** The option body, or the problems of the adjustments that are not complete yet. */
export function toOptionBody(
  fields: Pick<StoredOptionBody, 'name' | 'purpose' | 'response' | 'uncertainty'>,
  drafts: readonly AdjustmentDraft[],
): { body: StoredOptionBody; problems: [] } | { body: null; problems: AdjustmentProblem[] } {
  const adjustments: Adjustment[] = [];
  const problems: AdjustmentProblem[] = [];
  drafts.forEach((draft, index) => {
    const made = toAdjustment(draft);
    if (typeof made === 'string') problems.push({ adjustment: index, problem: made });
    else adjustments.push(made);
  });
  if (problems.length > 0) return { body: null, problems };
  return { body: { ...fields, adjustments }, problems: [] };
}

/** The fleets of a web (each export's fleet), in the order they first appear. */
export function fleetsOf(web: Web | null): string[] {
  return [...new Set((web?.exports ?? []).flatMap((e) => (e.fleet ? [e.fleet] : [])))];
}

/** The compartments an adjustment may name: what the fleet catches, the producers, or any compartment for a new fishery. */
export function compartmentsFor(draft: AdjustmentDraft, web: Web | null): { id: string; name: string }[] {
  const all = web?.compartments ?? [];
  if (draft.type === 'scale-production') return all.filter((c) => c.kind === 'producer');
  if (draft.type === 'open-fishery') return all;
  const caught = new Set((web?.exports ?? []).filter((e) => e.fleet === draft.fleet.trim()).map((e) => e.from));
  return all.filter((c) => caught.has(c.id));
}
