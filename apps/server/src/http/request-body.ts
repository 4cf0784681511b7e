import type { Request } from 'express';
import type { z } from 'zod';
import { describeIssues, findDuplicateKey } from '@seinework/contracts';
import { RequestText } from '../engine/engine-task';
import { RequestError } from './errors';

/**
 * The JSON object a route takes: a missing body, text that is not JSON or repeats a key, a
 * non-object (null, an array, a number) or the wrong shape is a 400. Pure, so that an engine
 * worker can check a request's raw text (the server's thread never parses a large body).
 */

/** Parses the raw text of a JSON body; undefined or blank text is a missing body. */
export function parseJsonText(text: string | undefined): unknown {
  if (text === undefined || text.trim() === '') throw new RequestError(400, 'The request has no body: send a JSON object');
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch (error) {
    throw new RequestError(400, 'The request body is not valid JSON', [(error as Error).message]);
  }
  // JSON.parse keeps the last of two equal keys without a word: refuse them instead
  const duplicate = findDuplicateKey(text);
  if (duplicate) throw new RequestError(400, 'The request body gives a key twice', [duplicate]);
  return value;
}

export function objectOf(body: unknown): Record<string, unknown> {
  if (typeof body !== 'object' || body === null || Array.isArray(body)) {
    throw new RequestError(400, `The request body is not an object: it is ${body === null ? 'null' : Array.isArray(body) ? 'an array' : `a ${typeof body}`}`);
  }
  return body as Record<string, unknown>;
}

export function shapeOf<T>(schema: z.ZodType<T>, body: unknown): T {
  const parsed = schema.safeParse(objectOf(body));
  if (!parsed.success) throw new RequestError(400, 'The request body does not have the expected shape', describeIssues(parsed.error));
  return parsed.data;
}

/** The raw JSON text of a request read by bodyText(), for an engine worker to parse and check. */
export function requestText(request: Request): RequestText {
  if (request.is('multipart/form-data')) throw new RequestError(415, 'Send the request body as JSON (Content-Type: application/json), not multipart/form-data');
  return new RequestText(typeof request.body === 'string' ? request.body : undefined);
}
