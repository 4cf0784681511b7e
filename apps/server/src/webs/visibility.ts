import { and, eq, inArray, isNull, sql, type SQL } from 'drizzle-orm';
import { can, type CurrentUser, type ShareAudience } from '@seinework/contracts';
import { options, shares, webs, webVersions } from '../db/schema';

/**
 * Who sees which web and version (PRODUCT.md: nobody sees a draft that was not shared with them).
 * Roles that may read drafts see every version; council and staff see only published versions,
 * and only webs that have one; council members, moreover, only the published baselines that carry
 * a harvest option shared for council review or public comment (ARCH8), and stakeholders only the
 * published baselines carrying an option shared for public comment. A web or version someone may not see is
 * answered 404, as if it did not exist.
 */
export function readsDrafts(user: CurrentUser): boolean {
  return can(user.role, 'webs.read-drafts');
}

/** Condition on web_versions: the versions this person may see. */
export function visibleVersion(user: CurrentUser): SQL | undefined {
  if (readsDrafts(user)) return undefined;
  if (user.role === 'council') return and(eq(webVersions.status, 'published'), sharedWith(['council', 'public']));
  if (!can(user.role, 'webs.read-published')) return and(eq(webVersions.status, 'published'), sharedWith(['public']));
  return eq(webVersions.status, 'published');
}

/** The version carries an option with an active share for one of these audiences. */
function sharedWith(audiences: ShareAudience[]): SQL {
  return sql`exists (select 1 from ${options} inner join ${shares} on ${eq(shares.optionId, options.id)} where ${and(eq(options.versionId, webVersions.id), inArray(shares.audience, audiences), isNull(shares.withdrawnAt))})`;
}

/** Condition on webs: the webs this person may see. */
export function visibleWeb(user: CurrentUser): SQL | undefined {
  if (readsDrafts(user)) return undefined;
  return sql`exists (select 1 from ${webVersions} where ${and(eq(webVersions.webId, webs.id), visibleVersion(user))})`;
}
