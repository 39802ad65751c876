// Database backup and restore with Debian's pg_dump / pg_restore (custom format: compressed, restorable
// table by table). `npm run db:backup` writes .data/backups/<database>-<UTC time>.dump; `npm run db:restore`
// restores the newest one (or a given file) into a new database (`--into <name>`) or over DATABASE_URL's.
import { execFileSync } from "node:child_process";
import { existsSync, mkdirSync, readdirSync } from "node:fs";
import path from "node:path";
import { pathToFileURL } from "node:url";
import { parseArgs } from "node:util";
import { databaseUrl, withDatabase } from "./database-url";
import { databaseName, ensureDatabase } from "./databases";
import { postgresBinDir } from "./system-packages";

const repoRoot = path.resolve(import.meta.dirname, "..");
export const BACKUP_DIR = path.join(repoRoot, ".data", "backups");

/** The versioned client of Debian's postgresql package, so it matches the local server; PATH otherwise. */
function tool(name: "pg_dump" | "pg_restore"): string {
  const bin = postgresBinDir();
  return bin && existsSync(`${bin}/${name}`) ? `${bin}/${name}` : name;
}

/** `20261202T004512Z`: sorts by time as text. */
function stamp(now: Date): string {
  return now.toISOString().replace(/[-:]/g, "").replace(/\.\d+Z$/, "Z");
}

export function backupDatabase(url = databaseUrl(), dir = BACKUP_DIR, now = new Date()): string {
  mkdirSync(dir, { recursive: true });
  const file = path.join(dir, `${databaseName(url)}-${stamp(now)}.dump`);
  execFileSync(tool("pg_dump"), ["--format=custom", "--no-owner", "--no-privileges", `--file=${file}`, `--dbname=${url}`], { stdio: "inherit" });
  return file;
}

export function latestBackup(dir = BACKUP_DIR): string | null {
  const dumps = existsSync(dir) ? readdirSync(dir).filter((f) => f.endsWith(".dump")) : [];
  // Newest by the time at the end of the name (`…-20261202T004512Z.dump`), whatever the database.
  const newest = dumps.sort((a, b) => a.slice(-21).localeCompare(b.slice(-21))).at(-1);
  return newest ? path.join(dir, newest) : null;
}

/**
 * Restores a dump. Into a new database it is created first and must be empty; over an existing one the
 * dumped objects are dropped and recreated (`--clean`). One transaction: a failed restore changes nothing.
 */
export async function restoreDatabase(file: string, url: string, { clean = false } = {}): Promise<void> {
  await ensureDatabase(url);
  const args = ["--no-owner", "--no-privileges", "--single-transaction", "--exit-on-error", `--dbname=${url}`];
  if (clean) args.push("--clean", "--if-exists");
  execFileSync(tool("pg_restore"), [...args, file], { stdio: "inherit" });
}

async function main(): Promise<void> {
  const [command, ...rest] = process.argv.slice(2);
  if (command === "backup") {
    console.log(`[plumbline] backup written: ${path.relative(repoRoot, backupDatabase())}`);
    return;
  }
  const { values, positionals } = parseArgs({ args: rest, options: { into: { type: "string" } }, allowPositionals: true });
  const file = positionals[0] ?? latestBackup();
  if (!file) throw new Error(`no backup to restore in ${path.relative(repoRoot, BACKUP_DIR)}`);
  const target = values.into ? withDatabase(databaseUrl(), values.into) : databaseUrl();
  await restoreDatabase(file, target, { clean: !values.into });
  console.log(`[plumbline] restored ${path.basename(file)} into ${databaseName(target)}`);
}

if (process.argv[1] && import.meta.url === pathToFileURL(process.argv[1]).href) {
  main().catch((error: unknown) => {
    console.error(error instanceof Error ? error.message : error);
    process.exit(1);
  });
}
