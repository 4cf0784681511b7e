import { and, eq, isNull, sql, type SQL } from 'drizzle-orm';
import { can, type CurrentUser } from '@seinework/contracts';
import { options, shares, webs, webVersions } from '../db/schema';

/**
 * Who sees which web and version (PRODUCT.md: nobody sees a draft that was not shared with them).
 * Roles that may read drafts see every version; council and staff see only published versions,
 * and only webs that have one; council members, moreover, only the published baselines that carry
 * a harvest option shared for council review (ARCH8). A web or version someone may not see is
 * answered 404, as if it did not exist.
 */
export function readsDrafts(user: CurrentUser): boolean {
  return can(user.role, 'webs.read-drafts');
}

/** Condition on web_versions: the versions this person may see. */
export function visibleVersion(user: CurrentUser): SQL | undefined {
  if (readsDrafts(user)) return undefined;
  return and(eq(webVersions.status, 'published'), user.role === 'council' ? sharedForCouncil() : undefined);
}

/** The version carries an option with an active share for council review. */
function sharedForCouncil(): SQL {
  return sql`exists (select 1 from ${options} inner join ${shares} on ${eq(shares.optionId, options.id)} where ${and(eq(options.versionId, webVersions.id), eq(shares.audience, 'council'), isNull(shares.withdrawnAt))})`;
}

/** Condition on webs: the webs this person may see. */
export function visibleWeb(user: CurrentUser): SQL | undefined {
  if (readsDrafts(user)) return undefined;
  return sql`exists (select 1 from ${webVersions} where ${and(eq(webVersions.webId, webs.id), visibleVersion(user))})`;
}
