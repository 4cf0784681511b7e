/** A unique index refused the row (PostgreSQL 23505), whether the driver's error comes bare or wrapped by drizzle (as its cause). */
export function isUniqueViolation(error: unknown): boolean {
  let e = error;
  for (let depth = 0; depth < 5 && typeof e === 'object' && e !== null; depth++) {
    if ((e as { code?: unknown }).code === '23505') return true;
    e = (e as { cause?: unknown }).cause;
  }
  return false;
}
