import { createHash } from 'node:crypto';
import { existsSync, readFileSync } from 'node:fs';
import { resolve } from 'node:path';
import express from 'express';
import request from 'supertest';
import { securityHeaders } from './security-headers';

function appWith(publicOrigin: string) {
  const app = express();
  app.use(securityHeaders(publicOrigin));
  app.get('/', (_request, response) => void response.send('ok'));
  return app;
}

describe('security headers', () => {
  it('sends a Content-Security-Policy that refuses other origins, framing and inline scripts', async () => {
    const response = await request(appWith('http://127.0.0.1:4300')).get('/');
    const csp = String(response.headers['content-security-policy']);
    expect(csp).toContain("default-src 'self'");
    expect(csp).toContain("script-src 'self'");
    expect(csp).toContain("frame-ancestors 'self'");
    expect(csp).toContain("object-src 'none'");
    expect(csp).not.toContain('upgrade-insecure-requests');
    expect(response.headers['x-content-type-options']).toBe('nosniff');
    expect(response.headers['strict-transport-security']).toBeUndefined();
  });

  it('adds HSTS and upgrade-insecure-requests behind https', async () => {
    const response = await request(appWith('https://seinework.example.org')).get('/');
    expect(String(response.headers['content-security-policy'])).toContain('upgrade-insecure-requests');
    expect(response.headers['strict-transport-security']).toMatch(/max-age=/);
  });

  // The built app's only inline script is the stylesheet's onload handler: the policy must allow exactly it.
  // `npm test` builds the app before this suite runs.
  it('allows every inline event handler of the built app by its hash', async () => {
    const built = resolve(import.meta.dirname, '../../../../dist/web/browser/index.html');
    expect(existsSync(built), 'build the browser app first (npm run build)').toBe(true);
    const html = readFileSync(built, 'utf8');
    const handlers = [...html.matchAll(/\son\w+="([^"]*)"/g)].map((m) => m[1]);
    const csp = String((await request(appWith('http://127.0.0.1:4300')).get('/')).headers['content-security-policy']);
    for (const handler of handlers) expect(csp).toContain(`'sha256-${createHash('sha256').update(handler).digest('base64')}'`);
    expect(html).not.toMatch(/<script(?![^>]*\bsrc=)[^>]*>/);
  });
});
