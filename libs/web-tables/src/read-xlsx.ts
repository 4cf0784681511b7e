import ExcelJS from 'exceljs';
import { isTableName, TABLE_NAMES } from './layout';
import { MAX_UNPACKED_BYTES } from './limits';
import { ProblemList } from './problems';
import type { Cell, RawRow, RawTable } from './raw-table';
import type { TablesFound } from './read-csv';
import { declaredUnpackedBytes } from './zip-size';

/** An XLSX workbook in our layout: one sheet per table, named after it, with a header row. */
export async function readXlsx(data: Uint8Array, fileName: string): Promise<TablesFound> {
  const problems = new ProblemList();
  const unpacked = declaredUnpackedBytes(data);
  if (unpacked !== undefined && unpacked > MAX_UNPACKED_BYTES) {
    problems.add(fileName, null, null, `the workbook unpacks to more than ${MAX_UNPACKED_BYTES / 1024 / 1024} MB: save it without other sheets, images or formatting, or send CSV`);
    return { tables: [], problems };
  }
  const workbook = new ExcelJS.Workbook();
  try {
    await workbook.xlsx.load(data as unknown as ExcelJS.Buffer);
  } catch {
    problems.add(fileName, null, null, 'the file is not a readable XLSX workbook');
    return { tables: [], problems };
  }
  const tables: RawTable[] = [];
  for (const sheet of workbook.worksheets) {
    const name = sheet.name.trim().toLowerCase();
    if (!isTableName(name)) {
      problems.add(sheet.name, null, null, `unknown sheet "${sheet.name}" (the sheets are ${TABLE_NAMES.join(', ')})`);
      continue;
    }
    let header: string[] | undefined;
    let headerRow = 1;
    const rows: RawRow[] = [];
    sheet.eachRow({ includeEmpty: false }, (row, rowNumber) => {
      const values: Cell[] = [];
      row.eachCell({ includeEmpty: true }, (cell, column) => {
        values[column - 1] = cellValue(cell.value);
      });
      if (header === undefined) {
        header = Array.from(values, (v) => (v === null || v === undefined ? '' : String(v).trim().toLowerCase()));
        headerRow = rowNumber;
        return;
      }
      const columns = header;
      if (values.every((v) => v === null || v === undefined || String(v).trim() === '')) return;
      rows.push({ row: rowNumber, cells: Object.fromEntries(columns.map((c, i) => [c, values[i] ?? null])) });
    });
    tables.push({ name, columns: header ?? [], headerRow, rows });
  }
  return { tables, problems };
}

/** A cell's value as text or number; formulas give their last computed result. */
function cellValue(value: ExcelJS.CellValue): Cell {
  if (value === null || value === undefined) return null;
  if (typeof value === 'number' || typeof value === 'string') return value;
  if (typeof value === 'boolean') return String(value);
  if (value instanceof Date) return value.toISOString();
  if ('richText' in value) return value.richText.map((part) => part.text).join('');
  if ('formula' in value || 'sharedFormula' in value) return cellValue((value as ExcelJS.CellFormulaValue).result as ExcelJS.CellValue);
  if ('text' in value) return String(value.text);
  if ('error' in value) return String(value.error);
  return null;
}
