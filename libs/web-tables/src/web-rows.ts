import type { Web } from '@seinework/contracts';
import { LAYOUT, TABLE_NAMES, type TableName } from './layout';

/** Place and period travel with a stored web but are not part of WEB.json. */
export interface WebPlace {
  readonly place: string;
  readonly period: string;
}

export type OutRow = Record<string, string | number>;

/** A web as the rows of each table of our layout, for the CSV and XLSX writers. */
export function webRows(web: Web, details: WebPlace): Record<TableName, OutRow[]> {
  const pick = (table: TableName, entry: object): OutRow =>
    Object.fromEntries(
      LAYOUT[table].columns.flatMap((c) => {
        const value = (entry as Record<string, unknown>)[c];
        return value === undefined ? [] : [[c, value as string | number]];
      }),
    );
  const meta: [string, string | number | undefined][] = [
    ['name', web.name],
    ['unit', web.unit],
    ['place', details.place],
    ['period', details.period],
    ['areaKm2', web.areaKm2],
    ['tonnesPerUnit', web.tonnesPerUnit],
  ];
  const rows = {
    web: meta.map(([key, value]): OutRow => (value === undefined || value === '' ? { key } : { key, value })),
  } as Record<TableName, OutRow[]>;
  for (const table of TABLE_NAMES.slice(1) as Exclude<TableName, 'web'>[]) rows[table] = web[table].map((entry) => pick(table, entry));
  return rows;
}
