import type { RequestHandler } from 'express';
import { RequestError } from './errors';

/** PostgreSQL's text cannot hold U+0000: an id or a query carrying one is refused here, in words, before any query. */
const NUL = '\u0000';

function carriesNul(value: unknown, depth = 0): boolean {
  if (typeof value === 'string') return value.includes(NUL);
  if (depth > 64 || value === null || typeof value !== 'object') return false;
  if (Array.isArray(value)) return value.some((item) => carriesNul(item, depth + 1));
  return Object.entries(value).some(([key, item]) => key.includes(NUL) || carriesNul(item, depth + 1));
}

function decodedPath(path: string): string {
  try {
    return decodeURIComponent(path);
  } catch {
    return path; // a malformed escape is the router's to refuse
  }
}

/**
 * The address and the query of a request to the stored data. Bodies are left to the routes' schemas,
 * which say which field is wrong (comment text refuses control characters with 422); what a schema lets
 * through is caught as unstorable text by the error handler (db/postgres-error.ts).
 */
export function refuseNul(): RequestHandler {
  return (request, _response, next) => {
    if (decodedPath(request.path).includes(NUL) || carriesNul(request.query)) {
      next(new RequestError(400, 'The request contains a NUL character (U+0000), which Seinework does not store: remove it and send again'));
      return;
    }
    next();
  };
}
