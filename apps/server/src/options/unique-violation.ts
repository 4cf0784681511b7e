/** A unique index refused the row (PostgreSQL 23505), whether the driver's error comes bare or wrapped by drizzle. */
export function isUniqueViolation(error: unknown): boolean {
  for (let e: unknown = error; e instanceof Error || (typeof e === 'object' && e !== null); e = (e as { cause?: unknown }).cause) {
    if ((e as { code?: unknown }).code === '23505') return true;
    if (!(e as { cause?: unknown }).cause) break;
  }
  return false;
}
