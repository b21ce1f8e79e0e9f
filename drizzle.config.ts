import { defineConfig } from 'drizzle-kit';

// Migrations are generated from the table files and applied at server start-up
// (server/db/migrate.ts), for PGlite and for a PostgreSQL server alike.
export default defineConfig({
  dialect: 'postgresql',
  schema: './server/db/tables/index.ts',
  out: './drizzle',
});
