import { analyze, analyzeWeb, countSimpleCycles, createNetwork, parseWeb } from '@seinework/network-analysis';
import { generateWeb } from '../libs/network-analysis/src/testing/generated-web';
import { harvestBenchmarks } from './bench-harvest';
import { readJsonFile, runCommand } from './cli';

/**
 * npm run bench                      — table of engine timings on generated webs, with targets
 * npm run --silent bench -- --json W — { "analyzeMs": median } of the full analysis of web W
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
}

function engineRows(): Row[] {
  const rows: Row[] = [];
  for (const n of [10, 50, 100, 200, 400]) {
    const network = createNetwork(generateWeb({ compartments: n, seed: n, density: 0.2 }));
    const ms = medianMs(() => analyze(network, { cycles: false }), n >= 200 ? 5 : 21);
    const target = n === 100 ? '< 20 ms' : n === 400 ? '< 1000 ms' : '';
    rows.push({ name: `analysis without cycles, ${n} compartments`, result: `${ms.toFixed(2)} ms`, target });
  }
  const dense = createNetwork(generateWeb({ compartments: 14, seed: 7, density: 0.9 }));
  let found = 0;
  const ms = medianMs(() => {
    found = countSimpleCycles(dense, { maxCycles: 2_000_000, maxMilliseconds: 60_000 }).count;
  }, 3);
  rows.push({ name: `simple cycles, dense 14-compartment web (${found} cycles)`, result: `${Math.round((found / ms) * 1000).toLocaleString('en')} cycles/s`, target: '≥ 1,000,000 cycles/s' });
  return rows;
}

function printTable(rows: readonly Row[]): void {
  const width = Math.max(...rows.map((r) => r.name.length));
  const resultWidth = Math.max(...rows.map((r) => r.result.length));
  console.log(`${'benchmark'.padEnd(width)}  ${'median'.padStart(resultWidth)}  target`);
  for (const row of rows) console.log(`${row.name.padEnd(width)}  ${row.result.padStart(resultWidth)}  ${row.target}`);
}

if (process.argv[2] === '--json') {
  await runCommand('bench', () => {
    const web = parseWeb(readJsonFile(process.argv[3], 'web'));
    return { analyzeMs: medianMs(() => analyzeWeb(web), 11) };
  });
} else {
  const harvest = await harvestBenchmarks();
  printTable([
    ...engineRows(),
    ...harvest.map((h) => ({ name: h.name, result: `${h.medianMs.toFixed(2)} ms`, target: h.target })),
  ]);
}
