import helmet from 'helmet';
import type { RequestHandler } from 'express';

/**
 * helmet's security headers with its default Content-Security-Policy, adjusted only where the built
 * Angular app needs it: the production build loads its stylesheet with
 * `<link media="print" onload="this.media='all'">` (critical CSS inlining), so that one inline
 * handler is allowed by its hash. Inline styles (the inlined critical CSS, Angular Material's
 * component styles) and fonts from 'self' are already allowed by the defaults.
 * On plain http (loopback development) HSTS and upgrade-insecure-requests are left out: they would
 * send the browser to an https that does not exist.
 */
const STYLESHEET_ONLOAD_HASH = "'sha256-MhtPZXr7+LpJUY5qtMutB+qWfQtMaPccfe7QXtCcEYc='";

export function securityHeaders(publicOrigin: string): RequestHandler {
  const https = new URL(publicOrigin).protocol === 'https:';
  return helmet({
    contentSecurityPolicy: {
      useDefaults: true,
      directives: {
        'script-src-attr': ["'unsafe-hashes'", STYLESHEET_ONLOAD_HASH],
        'upgrade-insecure-requests': https ? [] : null,
      },
    },
    strictTransportSecurity: https,
  });
}
