import { Router, type Response } from 'express';
import { EngineOverBudget, EngineStopping } from '../engine/engine-errors';
import type { EngineJobs } from '../engine/engine-jobs';
import { clientSignal, sendJsonText } from './client-signal';
import { bodyText } from './json-body';
import { requestText } from './request-body';
import { tableSelection } from './table-selection';

/**
 * Stateless harvest-option runs (METHODS.md §8): `{ web, option }` or `{ web, response? }` travel
 * in the body as text to an engine worker, which parses and checks them and does the math; draws
 * run on the draw pool. Saved options and baselines come with the database.
 */

/** Asked for with `Accept: application/x-ndjson`: progress lines while the draws run. */
const NDJSON = 'application/x-ndjson';

export function optionRoutes(engine: EngineJobs): Router {
  const router = Router();
  router.use(bodyText());

  router.post('/run', async (request, response) => {
    const body = requestText(request);
    const tables = tableSelection(request);
    const signal = clientSignal(request, response);
    if (!request.get('accept')?.includes(NDJSON)) {
      sendJsonText(response, await engine.requestOffThread('run-option', body, { tables, signal }));
      return;
    }
    // Progress for a long run: one JSON line per finished chunk of draws, then the result. The
    // stream begins with the first line, once the engine has accepted the input: a refusal before
    // it is an ordinary 4xx; after it, an error line ends the stream.
    const stream = new LineStream(response);
    try {
      const result = await engine.requestOffThread('run-option', body, {
        tables,
        signal,
        onProgress: (done, total) => stream.line(JSON.stringify({ progress: { done, total } })),
      });
      stream.parts('{"result":', result, '}\n');
      response.end();
    } catch (error) {
      if (!stream.started) throw error;
      // a client that went away is not told; anything else ends the stream with a line saying what happened
      if (!signal.aborted) {
        const told = error instanceof EngineOverBudget || error instanceof EngineStopping;
        if (!told) console.error(error);
        stream.line(JSON.stringify({ error: told ? error.message : 'Something went wrong on the server while drawing' }));
      }
      response.end();
    }
  });

  router.post('/sensitivity', async (request, response) => {
    sendJsonText(response, await engine.requestOffThread('sensitivity', requestText(request), { signal: clientSignal(request, response) }));
  });

  return router;
}

/** An NDJSON answer whose status and headers go out with its first line. */
class LineStream {
  started = false;

  constructor(private readonly response: Response) {}

  line(text: string): void {
    this.parts(text, '\n');
  }

  /** One line written in parts, so that a large result is written as it came, never copied into one string. */
  parts(...parts: (string | Buffer)[]): void {
    if (this.response.destroyed) return;
    if (!this.started) {
      this.started = true;
      this.response.status(200).type(NDJSON);
    }
    for (const part of parts) this.response.write(part);
  }
}
