import type { Web } from '@seinework/contracts';
import { MAX_COMPARTMENTS } from '@seinework/web-tables';
import { RequestError } from '../http/errors';

/** The sizes one stored web may reach (the same as the stateless API's): refused with 413 naming the limit. */
const LIMITS = { compartments: MAX_COMPARTMENTS, flows: 20_000, entries: 4_000 } as const;

export function requireWithinLimits(web: Web): void {
  const over: string[] = [];
  if (web.compartments.length > LIMITS.compartments) over.push(`${web.compartments.length} compartments: at most ${LIMITS.compartments}`);
  if (web.flows.length > LIMITS.flows) over.push(`${web.flows.length} flows: at most ${LIMITS.flows}`);
  for (const part of ['imports', 'exports', 'respiration'] as const) {
    if (web[part].length > LIMITS.entries) over.push(`${web[part].length} ${part}: at most ${LIMITS.entries}`);
  }
  if (over.length > 0) throw new RequestError(413, 'The web is larger than the server accepts', over);
}
