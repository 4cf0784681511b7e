import { eq } from 'drizzle-orm';
import type { ShareAudience } from '@seinework/contracts';
import { notificationsOf } from '../app';
import { emailOutbox, shares } from '../db/schema';
import { createOption, gillnetClosure, publishedBaseline, storeRun, type Baseline } from '../options/test-options';
import type { TestApp } from '../testing/test-app';

/** Support for the discussion's tests: an option with a finished run whose result has indicators and compartments, shared. */

/** A result document reduced to what anchors are checked against: a few indicator differences and the web's compartments. */
export const RESULT = {
  baseline: { totalCatch: 10, ascendency: 100 },
  option: { totalCatch: 6, ascendency: 101 },
  difference: { totalCatch: -4, ascendency: 1, fishingInBalance: 0.02 },
  web: { compartments: [{ id: 'forage-fish' }, { id: 'seabirds' }] },
};

export const DAY_MS = 24 * 60 * 60 * 1000;

export interface SharedOption {
  readonly baseline: Baseline;
  readonly optionId: string;
  readonly runId: string;
  readonly shareId: string;
}

/** A fresh baseline with one option, a finished run, shared with that audience (public comment closes in 30 days unless told). */
export async function sharedOption(t: TestApp, audience: ShareAudience, closesAt: Date | null = audience === 'public' ? new Date(Date.now() + 30 * DAY_MS) : null, baseline?: Baseline): Promise<SharedOption> {
  const base = baseline ?? (await publishedBaseline(t));
  const optionId = await createOption(base, { ...gillnetClosure, name: `Close the set-gillnet fleet (${audience}, ${Math.random().toString(36).slice(2, 8)})` });
  const runId = await storeRun(t.database.db, optionId, RESULT);
  const shareId = await share(base, optionId, audience, closesAt);
  return { baseline: base, optionId, runId, shareId };
}

export async function share(baseline: Baseline, optionId: string, audience: ShareAudience, closesAt: Date | null): Promise<string> {
  const response = await baseline.analyst.post(`/api/options/${optionId}/shares`).send({ audience, ...(closesAt ? { closesAt: closesAt.toISOString() } : {}) });
  if (response.status !== 201) throw new Error(`sharing failed: ${response.status} ${JSON.stringify(response.body)}`);
  return response.body.id as string;
}

/** Moves a share's closing date (into the past, to close its discussion): the API refuses a closing date that has passed. */
export async function setClosesAt(t: TestApp, shareId: string, closesAt: Date): Promise<void> {
  await t.database.db.update(shares).set({ closesAt }).where(eq(shares.id, shareId));
}

/** The messages sent to one address so far, once every queued notice has gone. */
export async function mailTo(t: TestApp, to: string, subject?: RegExp): Promise<(typeof emailOutbox.$inferSelect)[]> {
  await notificationsOf(t.app).queue.idle();
  const rows = await t.database.db.select().from(emailOutbox).where(eq(emailOutbox.to, to)).orderBy(emailOutbox.id);
  return subject ? rows.filter((row) => subject.test(row.subject)) : rows;
}

/** The unsubscribe link's token in a message. */
export function unsubscribeToken(text: string): string {
  const match = /\/api\/notifications\/unsubscribe\?token=([A-Za-z0-9_-]+)/.exec(text);
  if (!match) throw new Error(`No unsubscribe link in:\n${text}`);
  return match[1]!;
}
