import type { AdjustmentProblem } from '@seinework/contracts';
import { WebError } from '@seinework/network-analysis';
import { EngineRefusal } from '../engine/engine-errors';
import { storedOptionBodySchema, type StoredOptionBody } from '@seinework/contracts';
import { RequestError, type ProblemDetail } from '../http/errors';

/**
 * The engine names the adjustment it refuses by position (`adjustments[2] (close-fleet "Trawl"): …`,
 * METHODS.md §8); the option form shows each problem against its adjustment, so a refusal of an
 * option is answered 422 with `{adjustment, problem}` details (adjustment null for the whole option).
 */

const POSITION = /^adjustments(?:\[(\d+)\]|\.(\d+))/;

export function adjustmentProblems(problems: readonly string[]): AdjustmentProblem[] {
  return problems.map((problem) => {
    const found = POSITION.exec(problem.replace(/^option: /, ''));
    return { adjustment: found ? Number(found[1] ?? found[2]) : null, problem };
  });
}

/** Runs an engine call, turning its refusal of the option into the 422 the option routes answer. */
export async function withOptionProblems<T>(work: () => Promise<T>): Promise<T> {
  try {
    return await work();
  } catch (error) {
    // a refused web is the baseline's fault, not the option's: the general handler words it
    if (!(error instanceof WebError) || (error instanceof EngineRefusal && error.input !== 'option')) throw error;
    const details = adjustmentProblems(error.problems);
    const named = details.filter((d) => d.adjustment !== null).map((d) => `adjustments[${d.adjustment}]`);
    const which = named.length > 0 ? `: see ${[...new Set(named)].join(', ')}` : '';
    // the error handler sends details as given; these are objects of the option contract, not upload rows
    throw new RequestError(422, `The engine refuses this harvest option on this baseline${which}`, details as unknown as ProblemDetail[]);
  }
}

/** The body of an option route, or a 400 whose problems stand against their adjustments (`adjustments.2.percent: …`). */
export function parseOptionBody(body: unknown): StoredOptionBody {
  if (typeof body !== 'object' || body === null || Array.isArray(body)) throw new RequestError(400, 'Send the harvest option as a JSON object (OPTION.json, with an optional purpose)');
  const parsed = storedOptionBodySchema.safeParse(body);
  if (parsed.success) return parsed.data;
  const problems = parsed.error.issues.map((issue) => (issue.path.length > 0 ? `${issue.path.join('.')}: ${issue.message}` : issue.message));
  throw new RequestError(400, 'The harvest option is not valid', adjustmentProblems(problems) as unknown as ProblemDetail[]);
}
