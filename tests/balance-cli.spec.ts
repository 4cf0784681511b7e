import cone from './fixtures/cone-spring.json';
import { runTool, temporaryFile } from './support/run-command';

/** `npm run balance` — the offer to balance an unbalanced web (METHODS.md §0 and §7). */

const unbalanced = { ...cone, imports: cone.imports.map((i) => (i.to === 'plants' ? { ...i, value: i.value + 50 } : i)) };

function imbalance(web: typeof cone, id: string): number {
  const sum = (values: { value: number }[]) => values.reduce((s, v) => s + v.value, 0);
  const inputs = sum(web.imports.filter((i) => i.to === id)) + sum(web.flows.filter((f) => f.to === id));
  const outputs = sum(web.exports.filter((e) => e.from === id)) + sum(web.respiration.filter((r) => r.from === id)) + sum(web.flows.filter((f) => f.from === id));
  return Math.abs(inputs - outputs) / Math.max(inputs, outputs);
}

describe('npm run balance', () => {
  it.each(['input', 'output', 'average', 'least-change'])('balances a web with the %s method, which analyze then accepts', (method) => {
    const file = temporaryFile('web.json', unbalanced);
    expect(runTool('analyze.ts', [file]).status).toBe(2);
    const result = runTool('balance.ts', [file, method]);
    expect(result.stderr).toBe('');
    expect(result.status).toBe(0);
    const balanced = JSON.parse(result.stdout) as typeof cone;
    for (const c of balanced.compartments) expect(imbalance(balanced, c.id)).toBeLessThan(1e-6);
    expect(runTool('analyze.ts', [temporaryFile('balanced.json', balanced)]).status).toBe(0);
  });

  it('returns a balanced web unchanged', () => {
    const result = runTool('balance.ts', [temporaryFile('web.json', cone)]);
    expect(result.status).toBe(0);
    const web = JSON.parse(result.stdout) as typeof cone;
    expect(web.flows).toEqual(cone.flows);
    expect(web.respiration).toEqual(cone.respiration);
  });

  it('exits 2 with one line for an unknown method', () => {
    const result = runTool('balance.ts', [temporaryFile('web.json', cone), 'guess']);
    expect(result.status).toBe(2);
    expect(result.stdout).toBe('');
    expect(result.stderr.trim().split('\n')).toEqual(['balance: unknown balancing method "guess" (methods: input, output, average, least-change)']);
  });
});
