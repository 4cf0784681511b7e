import type { Request } from 'express';
import type { z } from 'zod';
import { describeIssues } from '@seinework/contracts';
import { RequestError } from './errors';

/** The JSON object a route takes: a missing body, a non-object (null, an array, a number) or the wrong shape is a 4xx. */
export function objectBody(request: Request): Record<string, unknown> {
  const body: unknown = request.body;
  if (body === undefined) {
    if (request.is('multipart/form-data')) throw new RequestError(415, 'Send the request body as JSON (Content-Type: application/json), not multipart/form-data');
    throw new RequestError(400, 'The request has no body: send a JSON object');
  }
  if (typeof body !== 'object' || body === null || Array.isArray(body)) {
    throw new RequestError(400, `The request body is not an object: it is ${body === null ? 'null' : Array.isArray(body) ? 'an array' : `a ${typeof body}`}`);
  }
  return body as Record<string, unknown>;
}

export function parsedBody<T>(request: Request, schema: z.ZodType<T>): T {
  const parsed = schema.safeParse(objectBody(request));
  if (!parsed.success) throw new RequestError(400, 'The request body does not have the expected shape', describeIssues(parsed.error));
  return parsed.data;
}
