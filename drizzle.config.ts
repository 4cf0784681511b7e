import { defineConfig } from 'drizzle-kit';

// `node_modules/.bin/drizzle-kit generate` writes a new SQL migration into drizzle/ from the schema;
// the server applies drizzle/ at start-up (apps/server/src/db/database.ts).
export default defineConfig({
  dialect: 'postgresql',
  schema: './apps/server/src/db/schema/index.ts',
  out: './drizzle',
});
