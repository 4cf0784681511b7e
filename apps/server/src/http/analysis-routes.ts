import { Router } from 'express';
import type { EngineJobs } from '../engine/engine-jobs';
import { clientSignal, sendJsonText } from './client-signal';
import { bodyText } from './json-body';
import { requestText } from './request-body';
import { tableSelection } from './table-selection';

/**
 * Stateless analysis of a web sent in the body (WEB.json). The body is read as text and handed to
 * an engine worker, which parses, checks and analyses it: nothing heavy on the server's thread.
 */
export function analysisRoutes(engine: EngineJobs): Router {
  const router = Router();
  router.use(bodyText());
  router.post('/', async (request, response) => {
    const tables = tableSelection(request);
    sendJsonText(response, await engine.requestOffThread('analyze', requestText(request), { tables, signal: clientSignal(request, response) }));
  });
  return router;
}
