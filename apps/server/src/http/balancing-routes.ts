import { Router } from 'express';
import type { EngineJobs } from '../engine/engine-jobs';
import { clientSignal, sendJsonText } from './client-signal';
import { bodyText } from './json-body';
import { requestText } from './request-body';

/**
 * The offer to balance (METHODS.md §0 and §7): `{ web, method? }` in (least change by default),
 * `{ method, wasBalanced, web }` out; read, checked and balanced on an engine worker.
 */
export function balancingRoutes(engine: EngineJobs): Router {
  const router = Router();
  router.use(bodyText());
  router.post('/', async (request, response) => {
    sendJsonText(response, await engine.requestOffThread('balance', requestText(request), { signal: clientSignal(request, response) }));
  });
  return router;
}
