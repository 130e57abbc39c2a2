import { defineConfig } from 'drizzle-kit';

// Only `drizzle-kit generate` is used (no push): migrations are SQL files committed in drizzle/.
export default defineConfig({
  dialect: 'mysql',
  schema: './server/db/schema.ts',
  out: './drizzle',
  casing: 'snake_case',
});
