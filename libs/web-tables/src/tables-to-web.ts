import type { CompartmentKind, UploadProblem, Web } from '@seinework/contracts';
import { compartmentKindSchema } from '@seinework/contracts';
import { cellNumber, cellText } from './cells';
import { checkWithEngine, type RowSources } from './engine-check';
import { LAYOUT, WEB_KEYS, type TableName, type WebKey } from './layout';
import { MAX_COMPARTMENTS } from './limits';
import { ProblemList } from './problems';
import type { RawRow, RawTable } from './raw-table';

/**
 * From the tables of an upload to WEB.json, checking every row: missing columns, empty cells,
 * numbers that are not numbers or are negative, unknown kinds, unknown and duplicate compartments,
 * duplicate flows, imports, exports and respiration. The engine then checks the whole web.
 */

/** Text fields sent beside the file; a non-empty field wins over the file's `web` table. */
export interface WebFields {
  readonly name?: string;
  readonly unit?: string;
  readonly place?: string;
  readonly period?: string;
}

export interface WebRead {
  /** Present only when there are no problems. */
  readonly web?: Web;
  readonly place: string;
  readonly period: string;
  readonly problems: UploadProblem[];
  /** Unbalanced compartments: reported, not refused (see engine-check.ts). */
  readonly warnings: UploadProblem[];
}

const KINDS = compartmentKindSchema.options;

export function tablesToWeb(tables: readonly RawTable[], fields: WebFields = {}): WebRead {
  const problems = new ProblemList();
  const byName = new Map<TableName, RawTable>();
  for (const table of tables) {
    if (byName.has(table.name)) problems.add(table.name, null, null, `the ${table.name} table is given twice`);
    else byName.set(table.name, table);
  }
  for (const table of byName.values()) checkColumns(table, problems);

  const meta = readWebTable(byName.get('web'), fields, problems);
  const compartmentsTable = byName.get('compartments');
  if (!compartmentsTable) problems.add('compartments', null, null, 'there is no compartments table: a web needs at least one compartment');
  const reader = new RowReader(problems);
  const compartments = compartmentsTable ? reader.compartments(compartmentsTable) : [];
  // Ids named in the compartments table, valid rows or not: a bad compartment row is reported once, not again in every flow.
  const known = new Set(compartmentsTable?.rows.map((r) => cellText(r.cells['id'])).filter((id) => id !== undefined));
  const flows = reader.entries(byName.get('flows'), known);
  const imports = reader.entries(byName.get('imports'), known);
  const exports = reader.entries(byName.get('exports'), known);
  const respiration = reader.entries(byName.get('respiration'), known);

  const place = meta.place ?? '';
  const period = meta.period ?? '';
  if (!problems.empty) return { place, period, problems: problems.items, warnings: [] };

  const candidate = dropUndefined({
    name: meta.name,
    unit: meta.unit,
    areaKm2: meta.areaKm2,
    tonnesPerUnit: meta.tonnesPerUnit,
    compartments: compartments.map((c) => c.value),
    flows: flows.map((f) => f.value),
    imports: imports.map((f) => f.value),
    exports: exports.map((f) => f.value),
    respiration: respiration.map((f) => f.value),
  });
  const sources: RowSources = {
    compartments: compartments.map((c) => c.row),
    flows: flows.map((f) => f.row),
    imports: imports.map((f) => f.row),
    exports: exports.map((f) => f.row),
    respiration: respiration.map((f) => f.row),
  };
  const checked = checkWithEngine(candidate, sources);
  return { web: checked.web, place, period, problems: checked.problems, warnings: checked.warnings };
}

function checkColumns(table: RawTable, problems: ProblemList): void {
  const layout = LAYOUT[table.name];
  for (const column of table.columns) {
    if (column !== '' && !layout.columns.includes(column)) {
      problems.add(table.name, table.headerRow, column, `unknown column "${column}" (the ${table.name} table has ${layout.columns.join(', ')})`);
    }
  }
  for (const column of layout.required) {
    if (!table.columns.includes(column)) problems.add(table.name, table.headerRow, column, `missing column "${column}"`);
  }
}

interface WebMeta {
  name?: string;
  unit?: string;
  place?: string;
  period?: string;
  areaKm2?: number;
  tonnesPerUnit?: number;
}

function readWebTable(table: RawTable | undefined, fields: WebFields, problems: ProblemList): WebMeta {
  const meta: WebMeta = {};
  const seen = new Map<WebKey, number>();
  for (const { row, cells } of table?.rows ?? []) {
    const keyText = cellText(cells['key']);
    const key = WEB_KEYS.find((k) => k.toLowerCase() === keyText?.toLowerCase());
    if (keyText === undefined) {
      problems.add('web', row, 'key', 'the key is empty');
      continue;
    }
    if (key === undefined) {
      problems.add('web', row, 'key', `unknown key "${keyText}" (the web table has ${WEB_KEYS.join(', ')})`);
      continue;
    }
    const first = seen.get(key);
    if (first !== undefined) {
      problems.add('web', row, 'key', `duplicate key "${key}" (first given at row ${first})`);
      continue;
    }
    seen.set(key, row);
    if (key === 'areaKm2' || key === 'tonnesPerUnit') {
      const value = cellNumber(cells['value'], { table: 'web', row, column: 'value' }, problems);
      if (typeof value === 'number') meta[key] = value;
    } else {
      meta[key] = cellText(cells['value']);
    }
  }
  for (const key of ['name', 'unit', 'place', 'period'] as const) {
    const field = fields[key]?.trim();
    if (field) meta[key] = field;
  }
  for (const key of ['name', 'unit'] as const) {
    if (meta[key] === undefined) {
      problems.add('web', seen.get(key) ?? null, 'value', `the web has no ${key}: give a "${key}" row in the web table or the ${key} field`);
    }
  }
  return meta;
}

