import type { z } from 'zod';
import { RequestError } from './http/errors';

/** A request part checked by a contracts schema, or a 400 naming every problem (`path: message`). */
export function parseInput<S extends z.ZodType>(schema: S, value: unknown, what = 'request body'): z.output<S> {
  const result = schema.safeParse(value ?? {});
  if (result.success) return result.data;
  const details = result.error.issues.map((issue) => (issue.path.length > 0 ? `${issue.path.join('.')}: ${issue.message}` : issue.message));
  // two checks can say the same sentence (1e20 is neither a safe whole number nor small enough): say it once
  throw new RequestError(400, `The ${what} is not valid`, [...new Set(details)]);
}
