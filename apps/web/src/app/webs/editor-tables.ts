import type { Web } from '@seinework/contracts';

/**
 * The editor holds a web as tables of text cells, exactly as typed, so that a half-typed number
 * ("12.") is never rewritten under the cursor; `tablesToWeb` reads them back into WEB.json and
 * names every cell that does not read.
 */

export const EDITOR_TABLES = ['compartments', 'flows', 'imports', 'exports', 'respiration'] as const;
export type EditorTable = (typeof EDITOR_TABLES)[number];

export type CellKind = 'text' | 'number' | 'kind' | 'compartment';

export interface EditorColumn {
  readonly field: string;
  readonly label: string;
  readonly kind: CellKind;
  readonly required: boolean;
}

export const EDITOR_COLUMNS: Readonly<Record<EditorTable, readonly EditorColumn[]>> = {
  compartments: [
    { field: 'id', label: 'Id', kind: 'text', required: true },
    { field: 'name', label: 'Name', kind: 'text', required: true },
    { field: 'kind', label: 'Kind', kind: 'kind', required: true },
    { field: 'biomass', label: 'Biomass', kind: 'number', required: false },
  ],
  flows: [
    { field: 'from', label: 'From', kind: 'compartment', required: true },
    { field: 'to', label: 'To', kind: 'compartment', required: true },
    { field: 'value', label: 'Flow', kind: 'number', required: true },
    { field: 'cv', label: 'cv', kind: 'number', required: false },
  ],
  imports: [
    { field: 'to', label: 'Into', kind: 'compartment', required: true },
    { field: 'value', label: 'Import', kind: 'number', required: true },
    { field: 'cv', label: 'cv', kind: 'number', required: false },
  ],
  exports: [
    { field: 'from', label: 'From', kind: 'compartment', required: true },
    { field: 'value', label: 'Export', kind: 'number', required: true },
    { field: 'fleet', label: 'Fleet (harvest)', kind: 'text', required: false },
    { field: 'price', label: 'Price per tonne', kind: 'number', required: false },
    { field: 'cv', label: 'cv', kind: 'number', required: false },
  ],
  respiration: [
    { field: 'from', label: 'From', kind: 'compartment', required: true },
    { field: 'value', label: 'Respiration', kind: 'number', required: true },
    { field: 'cv', label: 'cv', kind: 'number', required: false },
  ],
};

export interface EditorRow {
  /** Stable across edits, so that the table keeps the row (and the cursor) while its cells change. */
  readonly key: number;
  readonly cells: Readonly<Record<string, string>>;
}

export type EditorTables = Readonly<Record<EditorTable, readonly EditorRow[]>>;

export interface CellProblem {
  readonly table: EditorTable;
  readonly key: number;
  readonly row: number;
  readonly field: string;
  readonly problem: string;
}

let nextKey = 1;
export function newRow(table: EditorTable, cells: Record<string, string> = {}): EditorRow {
  const blank = Object.fromEntries(EDITOR_COLUMNS[table].map((c) => [c.field, c.kind === 'kind' ? 'consumer' : '']));
  return { key: nextKey++, cells: { ...blank, ...cells } };
}

export function webToTables(web: Web): EditorTables {
  const rowsOf = (table: EditorTable, items: readonly object[]) =>
    items.map((item) => newRow(table, Object.fromEntries(Object.entries(item).map(([k, v]) => [k, v === undefined ? '' : String(v)]))));
  return {
    compartments: rowsOf('compartments', web.compartments),
    flows: rowsOf('flows', web.flows),
    imports: rowsOf('imports', web.imports),
    exports: rowsOf('exports', web.exports),
    respiration: rowsOf('respiration', web.respiration),
  };
}

/** The engine refuses a second flow between the same pair, a second import into or respiration of one compartment. */
const REPEAT_KEYS: Partial<Record<EditorTable, { fields: readonly string[]; blame: string; what: (cells: Record<string, string>) => string }>> = {
  flows: { fields: ['from', 'to'], blame: 'to', what: (c) => `a flow from “${c['from']}” to “${c['to']}”` },
  imports: { fields: ['to'], blame: 'to', what: (c) => `an import into “${c['to']}”` },
  respiration: { fields: ['from'], blame: 'from', what: (c) => `respiration of “${c['from']}”` },
};

function flagRepeats(tables: EditorTables, problems: CellProblem[]): void {
  for (const [table, rule] of Object.entries(REPEAT_KEYS) as [EditorTable, NonNullable<(typeof REPEAT_KEYS)[EditorTable]>][]) {
    const firstRow = new Map<string, number>();
    tables[table].forEach((row, index) => {
      const cells = Object.fromEntries(rule.fields.map((f) => [f, (row.cells[f] ?? '').trim()]));
      if (Object.values(cells).some((v) => v === '')) return;
      const key = rule.fields.map((f) => cells[f]).join('\u0000');
      const first = firstRow.get(key);
      if (first === undefined) firstRow.set(key, index + 1);
      else problems.push({ table, key: row.key, row: index + 1, field: rule.blame, problem: `${rule.what(cells)} is already in row ${first}` });
    });
  }
}

/** Reads a typed number: blanks and text become NaN so that sums skip them and the cell is flagged. */
function readNumber(text: string): number {
  const trimmed = text.trim().replace(',', '.');
  return trimmed === '' ? Number.NaN : Number(trimmed);
}

export function tablesToWeb(tables: EditorTables, header: { name: string; unit: string; areaKm2?: number; tonnesPerUnit?: number }): { web: Web; problems: CellProblem[] } {
  const problems: CellProblem[] = [];
  const ids = new Set(tables.compartments.map((r) => r.cells['id'].trim()).filter((id) => id !== ''));
  const seenIds = new Set<string>();
  const read = (table: EditorTable) =>
    tables[table].map((row, index) => {
      const item: Record<string, string | number> = {};
      for (const column of EDITOR_COLUMNS[table]) {
        const text = (row.cells[column.field] ?? '').trim();
        const flag = (problem: string) => problems.push({ table, key: row.key, row: index + 1, field: column.field, problem });
        if (text === '') {
          if (column.required) flag(`${column.label} is empty`);
          if (column.required && column.kind === 'number') item[column.field] = Number.NaN;
          else if (column.required) item[column.field] = '';
          continue;
        }
        if (column.kind === 'number') {
          const value = readNumber(text);
          if (!Number.isFinite(value)) flag(`“${text}” is not a number`);
          else if (value < 0) flag(`${column.label} must not be negative`);
          item[column.field] = value;
        } else {
          if (column.kind === 'compartment' && !ids.has(text)) flag(`no compartment has the id “${text}”`);
          if (table === 'compartments' && column.field === 'id') {
            if (seenIds.has(text)) flag(`the id “${text}” is used twice`);
            seenIds.add(text);
          }
          item[column.field] = text;
        }
      }
      return item;
    });
  flagRepeats(tables, problems);
  const web = {
    name: header.name,
    unit: header.unit,
    ...(header.areaKm2 !== undefined ? { areaKm2: header.areaKm2 } : {}),
    ...(header.tonnesPerUnit !== undefined ? { tonnesPerUnit: header.tonnesPerUnit } : {}),
    compartments: read('compartments'),
    flows: read('flows'),
    imports: read('imports'),
    exports: read('exports'),
    respiration: read('respiration'),
  } as unknown as Web;
  return { web, problems };
}
