import type { ErrorRequestHandler } from 'express';
import { WebError } from '@seinework/network-analysis';

/** An error whose message is safe and useful to show to the person who sent the request. */
export class RequestError extends Error {
  constructor(
    readonly status: number,
    message: string,
    readonly problems: readonly string[] = [],
  ) {
    super(message);
  }
}

/**
 * The one place that turns errors into answers: known input problems become 4xx with a readable
 * body `{ error, problems }`; anything else is logged and answered 500 without internals.
 */
export const errorHandler: ErrorRequestHandler = (error, _request, response, _next) => {
  if (error instanceof RequestError) {
    response.status(error.status).json({ error: error.message, problems: error.problems });
    return;
  }
  if (error instanceof WebError) {
    const message = error.kind === 'invalid' ? 'The web is not valid' : error.kind === 'unbalanced' ? 'The web is not balanced: balance it (input, output, average or least change) before analysing' : 'The web cannot be analysed';
    response.status(422).json({ error: message, problems: error.problems });
    return;
  }
  if (isBodyParserError(error)) {
    response.status(error.status).json({ error: error.type === 'entity.parse.failed' ? 'The request body is not valid JSON' : error.message, problems: [] });
    return;
  }
  console.error(error);
  response.status(500).json({ error: 'Something went wrong on the server', problems: [] });
};

function isBodyParserError(error: unknown): error is { status: number; type: string; message: string } {
  return typeof error === 'object' && error !== null && 'type' in error && 'status' in error && typeof (error as { status: unknown }).status === 'number' && (error as { status: number }).status < 500;
}
