import { runTool } from './support/run-command';

/** `npm run --silent bench -- --json WEB.json` (issue contracts): one JSON document, nothing else. Timings themselves are not asserted. */
describe('npm run bench -- --json', () => {
  it('prints { analyzeMs, analyzeWithoutCyclesMs } for a given web', () => {
    const result = runTool('bench.ts', ['--json', 'tests/fixtures/cone-spring.json']);
    expect(result.stderr).toBe('');
    expect(result.status).toBe(0);
    const output = JSON.parse(result.stdout);
    expect(Object.keys(output)).toEqual(['analyzeMs', 'analyzeWithoutCyclesMs']);
    expect(output.analyzeMs).toBeGreaterThan(0);
    expect(output.analyzeWithoutCyclesMs).toBeGreaterThan(0);
  });

  it('exits 2 with one line for a missing web', () => {
    const result = runTool('bench.ts', ['--json', 'no-such-web.json']);
    expect(result.status).toBe(2);
    expect(result.stdout).toBe('');
    expect(result.stderr.trim().split('\n')).toHaveLength(1);
    expect(result.stderr).toMatch(/no-such-web\.json/);
  });
});
