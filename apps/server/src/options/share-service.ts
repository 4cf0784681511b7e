import { randomUUID } from 'node:crypto';
import { and, desc, eq, isNull } from 'drizzle-orm';
import type { z } from 'zod';
import type { CurrentUser, shareBodySchema } from '@seinework/contracts';
import { recordAudit } from '../audit/audit-log';
import type { Db } from '../db/database';
import { options, runs, shares } from '../db/schema';
import { RequestError } from '../http/errors';
import type { Notifications } from '../notifications/notification-service';
import type { OptionService } from './option-service';
import { isUniqueViolation } from './unique-violation';
import { AUDIENCE_WORDS } from './audience-words';

/**
 * Sharing an option for council review or public comment, and withdrawing the share. A share shows
 * one finished run (readers compare results, not inputs); withdrawing keeps the row, so the audit log
 * and the shares say who could see what, when. A share for public comment may have a closing date
 * (optional); after it the discussion is read-only. Once the share is stored its audience is told by e-mail
 * (notifications/, queued after the commit).
 */

type ShareBody = z.infer<typeof shareBodySchema>;


export class ShareService {
  constructor(
    private readonly db: Db,
    private readonly optionService: OptionService,
    private readonly notifications?: Notifications,
    private readonly now: () => Date = () => new Date(),
  ) {}

  async share(user: CurrentUser, optionId: string, body: ShareBody): Promise<{ id: string }> {
    const closesAt = body.closesAt ? new Date(body.closesAt) : null;
    if (closesAt && closesAt.getTime() <= this.now().getTime()) throw new RequestError(422, 'closesAt must be in the future', ['closesAt: must be later than now']);
    const option = await this.optionService.visibleRow(user, optionId);
    const runId = await this.shownRun(optionId, body.runId);
    const id = randomUUID();
    try {
      await this.db.transaction(async (tx) => {
        await tx.insert(shares).values({ id, optionId, audience: body.audience, runId, sharedBy: user.id, closesAt });
        const until = closesAt ? `, closing ${closesAt.toISOString()}` : '';
        await recordAudit(tx, { actorId: user.id, action: 'option.shared', subject: `option:${optionId}`, detail: `Harvest option "${option.name}" shared ${AUDIENCE_WORDS[body.audience]} (run ${runId}${until})` });
      });
    } catch (error) {
      if (isUniqueViolation(error)) throw new RequestError(409, `This option is already shared ${AUDIENCE_WORDS[body.audience]}`);
      throw error;
    }
    this.notifications?.optionShared(id);
    return { id };
  }

  async withdraw(user: CurrentUser, shareId: string): Promise<void> {
    const [found] = await this.db
      .select({ share: shares, optionName: options.name })
      .from(shares)
      .innerJoin(options, eq(options.id, shares.optionId))
      .where(eq(shares.id, shareId));
    if (!found) throw new RequestError(404, 'No such share');
    await this.db.transaction(async (tx) => {
      // only an active share is withdrawn: two withdrawals at once leave one event
      const withdrawn = await tx
        .update(shares)
        .set({ withdrawnAt: new Date(), withdrawnBy: user.id })
        .where(and(eq(shares.id, shareId), isNull(shares.withdrawnAt)))
        .returning({ id: shares.id });
      if (withdrawn.length === 0) throw new RequestError(409, 'This share was already withdrawn');
      const what = found.share.audience === 'public' ? 'Public comment on' : 'Council review of';
      await recordAudit(tx, { actorId: user.id, action: 'option.share-withdrawn', subject: `option:${found.share.optionId}`, detail: `${what} "${found.optionName}" withdrawn` });
    });
  }

  /** The run the share shows: the one asked for (a finished run of this option), or the option's newest finished run. */
  private async shownRun(optionId: string, runId: string | undefined): Promise<string> {
    if (runId !== undefined) {
      const [run] = await this.db
        .select({ status: runs.status })
        .from(runs)
        .where(and(eq(runs.id, runId), eq(runs.optionId, optionId)));
      if (!run) throw new RequestError(422, 'runId is not a run of this option');
      if (run.status !== 'done') throw new RequestError(409, `That run is ${run.status}: share a finished run`);
      return runId;
    }
    const [newest] = await this.db
      .select({ id: runs.id })
      .from(runs)
      .where(and(eq(runs.optionId, optionId), eq(runs.status, 'done')))
      .orderBy(desc(runs.finishedAt), desc(runs.createdAt))
      .limit(1);
    if (!newest) throw new RequestError(409, 'This option has no finished run for the council to read: run it before sharing it');
    return newest.id;
  }
}
