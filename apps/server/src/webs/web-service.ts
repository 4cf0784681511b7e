import { randomUUID } from 'node:crypto';
import { and, asc, count, desc, eq, ilike, max, or, sql, type SQL } from 'drizzle-orm';
import { alias } from 'drizzle-orm/pg-core';
import type { CurrentUser, Page, VersionDetail, VersionStatus, VersionSummary, Web, WebDetail, WebListQuery, WebSummary } from '@seinework/contracts';
import { createNetwork, imbalances, parseWeb } from '@seinework/network-analysis';
import { recordAudit } from '../audit/audit-log';
import type { Db } from '../db/database';
import { users, webs, webVersions } from '../db/schema';
import { RequestError } from '../http/errors';
import { requireWebWithinLimits } from '../http/size-limits';
import { insertWebRows, readWeb } from './version-rows';
import { VersionWebCache } from './version-web-cache';
import { readsDrafts, visibleVersion, visibleWeb } from './visibility';

/**
 * Stored webs and their versions: every query and transaction of the webs routes. Every save is a
 * new version; a published version is never changed; every change is audited in its transaction.
 */

export interface Created {
  readonly id: string;
  readonly versionId: string;
}

export interface NewWeb {
  readonly web: Web;
  readonly name?: string;
  readonly place: string;
  readonly period: string;
  readonly note: string;
}

/** Checks a web as the engine does (shape, then structure) and against the size limits; 422 / 413 otherwise. */
export function checkedWeb(input: unknown, where = ''): Web {
  requireWebWithinLimits(input, where);
  const web = parseWeb(input);
  createNetwork(web);
  return web;
}

/** A row of the list of webs; `published` is there only for those who read drafts (list). */
interface ListRow {
  web: typeof webs.$inferSelect;
  latest: { id: string; number: number; status: VersionStatus; createdAt: Date; publishedAt: Date | null; publishedBy: string | null };
  published?: { id: string | null; number: number | null; publishedAt: Date | null; publishedBy: string | null } | null;
  total: number;
}

interface PreparedList {
  execute(values: { pattern?: string; status?: string; limit: number; offset: number }): Promise<ListRow[]>;
}

const creator = alias(users, 'creator');
const publisher = alias(users, 'publisher');

export class WebService {
  private readonly cache = new VersionWebCache();

  constructor(private readonly db: Db) {}

  /** A version's web (callers have checked that the person may see it). */
  private web(versionId: string): Promise<Web> {
    return this.cache.get(versionId, () => readWeb(this.db, versionId));
  }

  /**
   * One page of the webs this person may see, each with its latest visible version and its newest
   * published one (and who published it), in one query: the versions come from lateral subqueries
   * (a web someone may see is one with a version they may see: the inner lateral join is that
   * condition), the total from a window over the page. The query is prepared once per shape (role,
   * sort, direction, filter and status given or not): building it costs more than running it.
   */
  async list(user: CurrentUser, query: WebListQuery): Promise<Page<WebSummary>> {
    const shape = `${user.role}_${query.sort}_${query.direction}_${query.filter ? 'f' : ''}${query.status ? 's' : ''}`;
    let prepared = this.listQueries.get(shape);
    if (!prepared) {
      prepared = this.listQuery(user, query, `web_list_${shape}`);
      this.listQueries.set(shape, prepared);
    }
    const pattern = query.filter ? `%${query.filter.replace(/[\\%_]/g, (c) => `\\${c}`)}%` : undefined;
    const page = await prepared.execute({ pattern, status: query.status, limit: query.pageSize, offset: (query.page - 1) * query.pageSize });
    // a page past the end has no row to carry the total: then it is asked for alone
    const total =
      page[0]?.total ??
      (
        await this.db
          .select({ total: count() })
          .from(webs)
          .innerJoinLateral(this.latestVisible(user), sql`true`)
          .where(this.listFilters(query, { pattern, status: query.status }))
      )[0].total;
    const items = page.map(({ web, latest, published }): WebSummary => {
      // those who do not read drafts see published versions only: their latest is their newest published
      const p = published === undefined ? latest : published;
      return {
        id: web.id,
        name: web.name,
        place: web.place,
        period: web.period,
        unit: web.unit,
        latestVersion: { id: latest.id, number: latest.number, status: latest.status, createdAt: latest.createdAt.toISOString() },
        published: p?.id ? { id: p.id, number: p.number!, publishedBy: p.publishedBy!, publishedAt: p.publishedAt!.toISOString() } : null,
        updatedAt: web.updatedAt.toISOString(),
      };
    });
    return { items, total };
  }

