import type { ErrorRequestHandler } from 'express';
import { capProblems, type UploadProblem } from '@seinework/contracts';
import { WebError } from '@seinework/network-analysis';
import { QueueFullError } from '@seinework/draw-pool';
import { isUnstorableText } from '../db/postgres-error';
import { EngineOverBudget, EngineRefusal, EngineStopping, type RefusedInput } from '../engine/engine-errors';

/** When a client refused for a full queue should try again: about one heavy request's time. */
const RETRY_AFTER_SECONDS = 10;

/** One problem of a refused request: a readable line, or a row of an uploaded table. */
export type ProblemDetail = string | UploadProblem;

/** An error whose message is safe and useful to show to the person who sent the request. */
export class RequestError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly details: readonly ProblemDetail[] = [],
    /** Extra response headers, e.g. Retry-After. */
    readonly headers: Readonly<Record<string, string>> = {},
  ) {
    super(message);
  }
}

/**
 * The one place that turns errors into answers: known input problems become 4xx (or 503 when the
 * server is busy) with a readable body `{ error, details? }` — details the problem lines, at most
 * PROBLEMS_LISTED of them and a count of the rest; anything else is logged and answered 500
 * without internals.
 */
export const errorHandler: ErrorRequestHandler = (error, _request, response, next) => {
  if (response.headersSent) return next(error);
  // the client went away (its request was cancelled): there is nobody to answer
  if (response.destroyed) return;
  const known = asRequestError(error);
  if (!known) {
    console.error(error);
    response.status(500).json({ error: 'Something went wrong on the server' });
    return;
  }
  response.status(known.status).set(known.headers);
  response.json(known.details.length > 0 ? { error: known.message, details: capProblems(known.details) } : { error: known.message });
};

function asRequestError(error: unknown): RequestError | undefined {
  if (error instanceof RequestError) return error;
  if (error instanceof WebError) return new RequestError(422, refusalMessage(error, error instanceof EngineRefusal ? error.input : 'web'), error.problems);
  if (error instanceof QueueFullError) return new RequestError(503, 'The server is busy with other analyses: try again shortly', [], { 'Retry-After': String(RETRY_AFTER_SECONDS) });
  if (error instanceof EngineOverBudget || error instanceof EngineStopping) return new RequestError(503, error.message);
  if (isMulterError(error)) return new RequestError(error.code.startsWith('LIMIT_') && error.code.endsWith('_SIZE') ? 413 : 400, `The upload was refused: ${error.message}`);
  if (isUnstorableText(error)) return new RequestError(400, 'The request contains characters Seinework cannot store (such as NUL): remove them and send again');
  const status = clientErrorStatus(error);
  // body parsers and other middleware (http-errors): a client error whose message is meant to be shown
  if (status !== undefined) return new RequestError(status, (error as Error).message);
  return undefined;
}

function refusalMessage(error: WebError, input: RefusedInput): string {
  if (input === 'option') return error.kind === 'invalid' ? 'The harvest option is not valid' : 'The harvest option cannot be applied to this web';
  switch (error.kind) {
    case 'invalid':
      return 'The web is not valid';
    case 'unbalanced':
      return 'The web is not balanced: balance it (input, output, average or least change) before analysing';
    default:
      return 'The web cannot be analysed';
  }
}

function isMulterError(error: unknown): error is { code: string; message: string } {
  return error instanceof Error && error.name === 'MulterError' && typeof (error as { code?: unknown }).code === 'string';
}

function clientErrorStatus(error: unknown): number | undefined {
  if (!(error instanceof Error) || (error as { expose?: unknown }).expose !== true) return undefined;
  const status = (error as { status?: unknown }).status;
  return typeof status === 'number' && status >= 400 && status < 500 ? status : undefined;
}
