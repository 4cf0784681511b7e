import { INDICATOR_NAMES, SCALAR_INDICATORS, type CommentAnchor, type Web } from '@seinework/contracts';

/** Something of the result a comment can point at, with the words the screen shows for it. */
export interface AnchorChoice {
  anchor: CommentAnchor;
  label: string;
}

/** The words for what a comment points at ("Total catch", "compartment Forage fish"). */
export function anchorLabel(anchor: CommentAnchor, web: Web | null): string {
  if (anchor.kind === 'indicator') {
    return (INDICATOR_NAMES as Record<string, string | undefined>)[anchor.key] ?? anchor.key;
  }
  const compartment = web?.compartments.find((c) => c.id === anchor.key);
  return `compartment ${compartment?.name ?? anchor.key}`;
}

/** Every indicator of the result, then every compartment of the baseline, for the comment form's picker. */
export function anchorChoices(web: Web | null): AnchorChoice[] {
  const indicators = [...SCALAR_INDICATORS, 'fishingInBalance' as const].map((key) => ({ kind: 'indicator' as const, key }));
  const compartments = (web?.compartments ?? []).map((c) => ({ kind: 'compartment' as const, key: c.id }));
  return [...indicators, ...compartments].map((anchor) => ({ anchor, label: anchorLabel(anchor, web) }));
}

/** The id of the element the result page shows it in (`indicator-<key>`, `compartment-<id>`). */
export function anchorElementId(anchor: CommentAnchor): string {
  return `${anchor.kind}-${anchor.key}`;
}

/** `indicator:tst` ⇄ anchor, for the discussion page's `?on=` query and the form's select. */
export function anchorToken(anchor: CommentAnchor): string {
  return `${anchor.kind}:${anchor.key}`;
}

export function parseAnchorToken(token: string | null | undefined): CommentAnchor | null {
  const match = /^(indicator|compartment):(.+)$/u.exec(token ?? '');
  return match ? { kind: match[1] as CommentAnchor['kind'], key: match[2]! } : null;
}
