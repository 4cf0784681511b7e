import { sql } from 'drizzle-orm';
import { check, doublePrecision, index, integer, jsonb, pgTable, primaryKey, text, timestamp, unique } from 'drizzle-orm/pg-core';
import type { CompartmentKind, TableSelection, VersionStatus } from '@seinework/contracts';
import { users } from './accounts';

/**
 * Stored webs and their versions. A web (name, place, period, unit) has a history of numbered
 * versions; each version holds a whole web, normalised into rows: compartments, flows, imports,
 * exports (a harvest is an export with its fleet and price per tonne) and respiration, each with
 * its position so that the web reads back in the order it was given. Every save is a new version;
 * a published version is immutable (the service never changes one, and the triggers of migration
 * 0002 refuse any UPDATE or DELETE of a published version or its rows).
 */

const at = (name: string) => timestamp(name, { withTimezone: true, mode: 'date' });

export const webs = pgTable(
  'webs',
  {
    id: text('id').primaryKey(),
    name: text('name').notNull(),
    place: text('place').notNull().default(''),
    period: text('period').notNull().default(''),
    unit: text('unit').notNull(),
    createdBy: text('created_by')
      .notNull()
      .references(() => users.id),
    createdAt: at('created_at').notNull().defaultNow(),
    /** The time of the latest version or publication: the list sorts by it. */
    updatedAt: at('updated_at').notNull().defaultNow(),
  },
  (table) => [index('webs_updated_at_idx').on(table.updatedAt)],
);

export const webVersions = pgTable(
  'web_versions',
  {
    id: text('id').primaryKey(),
    webId: text('web_id')
      .notNull()
      .references(() => webs.id),
    /** 1, 2, 3, … within the web; the unique constraint guards against two saves taking one number. */
    number: integer('number').notNull(),
    status: text('status').$type<VersionStatus>().notNull().default('draft'),
    note: text('note').notNull().default(''),
    /** The version this one was edited or cloned from (possibly of another web). */
    basedOn: text('based_on'),
    createdBy: text('created_by')
      .notNull()
      .references(() => users.id),
    createdAt: at('created_at').notNull().defaultNow(),
    publishedBy: text('published_by').references(() => users.id),
    publishedAt: at('published_at'),
    /** WEB.json's own name and unit of this version, and its scale. */
    webName: text('web_name').notNull(),
    unit: text('unit').notNull(),
    areaKm2: doublePrecision('area_km2'),
    tonnesPerUnit: doublePrecision('tonnes_per_unit'),
  },
  (table) => [
    unique('web_versions_web_number_unique').on(table.webId, table.number),
    check('web_versions_status_check', sql`${table.status} in ('draft', 'published')`),
    check('web_versions_published_check', sql`(${table.status} = 'published') = (${table.publishedAt} is not null and ${table.publishedBy} is not null)`),
  ],
);

const versionId = () =>
  text('version_id')
    .notNull()
    .references(() => webVersions.id);
const position = () => integer('position').notNull();
const cv = () => doublePrecision('cv');

export const versionCompartments = pgTable(
  'version_compartments',
  {
    versionId: versionId(),
    position: position(),
    compartmentId: text('compartment_id').notNull(),
    name: text('name').notNull(),
    kind: text('kind').$type<CompartmentKind>().notNull(),
    biomass: doublePrecision('biomass'),
  },
  (table) => [primaryKey({ columns: [table.versionId, table.position] }), unique('version_compartments_compartment_unique').on(table.versionId, table.compartmentId)],
);

export const versionFlows = pgTable(
  'version_flows',
  {
    versionId: versionId(),
    position: position(),
    fromId: text('from_id').notNull(),
    toId: text('to_id').notNull(),
    value: doublePrecision('value').notNull(),
    cv: cv(),
  },
  (table) => [primaryKey({ columns: [table.versionId, table.position] })],
);

export const versionImports = pgTable(
  'version_imports',
  {
    versionId: versionId(),
    position: position(),
    toId: text('to_id').notNull(),
    value: doublePrecision('value').notNull(),
    cv: cv(),
  },
  (table) => [primaryKey({ columns: [table.versionId, table.position] })],
);

/** Exports, harvests among them: a harvest names the fleet that lands it and its price per tonne. */
export const versionExports = pgTable(
  'version_exports',
  {
    versionId: versionId(),
    position: position(),
    fromId: text('from_id').notNull(),
    value: doublePrecision('value').notNull(),
    fleet: text('fleet'),
    price: doublePrecision('price'),
    cv: cv(),
  },
  (table) => [primaryKey({ columns: [table.versionId, table.position] })],
);

export const versionRespiration = pgTable(
  'version_respiration',
  {
    versionId: versionId(),
    position: position(),
    fromId: text('from_id').notNull(),
    value: doublePrecision('value').notNull(),
    cv: cv(),
  },
  (table) => [primaryKey({ columns: [table.versionId, table.position] })],
);

/** The engine's analysis of a version, computed once (a version's web never changes), per table selection. */
export const versionAnalyses = pgTable(
  'version_analyses',
  {
    versionId: text('version_id')
      .notNull()
      .references(() => webVersions.id),
    /** 'summary' or 'all' (the `?tables=` of the analysis route). */
    tables: text('tables').$type<TableSelection>().notNull(),
    document: jsonb('document').notNull(),
    computedAt: at('computed_at').notNull().defaultNow(),
  },
  (table) => [primaryKey({ columns: [table.versionId, table.tables] })],
);