  private readonly listQueries = new Map<string, PreparedList>();

  /** The newest version of each web this person may see, with who published it (if it is published). */
  private latestVisible(user: CurrentUser) {
    return this.db
      .select({ id: webVersions.id, number: webVersions.number, status: webVersions.status, createdAt: webVersions.createdAt, publishedAt: webVersions.publishedAt, publishedBy: publisher.name })
      .from(webVersions)
      .leftJoin(publisher, eq(publisher.id, webVersions.publishedBy))
      .where(and(eq(webVersions.webId, webs.id), visibleVersion(user)))
      .orderBy(desc(webVersions.number))
      .limit(1)
      .as('latest');
  }

  /** The filter on name or place, and on the status of the latest visible version (the `latest` subquery); values or placeholders. */
  private listFilters(query: WebListQuery, values: { pattern: unknown; status: unknown }): SQL | undefined {
    const pattern = values.pattern as string;
    return and(
      query.filter ? or(ilike(webs.name, pattern), ilike(webs.place, pattern)) : undefined,
      query.status ? sql`"latest"."status" = ${values.status}` : undefined,
    );
  }

  private listQuery(user: CurrentUser, query: WebListQuery, name: string): PreparedList {
    const latest = this.latestVisible(user);
    const fields = {
      web: webs,
      latest: { id: latest.id, number: latest.number, status: latest.status, createdAt: latest.createdAt, publishedAt: latest.publishedAt, publishedBy: latest.publishedBy },
      total: sql<number>`cast(count(*) over () as integer)`,
    };
    const where = this.listFilters(query, { pattern: sql.placeholder('pattern'), status: sql.placeholder('status') });
    const order = query.direction === 'asc' ? asc : desc;
    // People expect "alpha" before "Bravo": text sorts ignore case.
    const orderBy = [order(query.sort === 'updatedAt' ? webs.updatedAt : sql`lower(${webs[query.sort]})`), asc(webs.id)];
    const limit = sql.placeholder('limit') as unknown as number;
    const offset = sql.placeholder('offset') as unknown as number;
    if (!readsDrafts(user)) {
      // only those who read drafts can have a newest published version other than their latest
      return this.db.select(fields).from(webs).innerJoinLateral(latest, sql`true`).where(where).orderBy(...orderBy).limit(limit).offset(offset).prepare(name);
    }
    const published = this.db
      .select({ id: webVersions.id, number: webVersions.number, publishedAt: webVersions.publishedAt, publishedBy: publisher.name })
      .from(webVersions)
      .leftJoin(publisher, eq(publisher.id, webVersions.publishedBy))
      .where(and(eq(webVersions.webId, webs.id), eq(webVersions.status, 'published')))
      .orderBy(desc(webVersions.number))
      .limit(1)
      .as('published');
    return this.db
      .select({ ...fields, published: { id: published.id, number: published.number, publishedAt: published.publishedAt, publishedBy: published.publishedBy } })
      .from(webs)
      .innerJoinLateral(latest, sql`true`)
      .leftJoinLateral(published, sql`true`)
      .where(where)
      .orderBy(...orderBy)
      .limit(limit)
      .offset(offset)
      .prepare(name);
  }

  async create(user: CurrentUser, input: NewWeb): Promise<Created> {
    return this.db.transaction(async (tx) => {
      const id = randomUUID();
      const name = input.name ?? input.web.name;
      await tx.insert(webs).values({ id, name, place: input.place, period: input.period, unit: input.web.unit, createdBy: user.id });
      const versionId = await this.insertVersion(tx, user, { webId: id, number: 1, web: input.web, note: input.note, basedOn: null });
      await recordAudit(tx, { actorId: user.id, action: 'web.created', subject: `web:${id}/version:${versionId}`, detail: `Web "${name}" created with draft version 1` });
      return { id, versionId };
    });
  }

