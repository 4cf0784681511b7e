import { z } from 'zod';
import { harvestOptionSchema, type HarvestOption, type UncertaintySettings } from './option';
import type { FleetSummary, ScalarIndicators } from './analysis';

/** Request and answer shapes of stored harvest options, runs, council review shares, comparisons and preferences. */

const text = (what: string, max: number) => z.string({ error: `${what} must be a string` }).trim().max(max, `${what} must be at most ${max} characters`);

/** Runs of up to this many draws are accepted (a background job, not a held-open request). */
export const MAX_RUN_DRAWS = 20_000;

/**
 * `POST /api/webs/:id/versions/:versionId/options` and `PUT /api/options/:id`: OPTION.json, with an
 * optional `purpose` (why the council should look at it) beside the OPTION.json keys.
 */
export const storedOptionBodySchema = harvestOptionSchema.extend({ purpose: text('purpose', 2000).optional() });
export type StoredOptionBody = z.infer<typeof storedOptionBodySchema>;

/** `POST /api/options/:id/runs`: the run's uncertainty settings, defaulting to the option's own. */
export const runBodySchema = z.strictObject({
  draws: z.number({ error: 'draws must be a number' }).int('draws must be a whole number').min(0, 'draws must be at least 0').max(MAX_RUN_DRAWS, `draws must be at most ${MAX_RUN_DRAWS}`).optional(),
  cv: z.number({ error: 'cv must be a number' }).min(0, 'cv must be at least 0').max(2, 'cv must be at most 2').optional(),
  seed: z.number({ error: 'seed must be a number' }).int('seed must be a whole number').min(0, 'seed must be at least 0').max(2 ** 31 - 1, 'seed must be below 2^31').optional(),
});

export const RUN_STATUSES = ['queued', 'running', 'done', 'failed', 'cancelled'] as const;
export type RunStatus = (typeof RUN_STATUSES)[number];

export const SHARE_AUDIENCES = ['council', 'public'] as const;
export type ShareAudience = (typeof SHARE_AUDIENCES)[number];
export const shareBodySchema = z.strictObject({
  audience: z.enum(SHARE_AUDIENCES, { error: 'audience must be "council" or "public"' }),
  /** Public comment only: when the discussion closes (ISO date-time). */
  closesAt: z.iso.datetime({ error: 'closesAt must be an ISO date-time', offset: true }).optional(),
  /** The run the share shows (default: the option's newest done run). */
  runId: z.string().max(64).optional(),
});

/** `GET /api/comparisons?runs=ID,ID` and the comparison brief: 2 to 6 distinct run ids, separated by commas. */
export const comparisonQuerySchema = z.strictObject({
  runs: z
    .string({ error: 'runs must list 2 to 6 run ids, separated by commas' })
    .transform((list) => list.split(',').map((part) => part.trim()))
    .pipe(
      z
        .array(z.string().min(1).max(64), { error: 'runs must list run ids' })
        .min(2, 'compare at least 2 runs')
        .max(6, 'compare at most 6 runs')
        .refine((ids) => new Set(ids).size === ids.length, 'a run is listed twice'),
    ),
});

export const preferenceBodySchema = z.strictObject({
  reason: text('reason', 4000).min(1, 'reason must not be empty'),
  /** The comparison the preference was recorded in (run ids), for the record. */
  comparedRuns: z.array(z.string().max(64)).max(6).optional(),
});

export interface ShareSummary {
  id: string;
  audience: ShareAudience;
  runId: string | null;
  sharedBy: string;
  sharedAt: string;
  closesAt: string | null;
}

export interface RunSummary {
  id: string;
  optionId: string;
  status: RunStatus;
  progress: { done: number; total: number };
  draws: number;
  cv: number;
  seed: number;
  engineVersion: string;
  createdBy: string;
  createdAt: string;
  startedAt: string | null;
  finishedAt: string | null;
  error: string | null;
}

export interface OptionSummary {
  id: string;
  webId: string;
  versionId: string;
  name: string;
  purpose: string;
  response: HarvestOption['response'];
  adjustments: number;
  /** An option with runs keeps its inputs: editing it makes a new option. */
  frozen: boolean;
  createdBy: string;
  createdAt: string;
  latestRun: RunSummary | null;
  shares: ShareSummary[];
}

export interface OptionDetail extends OptionSummary {
  /** The option in OPTION.json form. */
  option: HarvestOption;
}

/** `GET /api/runs/:id`: `result` as printed by the `scenario` command, once done. */
export interface RunDetail extends RunSummary {
  inputs: { webId: string; versionId: string; option: HarvestOption; uncertainty: UncertaintySettings | null };
  timings: { queuedMs: number | null; runMs: number | null } | null;
  result?: unknown;
}

/** A key indicator as compared side by side. */
export interface ComparedIndicator {
  key: keyof ScalarIndicators | 'fishingInBalance';
  baseline: number | null;
  values: {
    runId: string;
    after: number | null;
    difference: number | null;
    band: { p5: number; median: number; p95: number } | null;
    /** The 5–95 % band of the difference excludes zero. */
    exceedsUncertainty: boolean;
  }[];
}

/** `GET /api/comparisons?runs=ID,ID,...` */
export interface Comparison {
  runs: (RunSummary & { optionName: string; webId: string; versionId: string })[];
  indicators: ComparedIndicator[];
  preferences: PreferenceSummary[];
}

export interface PreferenceSummary {
  id: string;
  optionId: string;
  optionName: string;
  member: string;
  reason: string;
  createdAt: string;
}

/** One refusal of the option preview, against the adjustment it concerns (index in `adjustments`, or null for the whole option). */
export interface AdjustmentProblem {
  adjustment: number | null;
  problem: string;
}

/**
 * `POST /api/webs/:id/versions/:versionId/options/preview`: the option's deterministic run (no
 * draws) in brief, for the option form — every scalar indicator before, after and their
 * difference, and each fleet's figures before and after.
 */
export interface OptionPreview {
  indicators: { key: keyof ScalarIndicators | 'fishingInBalance'; baseline: number | null; option: number | null; difference: number | null }[];
  fleets: { fleet: string; baseline: FleetSummary | null; option: FleetSummary | null; fishingInBalance: number | null }[];
}
