/**
 * The one error the engine throws for bad input. `problems` holds one readable line per problem,
 * naming the compartment, flow or row, so the CLI, the API and the upload screen can show them all.
 */
export type WebErrorKind = 'invalid' | 'unbalanced' | 'closed' | 'infeasible';

export class WebError extends Error {
  constructor(
    readonly kind: WebErrorKind,
    readonly problems: readonly string[],
  ) {
    super(problems.join('; '));
    this.name = 'WebError';
  }
}
