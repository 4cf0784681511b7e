import { postgresCode } from '../db/postgres-error';

/** A unique index refused the row (PostgreSQL 23505). */
export function isUniqueViolation(error: unknown): boolean {
  return postgresCode(error) === '23505';
}
