/**
 * Every table a result page shows, in one plain shape, so that each can be written out as CSV in the
 * browser exactly as it is shown (same rows, same columns, numbers at full precision).
 */
export type Cell = string | number | null;

export interface ExportTable {
  /** File name without extension, e.g. `fleets`. */
  readonly name: string;
  readonly columns: readonly string[];
  readonly rows: readonly (readonly Cell[])[];
}

/** One CSV field (RFC 4180): quoted when it holds a comma, quote or line break; empty for no value. */
function field(cell: Cell): string {
  if (cell === null || (typeof cell === 'number' && !Number.isFinite(cell))) return '';
  const text = String(cell);
  return /[",\r\n]/.test(text) ? `"${text.replaceAll('"', '""')}"` : text;
}

export function toCsv(table: ExportTable): string {
  return [table.columns, ...table.rows].map((row) => row.map(field).join(',')).join('\r\n') + '\r\n';
}

/** Offers the table as a CSV download; the file name carries the run so downloads of several runs do not collide. */
export function downloadCsv(table: ExportTable, prefix: string): void {
  offer(new Blob([toCsv(table)], { type: 'text/csv;charset=utf-8' }), `${prefix}-${table.name}.csv`);
}

/** A worksheet name Excel accepts: at most 31 characters, none of []:*?/\, unique in the workbook. */
export function sheetName(name: string, taken: Set<string>): string {
  const base = name.replace(/[[\]:*?/\\]/g, ' ').slice(0, 31) || 'table';
  let candidate = base;
  for (let n = 2; taken.has(candidate.toLowerCase()); n++) candidate = `${base.slice(0, 31 - String(n).length - 1)}-${n}`;
  taken.add(candidate.toLowerCase());
  return candidate;
}

/**
 * Every table in one workbook, one worksheet each. exceljs is loaded on first use only, so it stays
 * out of the bundle a page loads.
 */
export async function downloadXlsx(tables: readonly ExportTable[], prefix: string): Promise<void> {
  const loaded = (await import('exceljs')) as typeof import('exceljs') & { default?: typeof import('exceljs') };
  // exceljs is CommonJS: depending on the bundler its exports sit on the module or on its default
  const Workbook = loaded.Workbook ?? loaded.default!.Workbook;
  const workbook = new Workbook();
  workbook.creator = 'Seinework';
  const taken = new Set<string>();
  for (const table of tables) {
    const sheet = workbook.addWorksheet(sheetName(table.name, taken));
    sheet.addRow([...table.columns]).font = { bold: true };
    for (const row of table.rows) sheet.addRow(row.map((cell) => (typeof cell === 'number' && !Number.isFinite(cell) ? null : cell)));
    sheet.views = [{ state: 'frozen', ySplit: 1 }];
    sheet.columns.forEach((column, i) => (column.width = Math.min(40, Math.max(10, String(table.columns[i] ?? '').length + 2))));
  }
  const buffer = await workbook.xlsx.writeBuffer();
  offer(new Blob([buffer], { type: 'application/vnd.openxmlformats-officedocument.spreadsheetml.sheet' }), `${prefix}.xlsx`);
}

function offer(blob: Blob, fileName: string): void {
  const url = URL.createObjectURL(blob);
  const link = document.createElement('a');
  link.href = url;
  link.download = fileName;
  document.body.appendChild(link);
  link.click();
  link.remove();
  // revoked a moment later: some browsers read the object URL after click() returns
  setTimeout(() => URL.revokeObjectURL(url), 1000);
}
