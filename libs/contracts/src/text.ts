import { z } from 'zod';

/**
 * Text fields of WEB.json and OPTION.json (ids, names, fleets, units). They end up in tables,
 * file names, messages and other people's screens, so characters that control a terminal or
 * reorder what a reader sees are refused, and lengths are bounded.
 */
export const TEXT_LIMITS = {
  /** Names of webs, options and compartments, and units. */
  name: 200,
  /** Compartment ids and fleet names: keys of every table. */
  id: 100,
} as const;

/**
 * C0 controls (NUL, tab, line breaks, escape…), DEL and C1 controls; then the bidirectional
 * marks, embeddings, overrides and isolates (U+061C, U+200E–U+200F, U+202A–U+202E, U+2066–U+2069),
 * which make a text read differently from what it holds.
 */
const CONTROL = /[\u0000-\u001f\u007f-\u009f]/u;
const BIDIRECTIONAL = /[\u061c\u200e\u200f\u202a-\u202e\u2066-\u2069]/u;

function codePoint(char: string): string {
  return `U+${char.codePointAt(0)!.toString(16).toUpperCase().padStart(4, '0')}`;
}

/** Length in characters (code points), counted no further than `max + 1`: a 200 MB name is not walked. */
function longerThan(text: string, max: number): boolean {
  if (text.length <= max) return false;
  let count = 0;
  for (const _ of text) if (++count > max) return true;
  return false;
}

/**
 * A required text field: `what` names it in messages; ids and fleet names are trimmed (a
 * trailing space would make two ids that look alike).
 */
export function textField(what: string, options: { max: number; trim?: boolean }) {
  const base = z.string({ error: `${what} must be a string` });
  return (options.trim ? base.trim() : base)
    .min(1, `${what} must not be empty`)
    .refine((text) => !longerThan(text, options.max), { message: `${what} must be at most ${options.max} characters`, abort: true })
    .superRefine((text, ctx) => {
      const control = CONTROL.exec(text);
      if (control) {
        ctx.addIssue({ code: 'custom', message: `${what} must not contain control characters (${codePoint(control[0])} at position ${control.index + 1})` });
      }
      const bidirectional = BIDIRECTIONAL.exec(text);
      if (bidirectional) {
        ctx.addIssue({
          code: 'custom',
          message: `${what} must not contain bidirectional formatting characters (${codePoint(bidirectional[0])} at position ${bidirectional.index + 1})`,
        });
      }
    });
}
