import type { CycleLimits } from '@seinework/network-analysis';

/**
 * Simple-cycle caps for analyses answered over HTTP. The CLI lists every cycle (up to the engine's
 * million); a dense 50-compartment web reaches that and its nexus listing alone runs to tens of
 * megabytes, so a request stops earlier and says so (`cycles.capped`). The cycled and acyclic flows
 * stay complete either way: cycles beyond the cap are broken one at a time.
 */
export const HTTP_CYCLE_LIMITS: CycleLimits = { maxCycles: 50_000, maxMilliseconds: 2_000 };
