import { WebError, type WebErrorKind } from '@seinework/network-analysis';

/** Which part of a request the engine refused: the web itself, or the harvest option applied to it. */
export type RefusedInput = 'web' | 'option';

/** A WebError from an engine worker, carried back across the thread with what it was about. */
export class EngineRefusal extends WebError {
  constructor(
    kind: WebErrorKind,
    problems: readonly string[],
    readonly input: RefusedInput,
  ) {
    super(kind, problems);
  }
}

/** The engine worked on a request for longer than its time budget and was stopped. */
export class EngineOverBudget extends Error {
  constructor(readonly budgetMs: number) {
    super(`The engine stopped after ${formatSeconds(budgetMs)}, the time one request may take: try a smaller web or fewer draws`);
  }
}

function formatSeconds(ms: number): string {
  return ms >= 1000 ? `${Number((ms / 1000).toFixed(1))} s` : `${ms} ms`;
}

/** The server is shutting down: the engine's workers were stopped under a running request. */
export class EngineStopping extends Error {
  constructor() {
    super('The server is shutting down: send the request again in a moment');
  }
}
