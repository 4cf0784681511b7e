import { Router } from 'express';
import { z } from 'zod';
import { describeIssues, responseRuleSchema } from '@seinework/contracts';
import { harvestSensitivity, optionUncertainty, parseHarvestOption, runOption, type DrawRunner } from '@seinework/harvest-options';
import { createNetwork, parseWeb } from '@seinework/network-analysis';
import { HTTP_CYCLE_LIMITS } from './cycle-limits';
import { RequestError } from './errors';

/**
 * Stateless harvest-option runs (METHODS.md §8): the web and the option travel in the body, the
 * engine validates them and does the math. Saved options and baselines come with the database.
 */

/** A request holds a connection open while it draws: larger studies belong to a background job. */
export const MAX_DRAWS_PER_REQUEST = 5_000;

/** Asked for with `Accept: application/x-ndjson`: progress lines while the draws run. */
const NDJSON = 'application/x-ndjson';

const runBody = z.strictObject({ web: z.unknown(), option: z.unknown() });
const sensitivityBody = z.strictObject({ web: z.unknown(), response: responseRuleSchema.default('bottom-up') });

export interface OptionRouteSettings {
  /** Worker threads for uncertainty draws; without a pool draws run in the server's own thread. */
  readonly drawPool?: DrawRunner;
}

export function optionRoutes(settings: OptionRouteSettings = {}): Router {
  const router = Router();

  router.post('/run', async (request, response) => {
    const body = parse(runBody, request.body);
    const web = parseWeb(body.web);
    const option = parseHarvestOption(body.option);
    if (option.uncertainty && option.uncertainty.draws > MAX_DRAWS_PER_REQUEST) {
      throw new RequestError(422, 'Too many uncertainty draws', [
        `option: uncertainty.draws: at most ${MAX_DRAWS_PER_REQUEST} draws per request (asked for ${option.uncertainty.draws})`,
      ]);
    }
    const run = runOption(web, option, { cycles: HTTP_CYCLE_LIMITS });
    if (!option.uncertainty) {
      response.json(run);
      return;
    }
    const where = { pool: settings.drawPool };
    if (!request.get('accept')?.includes(NDJSON)) {
      response.json({ ...run, uncertainty: await optionUncertainty(web, option, option.uncertainty, where) });
      return;
    }
    // Progress for a long run: one JSON line per finished chunk of draws, then the result. The
    // input was checked above, so once the stream has begun only a server fault can end it early.
    response.status(200).type(NDJSON);
    const line = (value: unknown) => response.write(`${JSON.stringify(value)}\n`);
    try {
      const uncertainty = await optionUncertainty(web, option, option.uncertainty, {
        ...where,
        onProgress: (done, total) => line({ progress: { done, total } }),
      });
      line({ result: { ...run, uncertainty } });
    } catch (error) {
      console.error(error);
      line({ error: 'Something went wrong on the server while drawing' });
    }
    response.end();
  });

  router.post('/sensitivity', (request, response) => {
    const body = parse(sensitivityBody, request.body);
    response.json(harvestSensitivity(createNetwork(parseWeb(body.web)), body.response));
  });

  return router;
}

function parse<T>(schema: z.ZodType<T>, body: unknown): T {
  const parsed = schema.safeParse(body);
  if (!parsed.success) throw new RequestError(400, 'The request body does not have the expected shape', describeIssues(parsed.error));
  return parsed.data;
}
