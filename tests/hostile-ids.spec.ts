import type { Web } from '@seinework/contracts';
import cone from './fixtures/cone-spring.json';
import { runTool, temporaryFile } from './support/run-command';

/**
 * The command-line tools on a web whose ids and fleets are names of Object.prototype members:
 * each prints its document with those keys (an id `__proto__` once made `analyze` exit 1 with an
 * internal error). The libraries' hostile-ids specs check every document row by row.
 */

/** Cone Spring (Finn 1976) with carnivores as `__proto__`, bacteria as `constructor`, and a fleet `toString` on `__proto__`. */
function hostileCone(): Web {
  const web = JSON.parse(JSON.stringify(cone).replaceAll('"carnivores"', '"__proto__"').replaceAll('"bacteria"', '"constructor"')) as Web;
  web.respiration = web.respiration.map((r) => (r.from === '__proto__' ? { ...r, value: 153 } : r));
  web.exports.push({ from: '__proto__', value: 50, fleet: 'toString' });
  return web;
}

const ownKeys = (value: object) => Object.keys(value);

describe('command-line tools on ids named like Object.prototype members', () => {
  it('analyze prints every map with the hostile keys', () => {
    const result = runTool('analyze.ts', [temporaryFile('web.json', hostileCone())]);
    expect(result.stderr).toBe('');
    expect(result.status).toBe(0);
    const document = JSON.parse(result.stdout);
    expect(ownKeys(document.trophicLevels)).toEqual(['plants', 'detritus', 'constructor', 'detritivores', '__proto__']);
    expect(ownKeys(document.robustnessGradient.detritivores)).toEqual(['detritus', '__proto__']);
    expect(ownKeys(document.robustnessGradient.__proto__)).toEqual(['detritus']);
    expect(ownKeys(document.fleets)).toEqual(['toString']);
    expect(ownKeys(document.mixedTrophicImpact)).toContain('toString');
  });

  it('scenario prints the run with the fleets of both sides in the difference', () => {
    const option = {
      name: 'hostile',
      adjustments: [
        { type: 'scale-catch', fleet: 'toString', compartment: '__proto__', percent: -20 },
        { type: 'open-fishery', fleet: 'hasOwnProperty', compartment: 'constructor', amount: 10 },
      ],
    };
    const result = runTool('scenario.ts', [temporaryFile('web.json', hostileCone()), temporaryFile('option.json', option)]);
    expect(result.stderr).toBe('');
    expect(result.status).toBe(0);
    const run = JSON.parse(result.stdout);
    expect(ownKeys(run.difference.fleets)).toEqual(['toString', 'hasOwnProperty']);
    expect(run.difference.fleets.hasOwnProperty.catch).toBe(10);
    expect(run.difference.fleets.toString.catch).toBeCloseTo(-10, 9);
    expect(ownKeys(run.difference.trophicLevels)).toContain('__proto__');
    expect(run.web.exports.at(-1)).toEqual({ from: 'constructor', value: 10, fleet: 'hasOwnProperty' });
  });
});
