import { spawn } from 'node:child_process';
import { request } from 'node:http';
import { join } from 'node:path';
import cone from '../tests/fixtures/cone-spring.json';
import { generateWeb } from '../libs/network-analysis/src/testing/generated-web';

/**
 * Server timings for `npm run bench`: how long /api/health takes to answer while the heaviest
 * requests the API allows are being worked on (a 400-compartment web with close to 20,000 flows:
 * its analysis and an option run with every table, its harvest sensitivity, a 5,000-draw
 * uncertainty run and least-change balancing, all at once). The server runs in a process of its
 * own; health is asked every 25 ms until the analysis and the option run have been answered (or
 * 60 s), then the requests still running are abandoned — which also shows the server dropping them.
 */

export interface ServerBenchmark {
  readonly name: string;
  readonly ms: number;
  readonly limitMs?: number;
}

const root = join(import.meta.dirname, '..');

interface Timed {
  readonly status: number;
  readonly ms: number;
  readonly bytes: number;
}

/** One request, its whole answer read (and dropped); aborted by `signal`. */
function timedRequest(port: number, method: string, path: string, body?: string, headers: Record<string, string> = {}, signal?: AbortSignal): Promise<Timed> {
  return new Promise((resolve, reject) => {
    const start = performance.now();
    const sent = request({ host: '127.0.0.1', port, method, path, headers: body ? { 'content-type': 'application/json', ...headers } : headers, signal }, (response) => {
      let bytes = 0;
      response.on('data', (chunk: Buffer) => (bytes += chunk.length));
      response.on('end', () => resolve({ status: response.statusCode ?? 0, ms: performance.now() - start, bytes }));
      response.on('error', reject);
    });
    sent.on('error', reject);
    sent.end(body);
  });
}

async function startServer(): Promise<{ port: number; stop(): Promise<void> }> {
  const child = spawn(join(root, 'node_modules/.bin/tsx'), [join(root, 'tools/bench-server-child.ts')], { cwd: root, stdio: ['pipe', 'pipe', 'inherit'] });
  const port = await new Promise<number>((resolve, reject) => {
    child.stdout.once('data', (data: Buffer) => resolve(Number(String(data).trim())));
    child.once('exit', (code) => reject(new Error(`the bench server stopped (${code})`)));
  });
  return {
    port,
    stop: () =>
      new Promise((done) => {
        child.once('exit', () => done());
        child.stdin.end();
      }),
  };
}

export async function serverBenchmarks(): Promise<ServerBenchmark[]> {
  const heavy = generateWeb({ compartments: 400, seed: 400, density: 0.2, fleets: 4 });
  const catchEntry = heavy.exports.find((e) => e.fleet !== undefined)!;
  const option = { name: 'cut', adjustments: [{ type: 'scale-catch', fleet: catchEntry.fleet, compartment: catchEntry.from, percent: -20 }] };
  const server = await startServer();
  const { port } = server;
  try {
    // warm both pools, so that worker start-up is not counted
    await timedRequest(port, 'POST', '/api/analyses', JSON.stringify(cone));
    await timedRequest(port, 'POST', '/api/options/run', JSON.stringify({ web: cone, option: { name: 'x', adjustments: [], uncertainty: { draws: 50, cv: 0.1, seed: 1 } } }));

    const abandon = new AbortController();
    const ignoreAbort = (promise: Promise<Timed>) => promise.catch(() => undefined);
    const analysis = timedRequest(port, 'POST', '/api/analyses?tables=all', JSON.stringify(heavy));
    const run = timedRequest(port, 'POST', '/api/options/run?tables=all', JSON.stringify({ web: heavy, option }));
    const others = [
      timedRequest(port, 'POST', '/api/options/sensitivity', JSON.stringify({ web: heavy }), {}, abandon.signal),
      timedRequest(port, 'POST', '/api/options/run', JSON.stringify({ web: heavy, option: { ...option, uncertainty: { draws: 5000, cv: 0.1, seed: 1 } } }), { accept: 'application/x-ndjson' }, abandon.signal),
      timedRequest(port, 'POST', '/api/balancing', JSON.stringify({ web: heavy, method: 'least-change' }), {}, abandon.signal),
    ].map(ignoreAbort);

    let done = false;
    const finished = Promise.all([analysis, run]).finally(() => (done = true));
    const deadline = performance.now() + 60_000;
    const probes: number[] = [];
    while (!done && performance.now() < deadline) {
      probes.push((await timedRequest(port, 'GET', '/api/health')).ms);
      await new Promise((resolve) => setTimeout(resolve, 25));
    }
    const [analysed, ran] = await finished;
    abandon.abort();
    await Promise.all(others);
    probes.sort((a, b) => a - b);
    const flows = `${heavy.flows.length.toLocaleString('en')} flows`;
    return [
      { name: `/api/health under the heaviest allowed requests, slowest of ${probes.length} answers`, ms: probes.at(-1) ?? NaN, limitMs: 100 },
      { name: '/api/health under the heaviest allowed requests, median', ms: probes[Math.floor(probes.length / 2)] ?? NaN },
      { name: `analysis over HTTP, every table, 400 compartments, ${flows} (${(analysed.bytes / 1e6).toFixed(0)} MB, under load)`, ms: analysed.ms },
      { name: `option run over HTTP, every table, 400 compartments (${(ran.bytes / 1e6).toFixed(0)} MB, under load)`, ms: ran.ms },
    ];
  } finally {
    await server.stop();
  }
}
