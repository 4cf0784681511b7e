import ExcelJS from 'exceljs';
import { readUpload } from './read-upload';
import { MAX_UNPACKED_BYTES, MAX_UPLOAD_BYTES } from './limits';
import { declaredUnpackedBytes } from './zip-size';
import { webToXlsx } from './write-xlsx';

/** Every kind of bad row, reported against its table, row and column; nothing returned as a web. */

const header = 'table,key,value,id,name,kind,biomass,from,to,cv,fleet,price';
const good = [
  header,
  'web,name,Tiny bay,,,,,,,,,',
  'web,unit,g C m-2 y-1,,,,,,,,,',
  'compartments,,,algae,Algae,producer,3,,,,,',
  'compartments,,,fish,Fish,consumer,1,,,,,',
  'flows,,10,,,,,algae,fish,0.2,,',
  'imports,,20,,,,,,algae,,,',
  'respiration,,10,,,,,algae,,,,',
  'exports,,4,,,,,fish,,,trawl,1200',
  'respiration,,6,,,,,fish,,,,',
];

const csv = (lines: string[]) => [{ name: 'web.csv', data: lines.join('\n') }];
const withLine = (index: number, line: string) => good.map((l, i) => (i === index ? line : l));

describe('readUpload', () => {
  it('reads a good combined CSV into a balanced web', async () => {
    const read = await readUpload(csv(good));
    expect(read.problems).toEqual([]);
    expect(read.warnings).toEqual([]);
    expect(read.web?.exports).toEqual([{ from: 'fish', value: 4, fleet: 'trawl', price: 1200 }]);
    expect(read.web?.flows).toEqual([{ from: 'algae', to: 'fish', value: 10, cv: 0.2 }]);
  });

  it.each([
    ['unknown compartment', withLine(5, 'flows,,10,,,,,algae,shark,,,'), { table: 'flows', row: 6, column: 'to', problem: 'unknown compartment "shark"' }],
    ['negative flow', withLine(5, 'flows,,-10,,,,,algae,fish,,,'), { table: 'flows', row: 6, column: 'value', problem: 'value must not be negative (got -10)' }],
    ['not a number', withLine(5, 'flows,,ten,,,,,algae,fish,,,'), { table: 'flows', row: 6, column: 'value', problem: '"ten" is not a number' }],
    ['not a number in cv', withLine(5, 'flows,,10,,,,,algae,fish,1.2.3,,'), { table: 'flows', row: 6, column: 'cv', problem: '"1.2.3" is not a number' }],
    ['empty value', withLine(5, 'flows,,,,,,,algae,fish,,,'), { table: 'flows', row: 6, column: 'value', problem: 'value is empty' }],
    ['duplicate flow', [...good, 'flows,,1,,,,,algae,fish,,,'], { table: 'flows', row: 11, column: null, problem: 'duplicate flow algae → fish (first given at row 6)' }],
    ['duplicate compartment', [...good, 'compartments,,,fish,Fish again,consumer,,,,,,'], { table: 'compartments', row: 11, column: 'id', problem: 'duplicate compartment id "fish" (first given at row 5)' }],
    ['unknown kind', withLine(4, 'compartments,,,fish,Fish,predator,1,,,,,'), { table: 'compartments', row: 5, column: 'kind', problem: 'unknown kind "predator" (one of producer, consumer, detritus)' }],
    ['price without fleet', withLine(8, 'exports,,4,,,,,fish,,,,1200'), { table: 'exports', row: 9, column: 'price', problem: 'a price is given for an export with no fleet' }],
    ['unknown table', [...good, 'fleets,,1,,,,,,,,,'], { table: 'web.csv', row: 11, column: 'table', problem: 'unknown table "fleets" (one of web, compartments, flows, imports, exports, respiration)' }],
    ['value in a column of another table', withLine(6, 'imports,,20,,,,,algae,algae,,,'), { table: 'imports', row: 7, column: 'from', problem: 'the imports table has no column "from" (it has to, value, cv)' }],
    ['unknown web key', [...good, 'web,colour,blue,,,,,,,,,'], { table: 'web', row: 11, column: 'key', problem: 'unknown key "colour" (the web table has name, unit, place, period, areaKm2, tonnesPerUnit)' }],
  ])('reports %s against its row and column', async (_, lines, problem) => {
    const read = await readUpload(csv(lines));
    expect(read.web).toBeUndefined();
    expect(read.problems).toContainEqual(problem);
  });

  it('reports a missing column once against the header', async () => {
    const lines = good.map((l) => l.split(',').filter((_, i) => i !== 5).join(','));
    const read = await readUpload(csv(lines));
    expect(read.problems).toEqual([{ table: 'compartments', row: 1, column: 'kind', problem: 'missing column "kind"' }]);
  });

  it('reports every problem of a file at once', async () => {
    const read = await readUpload(csv([...withLine(5, 'flows,,-1,,,,,algae,shark,,,'), 'compartments,,,x,X,alien,,,,,,']));
    expect(read.problems.map((p) => [p.row, p.column])).toEqual([
      [11, 'kind'],
      [6, 'to'],
      [6, 'value'],
    ]);
  });

  it('warns of an unbalanced compartment with its imbalance but keeps the web', async () => {
    const read = await readUpload(csv(withLine(9, 'respiration,,5,,,,,fish,,,,')));
    expect(read.problems).toEqual([]);
    expect(read.web).toBeDefined();
    expect(read.warnings).toEqual([{ table: 'compartments', row: 5, column: null, problem: 'compartment "fish" is unbalanced: inputs 10 and outputs 9 differ by 1' }]);
  });

  it('takes name, unit, place and period from the fields over the file', async () => {
    const read = await readUpload(csv(good.filter((l) => !l.startsWith('web,'))), { name: 'From field', unit: 't km-2 y-1', place: 'Here', period: '2020' });
    expect(read.problems).toEqual([]);
    expect(read.web).toMatchObject({ name: 'From field', unit: 't km-2 y-1' });
    expect([read.place, read.period]).toEqual(['Here', '2020']);
  });

  it('asks for a name and a unit when neither the file nor the fields give one', async () => {
    const read = await readUpload(csv(good.filter((l) => !l.startsWith('web,'))));
    expect(read.problems.map((p) => p.problem)).toEqual([
      'the web has no name: give a "name" row in the web table or the name field',
      'the web has no unit: give a "unit" row in the web table or the unit field',
    ]);
  });

  it('reads one CSV file per table, semicolon-separated, with a BOM', async () => {
    const read = await readUpload(
      [
        { name: 'compartments.csv', data: '\uFEFFid;name;kind\nalgae;Algae;producer\n' },
        { name: 'imports.csv', data: 'to;value\nalgae;5\n' },
        { name: 'respiration.csv', data: 'from;value\nalgae;5\n' },
      ],
      { name: 'Pond', unit: 'g' },
    );
    expect(read.problems).toEqual([]);
    expect(read.web).toEqual({ name: 'Pond', unit: 'g', compartments: [{ id: 'algae', name: 'Algae', kind: 'producer' }], flows: [], imports: [{ to: 'algae', value: 5 }], exports: [], respiration: [{ from: 'algae', value: 5 }] });
  });

  it('refuses a CSV file that names no table', async () => {
    const read = await readUpload([{ name: 'data.csv', data: 'id,name\na,b\n' }]);
    expect(read.problems[0]).toMatchObject({ table: 'data.csv', row: null });
  });

  it('reports a missing compartments table', async () => {
    const read = await readUpload([{ name: 'flows.csv', data: 'from,to,value\na,b,1\n' }], { name: 'x', unit: 'y' });
    expect(read.problems).toContainEqual({ table: 'compartments', row: null, column: null, problem: 'there is no compartments table: a web needs at least one compartment' });
  });

  it('refuses a file of the wrong type and a file too large', async () => {
    const png = new Uint8Array([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]);
    expect((await readUpload([{ name: 'web.png', data: png }])).problems[0].problem).toMatch(/not a WEB\.json file, an XLSX workbook or a CSV file/);
    const large = new Uint8Array(MAX_UPLOAD_BYTES + 1).fill(0x41);
    expect((await readUpload([{ name: 'web.csv', data: large }])).problems[0].problem).toBe('the upload is 5.0 MB: at most 5.0 MB');
    expect((await readUpload([])).problems[0].problem).toMatch(/no file was sent/);
  });

  it('refuses a workbook that unpacks to more than the limit, before unpacking it', async () => {
    const workbook = new ExcelJS.Workbook();
    const sheet = workbook.addWorksheet('compartments');
    // long, repetitive (but distinct) names pack into little and unpack into much
    const filler = 'x'.repeat(30_000);
    for (let k = 0; k < 2_200; k++) sheet.addRow([`c${k}`, `${k}${filler}`, 'producer']);
    const data = new Uint8Array(await workbook.xlsx.writeBuffer());
    expect(data.byteLength).toBeLessThan(MAX_UPLOAD_BYTES);
    expect(declaredUnpackedBytes(data)).toBeGreaterThan(MAX_UNPACKED_BYTES);
    expect((await readUpload([{ name: 'big.xlsx', data }])).problems).toEqual([
      { table: 'big.xlsx', row: null, column: null, problem: 'the workbook unpacks to more than 60 MB: save it without other sheets, images or formatting, or send CSV' },
    ]);
  });

  it('reports a broken workbook and bad JSON without throwing', async () => {
    const zip = new Uint8Array([0x50, 0x4b, 0x03, 0x04, 1, 2, 3]);
    expect((await readUpload([{ name: 'web.xlsx', data: zip }])).problems).toEqual([{ table: 'web.xlsx', row: null, column: null, problem: 'the file is not a readable XLSX workbook' }]);
    expect((await readUpload([{ name: 'web.json', data: '{"name": ' }])).problems[0].problem).toMatch(/^the file is not valid JSON/);
  });

  it('puts the engine\'s problems with a WEB.json file against the array entry', async () => {
    const web = { name: 'a', unit: 'b', compartments: [{ id: 'x', name: 'X', kind: 'producer' }], flows: [{ from: 'x', to: 'y', value: 1 }], imports: [], exports: [], respiration: [{ from: 'x', value: -1 }] };
    const read = await readUpload([{ name: 'web.json', data: JSON.stringify(web) }]);
    expect(read.problems).toEqual([{ table: 'respiration', row: 1, column: 'value', problem: 'respiration value must not be negative' }]);
  });

  it('reads bad rows of a workbook against the sheet row, formulas by their result', async () => {
    const workbook = new ExcelJS.Workbook();
    await workbook.xlsx.load((await webToXlsx({ name: 'n', unit: 'u', compartments: [{ id: 'a', name: 'A', kind: 'producer' }], flows: [], imports: [{ to: 'a', value: 1 }], exports: [], respiration: [] }, { place: '', period: '' })) as unknown as ExcelJS.Buffer);
    workbook.getWorksheet('respiration')!.addRow(['a', { formula: '0.5*2', result: 1 }]);
    workbook.getWorksheet('flows')!.addRow(['a', 'b', 'lots']);
    workbook.addWorksheet('notes');
    const read = await readUpload([{ name: 'web.xlsx', data: new Uint8Array(await workbook.xlsx.writeBuffer()) }]);
    expect(read.problems).toEqual([{ table: 'notes', row: null, column: null, problem: 'unknown sheet "notes" (the sheets are web, compartments, flows, imports, exports, respiration)' }]);
    workbook.removeWorksheet(workbook.getWorksheet('notes')!.id);
    const again = await readUpload([{ name: 'web.xlsx', data: new Uint8Array(await workbook.xlsx.writeBuffer()) }]);
    expect(again.problems).toEqual([
      { table: 'flows', row: 2, column: 'to', problem: 'unknown compartment "b"' },
      { table: 'flows', row: 2, column: 'value', problem: '"lots" is not a number' },
    ]);
    workbook.getWorksheet('flows')!.spliceRows(2, 1);
    const fixed = await readUpload([{ name: 'web.xlsx', data: new Uint8Array(await workbook.xlsx.writeBuffer()) }]);
    expect(fixed.web?.respiration).toEqual([{ from: 'a', value: 1 }]);
  });
});
