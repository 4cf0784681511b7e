import { count } from 'drizzle-orm';
import type { PgTable } from 'drizzle-orm/pg-core';
import { webToCsv, webToXlsx } from '@seinework/web-tables';
import { auditEvents, versionCompartments, versionExports, versionFlows, versionImports, versionRespiration, webs, webVersions } from '../db/schema';
import { createTestApp, type TestAgent, type TestApp } from '../testing/test-app';
import { brannockBay, tinyWeb } from './test-webs';

let t: TestApp;
let analyst: TestAgent;
beforeEach(async () => {
  t = await createTestApp();
  analyst = await t.signInAs('analyst');
}, 60_000);
afterEach(async () => {
  await t.close();
});

const header = 'table,key,value,id,name,kind,biomass,from,to,cv,fleet,price';
const goodCsv = () => webToCsv(tinyWeb(), { place: 'Tiny Bay', period: '2020' }).split('\r\n');
const withRow = (lines: string[], index: number, line: string) => lines.map((l, i) => (i === index ? line : l));

const tables: PgTable[] = [webs, webVersions, versionCompartments, versionFlows, versionImports, versionExports, versionRespiration, auditEvents];
async function rowCounts(): Promise<number[]> {
  return Promise.all(tables.map(async (table) => (await t.database.db.select({ n: count() }).from(table))[0].n));
}

function upload(file: Buffer | string, name: string, fields: Record<string, string> = {}) {
  let request = analyst.post('/api/webs/upload');
  for (const [key, value] of Object.entries(fields)) request = request.field(key, value);
  return request.attach('file', Buffer.from(file), name);
}

