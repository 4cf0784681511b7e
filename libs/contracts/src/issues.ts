import type { z } from 'zod';

/**
 * Turns a zod error into one readable line per problem, with the JSON path of the offending
 * value ("flows[3].value: flow value must not be negative"), for the CLI, the API and uploads.
 */
export function describeIssues(error: z.ZodError): string[] {
  return error.issues.map((issue) => {
    const path = issue.path
      .map((part, index) => (typeof part === 'number' ? `[${part}]` : `${index === 0 ? '' : '.'}${String(part)}`))
      .join('');
    return path ? `${path}: ${issue.message}` : issue.message;
  });
}
