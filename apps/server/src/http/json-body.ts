import express, { type Request, type RequestHandler } from 'express';
import { RequestError } from './errors';
import { parseJsonText } from './request-body';

/**
 * Reads JSON request bodies, every failure a 4xx naming it: a body that is not JSON, or repeats a
 * key (JSON.parse would silently keep the last), is a 400; too large a 413; a compressed body that
 * does not decompress a 400; a content type or encoding we do not read a 415. Multipart bodies
 * pass through untouched for the upload routes to read, and form-encoded ones for the few addresses
 * a plain HTML form posts to (`formPaths`, e.g. the unsubscribe page's button).
 */

export const BODY_LIMIT_BYTES = 5 * 1024 * 1024;

const JSON_TYPES = ['application/json', '+json'];

export function jsonBody(limitBytes = BODY_LIMIT_BYTES, formPaths: readonly string[] = []): RequestHandler {
  const readText = bodyText(limitBytes, formPaths);
  return (request, response, next) =>
    readText(request, response, (error?: unknown) => {
      if (error) return next(error);
      const text: unknown = request.body;
      if (typeof text !== 'string') return next();
      request.body = undefined;
      if (text.trim() === '') return next();
      try {
        request.body = parseJsonText(text);
      } catch (parseError) {
        return next(parseError);
      }
      next();
    });
}

/**
 * Reads a JSON body as text into `request.body` (a string; undefined without a body), with every
 * check of jsonBody() but the parsing: for routes that hand the text to an engine worker to parse.
 */
export function bodyText(limitBytes = BODY_LIMIT_BYTES, formPaths: readonly string[] = []): RequestHandler {
  const readText = express.text({ type: () => true, limit: limitBytes, defaultCharset: 'utf-8' });
  return (request, response, next) => {
    if (typeof request.body === 'string' || !hasBody(request) || request.is('multipart/form-data')) return next();
    if (request.is('application/x-www-form-urlencoded') && formPaths.includes(request.path)) return next();
    if (!request.is(JSON_TYPES)) {
      return next(new RequestError(415, `Send the request body as JSON (Content-Type: application/json), not ${request.get('content-type') ?? 'without a type'}`));
    }
    readText(request, response, (error?: unknown) => next(error ? readFailure(error, limitBytes, request) : undefined));
  };
}

function hasBody(request: Request): boolean {
  const length = request.get('content-length');
  return request.get('transfer-encoding') !== undefined || (length !== undefined && length !== '0');
}

function readFailure(error: unknown, limitBytes: number, request: Request): RequestError {
  const type = (error as { type?: unknown }).type;
  const encoding = request.get('content-encoding') ?? 'identity';
  if (type === 'entity.too.large') return new RequestError(413, `The request body is larger than ${limitBytes / (1024 * 1024)} MB, the most one request may send`);
  if (type === 'encoding.unsupported') return new RequestError(415, `Content-Encoding "${encoding}" is not read here: send the body uncompressed, or as gzip, deflate or br`);
  if (type === 'charset.unsupported') return new RequestError(415, 'Send the request body in UTF-8');
  // the decompression stream failed: the body is not what its Content-Encoding says
  if (encoding !== 'identity' && type === undefined) return new RequestError(400, `The request body is not valid ${encoding} data (Content-Encoding: ${encoding})`);
  return new RequestError(400, 'The request body could not be read');
}
