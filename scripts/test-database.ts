// Test databases live on the same server as the development one, under their own names.
import { databaseUrl, withDatabase } from "./database-url";
import { ensureLocalPostgres } from "./postgres";
import { migrateDatabase, recreateDatabase } from "./databases";

/**
 * A fresh, migrated database for one test run; returns its URL.
 * PLUMBLINE_DB_SUFFIX keeps the databases of two checkouts that share one server apart.
 */
export async function freshTestDatabase(name: string): Promise<string> {
  if (!process.env.DATABASE_URL) ensureLocalPostgres();
  const url = withDatabase(databaseUrl(), `${name}${process.env.PLUMBLINE_DB_SUFFIX ?? ""}`);
  await recreateDatabase(url);
  await migrateDatabase(url);
  return url;
}
