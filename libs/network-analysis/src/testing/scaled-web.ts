import type { Web } from '@seinework/contracts';

/** The same web with every flow, import, export and respiration multiplied by k (prices kept). */
export function scaledWeb(web: Web, k: number): Web {
  return {
    ...web,
    flows: web.flows.map((f) => ({ ...f, value: f.value * k })),
    imports: web.imports.map((f) => ({ ...f, value: f.value * k })),
    exports: web.exports.map((f) => ({ ...f, value: f.value * k })),
    respiration: web.respiration.map((f) => ({ ...f, value: f.value * k })),
  };
}
