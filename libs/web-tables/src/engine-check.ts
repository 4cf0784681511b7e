import type { UploadProblem, Web } from '@seinework/contracts';
import { createNetwork, imbalances, parseWeb, WebError } from '@seinework/network-analysis';
import { ProblemList } from './problems';

/**
 * The engine has the last word on a web: its shape check (parseWeb) and structural check
 * (createNetwork) run on every upload, and their problems ("flows[3]: unknown compartment") are
 * put back against the row of the file they came from. Imbalance is reported, not refused: an
 * unbalanced web is kept as a draft to be balanced in the editor, and publishing refuses it.
 */

/** Row number in the file of each entry of each array of the web, by array name. */
export type RowSources = Partial<Record<'compartments' | 'flows' | 'imports' | 'exports' | 'respiration', readonly number[]>>;

export interface EngineCheck {
  readonly web?: Web;
  readonly problems: UploadProblem[];
  /** One per unbalanced compartment, against its compartments row. */
  readonly warnings: UploadProblem[];
}

const LOCATED = /^(compartments|flows|imports|exports|respiration)\[(\d+)\](?:\.(\w+))?(?:\[\d+\])?: (.*)$/s;

export function checkWithEngine(input: unknown, sources: RowSources): EngineCheck {
  const problems = new ProblemList();
  let web: Web;
  try {
    web = parseWeb(input);
    const network = createNetwork(web);
    const rowOf = new Map(web.compartments.map((c, i) => [c.id, sources.compartments?.[i] ?? i + 1]));
    const warnings = imbalances(network).map((u) => ({
      table: 'compartments',
      row: rowOf.get(u.id) ?? null,
      column: null,
      problem: `compartment "${u.id}" is unbalanced: inputs ${u.inputs} and outputs ${u.outputs} differ by ${u.imbalance}`,
    }));
    return { web, problems: [], warnings };
  } catch (error) {
    if (!(error instanceof WebError)) throw error;
    for (const line of error.problems) locate(line, sources, problems);
    return { problems: problems.items, warnings: [] };
  }
}

function locate(line: string, sources: RowSources, problems: ProblemList): void {
  const match = LOCATED.exec(line);
  if (!match) {
    const [path, ...rest] = line.split(': ');
    const column = rest.length > 0 && /^\w+$/.test(path) ? path : null;
    problems.add('web', null, column, column ? rest.join(': ') : line);
    return;
  }
  const [, table, index, column, problem] = match;
  const k = Number(index);
  const row = sources[table as keyof RowSources]?.[k] ?? k + 1;
  problems.add(table, row, column ?? null, problem);
}
