import type { Request, RequestHandler } from 'express';
import type { TLSSocket } from 'node:tls';
import { RequestError } from './errors';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);
const LOOPBACK_HOSTS = new Set(['127.0.0.1', 'localhost', '[::1]']);

/**
 * Refuses state-changing requests from another site, so that it cannot make a signed-in browser act
 * on Seinework (cross-site request forgery). The Origin (or, failing that, the Referer) must be one
 * of the server's public origins (PUBLIC_ORIGIN) — never compared with the Host header, which a
 * DNS-rebinding page controls. Without configured origins the address the server listens on is its
 * origin. A request with neither header is a non-browser client (CLI, script) and passes, unless it
 * carries a cookie: a browser sends cookies, so a cookie must come with where it was sent from.
 * Mounted before the body is read: a foreign origin is refused whatever it sends.
 */
export function originCheck(publicOrigins?: readonly string[]): RequestHandler {
  const configured = publicOrigins?.map((origin) => new URL(origin).origin);
  return (request, _response, next) => {
    if (SAFE_METHODS.has(request.method)) return next();
    const sent = request.get('origin') ?? originOf(request.get('referer'));
    if (sent === undefined) {
      if (request.get('cookie') !== undefined) return next(new RequestError(403, 'A request that carries a cookie must say where it comes from (Origin or Referer header)'));
      return next();
    }
    const allowed = configured ?? [listeningOrigin(request)];
    if (allowed.some((origin) => sameSite(origin, sent))) return next();
    next(new RequestError(403, `Requests from ${sent} are not accepted`));
  };
}

function originOf(referer: string | undefined): string | undefined {
  if (!referer) return undefined;
  try {
    return new URL(referer).origin;
  } catch {
    return 'an unreadable Referer';
  }
}

/** The origin of the address this request reached, from the socket, not from anything the client says. */
function listeningOrigin(request: Request): string {
  const scheme = (request.socket as TLSSocket).encrypted ? 'https' : 'http';
  const address = (request.socket.localAddress ?? '127.0.0.1').replace(/^::ffff:/, '');
  const host = address.includes(':') ? `[${address}]` : address;
  return new URL(`${scheme}://${host}:${request.socket.localPort}`).origin;
}

/** Equal origins; a loopback origin also accepts the other loopback names (localhost for 127.0.0.1) on its port. */
function sameSite(allowed: string, sent: string): boolean {
  if (allowed === sent) return true;
  let a: URL;
  let s: URL;
  try {
    a = new URL(allowed);
    s = new URL(sent);
  } catch {
    return false;
  }
  return LOOPBACK_HOSTS.has(a.hostname) && LOOPBACK_HOSTS.has(s.hostname) && a.protocol === s.protocol && a.port === s.port;
}
