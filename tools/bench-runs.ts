import { and, eq, isNull } from 'drizzle-orm';
import type { RunDetail } from '@seinework/contracts';
import type { Db } from '../apps/server/src/db/database';
import { options, runs, shares } from '../apps/server/src/db/schema';
import type { RunQueue } from '../apps/server/src/runs/run-queue';
import { DEMO_PASSWORD, demoEmail } from '../apps/server/src/seed/demo-users';

/**
 * Runs of a stored option on the demo web for `npm run bench` (issue 8): from `POST
 * /api/options/:id/runs` to the result stored (status done, read back over the API), with 1,000
 * and with 20,000 draws, on the server's warm draw pool and its queue loop. Targets: 3 s and 20 s.
 */

export interface RunBenchmark {
  readonly name: string;
  readonly ms: number;
  readonly limitMs: number;
}

/** `GET /api/runs/:id` of the demo run shared for council review (staff read it). */
export async function storedRunPath(db: Db): Promise<string> {
  const [shared] = await db
    .select({ id: runs.id })
    .from(shares)
    .innerJoin(runs, eq(runs.id, shares.runId))
    .where(and(isNull(shares.withdrawnAt), eq(runs.status, 'done')));
  if (!shared) throw new Error('bench: no finished demo run is shared');
  return `/api/runs/${shared.id}`;
}

export async function runBenchmarks(origin: string, queue: RunQueue, db: Db): Promise<RunBenchmark[]> {
  const signedIn = await fetch(`${origin}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin },
    body: JSON.stringify({ email: demoEmail('analyst'), password: DEMO_PASSWORD }),
  });
  const headers = { cookie: signedIn.headers.get('set-cookie')!.split(';')[0]!, origin, 'content-type': 'application/json' };
  const [option] = await db.select({ id: options.id }).from(options).where(eq(options.name, 'Cut the forage-fish quota by 40 %'));
  if (!option) throw new Error('bench: the demo forage-fish option is missing');
  queue.start();
  try {
    const rows: RunBenchmark[] = [];
    for (const [draws, limitMs] of [[1_000, 3_000], [20_000, 20_000]] as const) {
      const started = performance.now();
      const answer = await fetch(`${origin}/api/options/${option.id}/runs`, { method: 'POST', headers, body: JSON.stringify({ draws, cv: 0.25, seed: 1 }) });
      const { id } = (await answer.json()) as { id: string };
      for (;;) {
        const run = (await (await fetch(`${origin}/api/runs/${id}`, { headers })).json()) as RunDetail;
        if (run.status === 'done') break;
        if (run.status !== 'queued' && run.status !== 'running') throw new Error(`bench: the ${draws}-draw run ended ${run.status}: ${run.error}`);
        await new Promise((resolve) => setTimeout(resolve, 25));
      }
      rows.push({ name: `${draws.toLocaleString('en')}-draw run of a stored option on the demo web, start to stored result`, ms: performance.now() - started, limitMs });
    }
    return rows;
  } finally {
    await queue.stop();
  }
}
