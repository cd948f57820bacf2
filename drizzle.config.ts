import { defineConfig } from 'drizzle-kit';

// Migrations are generated from the schema (`npm run db:generate`) and applied by the app at start.
export default defineConfig({
  dialect: 'postgresql',
  schema: './src/db/schema/index.ts',
  out: './drizzle',
  casing: 'snake_case',
});
