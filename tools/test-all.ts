import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { withPostgresServer } from './postgres-server';

/**
 * `npm test`: every suite of the project, each run even when an earlier one failed, then one plain
 * closing line `N passed, N failed` summing them all (CI reads it). A check that is not a test
 * runner (typecheck, production build) counts as one test.
 */

interface Tally {
  passed: number;
  failed: number;
}

const bin = (name: string) => join('node_modules', '.bin', name);
const reportDir = mkdtempSync(join(tmpdir(), 'seinework-tests-'));

function run(label: string, command: string, args: string[], env: NodeJS.ProcessEnv = {}): { ok: boolean; output: string } {
  console.log(`\n▶ ${label}`);
  const result = spawnSync(command, args, { encoding: 'utf8', stdio: ['ignore', 'pipe', 'pipe'], env: { ...process.env, FORCE_COLOR: '0', NO_COLOR: '1', ...env } });
  const output = `${result.stdout ?? ''}${result.stderr ?? ''}`;
  process.stdout.write(output);
  return { ok: result.status === 0, output };
}

function check(label: string, command: string, args: string[]): Tally {
  const { ok } = run(label, command, args);
  return ok ? { passed: 1, failed: 0 } : { passed: 0, failed: 1 };
}

function vitestSuite(label: string, config: string, paths: string[] = [], env: NodeJS.ProcessEnv = {}): Tally {
  const report = join(reportDir, `${config}${paths.length > 0 ? `-${paths.join('-').replace(/\W+/g, '_')}` : ''}.json`);
  const { ok } = run(label, bin('vitest'), ['run', '--config', config, ...paths, '--reporter=default', '--reporter=json', `--outputFile.json=${report}`], env);
  try {
    const json = JSON.parse(readFileSync(report, 'utf8')) as { numPassedTests: number; numFailedTests: number; numTotalTestSuites: number; success: boolean };
    // a file that fails to load has no failed test of its own: count the run as one more failure
    return { passed: json.numPassedTests, failed: json.numFailedTests + (ok || json.numFailedTests > 0 ? 0 : 1) };
  } catch {
    return { passed: 0, failed: 1 };
  }
}

/** The server's tests again, each test file's database on a real PostgreSQL 15 server started for the run. */
function postgresSuite(label: string): Tally {
  try {
    // --throw-deprecation: pg warns (and pg 9 refuses) when one connection, a transaction's, gets overlapping queries
    return withPostgresServer(55432, (url) => vitestSuite(label, 'vitest.config.ts', ['apps/server'], { TEST_DATABASE_URL: url, NODE_OPTIONS: '--throw-deprecation' }));
  } catch (error) {
    console.log(`\n▶ ${label}\n${(error as Error).message}`);
    return { passed: 0, failed: 1 };
  }
}

function angularSuite(): Tally {
  const { ok, output } = run('browser app tests (ng test)', bin('ng'), ['test', 'web', '--watch=false']);
  // the Angular builder colours its summary whatever the environment says: read it without escapes
  const plain = output.replace(/\u001b\[[0-9;]*m/g, '');
  const line = plain.split('\n').find((l) => /^\s*Tests\s/.test(l)) ?? '';
  const passed = Number(/(\d+) passed/.exec(line)?.[1] ?? 0);
  const failed = Number(/(\d+) failed/.exec(line)?.[1] ?? 0);
  // a run that failed without a failed test, or whose tally cannot be read, counts as one failure
  const unexplained = (!ok && failed === 0) || passed + failed === 0;
  return { passed, failed: failed + (unexplained ? 1 : 0) };
}

/** @playwright/test in Debian's Chromium against the real server (playwright.config.ts), counted from its JSON report. */
function playwrightSuite(label: string): Tally {
  const report = join(reportDir, 'e2e.json');
  console.log(`\n▶ ${label}`);
  const result = spawnSync(bin('playwright'), ['test'], {
    encoding: 'utf8',
    stdio: ['ignore', 'pipe', 'pipe'],
    env: { ...process.env, FORCE_COLOR: '0', NO_COLOR: '1', PLAYWRIGHT_JSON_OUTPUT_FILE: report },
  });
  process.stdout.write(`${result.stdout ?? ''}${result.stderr ?? ''}`);
  try {
    const json = JSON.parse(readFileSync(report, 'utf8')) as { stats: { expected: number; unexpected: number; flaky: number }; errors: unknown[] };
    // a global setup that failed, or a file that did not load, shows up in errors with no failed test
    const unexplained = result.status !== 0 && json.stats.unexpected + json.stats.flaky === 0 ? 1 : 0;
    return { passed: json.stats.expected, failed: json.stats.unexpected + json.stats.flaky + Math.max(unexplained, json.errors.length > 0 ? 1 : 0) };
  } catch {
    return { passed: 0, failed: 1 };
  }
}

const tallies: Tally[] = [
  check('typecheck (libs, server, tools, tests)', bin('tsc'), ['-p', 'tsconfig.json', '--noEmit']),
  check('production build of the browser app (template typecheck)', bin('ng'), ['build', 'web']),
  vitestSuite('engine, CLI and server tests (vitest)', 'vitest.config.ts'),
  postgresSuite('server API tests on PostgreSQL'),
  angularSuite(),
  // after the production build above: the built app, the real server and Debian's Chromium
  playwrightSuite('end-to-end in Chromium (@playwright/test, real server on a fresh data folder)'),
];
const passed = tallies.reduce((s, t) => s + t.passed, 0);
const failed = tallies.reduce((s, t) => s + t.failed, 0);
console.log(`\n${passed} passed, ${failed} failed`);
process.exitCode = failed > 0 ? 1 : 0;
