import { randomUUID } from 'node:crypto';
import { and, desc, eq, inArray, isNull } from 'drizzle-orm';
import type { z } from 'zod';
import type { CurrentUser, PreferenceSummary, preferenceBodySchema } from '@seinework/contracts';
import { recordAudit } from '../audit/audit-log';
import type { Db } from '../db/database';
import { options, preferences, runs, shares, users } from '../db/schema';
import { RequestError } from '../http/errors';
import type { OptionService } from './option-service';
import { isUniqueViolation } from './unique-violation';

/**
 * A council member's preference among the options on one baseline, with a reason. Each member has
 * one current preference per baseline: recording a new one supersedes the old (which is kept, with
 * when it was superseded, so the record of the review shows a change of mind). Lists show current
 * preferences.
 */

type PreferenceBody = z.infer<typeof preferenceBodySchema>;

export class PreferenceService {
  constructor(
    private readonly db: Db,
    private readonly optionService: OptionService,
  ) {}

  async record(user: CurrentUser, optionId: string, body: PreferenceBody): Promise<{ id: string }> {
    const option = await this.optionService.visibleRow(user, optionId);
    const [shared] = await this.db
      .select({ id: shares.id })
      .from(shares)
      .where(and(eq(shares.optionId, optionId), eq(shares.audience, 'council'), isNull(shares.withdrawnAt)))
      .limit(1);
    // an admin sees every option, but a preference is recorded only among options under council review
    if (!shared) throw new RequestError(409, 'This option is not shared for council review: preferences are recorded on shared options only');
    const comparedRuns = [...new Set(body.comparedRuns ?? [])];
    await this.checkComparedRuns(user, option.versionId, comparedRuns);
    const id = randomUUID();
    try {
      await this.db.transaction(async (tx) => {
        const now = new Date();
        await tx
          .update(preferences)
          .set({ supersededAt: now })
          .where(and(eq(preferences.versionId, option.versionId), eq(preferences.memberId, user.id), isNull(preferences.supersededAt)));
        await tx.insert(preferences).values({ id, optionId, versionId: option.versionId, memberId: user.id, reason: body.reason, comparedRuns, createdAt: now });
        await recordAudit(tx, { actorId: user.id, action: 'preference.recorded', subject: `option:${optionId}`, detail: `Preference for "${option.name}": ${body.reason.slice(0, 200)}` });
      });
    } catch (error) {
      // two preferences of one member at the same moment: the other one stands
      if (isUniqueViolation(error)) throw new RequestError(409, 'Another preference of yours on this baseline was being recorded at the same moment: reload and try again');
      throw error;
    }
    return { id };
  }

  /** Current preferences recorded on these options, newest first. */
  async current(optionIds: readonly string[]): Promise<PreferenceSummary[]> {
    if (optionIds.length === 0) return [];
    const rows = await this.db
      .select({ preference: preferences, optionName: options.name, member: users.name })
      .from(preferences)
      .innerJoin(options, eq(options.id, preferences.optionId))
      .innerJoin(users, eq(users.id, preferences.memberId))
      .where(and(inArray(preferences.optionId, [...optionIds]), isNull(preferences.supersededAt)))
      .orderBy(desc(preferences.createdAt), desc(preferences.id));
    return rows.map(({ preference, optionName, member }) => ({
      id: preference.id,
      optionId: preference.optionId,
      optionName,
      member,
      reason: preference.reason,
      createdAt: preference.createdAt.toISOString(),
    }));
  }

  async ofOption(user: CurrentUser, optionId: string): Promise<{ items: PreferenceSummary[]; total: number }> {
    await this.optionService.visibleRow(user, optionId);
    const items = await this.current([optionId]);
    return { items, total: items.length };
  }

  /** The runs a preference was recorded among: runs of options this person sees, on the same baseline. */
  private async checkComparedRuns(user: CurrentUser, versionId: string, runIds: string[]): Promise<void> {
    if (runIds.length === 0) return;
    const found = await this.db
      .select({ id: runs.id, optionId: runs.optionId, versionId: options.versionId })
      .from(runs)
      .innerJoin(options, eq(options.id, runs.optionId))
      .where(inArray(runs.id, runIds));
    const problems: string[] = [];
    for (const runId of runIds) {
      const run = found.find((r) => r.id === runId);
      if (!run || !(await this.optionService.visibleRow(user, run.optionId).then(() => true, () => false))) problems.push(`comparedRuns: no such run "${runId}"`);
      else if (run.versionId !== versionId) problems.push(`comparedRuns: run "${runId}" is on another baseline`);
    }
    if (problems.length > 0) throw new RequestError(422, 'The compared runs are not runs of this baseline', problems);
  }
}
