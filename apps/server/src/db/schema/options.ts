import { sql } from 'drizzle-orm';
import { boolean, check, doublePrecision, index, integer, jsonb, pgTable, text, timestamp, uniqueIndex } from 'drizzle-orm/pg-core';
import type { Adjustment, ResponseRule, RunStatus, ShareAudience, UncertaintySettings } from '@seinework/contracts';
import { users } from './accounts';
import { webs, webVersions } from './webs';

/**
 * Harvest options on published baselines, their runs (one table that is also the queue), the shares
 * for council review and the council's preferences. An option with runs keeps its inputs (the
 * service refuses to edit it); each run stores its own copy of the inputs anyway, so a result always
 * says exactly what produced it.
 */

const at = (name: string) => timestamp(name, { withTimezone: true, mode: 'date' });
const userRef = (name: string) => text(name).references(() => users.id);

export const options = pgTable(
  'options',
  {
    id: text('id').primaryKey(),
    webId: text('web_id')
      .notNull()
      .references(() => webs.id),
    /** A published version (the service refuses drafts): the baseline the option changes. */
    versionId: text('version_id')
      .notNull()
      .references(() => webVersions.id),
    name: text('name').notNull(),
    purpose: text('purpose').notNull().default(''),
    response: text('response').$type<ResponseRule>().notNull(),
    adjustments: jsonb('adjustments').$type<Adjustment[]>().notNull(),
    uncertainty: jsonb('uncertainty').$type<UncertaintySettings | null>(),
    createdBy: userRef('created_by').notNull(),
    createdAt: at('created_at').notNull().defaultNow(),
    updatedAt: at('updated_at').notNull().defaultNow(),
  },
  (table) => [index('options_version_idx').on(table.versionId, table.createdAt)],
);

/** What a run was started with, kept with the run (the option may be duplicated or deleted later). */
export interface RunInputs {
  webId: string;
  versionId: string;
  option: { name: string; response: ResponseRule; adjustments: Adjustment[] };
  uncertainty: UncertaintySettings | null;
}

/**
 * A run, and the queue: workers claim the oldest queued run (`status = 'queued'`, or a 'running' run
 * whose lease expired) with `FOR UPDATE SKIP LOCKED`, renew the lease while drawing, and check
 * `cancel_requested` between chunks.
 */
export const runs = pgTable(
  'runs',
  {
    id: text('id').primaryKey(),
    optionId: text('option_id')
      .notNull()
      .references(() => options.id, { onDelete: 'cascade' }),
    status: text('status').$type<RunStatus>().notNull().default('queued'),
    inputs: jsonb('inputs').$type<RunInputs>().notNull(),
    draws: integer('draws').notNull(),
    cv: doublePrecision('cv').notNull(),
    seed: integer('seed').notNull(),
    engineVersion: text('engine_version').notNull(),
    progressDone: integer('progress_done').notNull().default(0),
    progressTotal: integer('progress_total').notNull().default(0),
    /** The `scenario` command's document `{baseline, option, difference, web, uncertainty?}`, once done. */
    result: jsonb('result'),
    error: text('error'),
    cancelRequested: boolean('cancel_requested').notNull().default(false),
    /** Which worker holds the run, until when; an expired lease lets another worker take it up again. */
    leaseOwner: text('lease_owner'),
    leaseExpiresAt: at('lease_expires_at'),
    heartbeatAt: at('heartbeat_at'),
    attempts: integer('attempts').notNull().default(0),
    createdBy: userRef('created_by').notNull(),
    createdAt: at('created_at').notNull().defaultNow(),
    startedAt: at('started_at'),
    finishedAt: at('finished_at'),
    /** Time spent computing (ms), apart from time waiting in the queue. */
    runMs: integer('run_ms'),
  },
  (table) => [
    index('runs_status_created_idx').on(table.status, table.createdAt),
    index('runs_option_idx').on(table.optionId, table.createdAt),
    check('runs_status_check', sql`${table.status} in ('queued', 'running', 'done', 'failed', 'cancelled')`),
  ],
);

/** An option shared with an audience; withdrawing keeps the row (the record of who saw what, when). */
export const shares = pgTable(
  'shares',
  {
    id: text('id').primaryKey(),
    optionId: text('option_id')
      .notNull()
      .references(() => options.id, { onDelete: 'cascade' }),
    audience: text('audience').$type<ShareAudience>().notNull(),
    /** The run the share shows. */
    runId: text('run_id').references(() => runs.id, { onDelete: 'set null' }),
    sharedBy: userRef('shared_by').notNull(),
    sharedAt: at('shared_at').notNull().defaultNow(),
    closesAt: at('closes_at'),
    withdrawnBy: userRef('withdrawn_by'),
    withdrawnAt: at('withdrawn_at'),
  },
  (table) => [
    index('shares_option_idx').on(table.optionId),
    /** At most one active share of an option per audience. */
    uniqueIndex('shares_active_unique').on(table.optionId, table.audience).where(sql`${table.withdrawnAt} is null`),
    check('shares_audience_check', sql`${table.audience} in ('council', 'public')`),
  ],
);

/**
 * A council member's preference among the options on one baseline, with a reason. History is kept:
 * a new preference supersedes the member's current one on that baseline (superseded_at set), so
 * each member has at most one current preference per baseline.
 */
export const preferences = pgTable(
  'preferences',
  {
    id: text('id').primaryKey(),
    optionId: text('option_id')
      .notNull()
      .references(() => options.id, { onDelete: 'cascade' }),
    /** The baseline (published version) the preference is among options of. */
    versionId: text('version_id')
      .notNull()
      .references(() => webVersions.id),
    memberId: userRef('member_id').notNull(),
    reason: text('reason').notNull(),
    comparedRuns: jsonb('compared_runs').$type<string[]>().notNull().default([]),
    createdAt: at('created_at').notNull().defaultNow(),
    supersededAt: at('superseded_at'),
  },
  (table) => [
    index('preferences_option_idx').on(table.optionId),
    uniqueIndex('preferences_current_unique').on(table.versionId, table.memberId).where(sql`${table.supersededAt} is null`),
  ],
);
