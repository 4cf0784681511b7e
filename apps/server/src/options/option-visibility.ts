import { and, eq, inArray, isNull, sql, type SQL } from 'drizzle-orm';
import { can, type CurrentUser, type ShareAudience } from '@seinework/contracts';
import { options, runs, shares } from '../db/schema';

/**
 * Who sees which harvest option (ARCH8, PRODUCT.md; DEVELOPERS.md, "Discussion"): analysts and
 * admins every option; council members options with an active share for council review or for
 * public comment; staff every option with an active share; stakeholders only options with an
 * active share for public comment, and of their runs only the one that share shows. An option
 * someone may not see is answered 404, as if it did not exist.
 */

export function readsAllOptions(user: CurrentUser): boolean {
  return can(user.role, 'options.read-all');
}

/** The audiences of the shares this person sees; null for every audience. */
export function shareAudiencesOf(user: CurrentUser): readonly ShareAudience[] | null {
  if (readsAllOptions(user)) return null;
  if (user.role === 'council') return ['council', 'public'];
  if (can(user.role, 'options.read-shared')) return null;
  if (can(user.role, 'options.read-public')) return ['public'];
  return [];
}

/** Whether this person sees shares (and the comments posted under them) of that audience. */
export function seesAudience(user: CurrentUser, audience: ShareAudience): boolean {
  const audiences = shareAudiencesOf(user);
  return audiences === null || audiences.includes(audience);
}

/** Condition on shares: the active shares this person sees. */
export function visibleShare(user: CurrentUser): SQL | undefined {
  const audiences = shareAudiencesOf(user);
  if (audiences !== null && audiences.length === 0) return sql`false`;
  return and(isNull(shares.withdrawnAt), audiences === null ? undefined : inArray(shares.audience, [...audiences]));
}

/** Condition on options: the options this person may see. */
export function visibleOption(user: CurrentUser): SQL | undefined {
  if (readsAllOptions(user)) return undefined;
  if (!can(user.role, 'options.read-shared') && !can(user.role, 'options.read-public')) return sql`false`;
  return sql`exists (select 1 from ${shares} where ${and(eq(shares.optionId, options.id), visibleShare(user))})`;
}

/** Whether this person reads only what is shared for public comment (the run a share shows, not the option's other runs). */
export function readsPublicOnly(user: CurrentUser): boolean {
  return !readsAllOptions(user) && !can(user.role, 'options.read-shared') && can(user.role, 'options.read-public');
}

/** Condition on runs joined with their option: the runs this person may read. */
export function visibleRun(user: CurrentUser): SQL | undefined {
  if (!readsPublicOnly(user)) return visibleOption(user);
  return sql`exists (select 1 from ${shares} where ${and(eq(shares.runId, runs.id), eq(shares.optionId, options.id), visibleShare(user))})`;
}
