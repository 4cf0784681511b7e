import { Agent, request } from 'node:http';

/**
 * The load of the API benchmark: an open loop of evenly spaced requests (one every 1000 / rate ms,
 * each on a free keep-alive connection, never waiting for earlier answers), as independent users
 * arriving at a steady rate would send them. A request's latency runs from the moment it was due,
 * not from when it could be sent, so a client that falls behind cannot hide the server's delays.
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

/** `rate` requests per second, evenly spaced, for `seconds`; resolves when every answer is in. */
export async function paced(origin: string, target: Target, rate: number, seconds: number): Promise<PacedResult> {
  const agent = new Agent({ keepAlive: true, maxSockets: Infinity });
  const interval = 1000 / rate;
  const total = Math.round(rate * seconds);
  const latencies: number[] = [];
  const answers: Promise<void>[] = [];
  let failed = 0;
  const start = performance.now();
  let next = 0;
  await new Promise<void>((done) => {
    const tick = () => {
      // every request due by now goes out, so a late timer delays nothing it could have sent
      while (next < total && start + next * interval <= performance.now()) {
        const due = start + next * interval;
        answers.push(
          send(agent, origin, target).then(
            (status) => {
              latencies.push(performance.now() - due);
              if (status < 200 || status > 299) failed++;
            },
            () => void failed++,
          ),
        );
        next++;
      }
      if (next < total) setTimeout(tick, Math.max(0, start + next * interval - performance.now()));
      else done();
    };
    tick();
  });
  await Promise.all(answers);
  const elapsed = performance.now() - start;
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
