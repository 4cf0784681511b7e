import type { Web } from '@seinework/contracts';
import cone from './fixtures/cone-spring.json';
import { runTool, temporaryFile } from './support/run-command';

/** The `scenario` command-line contract of METHODS.md §11. */

const fished = (): Web => {
  const web = structuredClone(cone) as Web;
  web.exports = web.exports.map((e) => (e.from === 'bacteria' ? { ...e, fleet: 'sieve' } : e));
  return web;
};
const run = (web: unknown, option: unknown) => runTool('scenario.ts', [temporaryFile('web.json', web), temporaryFile('option.json', option)]);

describe('npm run scenario', () => {
  it('prints { baseline, option, difference, web } for an option (Cone Spring, new detritivore fishery at 100)', () => {
    const result = run(cone, { name: 'net', adjustments: [{ type: 'open-fishery', fleet: 'net', compartment: 'detritivores', amount: 100 }] });
    expect(result.stderr).toBe('');
    expect(result.status).toBe(0);
    const output = JSON.parse(result.stdout);
    expect(Object.keys(output)).toEqual(['baseline', 'option', 'difference', 'web']);
    expect(output.baseline.tst).toBeCloseTo(42445, 6);
    expect(output.option.fleets.net.catch).toBe(100);
    expect(output.difference.totalCatch).toBe(100);
    expect(output.difference.tst).toBeCloseTo(output.option.tst - output.baseline.tst, 9);
    // regression target computed from the published table (Tilly 1968 via Finn 1976)
    expect(output.web.flows.find((f: { from: string; to: string }) => f.from === 'detritivores' && f.to === 'carnivores').value).toBeCloseTo(353.881, 3);
    expect(output.option.cycles).not.toBeNull();
  });

  it('returns the input web unchanged for an option with no adjustments', () => {
    const web = fished();
    const result = run(web, { name: 'as is', response: 'least-change', adjustments: [] });
    expect(result.status).toBe(0);
    const output = JSON.parse(result.stdout);
    expect(output.web).toEqual(web);
    expect(output.difference.robustness).toBe(0);
  });

  it('adds uncertainty when the option asks for it', () => {
    const result = run(fished(), { name: 'cut', adjustments: [{ type: 'scale-catch', fleet: 'sieve', compartment: 'bacteria', percent: -50 }], uncertainty: { draws: 20, cv: 0.1, seed: 4 } });
    expect(result.status).toBe(0);
    const output = JSON.parse(result.stdout);
    expect(output.uncertainty.draws).toBe(20);
    expect(output.uncertainty.indicators.totalCatch.difference.median).toBeLessThan(0);
    expect(Object.keys(output.uncertainty.indicators.robustness)).toEqual(['baseline', 'option', 'difference', 'shareDifferencePositive', 'robust']);
  });

  const badInputs: [string, () => [unknown, unknown], RegExp][] = [
    ['an unknown fleet', () => [fished(), { name: 'x', adjustments: [{ type: 'set-catch', fleet: 'trawl', compartment: 'bacteria', amount: 1 }] }], /adjustments\[0\] \(set-catch fleet "trawl" on "bacteria" to 1\): unknown fleet "trawl"/],
    ['a percentage below −100', () => [fished(), { name: 'x', adjustments: [{ type: 'scale-catch', fleet: 'sieve', compartment: 'bacteria', percent: -101 }] }], /adjustments\[0\]\.percent: percent must not be below -100/],
    ['a catch the web cannot supply', () => [fished(), { name: 'x', adjustments: [{ type: 'set-catch', fleet: 'sieve', compartment: 'bacteria', amount: 6000 }] }], /adjustments\[0\] \(set-catch fleet "sieve" on "bacteria" to 6000\): "bacteria" cannot supply a catch of 6000/],
    ['an option JSON that is not JSON', () => [fished(), '{ "name": '], /option file .* is not valid JSON/],
    ['a web JSON that is not JSON', () => ['[1, 2', { name: 'x', adjustments: [] }], /web file .* is not valid JSON/],
    ['an unbalanced web', () => [{ ...fished(), imports: [{ to: 'plants', value: 11000 }, cone.imports[1]] }, { name: 'x', adjustments: [] }], /"plants" is unbalanced/],
  ];
  it.each(badInputs)('exits 2 with one line on stderr and nothing on stdout for %s', (_, inputs, message) => {
    const [web, option] = inputs();
    const result = run(web, option);
    expect(result.status).toBe(2);
    expect(result.stdout).toBe('');
    expect(result.stderr).toMatch(message);
    expect(result.stderr.trim().split('\n')).toHaveLength(1);
  });

  it('exits 2 naming a missing file', () => {
    const result = runTool('scenario.ts', [temporaryFile('web.json', cone), '/nowhere/option.json']);
    expect(result.status).toBe(2);
    expect(result.stdout).toBe('');
    expect(result.stderr).toMatch(/option file not found: \/nowhere\/option.json/);
  });
});
