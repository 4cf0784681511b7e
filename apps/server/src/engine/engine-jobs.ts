import { setMaxListeners } from 'node:events';
import { API_TIME_BUDGET_MS, type ResponseRule, type TableSelection } from '@seinework/contracts';
import { createDrawPool, createWorkerPool, isAbortError, type DrawPool, type SerialisedDrawJob } from '@seinework/draw-pool';
import { summarise, type UncertaintySummary } from '@seinework/harvest-options';
import type { BalancingMethod } from '@seinework/network-analysis';
import { RequestError } from '../http/errors';
import { EngineOverBudget, EngineRefusal, EngineStopping } from './engine-errors';
import type { CheckedDraws, EngineAnswer, EngineInput, EngineTask, RequestText } from './engine-task';

/**
 * The engine off the server's thread: every analysis, balancing, option run and sensitivity table
 * runs on an engine worker, and uncertainty draws on the draw pool, each request within a time
 * budget and cancelled when its signal aborts (the route aborts it when the client goes away).
 * Answers come back as UTF-8 JSON text ready to send (`JSON.parse(text.toString())` for the
 * object); refusals as EngineRefusal (a WebError saying whether the web or the option is wrong),
 * a full queue as QueueFullError, an exhausted budget as EngineOverBudget.
 */

export interface JobOptions {
  /** Aborts the job: its task leaves the queue, or its worker is stopped. */
  readonly signal?: AbortSignal;
}

export interface TableJobOptions extends JobOptions {
  /** 'summary' (default) leaves the n² tables out; 'all' keeps the whole METHODS.md §11 document. */
  readonly tables?: TableSelection;
}

export interface OptionJobOptions extends TableJobOptions {
  /** Called as chunks of uncertainty draws finish. */
  readonly onProgress?: (done: number, total: number) => void;
}

export type RequestKind = EngineTask['kind'];

export interface EngineJobs {
  /** The analysis document of a WEB.json value. */
  analyzeOffThread(web: unknown, options?: TableJobOptions): Promise<Buffer>;
  /** `{ method, wasBalanced, web }`. */
  balanceOffThread(web: unknown, method: BalancingMethod, options?: JobOptions): Promise<Buffer>;
  /** `{ baseline, option, difference, web[, uncertainty] }`; the draws, if the option asks for them, on the draw pool. */
  runOptionOffThread(web: unknown, option: unknown, options?: OptionJobOptions): Promise<Buffer>;
  /** The harvest-sensitivity table. */
  sensitivityOffThread(web: unknown, response: ResponseRule, options?: JobOptions): Promise<Buffer>;
  /**
   * A stateless API request as it came (its raw JSON body), parsed and checked on the worker: a
   * bad body or shape is a 400 RequestError, a web over the API limits a 413. Bodies: the web
   * (analyze), `{ web, method? }` (balance), `{ web, option }` (run-option), `{ web, response? }` (sensitivity).
   */
  requestOffThread(kind: RequestKind, body: RequestText, options?: OptionJobOptions): Promise<Buffer>;
  /** Jobs started and not yet settled. */
  readonly pending: number;
  /** Stops the engine workers (and the draw pool, when the jobs started their own). */
  destroy(): Promise<void>;
}

export interface EngineJobsSettings {
  /** Engine worker threads (default: one per core). */
  readonly threads?: number;
  /** Jobs that may wait for an engine worker (default 8); one more is refused with QueueFullError. */
  readonly maxQueue?: number;
  /** Time one request may take, queue and draws included (default API_TIME_BUDGET_MS). */
  readonly budgetMs?: number;
  /** The server's draw pool; without one the jobs start their own, whose workers stop when idle. */
  readonly drawPool?: DrawPool;
  /** Keep engine workers running between jobs (the server's); otherwise they stop when idle. */
  readonly keepAlive?: boolean;
}

export const DEFAULT_ENGINE_QUEUE = 8;

