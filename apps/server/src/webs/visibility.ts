import { and, eq, sql, type SQL } from 'drizzle-orm';
import { can, type CurrentUser } from '@seinework/contracts';
import { webs, webVersions } from '../db/schema';

/**
 * Who sees which web and version (PRODUCT.md: nobody sees a draft that was not shared with them).
 * Roles that may read drafts see every version; council and staff see only published versions,
 * and only webs that have one. A web or version someone may not see is answered 404, as if it did
 * not exist.
 */
export function readsDrafts(user: CurrentUser): boolean {
  return can(user.role, 'webs.read-drafts');
}

/** Condition on web_versions: the versions this person may see. */
export function visibleVersion(user: CurrentUser): SQL | undefined {
  return readsDrafts(user) ? undefined : eq(webVersions.status, 'published');
}

/** Condition on webs: the webs this person may see. */
export function visibleWeb(user: CurrentUser): SQL | undefined {
  if (readsDrafts(user)) return undefined;
  return sql`exists (select 1 from ${webVersions} where ${and(eq(webVersions.webId, webs.id), eq(webVersions.status, 'published'))})`;
}
