import { and, eq, getTableColumns, inArray, sql, type SQL } from 'drizzle-orm';
import { SCALAR_INDICATORS, type Comparison, type CurrentUser } from '@seinework/contracts';
import type { Db } from '../db/database';
import { options, runs, users } from '../db/schema';
import { RequestError } from '../http/errors';
import { comparedIndicators } from './compared-indicators';
import { visibleOption } from './option-visibility';
import type { PreferenceService } from './preference-service';
import { runSummary } from './run-summary';

const { result: _result, ...runColumns } = getTableColumns(runs);

/**
 * Only what a comparison reads of a stored result (its scalar indicators and their bands), picked
 * out by the database: a whole document carries n² tables, megabytes on a large web.
 */
const COMPARED_KEYS = [...SCALAR_INDICATORS, 'fishingInBalance'];
const pick = (path: SQL): SQL => sql`jsonb_build_object(${sql.join(COMPARED_KEYS.map((key) => sql`${key}::text, ${path} -> ${key}::text`), sql`, `)})`;
const scalarsOfResult = sql<unknown>`jsonb_build_object(
  'baseline', ${pick(sql`(${runs.result} -> 'baseline')`)},
  'option', ${pick(sql`(${runs.result} -> 'option')`)},
  'difference', ${pick(sql`(${runs.result} -> 'difference')`)},
  'uncertainty', ${runs.result} -> 'uncertainty'
)`;

/**
 * `GET /api/comparisons?runs=…`: 2–6 finished runs of options on one baseline, every scalar
 * indicator side by side, with the council's current preferences on those options.
 */
export class ComparisonService {
  constructor(
    private readonly db: Db,
    private readonly preferenceService: PreferenceService,
  ) {}

  async compare(user: CurrentUser, runIds: readonly string[]): Promise<Comparison> {
    const rows = await this.db
      .select({ run: runColumns, scalars: scalarsOfResult, createdBy: users.name, optionName: options.name, webId: options.webId, versionId: options.versionId })
      .from(runs)
      .innerJoin(options, eq(options.id, runs.optionId))
      .innerJoin(users, eq(users.id, runs.createdBy))
      .where(and(inArray(runs.id, [...runIds]), visibleOption(user)));
    const ordered = runIds.map((id) => rows.find((row) => row.run.id === id));
    const missing = runIds.filter((_id, i) => !ordered[i]);
    if (missing.length > 0) throw new RequestError(404, `No such run: ${missing.join(', ')}`);
    const found = ordered as NonNullable<(typeof ordered)[number]>[];
    const unfinished = found.filter((row) => row.run.status !== 'done');
    if (unfinished.length > 0) throw new RequestError(409, 'Only finished runs can be compared', unfinished.map((row) => `run ${row.run.id} ("${row.optionName}") is ${row.run.status}`));
    if (new Set(found.map((row) => row.versionId)).size > 1) {
      throw new RequestError(422, 'Compared runs must stand on one baseline (one published version)', found.map((row) => `run ${row.run.id} ("${row.optionName}") is on version ${row.versionId}`));
    }
    return {
      runs: found.map((row) => ({ ...runSummary(row.run, row.createdBy), optionName: row.optionName, webId: row.webId, versionId: row.versionId })),
      indicators: comparedIndicators(found.map((row) => ({ runId: row.run.id, result: row.scalars }))),
      preferences: await this.preferenceService.current([...new Set(found.map((row) => row.run.optionId))]),
    };
  }
}
