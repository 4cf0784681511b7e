/** The SQLSTATE of a PostgreSQL (or PGlite) error, whether the driver's error comes bare or wrapped by drizzle (as its cause). */
export function postgresCode(error: unknown): string | undefined {
  let e = error;
  for (let depth = 0; depth < 5 && typeof e === 'object' && e !== null; depth++) {
    const code = (e as { code?: unknown }).code;
    if (typeof code === 'string' && /^[0-9A-Z]{5}$/.test(code)) return code;
    e = (e as { cause?: unknown }).cause;
  }
  return undefined;
}

/**
 * Text the database cannot hold (22021: NUL or a byte sequence invalid in UTF-8; 22P05: untranslatable):
 * the request's fault, answered 400 — refuse-nul.ts catches NUL earlier; this is the backstop.
 */
export function isUnstorableText(error: unknown): boolean {
  const code = postgresCode(error);
  return code === '22021' || code === '22P05';
}
