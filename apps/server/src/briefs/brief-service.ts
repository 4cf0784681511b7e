import { and, desc, eq, inArray, isNotNull, isNull, sql } from 'drizzle-orm';
import type { BriefBand, BriefWeb, ComparisonBrief, CurrentUser, OptionBrief } from '@seinework/contracts';
import type { Db } from '../db/database';
import { options, runs, shares, webs, webVersions } from '../db/schema';
import type { EngineJobs } from '../engine/engine-jobs';
import { RequestError } from '../http/errors';
import { readWeb } from '../webs/version-rows';
import { ComparisonService } from '../options/comparison-service';
import { optionOf, OptionService } from '../options/option-service';
import { PreferenceService } from '../options/preference-service';
import { adjustmentInWords, CAUTION, indicatorLabel, letter, responseInWords } from './brief-words';
import { fitnessChart, type PlacedPoint } from './charts/fitness-chart';
import { commentCounts } from './comment-counts';
import { optionBriefModel, type RunResult } from './option-brief-model';

/**
 * The briefs of an option (one finished run of it) and of a comparison: who may read them is who
 * may read the options (404 otherwise, as the option routes answer); a brief needs finished runs.
 */
export class BriefService {
  private readonly optionService: OptionService;
  private readonly preferenceService: PreferenceService;
  private readonly comparisonService: ComparisonService;

  constructor(
    private readonly db: Db,
    engine: EngineJobs,
  ) {
    this.optionService = new OptionService(db, engine);
    this.preferenceService = new PreferenceService(db, this.optionService);
    this.comparisonService = new ComparisonService(db, this.preferenceService);
  }

  async optionBrief(user: CurrentUser, optionId: string, runId?: string): Promise<OptionBrief> {
    const option = await this.optionService.visibleRow(user, optionId);
    const run = await this.briefRun(optionId, runId);
    const [result] = await this.db.select({ result: runs.result }).from(runs).where(eq(runs.id, run.id));
    const [web, preferences, comments] = await Promise.all([this.web(option.versionId), this.preferenceService.current([optionId]), commentCounts(this.db, optionId)]);
    return optionBriefModel({
      option: { id: option.id, name: option.name, purpose: option.purpose, inputs: { ...optionOf(option), ...run.inputs.option } },
      web,
      run: { id: run.id, engineVersion: run.engineVersion, seed: run.seed, draws: run.draws, cv: run.cv, finishedAt: (run.finishedAt ?? run.createdAt).toISOString() },
      result: result!.result as RunResult,
      preferences,
      comments,
    });
  }

