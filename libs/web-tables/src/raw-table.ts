import type { TableName } from './layout';

/** A cell as read from a file: text, a number (XLSX numeric cells) or empty. */
export type Cell = string | number | null;

/** One row of a table with the row number the person sees in their file or sheet (header = 1). */
export interface RawRow {
  readonly row: number;
  readonly cells: Readonly<Record<string, Cell>>;
}

/** A table read from a file, before any meaning is checked. */
export interface RawTable {
  readonly name: TableName;
  /** Header cells, lower-cased and trimmed. */
  readonly columns: readonly string[];
  /** Row number of the header line (1 in a sheet or a per-table file). */
  readonly headerRow: number;
  readonly rows: readonly RawRow[];
}

export function isEmptyCell(cell: Cell | undefined): boolean {
  return cell === null || cell === undefined || (typeof cell === 'string' && cell.trim() === '');
}
