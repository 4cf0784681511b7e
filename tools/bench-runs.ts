import { and, eq, isNull } from 'drizzle-orm';
import type { RunDetail } from '@seinework/contracts';
import type { Db } from '../apps/server/src/db/database';
import { runs, shares } from '../apps/server/src/db/schema';
import { DEMO_PASSWORD, demoEmail } from '../apps/server/src/seed/demo-users';

/**
 * Runs of a stored option on the demo web for `npm run bench` (issue 8): from `POST
 * /api/options/:id/runs` to the result stored (status done, read back over the API), with 1,000
 * and with 20,000 draws, on the warm draw pool and the queue loop of the benchmark's server
 * (bench-api-server.ts, a process of its own). Targets: 3 s and 20 s.
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

/** Times runs of the option `optionId` through the API of the server at `origin` (its queue loop running). */
export async function runBenchmarks(origin: string, optionId: string): Promise<RunBenchmark[]> {
  const signedIn = await fetch(`${origin}/api/auth/sign-in`, {
    method: 'POST',
    headers: { 'content-type': 'application/json', origin },
    body: JSON.stringify({ email: demoEmail('analyst'), password: DEMO_PASSWORD }),
  });
  const headers = { cookie: signedIn.headers.get('set-cookie')!.split(';')[0]!, origin, 'content-type': 'application/json' };
  const rows: RunBenchmark[] = [];
  for (const [draws, limitMs] of [[1_000, 3_000], [20_000, 20_000]] as const) {
    const started = performance.now();
    const answer = await fetch(`${origin}/api/options/${optionId}/runs`, { method: 'POST', headers, body: JSON.stringify({ draws, cv: 0.25, seed: 1 }) });
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
}
