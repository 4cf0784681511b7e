import { z } from 'zod';

/**
 * A finite number. JSON has no infinity, but JSON.parse reads a literal beyond ±1.8e308
 * (1e309, say) as ±Infinity: that number was given, it is too large, and the message says so.
 */
export function finiteNumber(what: string) {
  return z.number({
    error: (issue) => (issue.input === Infinity || issue.input === -Infinity ? `${what} is too large (beyond ±1.8e308)` : `${what} must be a number`),
  });
}

export function finiteNonNegative(what: string) {
  return finiteNumber(what).refine((v) => v >= 0, { message: `${what} must not be negative` });
}