  async detail(user: CurrentUser, webId: string): Promise<WebDetail> {
    const web = await this.visibleWebRow(user, webId);
    const versions = await this.versionRows(and(eq(webVersions.webId, webId), visibleVersion(user)));
    const [by] = await this.db.select({ name: users.name }).from(users).where(eq(users.id, web.createdBy));
    return {
      id: web.id,
      name: web.name,
      place: web.place,
      period: web.period,
      unit: web.unit,
      createdBy: by?.name ?? '',
      createdAt: web.createdAt.toISOString(),
      versions: versions.sort((a, b) => b.number - a.number).map(({ webId: _, ...summary }) => summary),
    };
  }

  async version(user: CurrentUser, webId: string, versionId: string): Promise<VersionDetail> {
    const summary = await this.visibleVersion(user, webId, versionId);
    return { ...summary, webId, web: await this.web(versionId) };
  }

  /** The web's place and period with a version's web, for the exports. */
  async versionForExport(user: CurrentUser, webId: string, versionId: string): Promise<{ web: Web; place: string; period: string; number: number }> {
    const summary = await this.visibleVersion(user, webId, versionId);
    const row = await this.visibleWebRow(user, webId);
    return { web: await this.web(versionId), place: row.place, period: row.period, number: summary.number };
  }

  async newVersion(user: CurrentUser, webId: string, input: { web: Web; note: string; basedOn: string | null }): Promise<Created> {
    await this.visibleWebRow(user, webId);
    if (input.basedOn !== null) {
      const [base] = await this.db.select({ id: webVersions.id }).from(webVersions).where(and(eq(webVersions.id, input.basedOn), eq(webVersions.webId, webId)));
      if (!base) throw new RequestError(422, 'basedOn must name a version of this web', [`basedOn: no version "${input.basedOn}" in this web`]);
    }
    return this.db.transaction(async (tx) => {
      // The web's row is the lock that gives concurrent saves distinct, consecutive numbers.
      await tx.select({ id: webs.id }).from(webs).where(eq(webs.id, webId)).for('update');
      const [{ last }] = await tx.select({ last: max(webVersions.number) }).from(webVersions).where(eq(webVersions.webId, webId));
      const number = (last ?? 0) + 1;
      const versionId = await this.insertVersion(tx, user, { webId, number, web: input.web, note: input.note, basedOn: input.basedOn });
      await tx.update(webs).set({ updatedAt: new Date() }).where(eq(webs.id, webId));
      await recordAudit(tx, { actorId: user.id, action: 'web.version-created', subject: `web:${webId}/version:${versionId}`, detail: `Draft version ${number} saved${input.basedOn ? ` from version ${input.basedOn}` : ''}` });
      return { id: webId, versionId };
    });
  }

  async publish(user: CurrentUser, webId: string, versionId: string): Promise<VersionSummary> {
    await this.visibleVersion(user, webId, versionId);
    const web = await this.web(versionId);
    const unbalanced = imbalances(createNetwork(web));
    if (unbalanced.length > 0) {
      throw new RequestError(
        422,
        `The version is not balanced (${unbalanced.map((u) => u.id).join(', ')}): balance it and save it as a new draft before publishing`,
        unbalanced.map((u) => `compartment "${u.id}" is unbalanced: inputs ${u.inputs} and outputs ${u.outputs} differ by ${u.imbalance}`),
      );
    }
    await this.db.transaction(async (tx) => {
      const [row] = await tx.select().from(webVersions).where(eq(webVersions.id, versionId)).for('update');
      if (row.status === 'published') throw new RequestError(409, `Version ${row.number} is already published: published versions cannot change`);
      const now = new Date();
      await tx.update(webVersions).set({ status: 'published', publishedBy: user.id, publishedAt: now }).where(eq(webVersions.id, versionId));
      await tx.update(webs).set({ updatedAt: now }).where(eq(webs.id, webId));
      await recordAudit(tx, { actorId: user.id, action: 'web.published', subject: `web:${webId}/version:${versionId}`, detail: `Version ${row.number} published` });
    });
    return this.visibleVersion(user, webId, versionId);
  }

