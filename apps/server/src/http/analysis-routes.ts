import { Router } from 'express';
import { analyzeWeb } from '@seinework/network-analysis';
import { HTTP_CYCLE_LIMITS } from './cycle-limits';

/** Stateless analysis of a web sent in the body (WEB.json); the engine validates and answers. */
export function analysisRoutes(): Router {
  const router = Router();
  router.post('/', (request, response) => {
    response.json(analyzeWeb(request.body, { cycles: HTTP_CYCLE_LIMITS }));
  });
  return router;
}
