import { Router } from 'express';
import type { EngineJobs } from '../engine/engine-jobs';
import { clientSignal, sendJsonText } from './client-signal';
import { objectBody } from './request-body';
import { requireWebWithinLimits } from './size-limits';
import { tableSelection } from './table-selection';

/** Stateless analysis of a web sent in the body (WEB.json): the engine checks and analyses it on a worker. */
export function analysisRoutes(engine: EngineJobs): Router {
  const router = Router();
  router.post('/', async (request, response) => {
    const web = objectBody(request);
    requireWebWithinLimits(web);
    const tables = tableSelection(request);
    sendJsonText(response, await engine.analyzeOffThread(web, { tables, signal: clientSignal(request, response) }));
  });
  return router;
}
