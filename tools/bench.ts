import { analyze, analyzeWeb, countSimpleCycles, createNetwork, parseWeb } from '@seinework/network-analysis';
import { generateWeb } from '../libs/network-analysis/src/testing/generated-web';
import { apiBenchmarks } from './bench-api';
import { harvestBenchmarks } from './bench-harvest';
import { serverBenchmarks } from './bench-server';
import { readJsonFile, runCommand } from './cli';

/**
 * npm run bench                      — table of engine timings on generated webs, with targets
 * npm run --silent bench -- --json W — { "analyzeMs", "analyzeWithoutCyclesMs" }: medians of the full analysis of web W, and of it without cycle enumeration
 * Medians of repeated in-process runs after a warm-up; speed is measured here, never in unit tests.
 */

function medianMs(run: () => unknown, repeats: number): number {
  run();
  const times: number[] = [];
  for (let k = 0; k < repeats; k++) {
    const start = performance.now();
    run();
    times.push(performance.now() - start);
  }
  times.sort((a, b) => a - b);
  return times[Math.floor(times.length / 2)];
}

interface Row {
  readonly name: string;
  readonly result: string;
  readonly target: string;
  /** Whether the target is met; undefined where there is none. */
  readonly met?: boolean;
}

const underMs = (name: string, ms: number, limitMs?: number): Row => ({
  name,
  result: `${ms.toFixed(2)} ms`,
  target: limitMs === undefined ? '' : `< ${limitMs} ms`,
  met: limitMs === undefined ? undefined : ms < limitMs,
});

function engineRows(): Row[] {
  const rows: Row[] = [];
  for (const n of [10, 50, 100, 200, 400]) {
    const network = createNetwork(generateWeb({ compartments: n, seed: n, density: 0.2 }));
    const ms = medianMs(() => analyze(network, { cycles: false }), n >= 200 ? 5 : 21);
    rows.push(underMs(`analysis without cycles, ${n} compartments`, ms, n === 100 ? 20 : n === 400 ? 1000 : undefined));
  }
  const dense = createNetwork(generateWeb({ compartments: 14, seed: 7, density: 0.9 }));
  let found = 0;
  const ms = medianMs(() => {
    found = countSimpleCycles(dense, { maxCycles: 2_000_000, maxMilliseconds: 60_000 }).count;
  }, 3);
  const perSecond = (found / ms) * 1000;
  rows.push({
    name: `simple cycles, dense 14-compartment web (${found} cycles)`,
    result: `${Math.round(perSecond).toLocaleString('en')} cycles/s`,
    target: '≥ 1,000,000 cycles/s',
    met: perSecond >= 1_000_000,
  });
  return rows;
}

function printTable(rows: readonly Row[]): void {
  const width = Math.max(...rows.map((r) => r.name.length));
  const resultWidth = Math.max(...rows.map((r) => r.result.length));
  console.log(`${'benchmark'.padEnd(width)}  ${'median'.padStart(resultWidth)}  target`);
  const targetWidth = Math.max(...rows.map((r) => r.target.length));
  for (const row of rows) {
    const verdict = row.met === undefined ? '' : row.met ? 'met' : 'MISSED';
    console.log(`${row.name.padEnd(width)}  ${row.result.padStart(resultWidth)}  ${row.target.padEnd(targetWidth)}  ${verdict}`.trimEnd());
  }
  const missed = rows.filter((r) => r.met === false).length;
  console.log(missed === 0 ? '\nevery target met' : `\n${missed} target(s) missed`);
}

if (process.argv[2] === '--json') {
  await runCommand('bench', () => {
    const web = parseWeb(readJsonFile(process.argv[3], 'web'));
    // the engine's speed targets are stated without cycle enumeration, whose cost grows with the cycles a web has
    return { analyzeMs: medianMs(() => analyzeWeb(web), 11), analyzeWithoutCyclesMs: medianMs(() => analyzeWeb(web, { cycles: false }), 11) };
  });
} else {
  const harvest = await harvestBenchmarks();
  const api = await apiBenchmarks();
  const server = await serverBenchmarks();
  printTable([
    ...engineRows(),
    ...harvest.map((h) => underMs(h.name, h.medianMs, h.limitMs)),
    ...api.map((a) =>
      a.unit === 'req/s'
        ? { name: a.name, result: `${Math.round(a.value).toLocaleString('en')} req/s`, target: '' }
        : { ...underMs(a.failed ? `${a.name} (${a.failed} not 2xx)` : a.name, a.value, a.limitMs), ...(a.failed ? { met: false } : {}) },
    ),
    ...server.map((s) => underMs(s.name, s.ms, s.limitMs)),
  ]);
}
