import { z } from 'zod';
import type { Web } from './web';

/** Request and answer shapes of stored webs and their versions (`/api/webs`). */

export const VERSION_STATUSES = ['draft', 'published'] as const;
export type VersionStatus = (typeof VERSION_STATUSES)[number];

/** A row of the list of webs. */
export interface WebSummary {
  id: string;
  name: string;
  place: string;
  period: string;
  unit: string;
  latestVersion: { id: string; number: number; status: VersionStatus; createdAt: string };
  /** The newest published version, if any. */
  published: { id: string; number: number; publishedBy: string; publishedAt: string } | null;
  updatedAt: string;
}

export interface VersionSummary {
  id: string;
  number: number;
  status: VersionStatus;
  note: string;
  createdBy: string;
  createdAt: string;
  publishedBy: string | null;
  publishedAt: string | null;
  /** The version this one was cloned or edited from. */
  basedOn: string | null;
}

/** `GET /api/webs/:id`. */
export interface WebDetail {
  id: string;
  name: string;
  place: string;
  period: string;
  unit: string;
  createdBy: string;
  createdAt: string;
  versions: VersionSummary[];
}

/** `GET /api/webs/:id/versions/:versionId`. */
export interface VersionDetail extends VersionSummary {
  webId: string;
  web: Web;
}

const text = (what: string, max: number) => z.string({ error: `${what} must be a string` }).trim().max(max, `${what} must be at most ${max} characters`);

/** `GET /api/webs` query. */
export const webListQuerySchema = z.strictObject({
  page: z.coerce.number({ error: 'page must be a number' }).int('page must be a whole number').min(1, 'page must be at least 1').default(1),
  pageSize: z.coerce.number({ error: 'pageSize must be a number' }).int('pageSize must be a whole number').min(1).max(100, 'pageSize must be at most 100').default(20),
  sort: z.enum(['name', 'place', 'period', 'updatedAt'], { error: 'sort must be one of name, place, period, updatedAt' }).default('updatedAt'),
  direction: z.enum(['asc', 'desc'], { error: 'direction must be asc or desc' }).default('desc'),
  filter: text('filter', 200).optional(),
  status: z.enum(VERSION_STATUSES, { error: 'status must be draft or published' }).optional(),
});
export type WebListQuery = z.infer<typeof webListQuerySchema>;

/** Place, period and a note travel beside WEB.json: the body of `POST /api/webs` is WEB.json itself,
 *  with these optional query parameters (or multipart fields on upload). */
export const webDetailsSchema = z.strictObject({
  place: text('place', 200).default(''),
  period: text('period', 100).default(''),
  note: text('note', 2000).default(''),
});
export type WebDetails = z.infer<typeof webDetailsSchema>;

/** The text fields of `POST /api/webs/upload` beside the file; name and unit win over the file's own. */
export const uploadFieldsSchema = webDetailsSchema.extend({
  name: text('name', 200).optional(),
  unit: text('unit', 100).optional(),
});
export type UploadFields = z.infer<typeof uploadFieldsSchema>;

/**
 * `POST /api/webs/:id/versions`: save an edited web as a new draft version. Every save is a new
 * version (traceable history); `basedOn` names the version the edit started from.
 */
export const newVersionBodySchema = z.strictObject({
  web: z.unknown(),
  note: text('note', 2000).optional(),
  basedOn: z.string({ error: 'basedOn must be a version id' }).max(64).optional(),
});

/** `POST /api/webs/:id/versions/:versionId/clone`: a new web whose first draft copies this version. */
export const cloneBodySchema = z.strictObject({ name: text('name', 200).min(1, 'name must not be empty'), place: text('place', 200).optional(), period: text('period', 100).optional() });

/**
 * `POST /api/webs/balance` (webs.edit): balance the web being edited and show what changed; nothing
 * is stored (the editor saves the result as a new draft). Answer: `BalancePreview`.
 */
export const balancePreviewBodySchema = z.strictObject({
  web: z.unknown(),
  method: z.enum(['input', 'output', 'average', 'least-change'], { error: 'method must be one of input, output, average, least-change' }).default('least-change'),
});

export interface BalancePreview {
  method: 'input' | 'output' | 'average' | 'least-change';
  wasBalanced: boolean;
  web: Web;
  changes: BalanceChange[];
}

/** One changed number of a balancing, for the "what changed" table. */
export interface BalanceChange {
  kind: 'flow' | 'import' | 'export' | 'respiration';
  from: string | null;
  to: string | null;
  fleet: string | null;
  before: number;
  after: number;
}

/** One problem of an upload, against the row and column of the file the person sent. */
export interface UploadProblem {
  /** The table (file or sheet) the row belongs to: compartments, flows, imports, exports, respiration, web. */
  table: string;
  /** 1-based row in that table, header row included (null for a problem of the whole table). */
  row: number | null;
  column: string | null;
  problem: string;
}
