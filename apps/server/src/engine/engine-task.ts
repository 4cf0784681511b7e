import type { OptionSpec } from '@seinework/harvest-options';
import type { TableSelection, UncertaintySettings } from '@seinework/contracts';
import type { WebErrorKind } from '@seinework/network-analysis';
import type { ProblemDetail } from '../http/errors';
import type { RefusedInput } from './engine-errors';

/**
 * The raw text of a JSON request body, handed to a worker as it came: the worker parses and checks
 * it, so that the server's thread never parses, checks or copies a large web.
 */
export class RequestText {
  constructor(readonly text: string | undefined) {}
}

/** A task's input as it crosses to the worker: request text, or a value from other server code. */
export type EngineInput = { readonly json: string | undefined } | { readonly value: unknown };

/** What the server hands an engine worker. Bodies: the web (analyze); `{ web, method? }`; `{ web, option }`; `{ web, response? }`. */
export type EngineTask =
  | { readonly kind: 'analyze'; readonly input: EngineInput; readonly tables: TableSelection }
  | { readonly kind: 'balance'; readonly input: EngineInput }
  | { readonly kind: 'run-option'; readonly input: EngineInput; readonly tables: TableSelection }
  | { readonly kind: 'sensitivity'; readonly input: EngineInput };

/** For an option run with uncertainty: what the draws need, the web as JSON text so that each chunk carries a string, not an object graph. */
export interface CheckedDraws {
  readonly webJson: string;
  readonly option: OptionSpec;
  readonly settings: UncertaintySettings;
}

/**
 * What comes back: the answer already serialised to UTF-8 JSON in the worker (so the server's
 * own thread never walks a large document), the engine's refusal (problems capped), or a refusal
 * of the request itself (its body, its size).
 */
export type EngineAnswer =
  | { readonly ok: true; readonly json: Uint8Array; readonly draws?: CheckedDraws }
  | { readonly ok: false; readonly kind: WebErrorKind; readonly problems: readonly string[]; readonly input: RefusedInput }
  | { readonly ok: false; readonly kind: 'request'; readonly status: number; readonly message: string; readonly details: readonly ProblemDetail[] };
