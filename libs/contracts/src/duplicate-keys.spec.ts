import fc from 'fast-check';
import { findDuplicateKey } from './duplicate-keys';

describe('findDuplicateKey', () => {
  it('names the first repeated key with its JSON path', () => {
    expect(findDuplicateKey('{"flows":[{"from":"a","to":"b","value":1},{"from":"a","value":2,"value":3}]}')).toBe('flows[1]: duplicate key "value"');
    expect(findDuplicateKey('{"name":"x","name":"y"}')).toBe('duplicate key "name"');
    expect(findDuplicateKey('{"web":{"compartments":[],"compartments":[]}}')).toBe('web: duplicate key "compartments"');
  });

  it('compares keys as JSON.parse reads them, escapes included, and ignores quotes and braces inside strings', () => {
    expect(findDuplicateKey('{"a":1,"\\u0061":2}')).toBe('duplicate key "a"');
    expect(findDuplicateKey('{"a":"x\\"}{,\\\\","b":"a","c":{"a":1}}')).toBeNull();
    expect(findDuplicateKey('{"a\\\\":1,"a":2}')).toBeNull();
  });

  it('finds nothing in any document JSON.stringify writes, and finds a key written twice anywhere', () => {
    fc.assert(
      fc.property(fc.jsonValue({ maxDepth: 4 }), (value) => {
        expect(findDuplicateKey(JSON.stringify(value))).toBeNull();
        expect(findDuplicateKey(JSON.stringify(value, null, 2))).toBeNull();
      }),
    );
    fc.assert(
      fc.property(fc.jsonValue({ maxDepth: 3 }), fc.string(), fc.jsonValue({ maxDepth: 2 }), (inner, key, value) => {
        const member = `${JSON.stringify(key)}:${JSON.stringify(value)}`;
        const text = `{"outer":[${JSON.stringify(inner)},{${member},${member}}]}`;
        expect(findDuplicateKey(text)).toBe(`outer[1]: duplicate key ${JSON.stringify(key)}`);
      }),
    );
  });

  it('reads a large document in one pass (many flows, no duplicate)', () => {
    const flows = Array.from({ length: 100_000 }, (_, i) => ({ from: `c${i}`, to: `c${i + 1}`, value: i }));
    expect(findDuplicateKey(JSON.stringify({ flows }))).toBeNull();
  });
});