describe('POST /api/webs/upload', () => {
  it('stores a web from our CSV with its place and period, as a first draft', async () => {
    const response = await upload(goodCsv().join('\r\n'), 'tiny.csv', { note: 'from the survey' });
    expect(response.status).toBe(201);
    expect(response.body.warnings).toEqual([]);
    const version = (await analyst.get(`/api/webs/${response.body.id}/versions/${response.body.versionId}`)).body;
    expect(version).toMatchObject({ status: 'draft', note: 'from the survey', web: tinyWeb() });
    expect((await analyst.get(`/api/webs/${response.body.id}`)).body).toMatchObject({ place: 'Tiny Bay', period: '2020' });
  });

  it('stores an unbalanced web as a draft, with the imbalance as a warning', async () => {
    const response = await upload(webToCsv(tinyWeb(5), { place: '', period: '' }), 'tiny.csv');
    expect(response.status).toBe(201);
    expect(response.body.warnings).toEqual([{ table: 'compartments', row: 9, column: null, problem: 'compartment "fish" is unbalanced: inputs 10 and outputs 9 differ by 1' }]);
  });

  // Lines of goodCsv(): 0 header, 1-6 web, 7-8 compartments, 9 the flow, 10 the import, 11 the export, 12-13 respiration.
  it.each([
    ['unknown compartment', 9, 'flows,,10,,,,,algae,shark,0.2,,', { table: 'flows', row: 10, column: 'to', problem: 'unknown compartment "shark"' }],
    ['negative flow', 9, 'flows,,-10,,,,,algae,fish,0.2,,', { table: 'flows', row: 10, column: 'value', problem: 'value must not be negative (got -10)' }],
    ['not a number', 9, 'flows,,ten,,,,,algae,fish,0.2,,', { table: 'flows', row: 10, column: 'value', problem: '"ten" is not a number' }],
    ['duplicate flow', null, 'flows,,1,,,,,algae,fish,,,', { table: 'flows', row: 15, column: null, problem: 'duplicate flow algae → fish (first given at row 10)' }],
    ['unknown kind', 8, 'compartments,,,fish,Fish,whale,1,,,,,', { table: 'compartments', row: 9, column: 'kind', problem: 'unknown kind "whale" (one of producer, consumer, detritus)' }],
  ])('refuses %s, naming table, row and column, storing nothing', async (_, index, line, problem) => {
    const bad = index === null ? [...goodCsv(), line] : withRow(goodCsv(), index, line);
    const before = await rowCounts();
    const response = await upload(bad.join('\r\n'), 'tiny.csv');
    expect(response.status).toBe(422);
    expect(response.body.error).toBe('The upload has problems: nothing was stored');
    expect(response.body.details).toContainEqual(problem);
    expect(await rowCounts()).toEqual(before);
  });

  it('refuses a missing column against the header row', async () => {
    const response = await upload(['table,id,name,biomass', 'compartments,a,A,1'].join('\n'), 'web.csv', { name: 'x', unit: 'y' });
    expect(response.status).toBe(422);
    expect(response.body.details).toEqual([{ table: 'compartments', row: 1, column: 'kind', problem: 'missing column "kind"' }]);
  });

  it('refuses a file of the wrong type, a file too large and a request with no file, storing nothing', async () => {
    const before = await rowCounts();
    const png = Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13]);
    const wrong = await upload(png, 'web.png');
    expect(wrong.status).toBe(422);
    expect(wrong.body.details[0]).toMatchObject({ table: 'web.png', row: null, problem: expect.stringMatching(/not a WEB\.json file, an XLSX workbook or a CSV file/) });
    const large = await upload(Buffer.alloc(5 * 1024 * 1024 + 1, 'a'), 'web.csv');
    expect(large.status).toBe(413);
    const none = await analyst.post('/api/webs/upload').field('name', 'x');
    expect(none.status).toBe(422);
    expect(none.body.details[0].problem).toMatch(/no file was sent/);
    const otherField = await analyst.post('/api/webs/upload').attach('spreadsheet', Buffer.from(header), 'web.csv');
    expect(otherField.status).toBe(400);
    const unknownField = await analyst.post('/api/webs/upload').field('colour', 'red').attach('file', Buffer.from(goodCsv().join('\n')), 'web.csv');
    expect(unknownField.status).toBe(400);
    expect(await rowCounts()).toEqual(before);
  });

  it('refuses a web larger than the server accepts', async () => {
    const compartments = Array.from({ length: 401 }, (_, i) => `compartments,,,c${i},C ${i},producer,,,,,,`);
    const response = await upload([header, 'web,name,Big,,,,,,,,,', 'web,unit,g,,,,,,,,,', ...compartments].join('\n'), 'big.csv');
    expect(response.status).toBe(422);
    expect(response.body.details).toEqual([{ table: 'compartments', row: null, column: null, problem: '401 compartments: at most 400 are accepted' }]);
  });

  it('reads an XLSX workbook, a WEB.json file and one CSV file per table', async () => {
    const xlsx = await upload(await webToXlsx(brannockBay, { place: 'Brannock Bay', period: '2019–2023' }), 'bay.xlsx');
    expect(xlsx.status).toBe(201);
    expect((await analyst.get(`/api/webs/${xlsx.body.id}/versions/${xlsx.body.versionId}`)).body.web).toEqual(brannockBay);
    const json = await upload(JSON.stringify(tinyWeb()), 'tiny.json', { name: 'Renamed', place: 'Tiny Bay' });
    expect(json.status).toBe(201);
    expect((await analyst.get(`/api/webs/${json.body.id}`)).body).toMatchObject({ name: 'Renamed', place: 'Tiny Bay' });
    const perTable = await analyst
      .post('/api/webs/upload')
      .field('name', 'Pond')
      .field('unit', 'g')
      .attach('file', Buffer.from('id,name,kind\nalgae,Algae,producer\n'), 'compartments.csv')
      .attach('file', Buffer.from('to,value\nalgae,5\n'), 'imports.csv')
      .attach('file', Buffer.from('from,value\nalgae,5\n'), 'respiration.csv');
    expect(perTable.status).toBe(201);
  });

  it('takes back its own exports: CSV, XLSX and WEB.json of a version upload to the same web', async () => {
    const created = await upload(await webToXlsx(brannockBay, { place: 'Brannock Bay', period: '2019–2023' }), 'bay.xlsx');
    const base = `/api/webs/${created.body.id}/versions/${created.body.versionId}/export`;
    for (const format of ['csv', 'xlsx', 'json'] as const) {
      const exported = await analyst.get(`${base}?format=${format}`).buffer(true).parse((res, done) => {
        const chunks: Buffer[] = [];
        res.on('data', (c: Buffer) => chunks.push(c));
        res.on('end', () => done(null, Buffer.concat(chunks)));
      });
      expect(exported.status).toBe(200);
      const again = await upload(exported.body as Buffer, `bay.${format}`);
      expect(again.status).toBe(201);
      expect((await analyst.get(`/api/webs/${again.body.id}/versions/${again.body.versionId}`)).body.web).toEqual(brannockBay);
      if (format !== 'json') expect((await analyst.get(`/api/webs/${again.body.id}`)).body).toMatchObject({ place: 'Brannock Bay', period: '2019–2023' });
    }
  });

  it('is refused to roles that may not create webs', async () => {
    for (const role of ['council', 'staff', 'stakeholder'] as const) {
      const agent = await t.signInAs(role);
      expect((await agent.post('/api/webs/upload').attach('file', Buffer.from(goodCsv().join('\n')), 'web.csv')).status).toBe(403);
    }
    expect((await t.anonymous().post('/api/webs/upload').attach('file', Buffer.from(goodCsv().join('\n')), 'web.csv')).status).toBe(401);
  });
});
