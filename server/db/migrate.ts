import { migrate } from 'drizzle-orm/mysql2/migrator';
import { fileURLToPath } from 'node:url';
import { join, dirname } from 'node:path';
import type { Database } from './client.js';

const migrationsFolder = join(dirname(fileURLToPath(import.meta.url)), '..', '..', 'drizzle');

/** Applies the committed SQL migrations in drizzle/ that the database has not seen. */
export async function migrateDatabase(database: Database): Promise<void> {
  await migrate(database.db, { migrationsFolder });
}
