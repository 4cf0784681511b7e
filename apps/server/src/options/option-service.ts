import { randomUUID } from 'node:crypto';
import { and, asc, count, desc, eq, inArray, isNull, type SQL } from 'drizzle-orm';
import { TEXT_LIMITS, type CurrentUser, type HarvestOption, type OptionDetail, type OptionPreview, type OptionSummary, type ShareSummary, type StoredOptionBody } from '@seinework/contracts';
import { recordAudit } from '../audit/audit-log';
import type { Db } from '../db/database';
import { comments, options, preferences, runs, shares, users, webVersions } from '../db/schema';
import type { EngineJobs } from '../engine/engine-jobs';
import { RequestError } from '../http/errors';
import { readWeb } from '../webs/version-rows';
import { visibleVersion } from '../webs/visibility';
import { withOptionProblems } from './engine-problems';
import { optionPreview } from './option-preview';
import { runSummary } from './run-summary';
import { readsPublicOnly, visibleOption, visibleShare } from './option-visibility';

/**
 * Stored harvest options: every query and transaction of the option routes. An option stands on a
 * published version; the engine's deterministic run must accept it before it is stored. An option
 * with runs keeps its inputs (duplicate it to change them); every change is audited in its
 * transaction.
 */

type OptionRow = typeof options.$inferSelect;

const ACTIVE_RUN = ['queued', 'running'] as const;

export class OptionService {
  constructor(
    private readonly db: Db,
    private readonly engine: EngineJobs,
  ) {}

  async create(user: CurrentUser, webId: string, versionId: string, body: StoredOptionBody, signal?: AbortSignal): Promise<{ id: string }> {
    await this.publishedVersion(user, webId, versionId);
    await this.check(versionId, body, signal);
    const id = randomUUID();
    await this.db.transaction(async (tx) => {
      await tx.insert(options).values({ id, webId, versionId, createdBy: user.id, ...columnsOf(body) });
      await recordAudit(tx, { actorId: user.id, action: 'option.created', subject: `option:${id}`, detail: `Harvest option "${body.name}" on version ${versionId}` });
    });
    return { id };
  }

  async list(user: CurrentUser, webId: string, versionId: string): Promise<{ items: OptionSummary[]; total: number }> {
    const [version] = await this.db
      .select({ id: webVersions.id })
      .from(webVersions)
      .where(and(eq(webVersions.id, versionId), eq(webVersions.webId, webId), visibleVersion(user)));
    if (!version) throw new RequestError(404, 'No such published version of this web');
    const rows = await this.db
      .select()
      .from(options)
      .where(and(eq(options.versionId, versionId), visibleOption(user)))
      .orderBy(asc(options.createdAt), asc(options.id));
    const items = await this.summaries(rows, user);
    return { items, total: items.length };
  }

  async detail(user: CurrentUser, id: string): Promise<OptionDetail> {
    const row = await this.visibleRow(user, id);
    const [summary] = await this.summaries([row], user);
    return { ...summary!, option: optionOf(row) };
  }

  async update(user: CurrentUser, id: string, body: StoredOptionBody, signal?: AbortSignal): Promise<OptionDetail> {
    const row = await this.visibleRow(user, id);
    await this.refuseIfFrozen(id);
    await this.check(row.versionId, body, signal);
    await this.db.transaction(async (tx) => {
      // the run check again, under a lock on the option's row (starting a run takes the same lock)
      await lockOption(tx, id);
      const [started] = await tx.select({ n: count() }).from(runs).where(eq(runs.optionId, id));
      if (started!.n > 0) throw frozen();
      await tx
        .update(options)
        .set({ ...columnsOf(body), updatedAt: new Date() })
        .where(eq(options.id, id));
      await recordAudit(tx, { actorId: user.id, action: 'option.edited', subject: `option:${id}`, detail: `Harvest option "${body.name}" edited` });
    });
    return this.detail(user, id);
  }

