// Where the databases live: DATABASE_URL wins; otherwise the project-local cluster on loopback.
export const LOCAL_PG = {
  host: "127.0.0.1",
  port: 54329,
  user: "plumbline",
  password: "plumbline-local",
} as const;

export function localDatabaseUrl(database: string): string {
  const { user, password, host, port } = LOCAL_PG;
  return `postgres://${user}:${password}@${host}:${port}/${database}`;
}

export function databaseUrl(): string {
  return process.env.DATABASE_URL ?? localDatabaseUrl("plumbline");
}

/** The same server, another database (used to create and drop the test databases). */
export function withDatabase(url: string, database: string): string {
  const parsed = new URL(url);
  parsed.pathname = `/${database}`;
  return parsed.toString();
}
