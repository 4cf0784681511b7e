import { asc, eq } from 'drizzle-orm';
import type { PgTable } from 'drizzle-orm/pg-core';
import type { Web } from '@seinework/contracts';
import type { Db } from '../db/database';
import { versionCompartments, versionExports, versionFlows, versionImports, versionRespiration, webVersions } from '../db/schema';

/**
 * A version's web ⇄ its rows (compartments, flows, imports, exports, respiration), position by
 * position, so that WEB.json reads back exactly as it was saved (optional fields left out, not null).
 */

/** Rows per INSERT: PostgreSQL takes at most 65,535 parameters in one statement. */
const CHUNK = 1_000;

export async function insertWebRows(tx: Db, versionId: string, web: Web): Promise<void> {
  const at = <T>(entries: readonly T[]) => entries.map((entry, position) => ({ versionId, position, entry }));
  await insertChunked(tx, versionCompartments, at(web.compartments).map(({ versionId, position, entry }) => ({ versionId, position, compartmentId: entry.id, name: entry.name, kind: entry.kind, biomass: entry.biomass ?? null })));
  await insertChunked(tx, versionFlows, at(web.flows).map(({ versionId, position, entry }) => ({ versionId, position, fromId: entry.from, toId: entry.to, value: entry.value, cv: entry.cv ?? null })));
  await insertChunked(tx, versionImports, at(web.imports).map(({ versionId, position, entry }) => ({ versionId, position, toId: entry.to, value: entry.value, cv: entry.cv ?? null })));
  await insertChunked(tx, versionExports, at(web.exports).map(({ versionId, position, entry }) => ({ versionId, position, fromId: entry.from, value: entry.value, fleet: entry.fleet ?? null, price: entry.price ?? null, cv: entry.cv ?? null })));
  await insertChunked(tx, versionRespiration, at(web.respiration).map(({ versionId, position, entry }) => ({ versionId, position, fromId: entry.from, value: entry.value, cv: entry.cv ?? null })));
}

async function insertChunked(tx: Db, table: PgTable, rows: readonly Record<string, unknown>[]): Promise<void> {
  for (let start = 0; start < rows.length; start += CHUNK) await tx.insert(table).values(rows.slice(start, start + CHUNK) as never);
}

export async function readWeb(db: Db, versionId: string): Promise<Web> {
  const [version] = await db.select().from(webVersions).where(eq(webVersions.id, versionId));
  // one after another, not Promise.all: `db` may be a transaction (the seed publishes inside one), and a
  // transaction's single connection takes one query at a time (pg 9 refuses overlapping ones); versions are cached
  const compartments = await db.select().from(versionCompartments).where(eq(versionCompartments.versionId, versionId)).orderBy(asc(versionCompartments.position));
  const flows = await db.select().from(versionFlows).where(eq(versionFlows.versionId, versionId)).orderBy(asc(versionFlows.position));
  const imports = await db.select().from(versionImports).where(eq(versionImports.versionId, versionId)).orderBy(asc(versionImports.position));
  const exports = await db.select().from(versionExports).where(eq(versionExports.versionId, versionId)).orderBy(asc(versionExports.position));
  const respiration = await db.select().from(versionRespiration).where(eq(versionRespiration.versionId, versionId)).orderBy(asc(versionRespiration.position));
  return present({
    name: version.webName,
    unit: version.unit,
    areaKm2: version.areaKm2,
    tonnesPerUnit: version.tonnesPerUnit,
    compartments: compartments.map((c) => present({ id: c.compartmentId, name: c.name, kind: c.kind, biomass: c.biomass })),
    flows: flows.map((f) => present({ from: f.fromId, to: f.toId, value: f.value, cv: f.cv })),
    imports: imports.map((f) => present({ to: f.toId, value: f.value, cv: f.cv })),
    exports: exports.map((f) => present({ from: f.fromId, value: f.value, fleet: f.fleet, price: f.price, cv: f.cv })),
    respiration: respiration.map((f) => present({ from: f.fromId, value: f.value, cv: f.cv })),
  }) as Web;
}

/** Leaves out the columns that are null: WEB.json has no nulls. */
function present<T extends object>(o: T): { [K in keyof T]: Exclude<T[K], null> } {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== null && v !== undefined)) as { [K in keyof T]: Exclude<T[K], null> };
}