  async duplicate(user: CurrentUser, id: string, name?: string): Promise<{ id: string }> {
    const row = await this.visibleRow(user, id);
    const copy = randomUUID();
    const copyName = name ?? `${row.name} (copy)`.slice(0, TEXT_LIMITS.name);
    await this.db.transaction(async (tx) => {
      await tx.insert(options).values({
        id: copy,
        webId: row.webId,
        versionId: row.versionId,
        name: copyName,
        purpose: row.purpose,
        response: row.response,
        adjustments: row.adjustments,
        uncertainty: row.uncertainty,
        createdBy: user.id,
      });
      await recordAudit(tx, { actorId: user.id, action: 'option.duplicated', subject: `option:${copy}`, detail: `Harvest option "${copyName}" duplicated from "${row.name}" (${id})` });
    });
    return { id: copy };
  }

  async remove(user: CurrentUser, id: string): Promise<void> {
    const row = await this.visibleRow(user, id);
    await this.db.transaction(async (tx) => {
      await lockOption(tx, id);
      const [shared] = await tx.select({ id: shares.id }).from(shares).where(and(eq(shares.optionId, id), isNull(shares.withdrawnAt))).limit(1);
      if (shared) throw new RequestError(409, 'This option is shared: withdraw the share before deleting it');
      const [active] = await tx.select({ id: runs.id }).from(runs).where(and(eq(runs.optionId, id), inArray(runs.status, ACTIVE_RUN))).limit(1);
      if (active) throw new RequestError(409, 'This option has a run queued or running: cancel it before deleting the option');
      // the council's preferences are part of the record of its review
      const [preferred] = await tx.select({ id: preferences.id }).from(preferences).where(eq(preferences.optionId, id)).limit(1);
      if (preferred) throw new RequestError(409, 'Council members recorded preferences on this option: it is kept as part of the review');
      // so are the comments: people spoke on the record, even after the share was withdrawn
      const [commented] = await tx.select({ id: comments.id }).from(comments).where(eq(comments.optionId, id)).limit(1);
      if (commented) throw new RequestError(409, 'This option has comments from its discussion: it is kept as part of the record');
      await tx.delete(options).where(eq(options.id, id));
      await recordAudit(tx, { actorId: user.id, action: 'option.deleted', subject: `option:${id}`, detail: `Harvest option "${row.name}" deleted with its runs` });
    });
  }

  /** The option if this person may see it, or 404 (an option not shared with a council member included). */
  async visibleRow(user: CurrentUser, id: string): Promise<OptionRow> {
    const [row] = await this.db
      .select()
      .from(options)
      .where(and(eq(options.id, id), visibleOption(user)));
    if (!row) throw new RequestError(404, 'No such harvest option');
    return row;
  }

  /** The deterministic run of an option not stored, in brief (nothing is stored). */
  async preview(user: CurrentUser, webId: string, versionId: string, body: StoredOptionBody, signal?: AbortSignal): Promise<OptionPreview> {
    await this.publishedVersion(user, webId, versionId);
    return optionPreview(JSON.parse((await this.check(versionId, body, signal)).toString('utf8')));
  }

  /** The engine's deterministic run of the option on the version's web (off the main thread): 422 naming the adjustment it refuses. */
  private async check(versionId: string, body: StoredOptionBody, signal?: AbortSignal): Promise<Buffer> {
    const web = await readWeb(this.db, versionId);
    return withOptionProblems(() => this.engine.runOptionOffThread(web, { name: body.name, response: body.response, adjustments: body.adjustments }, { signal }));
  }

  /** 404 when the version is not there (for this person), 409 when it is a draft. */
  async publishedVersion(user: CurrentUser, webId: string, versionId: string): Promise<void> {
    const [version] = await this.db
      .select({ status: webVersions.status })
      .from(webVersions)
      .where(and(eq(webVersions.id, versionId), eq(webVersions.webId, webId), visibleVersion(user)));
    if (!version) throw new RequestError(404, 'No such version of this web');
    if (version.status !== 'published') throw new RequestError(409, 'This version is a draft: harvest options stand on published versions only (publish it first)');
  }

