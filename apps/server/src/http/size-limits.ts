import { API_LIMITS } from '@seinework/contracts';
import { RequestError } from './errors';

/**
 * The API's limits on one request (libs/contracts api-limits.ts), checked on the counts alone
 * before any work, so that an oversized web is refused at once, naming each limit it exceeds.
 * Everything else about the input is the engine's to check (on a worker).
 */

const WEB_ARRAYS = [
  ['compartments', API_LIMITS.compartments],
  ['flows', API_LIMITS.flows],
  ['imports', API_LIMITS.entries],
  ['exports', API_LIMITS.entries],
  ['respiration', API_LIMITS.entries],
] as const;

export function requireWebWithinLimits(web: unknown, where = ''): void {
  if (!isObject(web)) return;
  const over = WEB_ARRAYS.flatMap(([key, limit]) => {
    const value = web[key];
    return Array.isArray(value) && value.length > limit ? [`${where}${key}: ${value.length} given, at most ${limit.toLocaleString('en')} per web`] : [];
  });
  if (over.length > 0) {
    throw new RequestError(413, `The web is larger than this server analyses (at most ${API_LIMITS.compartments} compartments and ${API_LIMITS.flows.toLocaleString('en')} flows)`, over);
  }
}

export function requireOptionWithinLimits(option: unknown): void {
  if (!isObject(option)) return;
  const adjustments = option['adjustments'];
  if (Array.isArray(adjustments) && adjustments.length > API_LIMITS.adjustments) {
    throw new RequestError(413, 'The harvest option is larger than this server runs', [
      `option: adjustments: ${adjustments.length} given, at most ${API_LIMITS.adjustments.toLocaleString('en')} per option`,
    ]);
  }
  const uncertainty = option['uncertainty'];
  const draws = isObject(uncertainty) ? uncertainty['draws'] : undefined;
  if (typeof draws === 'number' && draws > API_LIMITS.draws) {
    throw new RequestError(422, 'Too many uncertainty draws', [`option: uncertainty.draws: at most ${API_LIMITS.draws} draws per request (asked for ${draws})`]);
  }
}

function isObject(value: unknown): value is Record<string, unknown> {
  return typeof value === 'object' && value !== null && !Array.isArray(value);
}
