import { describeIssues } from './issues';
import { TEXT_LIMITS, webSchema, type Web } from './web';

/** WEB.json shape checks on careless and hostile text and numbers: the messages a user reads. */

function web(): Web {
  return {
    name: 'Two boxes',
    unit: 'g C m-2 y-1',
    compartments: [
      { id: 'a', name: 'Algae', kind: 'producer' },
      { id: 'b', name: 'Bream', kind: 'consumer' },
    ],
    flows: [{ from: 'a', to: 'b', value: 10 }],
    imports: [{ to: 'a', value: 30 }],
    exports: [{ from: 'b', value: 2, fleet: 'nets', price: 100 }],
    respiration: [
      { from: 'a', value: 20 },
      { from: 'b', value: 8 },
    ],
  };
}

/** The problems of a web changed by `change`, or [] when it is accepted. */
function problems(change: (w: Web) => void): string[] {
  const w = web();
  change(w);
  const parsed = webSchema.safeParse(w);
  return parsed.success ? [] : describeIssues(parsed.error);
}

/** As JSON text would arrive: `1e309` parses to Infinity. */
function problemsOfJson(text: string): string[] {
  const parsed = webSchema.safeParse(JSON.parse(text));
  return parsed.success ? [] : describeIssues(parsed.error);
}

describe('WEB.json text fields', () => {
  it('accepts the plain web, and names with spaces, accents and other scripts', () => {
    expect(problems(() => {})).toEqual([]);
    expect(problems((w) => (w.compartments[0].name = 'Diatomées — côte nord, 北'))).toEqual([]);
  });

  it.each([
    ['NUL', '\u0000', 'U+0000'],
    ['a tab', '\t', 'U+0009'],
    ['a line break', '\n', 'U+000A'],
    ['escape', '\u001b', 'U+001B'],
    ['DEL', '\u007f', 'U+007F'],
    ['a C1 control', '\u0085', 'U+0085'],
  ])('refuses %s in ids, names, fleets and units, naming the character and where it is', (_, char, code) => {
    const at = `must not contain control characters (${code} at position 2)`;
    expect(problems((w) => (w.compartments[1].id = `b${char}x`))).toContain(`compartments[1].id: id ${at}`);
    expect(problems((w) => (w.flows[0].to = `b${char}x`))).toContain(`flows[0].to: id ${at}`);
    expect(problems((w) => (w.compartments[0].name = `A${char}lgae`))).toEqual([`compartments[0].name: name ${at}`]);
    expect(problems((w) => (w.exports[0].fleet = `n${char}ets`))).toEqual([`exports[0].fleet: fleet ${at}`]);
    expect(problems((w) => (w.unit = `g${char}C`))).toEqual([`unit: unit ${at}`]);
    expect(problems((w) => (w.name = `T${char}wo`))).toEqual([`name: name ${at}`]);
  });

  it.each(['\u200e', '\u200f', '\u202a', '\u202b', '\u202c', '\u202d', '\u202e', '\u2066', '\u2067', '\u2068', '\u2069', '\u061c'])(
    'refuses the bidirectional formatting character %j',
    (char) => {
      const code = `U+${char.codePointAt(0)!.toString(16).toUpperCase().padStart(4, '0')}`;
      const at = `must not contain bidirectional formatting characters (${code} at position 4)`;
      expect(problems((w) => (w.compartments[0].name = `Alg${char}ae`))).toEqual([`compartments[0].name: name ${at}`]);
      expect(problems((w) => (w.exports[0].fleet = `net${char}s`))).toEqual([`exports[0].fleet: fleet ${at}`]);
      expect(problems((w) => (w.respiration[1].from = `bbb${char}`))).toEqual([`respiration[1].from: id ${at}`]);
    },
  );

  it('bounds names and units at 200 characters, ids and fleets at 100, counting characters rather than UTF-16 units', () => {
    expect(TEXT_LIMITS).toEqual({ name: 200, id: 100 });
    expect(problems((w) => (w.name = 'n'.repeat(200)))).toEqual([]);
    expect(problems((w) => (w.name = 'n'.repeat(201)))).toEqual(['name: name must be at most 200 characters']);
    expect(problems((w) => (w.unit = 'u'.repeat(201)))).toEqual(['unit: unit must be at most 200 characters']);
    expect(problems((w) => (w.compartments[0].name = '🐟'.repeat(200)))).toEqual([]);
    expect(problems((w) => (w.compartments[0].name = '🐟'.repeat(201)))).toEqual(['compartments[0].name: name must be at most 200 characters']);
    const id = 'i'.repeat(100);
    expect(problems((w) => {
      w.compartments[1].id = id;
      w.flows[0].to = id;
      w.exports[0].from = id;
      w.respiration[1].from = id;
    })).toEqual([]);
    expect(problems((w) => (w.compartments[1].id = `${id}i`))).toEqual(['compartments[1].id: id must be at most 100 characters']);
    expect(problems((w) => (w.exports[0].fleet = 'f'.repeat(101)))).toEqual(['exports[0].fleet: fleet must be at most 100 characters']);
  });

  it('refuses a very long name with the length message alone (no scan of its characters)', () => {
    const huge = `\u0000${'x'.repeat(20_000_000)}`;
    expect(problems((w) => (w.name = huge))).toEqual(['name: name must be at most 200 characters']);
  });

  it('takes __proto__ as an id like any other, and refuses it as a key, without touching Object.prototype', () => {
    const before = Object.getOwnPropertyNames(Object.prototype).join();
    const w = web();
    w.compartments[1].id = '__proto__';
    w.flows[0].to = '__proto__';
    w.exports[0].from = '__proto__';
    w.respiration[1].from = '__proto__';
    expect(webSchema.parse(w).compartments[1].id).toBe('__proto__');
    const text = JSON.stringify(web()).replace('"kind":"producer"', '"kind":"producer","__proto__":{"polluted":true}');
    expect(problemsOfJson(text)).toEqual(['compartments[0]: Unrecognized key: "__proto__"']);
    expect(({} as Record<string, unknown>)['polluted']).toBeUndefined();
    expect(Object.getOwnPropertyNames(Object.prototype).join()).toBe(before);
  });

  it('trims ids and fleets and refuses what is left empty', () => {
    const w = web();
    w.compartments[0].id = '  a ';
    w.exports[0].fleet = ' nets';
    const parsed = webSchema.parse(w);
    expect(parsed.compartments[0].id).toBe('a');
    expect(parsed.exports[0].fleet).toBe('nets');
    expect(problems((v) => (v.exports[0].fleet = '   '))).toEqual(['exports[0].fleet: fleet must not be empty']);
  });
});

