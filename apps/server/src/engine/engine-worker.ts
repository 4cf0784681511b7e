import { move, transferableSymbol, valueSymbol } from 'piscina';
import { z } from 'zod';
import { capProblems, responseRuleSchema } from '@seinework/contracts';
import { lowerWorkerPriority } from '@seinework/draw-pool';
import { harvestSensitivity, parseHarvestOption, planOption, runOption } from '@seinework/harvest-options';
import { analyze, BALANCING_METHODS, balanceNetwork, createNetwork, isBalanced, parseWeb, requireAnalysable, toWeb, WebError } from '@seinework/network-analysis';
import { HTTP_CYCLE_LIMITS } from '../http/cycle-limits';
import { RequestError } from '../http/errors';
import { objectOf, parseJsonText, shapeOf } from '../http/request-body';
import { requireOptionWithinLimits, requireWebWithinLimits } from '../http/size-limits';
import { proportionateAnalysis, proportionateDifference } from './analysis-tables';
import type { RefusedInput } from './engine-errors';
import type { EngineAnswer, EngineInput, EngineTask } from './engine-task';

/**
 * Engine worker thread: reads and checks the body of one request (JSON, shape, the API's size
 * limits), runs the engine on it and serialises the answer.
 */

lowerWorkerPriority();

const balanceBody = z.strictObject({
  web: z.unknown(),
  method: z.enum(BALANCING_METHODS, { error: `method must be one of ${BALANCING_METHODS.join(', ')}` }).default('least-change'),
});
const runBody = z.strictObject({ web: z.unknown(), option: z.unknown() });
const sensitivityBody = z.strictObject({ web: z.unknown(), response: responseRuleSchema.default('bottom-up') });

export default function engineTask(task: EngineTask): unknown {
  const result = run(task);
  // the JSON bytes move to the server's thread without a copy
  return result.ok ? move({ [transferableSymbol]: result.json.buffer, [valueSymbol]: result } as never) : result;
}

function run(task: EngineTask): EngineAnswer {
  let input: RefusedInput = 'web';
  try {
    switch (task.kind) {
      case 'analyze': {
        const web = objectOf(bodyOf(task.input));
        requireWebWithinLimits(web);
        return answer(proportionateAnalysis(analyze(createNetwork(parseWeb(web)), { cycles: HTTP_CYCLE_LIMITS }), task.tables));
      }
      case 'balance': {
        const body = shapeOf(balanceBody, bodyOf(task.input));
        requireWebWithinLimits(body.web, 'web.');
        const network = createNetwork(parseWeb(body.web));
        return answer({ method: body.method, wasBalanced: isBalanced(network), web: toWeb(balanceNetwork(network, { method: body.method })) });
      }
      case 'sensitivity': {
        const body = shapeOf(sensitivityBody, bodyOf(task.input));
        requireWebWithinLimits(body.web, 'web.');
        return answer(harvestSensitivity(createNetwork(parseWeb(body.web)), body.response));
      }
      case 'run-option': {
        const body = shapeOf(runBody, bodyOf(task.input));
        requireWebWithinLimits(body.web, 'web.');
        requireOptionWithinLimits(body.option);
        const web = parseWeb(body.web);
        const network = createNetwork(web);
        input = 'option';
        const option = parseHarvestOption(body.option);
        input = 'web';
        requireAnalysable(network);
        // from here a refusal is about the option: what its adjustments ask of this valid, balanced web
        input = 'option';
        planOption(network, option.adjustments);
        const run = runOption(web, option, { cycles: HTTP_CYCLE_LIMITS });
        const document = {
          baseline: proportionateAnalysis(run.baseline, task.tables),
          option: proportionateAnalysis(run.option, task.tables),
          difference: proportionateDifference(run.difference, task.tables),
          web: run.web,
        };
        const draws = option.uncertainty && { webJson: JSON.stringify(web), option: { response: option.response, adjustments: option.adjustments }, settings: option.uncertainty };
        return { ...answer(document), draws: draws || undefined };
      }
    }
  } catch (error) {
    if (error instanceof RequestError) return { ok: false, kind: 'request', status: error.status, message: error.message, details: capProblems(error.details) };
    if (!(error instanceof WebError)) throw error;
    return { ok: false, kind: error.kind, problems: capProblems(error.problems), input };
  }
}

function bodyOf(input: EngineInput): unknown {
  return 'json' in input ? parseJsonText(input.json) : input.value;
}

function answer(document: object): EngineAnswer & { ok: true } {
  // a fresh ArrayBuffer of its own (not Buffer's shared pool), so that it can be transferred
  return { ok: true, json: new TextEncoder().encode(JSON.stringify(document)) };
}