  async clone(user: CurrentUser, webId: string, versionId: string, input: { name: string; place?: string; period?: string }): Promise<Created> {
    const source = await this.versionForExport(user, webId, versionId);
    return this.db.transaction(async (tx) => {
      const id = randomUUID();
      const place = input.place ?? source.place;
      const period = input.period ?? source.period;
      await tx.insert(webs).values({ id, name: input.name, place, period, unit: source.web.unit, createdBy: user.id });
      const newVersionId = await this.insertVersion(tx, user, { webId: id, number: 1, web: { ...source.web, name: input.name }, note: `Cloned from version ${source.number}`, basedOn: versionId });
      await recordAudit(tx, { actorId: user.id, action: 'web.cloned', subject: `web:${id}/version:${newVersionId}`, detail: `Web "${input.name}" cloned from web ${webId} version ${source.number}` });
      return { id, versionId: newVersionId };
    });
  }

  private async insertVersion(tx: Db, user: CurrentUser, v: { webId: string; number: number; web: Web; note: string; basedOn: string | null }): Promise<string> {
    const id = randomUUID();
    await tx.insert(webVersions).values({
      id,
      webId: v.webId,
      number: v.number,
      note: v.note,
      basedOn: v.basedOn,
      createdBy: user.id,
      webName: v.web.name,
      unit: v.web.unit,
      areaKm2: v.web.areaKm2 ?? null,
      tonnesPerUnit: v.web.tonnesPerUnit ?? null,
    });
    await insertWebRows(tx, id, v.web);
    return id;
  }

  private async visibleWebRow(user: CurrentUser, webId: string): Promise<typeof webs.$inferSelect> {
    const [web] = await this.db.select().from(webs).where(and(eq(webs.id, webId), visibleWeb(user)));
    if (!web) throw new RequestError(404, 'No such web');
    return web;
  }

  /** A version of this web the person may see, or 404 (a draft hidden from them included); asked on every read of a version, so prepared per role. */
  async visibleVersion(user: CurrentUser, webId: string, versionId: string): Promise<VersionSummary> {
    let prepared = this.visibleVersionQueries.get(user.role);
    if (!prepared) {
      prepared = this.versionRowsQuery(and(eq(webVersions.id, sql.placeholder('versionId')), eq(webVersions.webId, sql.placeholder('webId')), visibleVersion(user))).prepare(`visible_version_${user.role}`);
      this.visibleVersionQueries.set(user.role, prepared);
    }
    const [version] = (await prepared.execute({ versionId, webId })).map(versionSummary);
    if (!version) throw new RequestError(404, readsDrafts(user) ? 'No such version of this web' : 'No such published version of this web');
    const { webId: _, ...summary } = version;
    return summary;
  }

  private readonly visibleVersionQueries = new Map<string, ReturnType<ReturnType<WebService['versionRowsQuery']>['prepare']>>();

  private async versionRows(where: SQL | undefined): Promise<(VersionSummary & { webId: string })[]> {
    return (await this.versionRowsQuery(where)).map(versionSummary);
  }

  private versionRowsQuery(where: SQL | undefined) {
    return this.db
      .select({
        id: webVersions.id,
        webId: webVersions.webId,
        number: webVersions.number,
        status: webVersions.status,
        note: webVersions.note,
        createdBy: creator.name,
        createdAt: webVersions.createdAt,
        publishedBy: publisher.name,
        publishedAt: webVersions.publishedAt,
        basedOn: webVersions.basedOn,
      })
      .from(webVersions)
      .innerJoin(creator, eq(creator.id, webVersions.createdBy))
      .leftJoin(publisher, eq(publisher.id, webVersions.publishedBy))
      .where(where);
  }
}

function versionSummary<T extends { createdAt: Date; publishedAt: Date | null }>(row: T): Omit<T, 'createdAt' | 'publishedAt'> & { createdAt: string; publishedAt: string | null } {
  return { ...row, createdAt: row.createdAt.toISOString(), publishedAt: row.publishedAt?.toISOString() ?? null };
}
