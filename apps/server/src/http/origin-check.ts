import type { RequestHandler } from 'express';
import { RequestError } from './errors';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Refuses state-changing requests whose Origin (or, failing that, Referer) is not this server's
 * own, so that another site cannot make a signed-in browser act on Seinework (cross-site request forgery).
 */
export function originCheck(allowedOrigins: readonly string[] = []): RequestHandler {
  return (request, _response, next) => {
    if (SAFE_METHODS.has(request.method)) return next();
    const own = `${request.protocol}://${request.get('host')}`;
    const sent = request.get('origin') ?? originOf(request.get('referer'));
    if (sent === undefined || sent === own || allowedOrigins.includes(sent)) {
      // No Origin at all means a non-browser client (CLI, test): cookies are not sent cross-site by those.
      return next();
    }
    next(new RequestError(403, `Requests from ${sent} are not accepted`));
  };
}

function originOf(referer: string | undefined): string | undefined {
  if (!referer) return undefined;
  try {
    return new URL(referer).origin;
  } catch {
    return 'invalid referer';
  }
}
