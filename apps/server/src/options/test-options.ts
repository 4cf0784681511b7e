import { randomUUID } from 'node:crypto';
import { eq } from 'drizzle-orm';
import type { HarvestOptionInput, Role } from '@seinework/contracts';
import type { Db } from '../db/database';
import { options, runs, users } from '../db/schema';
import { demoEmail } from '../seed/demo-users';
import type { TestAgent, TestApp } from '../testing/test-app';
import { brannockBay } from '../webs/test-webs';

/** Support for the option routes' tests: a published demo baseline, options on it, finished runs stored as the queue would. */

export const forageCut: HarvestOptionInput = {
  name: 'Cut the forage-fish quota by 40 %',
  response: 'bottom-up',
  adjustments: [{ type: 'scale-catch', fleet: 'Purse seine', compartment: 'forage-fish', percent: -40 }],
};
export const gillnetClosure: HarvestOptionInput = { name: 'Close the set-gillnet fleet', response: 'least-change', adjustments: [{ type: 'close-fleet', fleet: 'Set gillnet' }] };

export interface Baseline {
  readonly analyst: TestAgent;
  readonly webId: string;
  readonly versionId: string;
  readonly base: string;
}

/** The demo web created and published by the demo analyst (a fresh web each call). */
export async function publishedBaseline(t: TestApp): Promise<Baseline> {
  const analyst = await t.signInAs('analyst');
  const created = await analyst.post('/api/webs').send(brannockBay);
  if (created.status !== 201) throw new Error(`creating the web failed: ${created.status}`);
  const { id, versionId } = created.body as { id: string; versionId: string };
  const published = await analyst.post(`/api/webs/${id}/versions/${versionId}/publish`);
  if (published.status !== 200) throw new Error(`publishing failed: ${published.status}`);
  return { analyst, webId: id, versionId, base: `/api/webs/${id}/versions/${versionId}/options` };
}

export async function createOption(baseline: Baseline, option: object = forageCut): Promise<string> {
  const response = await baseline.analyst.post(baseline.base).send(option);
  if (response.status !== 201) throw new Error(`creating the option failed: ${response.status} ${JSON.stringify(response.body)}`);
  return response.body.id as string;
}

export async function userId(db: Db, role: Role): Promise<string> {
  const [user] = await db.select({ id: users.id }).from(users).where(eq(users.email, demoEmail(role)));
  return user!.id;
}

/** A run stored as the queue stores a finished one (the queue itself is tested in runs/). */
export async function storeRun(db: Db, optionId: string, result: unknown, status: 'done' | 'queued' | 'running' | 'failed' = 'done'): Promise<string> {
  const [option] = await db.select().from(options).where(eq(options.id, optionId));
  const id = randomUUID();
  await db.insert(runs).values({
    id,
    optionId,
    status,
    inputs: { webId: option!.webId, versionId: option!.versionId, option: { name: option!.name, response: option!.response, adjustments: option!.adjustments }, uncertainty: null },
    draws: 0,
    cv: 0,
    seed: 0,
    engineVersion: 'test',
    result: status === 'done' ? result : null,
    createdBy: option!.createdBy,
    finishedAt: status === 'done' ? new Date() : null,
  });
  return id;
}

/** Shares an option for council review (after storing a finished run for it). */
export async function shareForCouncil(t: TestApp, baseline: Baseline, optionId: string, result: unknown = { baseline: {}, option: {}, difference: {} }): Promise<{ shareId: string; runId: string }> {
  const runId = await storeRun(t.database.db, optionId, result);
  const shared = await baseline.analyst.post(`/api/options/${optionId}/shares`).send({ audience: 'council' });
  if (shared.status !== 201) throw new Error(`sharing failed: ${shared.status} ${JSON.stringify(shared.body)}`);
  return { shareId: shared.body.id as string, runId };
}
