import type { HarvestOption, ResponseRule, TableSelection, Web } from '@seinework/contracts';
import type { BalancingMethod, WebErrorKind } from '@seinework/network-analysis';
import type { RefusedInput } from './engine-errors';

/** What the server hands an engine worker: the raw input (the worker checks it) and what to do with it. */
export type EngineTask =
  | { readonly kind: 'analyze'; readonly web: unknown; readonly tables: TableSelection }
  | { readonly kind: 'balance'; readonly web: unknown; readonly method: BalancingMethod }
  | { readonly kind: 'run-option'; readonly web: unknown; readonly option: unknown; readonly tables: TableSelection }
  | { readonly kind: 'sensitivity'; readonly web: unknown; readonly response: ResponseRule };

/**
 * What comes back: the answer already serialised to UTF-8 JSON in the worker (so the server's
 * own thread never walks a large document), or the engine's refusal with its problems capped.
 */
export type EngineAnswer =
  | {
      readonly ok: true;
      readonly json: Uint8Array;
      /** For an option run: the checked web and option, for the uncertainty draws that follow. */
      readonly checked?: { readonly web: Web; readonly option: HarvestOption };
    }
  | { readonly ok: false; readonly kind: WebErrorKind; readonly problems: readonly string[]; readonly input: RefusedInput };
