// Creates, recreates and migrates databases on the configured server.
import pg from "pg";
import { drizzle } from "drizzle-orm/node-postgres";
import { migrate } from "drizzle-orm/node-postgres/migrator";
import path from "node:path";
import { withDatabase } from "./database-url";

const migrationsFolder = path.resolve(import.meta.dirname, "../drizzle");

function quoteIdent(name: string): string {
  if (!/^[a-z_][a-z0-9_]*$/.test(name)) throw new Error(`unsafe database name: ${name}`);
  return `"${name}"`;
}

async function withAdminClient<T>(url: string, fn: (client: pg.Client) => Promise<T>): Promise<T> {
  const client = new pg.Client({ connectionString: withDatabase(url, "postgres") });
  await client.connect();
  try {
    return await fn(client);
  } finally {
    await client.end();
  }
}

export function databaseName(url: string): string {
  return decodeURIComponent(new URL(url).pathname.replace(/^\//, ""));
}

export async function ensureDatabase(url: string): Promise<void> {
  const name = databaseName(url);
  await withAdminClient(url, async (client) => {
    const found = await client.query("select 1 from pg_database where datname = $1", [name]);
    if (found.rowCount === 0) await client.query(`create database ${quoteIdent(name)}`);
  });
}

/** Drops and creates the database: tests start from nothing on every run. */
export async function recreateDatabase(url: string): Promise<void> {
  const name = databaseName(url);
  await withAdminClient(url, async (client) => {
    await client.query(`drop database if exists ${quoteIdent(name)} with (force)`);
    await client.query(`create database ${quoteIdent(name)}`);
  });
}

export async function migrateDatabase(url: string): Promise<void> {
  const pool = new pg.Pool({ connectionString: url, max: 1 });
  try {
    await migrate(drizzle(pool), { migrationsFolder });
  } finally {
    await pool.end();
  }
}
