import ExcelJS from 'exceljs';
import type { Web } from '@seinework/contracts';
import { LAYOUT, TABLE_NAMES } from './layout';
import { webRows, type WebPlace } from './web-rows';

/** A web as an XLSX workbook of our layout: one sheet per table, a bold header row. */
export async function webToXlsx(web: Web, details: WebPlace): Promise<Buffer> {
  const workbook = new ExcelJS.Workbook();
  workbook.creator = 'Seinework';
  const rows = webRows(web, details);
  for (const table of TABLE_NAMES) {
    const sheet = workbook.addWorksheet(table);
    const columns = LAYOUT[table].columns;
    sheet.columns = columns.map((c) => ({ header: c, key: c, width: c === 'name' || c === 'value' ? 28 : 16 }));
    sheet.getRow(1).font = { bold: true };
    for (const row of rows[table]) sheet.addRow(row);
  }
  return Buffer.from(await workbook.xlsx.writeBuffer());
}
