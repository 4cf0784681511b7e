import { randomUUID } from 'node:crypto';
import { readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import { and, eq } from 'drizzle-orm';
import { harvestOptionSchema, type HarvestOption, type UncertaintySettings } from '@seinework/contracts';
import { recordAudit } from '../audit/audit-log';
import type { Db } from '../db/database';
import { options, runs, shares, users, webs, webVersions, type RunInputs } from '../db/schema';
import { ENGINE_VERSION } from './demo-run-document';
import { demoEmail } from './demo-users';
import { DEMO_WEB_PLACE } from './demo-webs';

/**
 * The demo harvest options (invented, on the demo baseline): the four of seeds/options/ and a
 * poorer phytoplankton year, each with a run with uncertainty; three of them (the forage-fish cut,
 * the gillnet closure and the predator quota rise) shared for council review by the demo analyst, so
 * that a council member has options to compare on a first start, and two not, to share in a demo;
 * the forage-fish cut is also open for public comment (its discussion: demo-discussion.ts). The seed's transaction stores the options, their runs as
 * queued and the share; the run queue (runs/run-queue.ts) computes them like any other once the
 * server has started, so that a first start answers at once and the council's pages fill within
 * seconds.
 */

const OPTIONS_DIR = resolve(import.meta.dirname, '../../../../seeds/options');

interface DemoOption {
  readonly file?: string;
  readonly option?: HarvestOption;
  readonly purpose: string;
  readonly shared?: boolean;
  /** Also shared for public comment, closing DEMO_PUBLIC_COMMENT_DAYS after seeding (seed/demo-discussion.ts adds its discussion). */
  readonly publicComment?: boolean;
}

/** How long the demo's public comment stays open after seeding. */
export const DEMO_PUBLIC_COMMENT_DAYS = 30;

const DEMO_OPTIONS: readonly DemoOption[] = [
  { file: 'forage-fish-quota-cut.json', purpose: 'Leave more forage fish in the water for seabirds and the mid-water predators that eat them.', shared: true, publicComment: true },
  { file: 'close-set-gillnet.json', purpose: 'End the by-catch of marine mammals and seabirds in set gillnets; the demersal predators they land are left to the bottom trawl.', shared: true },
  { file: 'filter-feeder-dredge.json', purpose: 'A new shellfish fishery on a stock nobody fishes today: what would it take from the rest of the bay?' },
  { file: 'raise-midwater-predator-quota.json', purpose: 'The hook-and-line fleet asks for a larger quota: can the bay carry it?', shared: true },
  {
    option: {
      name: 'A poorer phytoplankton year (production −15 %)',
      response: 'bottom-up',
      adjustments: [{ type: 'scale-production', compartment: 'phytoplankton', percent: -15 }],
    },
    purpose: 'Not a management choice: what a cooler, cloudier year would do to the bay with today’s catches, to read the options against.',
  },
];

/** 500 draws, cv 0.25 and a fixed seed: bands worth reading, about a second per option on the server's draw pool. */
export const DEMO_UNCERTAINTY: UncertaintySettings = { draws: 500, cv: 0.25, seed: 20261202 };

function demoOptions(uncertainty: UncertaintySettings): { option: HarvestOption; purpose: string; shared: boolean; publicComment: boolean }[] {
  return DEMO_OPTIONS.map((demo) => {
    const given = demo.option ?? harvestOptionSchema.parse(JSON.parse(readFileSync(resolve(OPTIONS_DIR, demo.file!), 'utf8')));
    return { option: { ...given, uncertainty }, purpose: demo.purpose, shared: demo.shared ?? false, publicComment: demo.publicComment ?? false };
  });
}

/** Stores the demo options on the demo baseline with queued runs, and the council share; the demo web must exist. */
export async function seedDemoOptions(db: Db, uncertainty: UncertaintySettings = DEMO_UNCERTAINTY): Promise<void> {
  const [analyst] = await db.select({ id: users.id }).from(users).where(eq(users.email, demoEmail('analyst')));
  const [baseline] = await db
    .select({ webId: webVersions.webId, versionId: webVersions.id })
    .from(webVersions)
    .innerJoin(webs, eq(webs.id, webVersions.webId))
    .where(and(eq(webs.place, DEMO_WEB_PLACE), eq(webVersions.status, 'published')));
  if (!analyst || !baseline) throw new Error('The demo analyst and the demo baseline must be seeded before the demo options');
  // one transaction gives every row the same now(): the options' order is set here instead
  const start = Date.now();
  for (const [position, { option, purpose, shared, publicComment }] of demoOptions(uncertainty).entries()) {
    const createdAt = new Date(start + position);
    const optionId = randomUUID();
    const runId = randomUUID();
    await db.insert(options).values({ id: optionId, ...baseline, name: option.name, purpose, response: option.response, adjustments: option.adjustments, uncertainty, createdBy: analyst.id, createdAt, updatedAt: createdAt });
    await recordAudit(db, { actorId: analyst.id, action: 'option.created', subject: `option:${optionId}`, detail: `Demo harvest option "${option.name}"` });
    const inputs: RunInputs = { ...baseline, option: { name: option.name, response: option.response, adjustments: option.adjustments }, uncertainty };
    await db.insert(runs).values({ id: runId, optionId, inputs, draws: uncertainty.draws, cv: uncertainty.cv, seed: uncertainty.seed, engineVersion: ENGINE_VERSION, progressTotal: uncertainty.draws, createdBy: analyst.id, createdAt });
    if (shared) {
      await db.insert(shares).values({ id: randomUUID(), optionId, audience: 'council', runId, sharedBy: analyst.id, sharedAt: createdAt });
      await recordAudit(db, { actorId: analyst.id, action: 'option.shared', subject: `option:${optionId}`, detail: `Demo harvest option "${option.name}" shared for council review (run ${runId})` });
    }
    if (publicComment) {
      const closesAt = new Date(start + DEMO_PUBLIC_COMMENT_DAYS * 24 * 60 * 60 * 1000);
      await db.insert(shares).values({ id: randomUUID(), optionId, audience: 'public', runId, sharedBy: analyst.id, sharedAt: createdAt, closesAt });
      await recordAudit(db, { actorId: analyst.id, action: 'option.shared', subject: `option:${optionId}`, detail: `Demo harvest option "${option.name}" shared for public comment (run ${runId}, closing ${closesAt.toISOString()})` });
    }
  }
}