  async comparisonBrief(user: CurrentUser, runIds: readonly string[]): Promise<ComparisonBrief> {
    const comparison = await this.comparisonService.compare(user, runIds);
    const rows = await this.db
      .select({
        id: runs.id,
        optionId: runs.optionId,
        inputs: runs.inputs,
        purpose: options.purpose,
        versionId: options.versionId,
        places: sql<Places>`jsonb_build_object(
          'baseline', jsonb_build_object('a', ${runs.result} #> '{baseline,relativeAscendency}', 'f', ${runs.result} #> '{baseline,robustness}'),
          'option', jsonb_build_object('a', ${runs.result} #> '{option,relativeAscendency}', 'f', ${runs.result} #> '{option,robustness}'),
          'bandA', ${runs.result} #> '{uncertainty,indicators,relativeAscendency}',
          'bandF', ${runs.result} #> '{uncertainty,indicators,robustness}'
        )`,
      })
      .from(runs)
      .innerJoin(options, eq(options.id, runs.optionId))
      .where(inArray(runs.id, [...runIds]));
    const byId = new Map(rows.map((row) => [row.id, row]));
    const [web, baselineWeb] = await Promise.all([this.web(rows[0]!.versionId), readWeb(this.db, rows[0]!.versionId)]);
    const names = new Map(baselineWeb.compartments.map((c) => [c.id, c.name]));
    const compared = comparison.runs.map((run) => {
      const row = byId.get(run.id)!;
      return {
        runId: run.id,
        optionId: run.optionId,
        optionName: run.optionName,
        purpose: row.purpose,
        responseInWords: responseInWords(row.inputs.option.response),
        adjustments: row.inputs.option.adjustments.map((a) => adjustmentInWords(a, (id) => names.get(id) ?? id, web.unit)),
        engineVersion: run.engineVersion,
        seed: run.seed,
        draws: run.draws,
        finishedAt: run.finishedAt ?? run.createdAt,
      };
    });
    const first = byId.get(comparison.runs[0]!.id)!.places;
    const points: PlacedPoint[] = [
      { label: 'baseline', relativeAscendency: first.baseline.a, robustness: first.baseline.f, bandA: first.bandA?.baseline ?? null, bandF: first.bandF?.baseline ?? null, baseline: true },
      ...comparison.runs.map((run, k) => {
        const places = byId.get(run.id)!.places;
        return { label: letter(k), relativeAscendency: places.option.a, robustness: places.option.f, bandA: places.bandA?.option ?? null, bandF: places.bandF?.option ?? null };
      }),
    ];
    return {
      web,
      options: compared,
      indicators: comparison.indicators.map((indicator) => ({ ...indicator, label: indicatorLabel(indicator.key) })),
      fitnessCurve: fitnessChart(points),
      preferences: comparison.preferences,
      caution: CAUTION,
      dated: compared.map((o) => o.finishedAt).sort().at(-1)!,
    };
  }

  /** The run a brief shows: the one asked for (a finished run of this option), or the option's newest finished run. */
  private async briefRun(optionId: string, runId?: string) {
    const { result: _result, ...columns } = runColumns();
    if (runId !== undefined) {
      const [run] = await this.db.select(columns).from(runs).where(and(eq(runs.id, runId), eq(runs.optionId, optionId)));
      if (!run) throw new RequestError(404, 'No such run of this option');
      if (run.status !== 'done') throw new RequestError(409, `This run is ${run.status}: a brief shows a finished run`);
      return run;
    }
    // without ?run=: the run the option is shared with (what the council and the public discuss), else the latest finished one
    const [sharedRun] = await this.db
      .select(columns)
      .from(shares)
      .innerJoin(runs, eq(runs.id, shares.runId))
      .where(and(eq(shares.optionId, optionId), isNull(shares.withdrawnAt), isNotNull(shares.runId), eq(runs.status, 'done')))
      .orderBy(desc(shares.sharedAt), desc(shares.id))
      .limit(1);
    if (sharedRun) return sharedRun;
    const [run] = await this.db
      .select(columns)
      .from(runs)
      .where(and(eq(runs.optionId, optionId), eq(runs.status, 'done')))
      .orderBy(desc(runs.finishedAt), desc(runs.createdAt), desc(runs.id))
      .limit(1);
    if (!run) throw new RequestError(409, 'This option has no finished run yet: a brief shows a finished run (run the option first)');
    return run;
  }

  private async web(versionId: string): Promise<BriefWeb> {
    const [row] = await this.db
      .select({ id: webs.id, name: webs.name, versionId: webVersions.id, versionNumber: webVersions.number, unit: webVersions.unit })
      .from(webVersions)
      .innerJoin(webs, eq(webs.id, webVersions.webId))
      .where(eq(webVersions.id, versionId));
    if (!row) throw new RequestError(404, 'No such version of this web');
    return row;
  }
}

interface Places {
  baseline: { a: number; f: number };
  option: { a: number; f: number };
  bandA: { baseline: BriefBand | null; option: BriefBand | null } | null;
  bandF: { baseline: BriefBand | null; option: BriefBand | null } | null;
}

function runColumns() {
  return {
    result: runs.result,
    id: runs.id,
    status: runs.status,
    inputs: runs.inputs,
    engineVersion: runs.engineVersion,
    seed: runs.seed,
    draws: runs.draws,
    cv: runs.cv,
    createdAt: runs.createdAt,
    finishedAt: runs.finishedAt,
  };
}
