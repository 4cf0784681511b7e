import { Agent, request } from 'node:http';

/**
 * The load of the API benchmark: an open loop of requests arriving as independent users send them
 * — a Poisson process of the given rate (exponential gaps, from a fixed seed so that runs compare),
 * each request on a free keep-alive connection, never waiting for earlier answers. A request's
 * latency runs from the moment it was due, not from when it could be sent, so a client that falls
 * behind cannot hide the server's delays.
 *
 * (autocannon's `overallRate` lets each connection send its share of the second back to back at
 * the start of every second: bursts, not a steady rate; autocannon is kept for the sequential
 * capacity figures.)
 */

export interface Target {
  readonly method: 'GET' | 'POST';
  readonly path: string;
  readonly headers: Record<string, string>;
  readonly body?: string;
}

export interface PacedResult {
  /** Every answer's latency from the moment its request was due, ms, sorted. */
  readonly latencies: readonly number[];
  /** Answers per second over the run (from the first request due to the last answer). */
  readonly answeredPerSecond: number;
  /** Answers that were not 2xx, and requests that failed outright. */
  readonly failed: number;
}

export function send(agent: Agent, origin: string, target: Target): Promise<number> {
  const url = new URL(target.path, origin);
  return new Promise((resolve, reject) => {
    const sent = request({ agent, host: url.hostname, port: url.port, method: target.method, path: url.pathname + url.search, headers: target.headers }, (response) => {
      response.resume();
      response.on('end', () => resolve(response.statusCode ?? 0));
      response.on('error', reject);
    });
    sent.on('error', reject);
    sent.end(target.body);
  });
}

/** When each request is due, ms from the start: a Poisson process of `rate` per second over `seconds`. */
export function arrivals(rate: number, seconds: number, seed = 1): number[] {
  // mulberry32: small, seeded, plenty for spacing requests
  let state = seed >>> 0;
  const uniform = () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
  const times: number[] = [];
  for (let at = -Math.log(1 - uniform()) * (1000 / rate); at < seconds * 1000; at += -Math.log(1 - uniform()) * (1000 / rate)) times.push(at);
  return times;
}

/** About `rate` requests per second (Poisson arrivals) for `seconds`; resolves when every answer is in. */
export async function paced(origin: string, target: Target, rate: number, seconds: number, seed = 1): Promise<PacedResult> {
  const agent = new Agent({ keepAlive: true, maxSockets: Infinity });
  const due = arrivals(rate, seconds, seed);
  const total = due.length;
  const latencies: number[] = [];
  const answers: Promise<void>[] = [];
  let failed = 0;
  const start = performance.now();
  let next = 0;
  await new Promise<void>((done) => {
    const tick = () => {
      // every request due by now goes out, so a late timer delays nothing it could have sent
      while (next < total && start + due[next]! <= performance.now()) {
        const dueAt = start + due[next]!;
        answers.push(
          send(agent, origin, target).then(
            (status) => {
              latencies.push(performance.now() - dueAt);
              if (status < 200 || status > 299) failed++;
            },
            () => void failed++,
          ),
        );
        next++;
      }
      if (next < total) setTimeout(tick, Math.max(0, start + due[next]! - performance.now()));
      else done();
    };
    tick();
  });
  await Promise.all(answers);
  const elapsed = Math.max(performance.now() - start, seconds * 1000);
  agent.destroy();
  latencies.sort((a, b) => a - b);
  return { latencies, answeredPerSecond: (latencies.length / elapsed) * 1000, failed };
}

/** The 95th percentile of sorted values (the smallest value at or above 95 % of them). */
export function p95(sorted: readonly number[]): number {
  return sorted[Math.min(sorted.length - 1, Math.ceil(sorted.length * 0.95) - 1)] ?? Number.NaN;
}

/** `count` requests one after another on one connection (the server never has two at once). */
export async function sequential(origin: string, target: Target, count: number): Promise<void> {
  const agent = new Agent({ keepAlive: true, maxSockets: 1 });
  try {
    for (let k = 0; k < count; k++) {
      const status = await send(agent, origin, target);
      if (status < 200 || status > 299) throw new Error(`bench: ${target.method} ${target.path} answered ${status}`);
    }
  } finally {
    agent.destroy();
  }
}