interface Located<T> {
  readonly row: number;
  readonly value: T;
}

type Entry = Web['flows'][number] | Web['imports'][number] | Web['exports'][number] | Web['respiration'][number];
type At = { readonly table: string; readonly row: number; readonly column: string };

/** Reads rows table by table, remembering where each compartment and flux was first given. */
class RowReader {
  constructor(private readonly problems: ProblemList) {}

  compartments(table: RawTable): Located<Web['compartments'][number]>[] {
    const found: Located<Web['compartments'][number]>[] = [];
    const firstRow = new Map<string, number>();
    for (const { row, cells } of table.rows) {
      const at = (column: string): At => ({ table: 'compartments', row, column });
      const id = this.required(table, cells, at('id'));
      const name = this.required(table, cells, at('name'));
      const kindText = this.required(table, cells, at('kind'));
      const kind = KINDS.find((k) => k === kindText?.toLowerCase());
      if (kindText !== undefined && kind === undefined) this.problems.add('compartments', row, 'kind', `unknown kind "${kindText}" (one of ${KINDS.join(', ')})`);
      const biomass = cellNumber(cells['biomass'], at('biomass'), this.problems);
      let duplicate = false;
      if (id !== undefined) {
        const first = firstRow.get(id);
        duplicate = first !== undefined;
        if (first !== undefined) this.problems.add('compartments', row, 'id', `duplicate compartment id "${id}" (first given at row ${first})`);
        else firstRow.set(id, row);
      }
      if (id === undefined || name === undefined || kind === undefined || biomass === 'invalid' || duplicate) continue;
      found.push({ row, value: dropUndefined({ id, name, kind: kind as CompartmentKind, biomass }) });
    }
    if (found.length > MAX_COMPARTMENTS) {
      this.problems.add('compartments', null, null, `${found.length} compartments: at most ${MAX_COMPARTMENTS} are accepted`);
    }
    return found;
  }

  entries<T extends Entry>(table: RawTable | undefined, known: ReadonlySet<string>): Located<T>[] {
    if (!table) return [];
    const found: Located<T>[] = [];
    const firstRow = new Map<string, number>();
    const columns = LAYOUT[table.name].columns;
    for (const { row, cells } of table.rows) {
      const at = (column: string): At => ({ table: table.name, row, column });
      const entry: Record<string, string | number | undefined> = {};
      let complete = true;
      for (const column of ['from', 'to'].filter((c) => columns.includes(c))) {
        const id = this.required(table, cells, at(column));
        if (id !== undefined && !known.has(id)) {
          this.problems.add(table.name, row, column, `unknown compartment "${id}"`);
          complete = false;
        }
        if (id === undefined) complete = false;
        entry[column] = id;
      }
      const value = cellNumber(cells['value'], at('value'), this.problems);
      if (value === undefined && table.columns.includes('value')) this.problems.add(table.name, row, 'value', 'value is empty');
      const cv = cellNumber(cells['cv'], at('cv'), this.problems);
      if (typeof value !== 'number' || cv === 'invalid') complete = false;
      entry['value'] = typeof value === 'number' ? value : undefined;
      if (columns.includes('fleet')) {
        entry['fleet'] = cellText(cells['fleet']);
        const price = cellNumber(cells['price'], at('price'), this.problems);
        if (price === 'invalid') complete = false;
        else if (price !== undefined && entry['fleet'] === undefined) {
          this.problems.add(table.name, row, 'price', 'a price is given for an export with no fleet');
          complete = false;
        }
        entry['price'] = price === 'invalid' ? undefined : price;
      }
      entry['cv'] = typeof cv === 'number' ? cv : undefined;
      const key = duplicateKey(table.name, entry);
      if (key !== undefined) {
        const first = firstRow.get(key.id);
        if (first !== undefined) {
          this.problems.add(table.name, row, null, `duplicate ${key.what} (first given at row ${first})`);
          complete = false;
        } else firstRow.set(key.id, row);
      }
      if (complete) found.push({ row, value: dropUndefined(entry) as unknown as T });
    }
    return found;
  }

  private required(table: RawTable, cells: RawRow['cells'], at: At): string | undefined {
    const text = cellText(cells[at.column]);
    // A missing column is reported once, against the header, by checkColumns.
    if (text === undefined && table.columns.includes(at.column)) this.problems.add(at.table, at.row, at.column, `${at.column} is empty`);
    return text;
  }
}

/** What makes two rows of a table the same flux, as the engine counts duplicates. */
function duplicateKey(table: TableName, entry: Record<string, string | number | undefined>): { id: string; what: string } | undefined {
  const { from, to, fleet } = entry;
  switch (table) {
    case 'flows':
      return from === undefined || to === undefined ? undefined : { id: `${from}\u0000${to}`, what: `flow ${from} → ${to}` };
    case 'imports':
      return to === undefined ? undefined : { id: String(to), what: `import into ${to}` };
    case 'exports':
      if (from === undefined) return undefined;
      return fleet === undefined ? { id: `${from}\u0000`, what: `export from ${from}` } : { id: `${from}\u0000${fleet}`, what: `catch of ${from} by fleet ${fleet}` };
    case 'respiration':
      return from === undefined ? undefined : { id: String(from), what: `respiration of ${from}` };
    default:
      return undefined;
  }
}

function dropUndefined<T extends object>(o: T): T {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) as T;
}
