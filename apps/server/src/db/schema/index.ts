// Every table of the database; drizzle-kit generates the migrations in drizzle/ from this module.
export * from './accounts';
export * from './webs';
export * from './options';
export * from './discussion';
