import { defineConfig } from 'drizzle-kit';

// Migrations are generated from db/schema by `npm run db:generate` and committed.
// They are applied by db/migrate.ts on every start; generation never needs a server.
export default defineConfig({
  dialect: 'postgresql',
  schema: './db/schema/index.ts',
  out: './migrations',
});
