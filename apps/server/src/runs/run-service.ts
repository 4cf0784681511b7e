import { randomInt, randomUUID } from 'node:crypto';
import { and, desc, eq, getTableColumns, sql } from 'drizzle-orm';
import { type CurrentUser, type RunDetail, type RunSummary, type UncertaintySettings } from '@seinework/contracts';
import { DEFAULT_CV } from '@seinework/network-analysis';
import { recordAudit } from '../audit/audit-log';
import type { Db } from '../db/database';
import { options, runs, users, type RunInputs } from '../db/schema';
import { RequestError } from '../http/errors';
import { lockOption, optionOf } from '../options/option-service';
import { visibleOption, visibleRun } from '../options/option-visibility';
import { runSummary } from '../options/run-summary';
import { ENGINE_VERSION } from '../seed/demo-run-document';
import type { RunQueue } from './run-queue';

/**
 * Starting, reading and cancelling runs of stored harvest options. A run stores its exact inputs
 * (the web version, the option in OPTION.json form, the response rule, seed, draws, cv and the
 * engine's version) and waits in the queue; who may read a run is who may read its option.
 */

export interface RunSettingsBody {
  readonly draws?: number;
  readonly cv?: number;
  readonly seed?: number;
}

type RunRow = typeof runs.$inferSelect;

/** Every column but the result document, which routes read as text (result-text.ts). */
const { result: _result, ...briefColumns } = getTableColumns(runs);

export const TERMINAL = new Set<RunRow['status']>(['done', 'failed', 'cancelled']);

export class RunService {
  constructor(
    private readonly db: Db,
    private readonly queue: RunQueue,
  ) {}

  async start(user: CurrentUser, optionId: string, body: RunSettingsBody): Promise<{ id: string }> {
    const id = randomUUID();
    await this.db.transaction(async (tx) => {
      // the option's row locked: an edit cannot slip in between its check for runs and this one
      await lockOption(tx, optionId);
      const [option] = await tx
        .select()
        .from(options)
        .where(and(eq(options.id, optionId), visibleOption(user)));
      if (!option) throw new RequestError(404, 'No such harvest option');
      const { name, response, adjustments } = optionOf(option);
      const uncertainty = settingsOf(body, option.uncertainty);
      const inputs: RunInputs = { webId: option.webId, versionId: option.versionId, option: { name, response, adjustments }, uncertainty };
      await tx.insert(runs).values({
        id,
        optionId,
        inputs,
        draws: uncertainty?.draws ?? 0,
        cv: uncertainty?.cv ?? 0,
        seed: uncertainty?.seed ?? 0,
        engineVersion: ENGINE_VERSION,
        progressTotal: uncertainty?.draws ?? 0,
        createdBy: user.id,
      });
      const what = uncertainty ? `${uncertainty.draws} draws, cv ${uncertainty.cv}, seed ${uncertainty.seed}` : 'no uncertainty draws';
      await recordAudit(tx, { actorId: user.id, action: 'run.started', subject: `run:${id}`, detail: `Run of harvest option "${name}" (${optionId}) queued: ${what}` });
    });
    this.queue.notify();
    this.queue.events.emit('changed', id);
    return { id };
  }

  async cancel(user: CurrentUser, id: string): Promise<RunSummary> {
    await this.db.transaction(async (tx) => {
      const [row] = await tx
        .select({ run: runs, optionName: options.name })
        .from(runs)
        .innerJoin(options, eq(options.id, runs.optionId))
        .where(and(eq(runs.id, id), visibleOption(user)))
        .for('update', { of: runs });
      if (!row) throw new RequestError(404, 'No such run');
      if (TERMINAL.has(row.run.status)) throw new RequestError(409, `This run is ${row.run.status} already: there is nothing to cancel`);
      // a queued run never starts; a running one stops at its next chunk of draws
      if (row.run.status === 'queued') await tx.update(runs).set({ status: 'cancelled', cancelRequested: true, finishedAt: new Date() }).where(eq(runs.id, id));
      else await tx.update(runs).set({ cancelRequested: true }).where(eq(runs.id, id));
      await recordAudit(tx, { actorId: user.id, action: 'run.cancelled', subject: `run:${id}`, detail: `Run of harvest option "${row.optionName}" cancelled while ${row.run.status}` });
    });
    this.queue.notify(id);
    this.queue.events.emit('changed', id);
    return (await this.visible(user, id)).summary;
  }

  /** The run without its result document (GET /api/runs/:id adds it as text when done). */
  async detail(user: CurrentUser, id: string): Promise<Omit<RunDetail, 'result'>> {
    const { row, summary } = await this.visible(user, id);
    const queuedMs = row.startedAt ? row.startedAt.getTime() - row.createdAt.getTime() : null;
    return {
      ...summary,
      inputs: { webId: row.inputs.webId, versionId: row.inputs.versionId, option: row.inputs.option, uncertainty: row.inputs.uncertainty },
      timings: row.startedAt || row.runMs !== null ? { queuedMs, runMs: row.runMs } : null,
    };
  }

  /** The run in brief, for progress events; 404 when this person may not see it. */
  async summary(user: CurrentUser, id: string): Promise<RunSummary> {
    return (await this.visible(user, id)).summary;
  }

  async listForOption(user: CurrentUser, optionId: string): Promise<{ items: RunSummary[]; total: number }> {
    const [option] = await this.db
      .select({ id: options.id })
      .from(options)
      .where(and(eq(options.id, optionId), visibleOption(user)));
    if (!option) throw new RequestError(404, 'No such harvest option');
    const rows = await this.db
      .select({ run: runs, createdBy: users.name })
      .from(runs)
      .innerJoin(users, eq(users.id, runs.createdBy))
      .where(eq(runs.optionId, optionId))
      .orderBy(desc(runs.createdAt), desc(runs.id));
    const items = rows.map((r) => runSummary(r.run, r.createdBy));
    return { items, total: items.length };
  }

  /** The run if this person may see it; asked on every read of a run (and every progress event), so prepared per role. */
  private async visible(user: CurrentUser, id: string): Promise<{ row: RunRow; summary: RunSummary }> {
    let prepared = this.visibleQueries.get(user.role);
    if (!prepared) {
      prepared = this.visibleQuery(user);
      this.visibleQueries.set(user.role, prepared);
    }
    const [found] = await prepared.execute({ id });
    if (!found) throw new RequestError(404, 'No such run');
    const row = { ...found.run, result: null };
    return { row, summary: runSummary(row, found.createdBy) };
  }

  private readonly visibleQueries = new Map<string, ReturnType<RunService['visibleQuery']>>();

  private visibleQuery(user: CurrentUser) {
    return this.db
      .select({ run: briefColumns, createdBy: users.name })
      .from(runs)
      .innerJoin(options, eq(options.id, runs.optionId))
      .innerJoin(users, eq(users.id, runs.createdBy))
      .where(and(eq(runs.id, sql.placeholder('id')), visibleRun(user)))
      .prepare(`visible_run_${user.role}`);
  }
}

/** The body's settings over the option's own; no draws, no uncertainty (the deterministic run alone). */
function settingsOf(body: RunSettingsBody, own: UncertaintySettings | null): UncertaintySettings | null {
  const draws = body.draws ?? own?.draws ?? 0;
  if (draws === 0) return null;
  // a seed the run was not given is chosen now and stored: the run can be repeated bit for bit
  return { draws, cv: body.cv ?? own?.cv ?? DEFAULT_CV, seed: body.seed ?? own?.seed ?? randomInt(2 ** 31 - 1) };
}
