import { Router } from 'express';
import { z } from 'zod';
import { BALANCING_METHODS } from '@seinework/network-analysis';
import type { EngineJobs } from '../engine/engine-jobs';
import { clientSignal, sendJsonText } from './client-signal';
import { parsedBody } from './request-body';
import { requireWebWithinLimits } from './size-limits';

/** The offer to balance (METHODS.md §0 and §7): the web and the method in, the balanced web out. */

const body = z.strictObject({
  web: z.unknown(),
  method: z.enum(BALANCING_METHODS, { error: `method must be one of ${BALANCING_METHODS.join(', ')}` }).default('least-change'),
});

export function balancingRoutes(engine: EngineJobs): Router {
  const router = Router();
  router.post('/', async (request, response) => {
    const { web, method } = parsedBody(request, body);
    requireWebWithinLimits(web, 'web.');
    sendJsonText(response, await engine.balanceOffThread(web, method, { signal: clientSignal(request, response) }));
  });
  return router;
}
