import { move, transferableSymbol, valueSymbol } from 'piscina';
import { capProblems } from '@seinework/contracts';
import { harvestSensitivity, parseHarvestOption, planOption, runOption } from '@seinework/harvest-options';
import { analyze, balanceNetwork, createNetwork, isBalanced, parseWeb, requireAnalysable, toWeb, WebError } from '@seinework/network-analysis';
import { HTTP_CYCLE_LIMITS } from '../http/cycle-limits';
import { proportionateAnalysis, proportionateDifference } from './analysis-tables';
import type { RefusedInput } from './engine-errors';
import type { EngineAnswer, EngineTask } from './engine-task';

/** Engine worker thread: checks the input of one request, runs the engine on it, serialises the answer. */
export default function engineTask(task: EngineTask): unknown {
  const result = run(task);
  // the JSON bytes move to the server's thread without a copy
  return result.ok ? move({ [transferableSymbol]: result.json.buffer, [valueSymbol]: result } as never) : result;
}

function run(task: EngineTask): EngineAnswer {
  let input: RefusedInput = 'web';
  try {
    const web = parseWeb(task.web);
    const network = createNetwork(web);
    switch (task.kind) {
      case 'analyze':
        return answer(proportionateAnalysis(analyze(network, { cycles: HTTP_CYCLE_LIMITS }), task.tables));
      case 'balance':
        return answer({ method: task.method, wasBalanced: isBalanced(network), web: toWeb(balanceNetwork(network, { method: task.method })) });
      case 'sensitivity':
        return answer(harvestSensitivity(network, task.response));
      case 'run-option': {
        input = 'option';
        const option = parseHarvestOption(task.option);
        input = 'web';
        requireAnalysable(network);
        // from here a refusal is about the option: what the adjustments ask of this (valid, balanced) web
        input = 'option';
        planOption(network, option.adjustments);
        const run = runOption(web, option, { cycles: HTTP_CYCLE_LIMITS });
        const document = {
          baseline: proportionateAnalysis(run.baseline, task.tables),
          option: proportionateAnalysis(run.option, task.tables),
          difference: proportionateDifference(run.difference, task.tables),
          web: run.web,
        };
        return { ...answer(document), checked: option.uncertainty ? { web, option } : undefined };
      }
    }
  } catch (error) {
    if (!(error instanceof WebError)) throw error;
    return { ok: false, kind: error.kind, problems: capProblems(error.problems), input };
  }
}

function answer(document: object): EngineAnswer & { ok: true } {
  // a fresh ArrayBuffer of its own (not Buffer's shared pool), so that it can be transferred
  return { ok: true, json: new TextEncoder().encode(JSON.stringify(document)) };
}
