import fc from 'fast-check';
import { FLOW_CV_LIMITS, type Web } from '@seinework/contracts';
import { readUpload } from './read-upload';
import { webToCsv } from './write-csv';
import { webToXlsx } from './write-xlsx';

/** Any web the engine accepts (fleets are named apart from compartments, as it asks) (balanced or not) comes back unchanged from our CSV and XLSX files. */

const char = fc.constantFrom(...'abcXYZ019 ,;"\'=+-@é–µ_/()'.split(''));
const text = fc
  .string({ unit: char, minLength: 1, maxLength: 10 })
  .map((s) => s.trim())
  .filter((s) => s.length > 0 && !s.startsWith("'"));
const amount = fc.double({ min: 0, max: 1e9, noNaN: true, noDefaultInfinity: true }).map((v) => (v === 0 ? 0 : v));
const optional = <T>(a: fc.Arbitrary<T>) => fc.option(a, { nil: undefined });
/** A flow's cv is 0 (held exactly) or within FLOW_CV_LIMITS. */
const cv = optional(fc.oneof(fc.constant(0), fc.double({ min: FLOW_CV_LIMITS.min, max: FLOW_CV_LIMITS.max, noNaN: true })));

const webArbitrary: fc.Arbitrary<{ web: Web; place: string; period: string }> = fc
  .uniqueArray(text, { minLength: 1, maxLength: 6 })
  .chain((ids) => {
    const id = fc.constantFrom(...ids);
    const strip = <T extends object>(o: T): T => Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) as T;
    return fc.record({
      web: fc.record({
        name: text,
        unit: text,
        areaKm2: optional(amount),
        tonnesPerUnit: optional(amount),
        compartments: fc.tuple(...ids.map((cid) => fc.record({ id: fc.constant(cid), name: text, kind: fc.constantFrom('producer', 'consumer', 'detritus'), biomass: optional(amount) }))),
        flows: fc.uniqueArray(fc.record({ from: id, to: id, value: amount, cv }), { selector: (f) => `${f.from}\u0000${f.to}`, maxLength: 8 }),
        imports: fc.uniqueArray(fc.record({ to: id, value: amount, cv }), { selector: (f) => f.to }),
        exports: fc.uniqueArray(
          fc.oneof(fc.record({ from: id, value: amount, cv }), fc.record({ from: id, value: amount, fleet: text.filter((f) => !ids.includes(f)), price: optional(amount), cv })),
          { selector: (f) => `${f.from}\u0000${'fleet' in f ? f.fleet : ''}` },
        ),
        respiration: fc.uniqueArray(fc.record({ from: id, value: amount, cv }), { selector: (f) => f.from }),
      }),
      place: fc.oneof(fc.constant(''), text),
      period: fc.oneof(fc.constant(''), text),
    }).map(({ web, place, period }) => ({
      place,
      period,
      web: strip({
        ...web,
        compartments: web.compartments.map(strip),
        flows: web.flows.map(strip),
        imports: web.imports.map(strip),
        exports: web.exports.map(strip),
        respiration: web.respiration.map(strip),
      }) as Web,
    }));
  });

describe('web → file → web', () => {
  it('CSV keeps every number, name and the place and period', async () => {
    await fc.assert(
      fc.asyncProperty(webArbitrary, async ({ web, place, period }) => {
        const read = await readUpload([{ name: 'web.csv', data: webToCsv(web, { place, period }) }]);
        expect(read.problems).toEqual([]);
        expect(read.web).toEqual(web);
        expect({ place: read.place, period: read.period }).toEqual({ place, period });
      }),
      { numRuns: 150 },
    );
  });

  it('XLSX keeps every number, name and the place and period', async () => {
    await fc.assert(
      fc.asyncProperty(webArbitrary, async ({ web, place, period }) => {
        const read = await readUpload([{ name: 'web.xlsx', data: await webToXlsx(web, { place, period }) }]);
        expect(read.problems).toEqual([]);
        expect(read.web).toEqual(web);
        expect({ place: read.place, period: read.period }).toEqual({ place, period });
      }),
      { numRuns: 40 },
    );
  });
});