export function createEngineJobs(settings: EngineJobsSettings = {}): EngineJobs {
  const workers = createWorkerPool<EngineTask, EngineAnswer>(new URL('./engine-worker.ts', import.meta.url), {
    threads: settings.threads,
    maxQueue: settings.maxQueue ?? DEFAULT_ENGINE_QUEUE,
    keepAlive: settings.keepAlive ?? false,
  });
  const ownDrawPool = settings.drawPool ? undefined : createDrawPool(undefined, { keepAlive: false });
  const drawPool = settings.drawPool ?? ownDrawPool!;
  const budgetMs = settings.budgetMs ?? API_TIME_BUDGET_MS;
  let pending = 0;
  let stopping = false;

  /** Runs `work` under the budget and the caller's signal, turning a budget abort into EngineOverBudget. */
  async function job(signal: AbortSignal | undefined, work: (signal: AbortSignal) => Promise<Buffer>): Promise<Buffer> {
    const budget = AbortSignal.timeout(budgetMs);
    // a job that fails part way (one chunk of draws refused by a full queue) drops the rest of its tasks
    const leftovers = new AbortController();
    const combined = AbortSignal.any([leftovers.signal, budget, ...(signal ? [signal] : [])]);
    // every chunk of draws listens to it
    setMaxListeners(Infinity, combined);
    pending++;
    try {
      return await work(combined);
    } catch (error) {
      if (budget.aborted && (isAbortError(error) || combined.aborted)) throw new EngineOverBudget(budgetMs);
      if (stopping) throw new EngineStopping();
      throw error;
    } finally {
      leftovers.abort();
      pending--;
    }
  }

  async function engine(task: EngineTask, signal: AbortSignal): Promise<EngineAnswer & { ok: true }> {
    const result = await workers.run(task, signal);
    if (result.ok) return result;
    if (result.kind === 'request') throw new RequestError(result.status, result.message, result.details);
    throw new EngineRefusal(result.kind, result.problems, result.input);
  }

  /** The draws of an option run, in chunks on the draw pool; summarised in draw order, as optionUncertainty does. */
  async function draws(checked: CheckedDraws, signal: AbortSignal, onProgress?: (done: number, total: number) => void): Promise<UncertaintySummary> {
    const { webJson, option, settings: uncertainty } = checked;
    // about eight chunks per worker, at most 100 draws each (the chunking of optionUncertainty)
    const chunkSize = Math.max(1, Math.min(100, Math.ceil(uncertainty.draws / (8 * drawPool.workers))));
    const chunks: SerialisedDrawJob[] = [];
    for (let start = 0; start < uncertainty.draws; start += chunkSize) {
      chunks.push({ webJson, option, cv: uncertainty.cv, seed: uncertainty.seed, start, end: Math.min(uncertainty.draws, start + chunkSize) });
    }
    let done = 0;
    const outcomes = await Promise.all(
      chunks.map(async (chunk) => {
        const outcome = await drawPool.runSerialised(chunk, signal);
        done += outcome.length;
        onProgress?.(done, uncertainty.draws);
        return outcome;
      }),
    );
    return summarise(outcomes.flat(), uncertainty);
  }

  const bytes = (json: Uint8Array) => Buffer.from(json.buffer, json.byteOffset, json.byteLength);

  function answer(kind: RequestKind, input: EngineInput, options: OptionJobOptions): Promise<Buffer> {
    const tables = options.tables ?? 'summary';
    return job(options.signal, async (signal) => {
      const result = await engine(kind === 'analyze' || kind === 'run-option' ? { kind, input, tables } : { kind, input }, signal);
      if (!result.draws) return bytes(result.json);
      const uncertainty = await draws(result.draws, signal, options.onProgress);
      // the run's document, its closing brace replaced by the uncertainty member
      const document = bytes(result.json);
      return Buffer.concat([document.subarray(0, document.lastIndexOf('}')), Buffer.from(`,"uncertainty":${JSON.stringify(uncertainty)}}`)]);
    });
  }

  return {
    analyzeOffThread: (web, options = {}) => answer('analyze', { value: web }, options),
    balanceOffThread: (web, method, options = {}) => answer('balance', { value: { web, method } }, options),
    runOptionOffThread: (web, option, options = {}) => answer('run-option', { value: { web, option } }, options),
    sensitivityOffThread: (web, response, options = {}) => answer('sensitivity', { value: { web, response } }, options),
    requestOffThread: (kind, body, options = {}) => answer(kind, { json: body.text }, options),
    get pending() {
      return pending;
    },
    destroy: async () => {
      stopping = true;
      await Promise.all([workers.destroy(), ownDrawPool?.destroy()]);
    },
  };
}
