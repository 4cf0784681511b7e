import Papa from 'papaparse';
import { CSV_COLUMNS, isTableName, LAYOUT, TABLE_COLUMN, TABLE_NAMES, type TableName } from './layout';
import { ProblemList } from './problems';
import { isEmptyCell, type RawRow, type RawTable } from './raw-table';

/**
 * CSV in our layout: either one file whose `table` column names each row's table (the other
 * columns are the union of all tables' columns), or one file per table named after it
 * (compartments.csv, flows.csv, ...). The delimiter is detected (comma, semicolon or tab, as
 * spreadsheets save them). Problems of a whole file are reported against the file's name.
 */

export interface CsvFile {
  readonly name: string;
  readonly text: string;
}

export interface TablesFound {
  readonly tables: RawTable[];
  readonly problems: ProblemList;
}

export function readCsvFiles(files: readonly CsvFile[]): TablesFound {
  const problems = new ProblemList();
  const tables: RawTable[] = [];
  for (const file of files) {
    const records = parseRecords(file, problems);
    if (records === undefined) continue;
    const headerIndex = records.findIndex((r) => r.some((c) => !isEmptyCell(c)));
    if (headerIndex < 0) {
      problems.add(file.name, null, null, 'the file is empty');
      continue;
    }
    const header = records[headerIndex].map((c) => c.trim().toLowerCase());
    const body = records.slice(headerIndex + 1).map((cells, k) => ({ row: headerIndex + k + 2, cells }));
    if (header.includes(TABLE_COLUMN)) tables.push(...splitCombined(file.name, header, headerIndex + 1, body, problems));
    else {
      const name = tableNameOf(file.name);
      if (name === undefined) {
        problems.add(file.name, null, null, `a CSV file needs a "${TABLE_COLUMN}" column, or must be named after its table (${TABLE_NAMES.map((t) => `${t}.csv`).join(', ')})`);
        continue;
      }
      tables.push({ name, columns: header, headerRow: headerIndex + 1, rows: toRows(header, body) });
    }
  }
  return { tables, problems };
}

function parseRecords(file: CsvFile, problems: ProblemList): string[][] | undefined {
  const text = file.text.replace(/^\uFEFF/, '');
  const result = Papa.parse<string[]>(text, { skipEmptyLines: false, delimiter: delimiterOf(text) });
  const fatal = result.errors.filter((e) => e.type === 'Quotes');
  if (fatal.length > 0) {
    for (const error of fatal) problems.add(file.name, error.row === undefined ? null : error.row + 1, null, error.message);
    return undefined;
  }
  return result.data;
}

/** The delimiter is the commonest of comma, semicolon and tab on the header line (which holds no quoted text). */
function delimiterOf(text: string): string {
  const header = text.split(/\r?\n/).find((line) => line.trim() !== '') ?? '';
  const count = (d: string) => header.split(d).length;
  return [',', ';', '\t'].reduce((best, d) => (count(d) > count(best) ? d : best));
}

function tableNameOf(fileName: string): TableName | undefined {
  const base = fileName.split(/[\\/]/).pop()!.toLowerCase().replace(/\.(csv|txt)$/, '');
  return isTableName(base) ? base : undefined;
}

function toRows(header: readonly string[], body: readonly { row: number; cells: string[] }[]): RawRow[] {
  return body
    .filter(({ cells }) => cells.some((c) => !isEmptyCell(c)))
    .map(({ row, cells }) => ({ row, cells: Object.fromEntries(header.map((column, i) => [column, cells[i] ?? null])) }));
}

function splitCombined(fileName: string, header: readonly string[], headerRow: number, body: readonly { row: number; cells: string[] }[], problems: ProblemList): RawTable[] {
  for (const column of header) {
    if (column !== '' && !CSV_COLUMNS.includes(column)) problems.add(fileName, headerRow, column, `unknown column "${column}" (the columns are ${CSV_COLUMNS.join(', ')})`);
  }
  const rowsOf = new Map<TableName, RawRow[]>();
  const tableIndex = header.indexOf(TABLE_COLUMN);
  for (const row of toRows(header, body)) {
    const named = String(row.cells[TABLE_COLUMN] ?? '').trim();
    const table = named.toLowerCase();
    if (!isTableName(table)) {
      problems.add(fileName, row.row, TABLE_COLUMN, named === '' ? 'the table is empty' : `unknown table "${named}" (one of ${TABLE_NAMES.join(', ')})`);
      continue;
    }
    const own = LAYOUT[table].columns;
    header.forEach((column, i) => {
      if (i !== tableIndex && CSV_COLUMNS.includes(column) && !own.includes(column) && !isEmptyCell(row.cells[column])) {
        problems.add(table, row.row, column, `the ${table} table has no column "${column}" (it has ${own.join(', ')})`);
      }
    });
    const rows = rowsOf.get(table) ?? [];
    rows.push(row);
    rowsOf.set(table, rows);
  }
  return [...rowsOf].map(([name, rows]) => ({
    name,
    columns: header.filter((c) => LAYOUT[name].columns.includes(c)),
    headerRow,
    rows,
  }));
}
