import type { Web } from '@seinework/contracts';
import demo from '../../../../../seeds/brannock-bay.json';
import { tablesToWeb, webToTables, type EditorTables } from './editor-tables';

const header = (web: Web) => ({ name: web.name, unit: web.unit, areaKm2: web.areaKm2, tonnesPerUnit: web.tonnesPerUnit });

describe('editor tables', () => {
  it('read back into the very web they were made from', () => {
    const web = demo as Web;
    const { web: read, problems } = tablesToWeb(webToTables(web), header(web));
    expect(problems).toEqual([]);
    expect(read).toEqual(web);
  });

  it('name every cell that does not read, by table, row and column', () => {
    const tables = webToTables(demo as Web);
    const edit = (table: keyof EditorTables, index: number, field: string, value: string): EditorTables => ({
      ...tables,
      [table]: tables[table].map((row, k) => (k === index ? { ...row, cells: { ...row.cells, [field]: value } } : row)),
    });
    let edited = edit('flows', 2, 'value', '12,5');
    expect(tablesToWeb(edited, header(demo as Web)).web.flows[2].value).toBe(12.5);
    edited = edit('flows', 2, 'value', 'twelve');
    edited = { ...edited, exports: edited.exports.map((row, k) => (k === 0 ? { ...row, cells: { ...row.cells, from: 'krill' } } : row)) };
    edited = { ...edited, respiration: edited.respiration.map((row, k) => (k === 1 ? { ...row, cells: { ...row.cells, value: '-3' } } : row)) };
    edited = { ...edited, compartments: edited.compartments.map((row, k) => (k === 1 ? { ...row, cells: { ...row.cells, id: 'phytoplankton' } } : row)) };
    const problems = tablesToWeb(edited, header(demo as Web)).problems.map(({ table, row, field, problem }) => ({ table, row, field, problem }));
    expect(problems).toEqual(
      expect.arrayContaining([
        { table: 'flows', row: 3, field: 'value', problem: '“twelve” is not a number' },
        { table: 'exports', row: 1, field: 'from', problem: 'no compartment has the id “krill”' },
        { table: 'respiration', row: 2, field: 'value', problem: 'Respiration must not be negative' },
        { table: 'compartments', row: 2, field: 'id', problem: 'the id “phytoplankton” is used twice' },
      ]),
    );
  });

  it('name a second flow between the same compartments against the later row', () => {
    const tables = webToTables(demo as Web);
    const copy = { ...tables.flows[0], key: -1 };
    const { problems } = tablesToWeb({ ...tables, flows: [...tables.flows, copy] }, header(demo as Web));
    const { from, to } = demo.flows[0];
    expect(problems).toEqual([expect.objectContaining({ table: 'flows', row: demo.flows.length + 1, field: 'to', problem: `a flow from “${from}” to “${to}” is already in row 1` })]);
  });

  it('leave optional cells out of WEB.json when they are empty and flag empty required ones', () => {
    const tables = webToTables(demo as Web);
    const blank = { ...tables, flows: tables.flows.map((row, k) => (k === 0 ? { ...row, cells: { ...row.cells, value: '', cv: '' } } : row)) };
    const { web, problems } = tablesToWeb(blank, header(demo as Web));
    expect(web.flows[0]).not.toHaveProperty('cv');
    expect(Number.isNaN(web.flows[0].value)).toBe(true);
    expect(problems).toEqual([expect.objectContaining({ table: 'flows', row: 1, field: 'value', problem: 'Flow is empty' })]);
  });
});
