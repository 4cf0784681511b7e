import demo from '../seeds/brannock-bay.json';
import cone from './fixtures/cone-spring.json';
import { runTool, temporaryFile } from './support/run-command';

/** `npm run sensitivity`: the harvest-sensitivity table of every catch of a web. */
describe('npm run sensitivity', () => {
  it.each(['bottom-up', 'least-change'])('tabulates every catch of the demo bay under %s, sorted toward the fitness peak and by catch value', (response) => {
    const result = runTool('sensitivity.ts', ['seeds/brannock-bay.json', response]);
    expect(result.stderr).toBe('');
    expect(result.status).toBe(0);
    const table = JSON.parse(result.stdout);
    expect(table.response).toBe(response);
    expect(table.rows).toHaveLength(demo.exports.filter((e) => 'fleet' in e).length);
    const toward = table.byRobustness.map((row: { distanceFromPeakChange: number }) => row.distanceFromPeakChange);
    expect(toward).toEqual([...toward].sort((a, b) => a - b));
    const value = table.byCatchValue.map((row: { catchValueChange: number }) => row.catchValueChange);
    expect(value).toEqual([...value].sort((a, b) => b - a));
    // +1 % of a catch adds 1 % of it to the total catch, whatever the response
    for (const row of table.rows) expect(row.perPercent.totalCatch).toBeCloseTo(row.catch / 100, 12);
  });

  it('gives an empty table for a web without catches', () => {
    const result = runTool('sensitivity.ts', [temporaryFile('web.json', cone)]);
    expect(result.status).toBe(0);
    expect(JSON.parse(result.stdout).rows).toEqual([]);
  });

  it('exits 2 with one line for an unknown response rule', () => {
    const result = runTool('sensitivity.ts', ['seeds/brannock-bay.json', 'top-down']);
    expect(result.status).toBe(2);
    expect(result.stdout).toBe('');
    expect(result.stderr.trim().split('\n')).toEqual(['sensitivity: unknown response rule "top-down" (bottom-up or least-change)']);
  });
});
