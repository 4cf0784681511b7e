import { Router } from 'express';
import { z } from 'zod';
import { describeIssues } from '@seinework/contracts';
import { BALANCING_METHODS, balanceNetwork, createNetwork, isBalanced, parseWeb, toWeb } from '@seinework/network-analysis';
import { RequestError } from './errors';

/** The offer to balance (METHODS.md §0 and §7): the web and the method in, the balanced web out. */

const body = z.strictObject({
  web: z.unknown(),
  method: z.enum(BALANCING_METHODS, { error: `method must be one of ${BALANCING_METHODS.join(', ')}` }).default('least-change'),
});

export function balancingRoutes(): Router {
  const router = Router();
  router.post('/', (request, response) => {
    const parsed = body.safeParse(request.body);
    if (!parsed.success) throw new RequestError(400, 'The request body does not have the expected shape', describeIssues(parsed.error));
    const network = createNetwork(parseWeb(parsed.data.web));
    const balanced = balanceNetwork(network, { method: parsed.data.method });
    response.json({ method: parsed.data.method, wasBalanced: isBalanced(network), web: toWeb(balanced) });
  });
  return router;
}
