import type { Request, Response } from 'express';

/**
 * Aborts when the client goes away before its answer is complete (the connection closes first),
 * so that the engine stops working on a request nobody is waiting for.
 */
export function clientSignal(_request: Request, response: Response): AbortSignal {
  const gone = new AbortController();
  response.once('close', () => {
    if (!response.writableFinished) gone.abort(new Error('the client went away'));
  });
  return gone.signal;
}

/** Sends JSON text that is already serialised (by an engine worker), without walking it again. */
export function sendJsonText(response: Response, json: Buffer): void {
  if (response.destroyed) return;
  response.status(200).type('application/json').set('Content-Length', String(json.byteLength)).end(json);
}
