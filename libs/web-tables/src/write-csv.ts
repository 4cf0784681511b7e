import Papa from 'papaparse';
import type { Web } from '@seinework/contracts';
import { CSV_COLUMNS, TABLE_COLUMN, TABLE_NAMES } from './layout';
import { webRows, type WebPlace } from './web-rows';

/**
 * A web as one CSV file of our layout (first column `table`). Text that a spreadsheet would take
 * for a formula (=, +, -, @) is written with a leading ', which the reader takes off again.
 */
export function webToCsv(web: Web, details: WebPlace): string {
  const rows = webRows(web, details);
  const data = TABLE_NAMES.flatMap((table) => rows[table].map((row) => CSV_COLUMNS.map((c) => (c === TABLE_COLUMN ? table : (row[c] ?? '')))));
  return Papa.unparse({ fields: [...CSV_COLUMNS], data }, { escapeFormulae: true, newline: '\r\n' });
}
