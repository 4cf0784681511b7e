import { HttpErrorResponse } from '@angular/common/http';

/**
 * A sentence a person can act on for a failed request: the server's own `{error, details?}` text
 * when it sent one, otherwise what went wrong in plain words.
 */
export function problemMessage(error: unknown): string {
  if (!(error instanceof HttpErrorResponse)) return error instanceof Error ? error.message : String(error);
  if (error.status === 0) return 'The server cannot be reached. Check your connection and try again.';
  if (error.status === 429) return tooManyAttempts(error);
  const said = serverSays(error.error);
  if (said) return said;
  if (error.status >= 500) return 'The server ran into a problem. Try again in a moment.';
  return `The request was refused (${error.status} ${error.statusText}).`;
}

/** 429: say how long to wait, from the Retry-After header (seconds) when the server sends it. */
function tooManyAttempts(error: HttpErrorResponse): string {
  const seconds = Number(error.headers.get('Retry-After'));
  if (!Number.isFinite(seconds) || seconds <= 0) return serverSays(error.error) ?? 'Too many attempts. Wait a while, then try again.';
  return `Too many attempts. Try again in ${waitFor(seconds)}.`;
}

function waitFor(seconds: number): string {
  if (seconds < 60) return seconds === 1 ? '1 second' : `${Math.ceil(seconds)} seconds`;
  const minutes = Math.ceil(seconds / 60);
  return minutes === 1 ? '1 minute' : `${minutes} minutes`;
}

/** The `{error, details?}` body of the server's error answers, as one sentence. */
function serverSays(body: unknown): string | null {
  if (!body || typeof body !== 'object' || !('error' in body) || typeof body.error !== 'string') return null;
  const details = 'details' in body && Array.isArray(body.details) ? body.details.filter((d): d is string => typeof d === 'string') : [];
  return details.length > 0 ? `${body.error}: ${details.join('; ')}` : body.error;
}
