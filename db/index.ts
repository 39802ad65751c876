// The shared database client: one pg pool per process for DATABASE_URL (or the local cluster),
// kept on globalThis so hot reloads in development reuse it.
import pg from "pg";
import { drizzle, type NodePgDatabase } from "drizzle-orm/node-postgres";
import { databaseUrl } from "@/scripts/database-url";
import * as baseSchema from "./schema";
import * as billingSchema from "./schema-billing";
import * as reviewSchema from "./schema-review";
import * as markupSchema from "./schema-markup";
import * as preferencesSchema from "./schema-preferences";
import * as hardeningSchema from "./schema-hardening";

// One typed client over every area's tables: one spread line per area schema file (db/schema-<area>.ts).
const schema = {
  ...baseSchema,
  ...billingSchema,
  ...reviewSchema,
  ...markupSchema,
  ...preferencesSchema,
  ...hardeningSchema,
};

export type Database = NodePgDatabase<typeof schema>;
/** A transaction handle; query helpers accept either, so they compose inside one transaction. */
export type Transaction = Parameters<Parameters<Database["transaction"]>[0]>[0];
export type Executor = Database | Transaction;

const globalForDb = globalThis as unknown as { plumblinePool?: pg.Pool };

/** A drizzle client over its own pool, for scripts that target another database (the seed, tests). */
export function createDatabase(url: string, max = 10): { db: Database; pool: pg.Pool } {
  const pool = new pg.Pool({ connectionString: url, max });
  return { db: drizzle(pool, { schema }), pool };
}

function sharedPool(): pg.Pool {
  globalForDb.plumblinePool ??= new pg.Pool({ connectionString: databaseUrl(), max: 10 });
  return globalForDb.plumblinePool;
}

export const db: Database = drizzle(sharedPool(), { schema });

/** Closes the shared pool (test files and scripts call this when they finish). */
export async function closeDb(): Promise<void> {
  const pool = globalForDb.plumblinePool;
  globalForDb.plumblinePool = undefined;
  await pool?.end();
}

export { schema };