  private async refuseIfFrozen(id: string): Promise<void> {
    const [started] = await this.db.select({ n: count() }).from(runs).where(eq(runs.optionId, id));
    if (started!.n > 0) throw frozen();
  }

  /**
   * Options as listed: with their creator, whether they have runs, their newest run and the active
   * shares this person sees; to a stakeholder, the run their public share shows stands for the newest.
   */
  private async summaries(rows: OptionRow[], user: CurrentUser): Promise<OptionSummary[]> {
    if (rows.length === 0) return [];
    const ids = rows.map((r) => r.id);
    const creatorIds = [...new Set(rows.map((r) => r.createdBy))];
    const [names, runRows, shareRows] = await Promise.all([
      this.db.select({ id: users.id, name: users.name }).from(users).where(inArray(users.id, creatorIds)),
      this.db
        .select({ run: runs, createdBy: users.name })
        .from(runs)
        .innerJoin(users, eq(users.id, runs.createdBy))
        .where(inArray(runs.optionId, ids))
        .orderBy(desc(runs.createdAt), desc(runs.id)),
      activeShares(this.db, and(inArray(shares.optionId, ids), visibleShare(user))),
    ]);
    const publicOnly = readsPublicOnly(user);
    const nameOf = new Map(names.map((n) => [n.id, n.name]));
    return rows.map((row) => {
      const shown = shareRows.filter((s) => s.optionId === row.id);
      const latest = runRows.find((r) => r.run.optionId === row.id && (!publicOnly || shown.some((s) => s.runId === r.run.id)));
      return {
        id: row.id,
        webId: row.webId,
        versionId: row.versionId,
        name: row.name,
        purpose: row.purpose,
        response: row.response,
        adjustments: row.adjustments.length,
        frozen: latest !== undefined,
        createdBy: nameOf.get(row.createdBy) ?? '',
        createdAt: row.createdAt.toISOString(),
        latestRun: latest ? runSummary(latest.run, latest.createdBy) : null,
        shares: shown.map(({ optionId: _, ...share }) => share),
      };
    });
  }
}

/** The active shares matching a condition, with their sharer's name. */
export async function activeShares(db: Db, where: SQL | undefined): Promise<(ShareSummary & { optionId: string })[]> {
  const rows = await db
    .select({ share: shares, sharedBy: users.name })
    .from(shares)
    .innerJoin(users, eq(users.id, shares.sharedBy))
    .where(and(where, isNull(shares.withdrawnAt)))
    .orderBy(asc(shares.sharedAt));
  return rows.map(({ share, sharedBy }) => ({
    id: share.id,
    optionId: share.optionId,
    audience: share.audience,
    runId: share.runId,
    sharedBy,
    sharedAt: share.sharedAt.toISOString(),
    closesAt: share.closesAt?.toISOString() ?? null,
  }));
}

/** Serialises the changes of one option (edit, delete, starting a run): `SELECT … FOR UPDATE` on its row. */
export async function lockOption(tx: Db, id: string): Promise<void> {
  await tx.select({ id: options.id }).from(options).where(eq(options.id, id)).for('update');
}

function frozen(): RequestError {
  return new RequestError(409, 'This option has runs; duplicate it to change it');
}

function columnsOf(body: StoredOptionBody) {
  return { name: body.name, purpose: body.purpose ?? '', response: body.response, adjustments: body.adjustments, uncertainty: body.uncertainty ?? null };
}

/** The stored option in OPTION.json form. */
export function optionOf(row: OptionRow): HarvestOption {
  return { name: row.name, response: row.response, adjustments: row.adjustments, ...(row.uncertainty ? { uncertainty: row.uncertainty } : {}) };
}
