/**
 * Seinework's own table layout of a web (DEVELOPERS.md, "Upload tables"): one table per part of
 * WEB.json plus a `web` table of key | value rows for the web's name, unit, place, period, area and
 * tonnes per unit. An XLSX workbook has one sheet per table; CSV is one file whose first column
 * `table` names the table of each row, or one file per table named after it (flows.csv, ...).
 */

export const TABLE_NAMES = ['web', 'compartments', 'flows', 'imports', 'exports', 'respiration'] as const;
export type TableName = (typeof TABLE_NAMES)[number];

export interface TableLayout {
  readonly columns: readonly string[];
  /** Columns every row must fill. */
  readonly required: readonly string[];
}

export const LAYOUT: Readonly<Record<TableName, TableLayout>> = {
  web: { columns: ['key', 'value'], required: ['key', 'value'] },
  compartments: { columns: ['id', 'name', 'kind', 'biomass'], required: ['id', 'name', 'kind'] },
  flows: { columns: ['from', 'to', 'value', 'cv'], required: ['from', 'to', 'value'] },
  imports: { columns: ['to', 'value', 'cv'], required: ['to', 'value'] },
  exports: { columns: ['from', 'value', 'fleet', 'price', 'cv'], required: ['from', 'value'] },
  respiration: { columns: ['from', 'value', 'cv'], required: ['from', 'value'] },
};

/** Keys of the `web` table, in the order they are written. */
export const WEB_KEYS = ['name', 'unit', 'place', 'period', 'areaKm2', 'tonnesPerUnit'] as const;
export type WebKey = (typeof WEB_KEYS)[number];

/** The column naming the table of each row in a single CSV file. */
export const TABLE_COLUMN = 'table';

/** Columns of the single CSV file: `table`, then every table's columns once, in layout order. */
export const CSV_COLUMNS: readonly string[] = [TABLE_COLUMN, ...new Set(TABLE_NAMES.flatMap((t) => LAYOUT[t].columns))];

export function isTableName(name: string): name is TableName {
  return (TABLE_NAMES as readonly string[]).includes(name);
}