describe('WEB.json numbers', () => {
  it('calls a number beyond ±1.8e308 (JSON 1e309, read as Infinity) too large, wherever it is', () => {
    const text = JSON.stringify(web());
    expect(problemsOfJson(text.replace('"value":10', '"value":1e309'))).toEqual(['flows[0].value: flow value is too large (beyond ±1.8e308)']);
    expect(problemsOfJson(text.replace('"value":30', '"value":-1e309'))).toEqual(['imports[0].value: import value is too large (beyond ±1.8e308)']);
    expect(problemsOfJson(text.replace('"price":100', '"price":1e400'))).toEqual(['exports[0].price: price is too large (beyond ±1.8e308)']);
    expect(problemsOfJson(text.replace('"kind":"producer"', '"kind":"producer","biomass":2e308'))).toEqual(['compartments[0].biomass: biomass is too large (beyond ±1.8e308)']);
    expect(problemsOfJson(text.replace('"value":10', '"value":10,"cv":1e309'))).toEqual(['flows[0].cv: cv is too large (beyond ±1.8e308)']);
    expect(problemsOfJson(text.replace('"value":10', '"value":"10"'))).toEqual(['flows[0].value: flow value must be a number']);
  });

  it('bounds a flow cv to 0 (held exactly) or between 0.000001 and 10', () => {
    const withCv = (cv: number) => problems((w) => (w.flows[0].cv = cv));
    for (const cv of [0, 1e-6, 0.25, 2, 10]) expect(withCv(cv)).toEqual([]);
    for (const cv of [1e154, 1e8, 10.000001]) expect(withCv(cv)).toEqual(['flows[0].cv: cv must be at most 10']);
    for (const cv of [1e-300, 5e-324, 9.9e-7]) expect(withCv(cv)).toEqual(['flows[0].cv: cv must be 0 (the flow held exactly) or at least 0.000001']);
    expect(withCv(-0.1)).toEqual(['flows[0].cv: cv must not be negative']);
    expect(problems((w) => (w.respiration[0].cv = 1e6))).toEqual(['respiration[0].cv: cv must be at most 10']);
  });
});
