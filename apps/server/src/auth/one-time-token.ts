import { createHash, randomBytes } from 'node:crypto';

/**
 * The secrets in invitation and password-reset links: 32 random bytes, base64url (43 characters).
 * Only their SHA-256 hash is stored, so a copy of the database opens no account. A plain hash is
 * enough here (no salt, no slow hash): the token is random, not a password someone chose.
 */

const TOKEN_PATTERN = /^[A-Za-z0-9_-]{43}$/;

export function newOneTimeToken(): { token: string; tokenHash: string } {
  const token = randomBytes(32).toString('base64url');
  return { token, tokenHash: hashOneTimeToken(token) };
}

export function hashOneTimeToken(token: string): string {
  return createHash('sha256').update(token).digest('hex');
}

/** Whether a link's token could be one of ours at all (anything else is answered as unknown). */
export function looksLikeOneTimeToken(token: string): boolean {
  return TOKEN_PATTERN.test(token);
}
