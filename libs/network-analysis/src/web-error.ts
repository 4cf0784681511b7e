import { capProblems } from '@seinework/contracts';

/**
 * The one error the engine throws for bad input. `problems` holds one readable line per problem,
 * naming the compartment, flow or row, so the CLI, the API and the upload screen can show them all.
 * The message lists the first few and counts the rest: a web with millions of bad rows must not
 * become one line of hundreds of megabytes.
 */
export type WebErrorKind = 'invalid' | 'unbalanced' | 'closed' | 'infeasible';

export class WebError extends Error {
  constructor(
    readonly kind: WebErrorKind,
    readonly problems: readonly string[],
  ) {
    super(capProblems(problems).join('; '));
    this.name = 'WebError';
  }
}
