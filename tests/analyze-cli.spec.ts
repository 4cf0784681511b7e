import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { generateWeb } from '../libs/network-analysis/src/testing/generated-web';
import cone from './fixtures/cone-spring.json';
import { repositoryRoot, runTool, temporaryFile } from './support/run-command';

/** The `analyze` command-line contract of METHODS.md §11. */

const SCALARS = [
  'tst', 'totalSystemThroughflow', 'developmentCapacity', 'ascendency', 'overhead', 'averageMutualInformation',
  'flowDiversity', 'relativeAscendency', 'robustness', 'effectiveRoles', 'effectiveConnectance', 'finnCyclingIndex',
  'totalCatch', 'meanTrophicLevelOfCatch', 'primaryProductionRequired', 'primaryProductionRequiredShare',
];
const MAPS = [
  'trophicLevels', 'cycledThroughflow', 'primaryProductionIntensity', 'totalDependency', 'allPathwayDependency',
  'mixedTrophicImpact', 'robustnessGradient', 'fleets', 'trophicLadder', 'cycles',
];

describe('npm run analyze', () => {
  it('prints one JSON document with every key of the contract (through npm itself)', () => {
    const result = spawnSync('npm', ['run', '--silent', 'analyze', '--', 'tests/fixtures/cone-spring.json'], {
      cwd: repositoryRoot,
      encoding: 'utf8',
    });
    expect(result.stderr).toBe('');
    expect(result.status).toBe(0);
    const analysis = JSON.parse(result.stdout);
    for (const key of [...SCALARS, ...MAPS]) expect(analysis).toHaveProperty(key);
    // Finn 1976, J. theor. Biol. 56:363-380: T.. = 42,445 and Σ T_j = 30,626 for Cone Spring
    expect(analysis.tst).toBeCloseTo(42445, 6);
    expect(analysis.totalSystemThroughflow).toBeCloseTo(30626, 6);
    expect(Object.keys(analysis.trophicLevels)).toEqual(cone.compartments.map((c) => c.id));
    expect(analysis.totalDependency.plants.carnivores).toBeCloseTo(0.93327, 5);
    expect(Object.keys(analysis.trophicLadder)).toEqual(expect.arrayContaining(['levels', 'shares', 'meanEfficiency']));
    expect(Object.keys(analysis.cycles)).toEqual(expect.arrayContaining(['count', 'capped', 'nexuses', 'cycledFlow', 'acyclicFlow']));
  });

  it('keys fleets by name and puts them among the mixed-trophic-impact ids', () => {
    const web = structuredClone(cone) as typeof cone & { exports: { from: string; value: number; fleet?: string; price?: number }[] };
    web.exports = web.exports.map((e) => (e.from === 'bacteria' ? { ...e, fleet: 'Sieve' } : e));
    const result = runTool('analyze.ts', [temporaryFile('web.json', web)]);
    expect(result.status).toBe(0);
    const analysis = JSON.parse(result.stdout);
    expect(analysis.fleets.Sieve.catch).toBe(255);
    expect(analysis.mixedTrophicImpact.Sieve.bacteria).toBeLessThan(0);
    expect(analysis.totalCatch).toBe(255);
  });

  const badInputs: [string, string | object, RegExp][] = [
    ['text that is not JSON', '{ "name": ', /not valid JSON/],
    ['a value of the wrong shape', { name: 'x' }, /unit/],
    ['an unknown compartment in a flow', { ...cone, flows: [...cone.flows, { from: 'plants', to: 'fish', value: 1 }] }, /flows\[8\]: unknown compartment "fish"/],
    ['a duplicate compartment id', { ...cone, compartments: [...cone.compartments, cone.compartments[0]] }, /duplicate compartment id "plants"/],
    ['a negative flow', { ...cone, flows: [{ from: 'plants', to: 'detritus', value: -3 }] }, /flows\[0\]\.value: flow value must not be negative/],
    ['a non-numeric value', { ...cone, imports: [{ to: 'plants', value: 'lots' }] }, /imports\[0\]\.value/],
    ['an unknown kind', { ...cone, compartments: [{ id: 'plants', name: 'P', kind: 'fungus' }] }, /kind must be one of/],
    ['an unknown key', { ...cone, colour: 'teal' }, /colour/],
    ['a web that carries no flow', { ...cone, flows: [], imports: [], exports: [], respiration: [] }, /carries no flow/],
    ['a non-finite value', '{"name":"x","unit":"u","compartments":[{"id":"a","name":"A","kind":"producer"}],"flows":[],"imports":[{"to":"a","value":1e999}],"exports":[],"respiration":[]}', /imports\[0\]\.value/],
    ['a key given twice', JSON.stringify(cone).replace('"value":', '"value":1,"value":'), /web file .*: flows\[0\]: duplicate key "value"/],
    ['an unbalanced web', { ...cone, imports: [{ to: 'plants', value: 11000 }, cone.imports[1]] }, /"plants" is unbalanced.* — balance it with: npm run --silent balance -- WEB.json/],
  ];
  it.each(badInputs)('exits 2 with one line on stderr and nothing on stdout for %s', (_, content, message) => {
    const result = runTool('analyze.ts', [temporaryFile('web.json', content)]);
    expect(result.status).toBe(2);
    expect(result.stdout).toBe('');
    expect(result.stderr).toMatch(message);
    expect(result.stderr.trim().split('\n')).toHaveLength(1);
    expect(result.stderr).not.toMatch(/\n\s+at /);
  });

  it('lists the first 20 problems and counts the rest, however many there are', () => {
    const flows = Array.from({ length: 5000 }, (_, i) => ({ from: 'plants', to: `nowhere-${i}`, value: 1 }));
    const result = runTool('analyze.ts', [temporaryFile('web.json', { ...cone, flows })]);
    expect(result.status).toBe(2);
    expect(result.stderr.trim().split('\n')).toHaveLength(1);
    expect(result.stderr).toMatch(/flows\[19\]: unknown compartment "nowhere-19"; …and 4980 more problems\n$/);
    expect(result.stderr).not.toMatch(/nowhere-20"/);
  });

  it('ends quietly when its reader stops early (piped into head)', () => {
    // a document well past a pipe's buffer, so that the write meets the closed pipe
    const web = temporaryFile('web.json', generateWeb({ compartments: 60, seed: 6, density: 0.3 }));
    const errors = temporaryFile('stderr.txt', '');
    const result = spawnSync('bash', ['-c', `"${repositoryRoot}/node_modules/.bin/tsx" tools/analyze.ts "${web}" 2>"${errors}" | head -c 100 >/dev/null; echo "\${PIPESTATUS[0]}"`], {
      cwd: repositoryRoot,
      encoding: 'utf8',
    });
    expect(readFileSync(errors, 'utf8')).toBe('');
    expect(result.stdout.trim()).toBe('0');
  });

  it('exits 2 naming a missing file', () => {
    const result = runTool('analyze.ts', ['/nowhere/web.json']);
    expect(result.status).toBe(2);
    expect(result.stdout).toBe('');
    expect(result.stderr).toMatch(/web file not found: \/nowhere\/web.json/);
  });

  it('exits 2 for a closed loop with no exit, naming its compartments', () => {
    const web = {
      name: 'trap',
      unit: 'u',
      compartments: [
        { id: 'a', name: 'A', kind: 'producer' },
        { id: 'b', name: 'B', kind: 'consumer' },
        { id: 'c', name: 'C', kind: 'consumer' },
      ],
      flows: [
        { from: 'b', to: 'c', value: 4 },
        { from: 'c', to: 'b', value: 4 },
      ],
      imports: [{ to: 'a', value: 1 }],
      exports: [],
      respiration: [{ from: 'a', value: 1 }],
    };
    const result = runTool('analyze.ts', [temporaryFile('web.json', web)]);
    expect(result.status).toBe(2);
    expect(result.stderr).toMatch(/"b", "c"/);
  });
});
