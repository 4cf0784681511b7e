import { and, eq, isNull, sql, type SQL } from 'drizzle-orm';
import { can, type CurrentUser } from '@seinework/contracts';
import { options, shares } from '../db/schema';

/**
 * Who sees which harvest option (ARCH8, PRODUCT.md): analysts and admins every option; council
 * members only options with an active share for council review; staff every option with an active
 * share (council review now, public comment later). An option someone may not see is answered 404,
 * as if it did not exist.
 */

export function readsAllOptions(user: CurrentUser): boolean {
  return can(user.role, 'options.read-all');
}

/** Council members see what is shared with the council; the other readers of shared options see every active share. */
function sharedAudiences(user: CurrentUser): SQL | undefined {
  return user.role === 'council' ? eq(shares.audience, 'council') : undefined;
}

/** Condition on options: the options this person may see. */
export function visibleOption(user: CurrentUser): SQL | undefined {
  if (readsAllOptions(user)) return undefined;
  if (!can(user.role, 'options.read-shared')) return sql`false`;
  return sql`exists (select 1 from ${shares} where ${and(eq(shares.optionId, options.id), isNull(shares.withdrawnAt), sharedAudiences(user))})`;
}
