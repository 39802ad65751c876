// A project-local PostgreSQL cluster on loopback, made from Debian's server binaries.
// Idempotent: creates the cluster once, starts it when it is not running, copes with a stale pid file.
import { chmodSync, chownSync, existsSync, mkdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { createHash } from "node:crypto";
import os from "node:os";
import path from "node:path";
import { spawnSync } from "node:child_process";
import { log, run } from "./run";
import { ensureSystemPackages, postgresBinDir } from "./system-packages";
import { LOCAL_PG } from "./database-url";

const repoRoot = path.resolve(import.meta.dirname, "..");

function isRoot(): boolean {
  return process.getuid?.() === 0;
}

function systemUserIds(name: string): { uid: number; gid: number } {
  const uid = Number(run("id", ["-u", name]).trim());
  const gid = Number(run("id", ["-g", name]).trim());
  return { uid, gid };
}

// initdb refuses to run as root, so as root the cluster belongs to Debian's `postgres` user.
function asClusterOwner(command: string, args: string[]): string {
  return isRoot() ? run("runuser", ["-u", "postgres", "--", command, ...args]) : run(command, args);
}

function clusterOwnerCanUse(dir: string): boolean {
  if (!isRoot()) return true;
  return spawnSync("runuser", ["-u", "postgres", "--", "test", "-x", dir], { stdio: "ignore" }).status === 0;
}

// Prefer `.data/` inside the repo; fall back to the temp folder when the postgres user
// cannot reach the repo (a home folder with mode 700, for example).
function clusterRoot(): string {
  const inRepo = path.join(repoRoot, ".data");
  mkdirSync(inRepo, { recursive: true });
  if (clusterOwnerCanUse(inRepo)) return inRepo;
  const hash = createHash("sha256").update(repoRoot).digest("hex").slice(0, 12);
  const fallback = path.join(os.tmpdir(), `plumbline-${hash}`);
  mkdirSync(fallback, { recursive: true });
  chmodSync(fallback, 0o755);
  return fallback;
}

function makeOwnedDir(dir: string): void {
  mkdirSync(dir, { recursive: true });
  if (isRoot()) {
    const { uid, gid } = systemUserIds("postgres");
    chownSync(dir, uid, gid);
  }
  chmodSync(dir, 0o700);
}

function initCluster(bin: string, dataDir: string): void {
  const pwFile = path.join(path.dirname(dataDir), "pg-password");
  writeFileSync(pwFile, LOCAL_PG.password);
  if (isRoot()) {
    const { uid, gid } = systemUserIds("postgres");
    chownSync(pwFile, uid, gid);
  }
  log("creating the local PostgreSQL cluster");
  asClusterOwner(`${bin}/initdb`, [
    "-D", dataDir,
    "-U", LOCAL_PG.user,
    `--pwfile=${pwFile}`,
    "--auth-host=scram-sha-256",
    "--auth-local=peer",
    "-E", "UTF8",
    "--locale=C.UTF-8",
  ]);
  rmSync(pwFile);
}

function isRunning(bin: string, dataDir: string): boolean {
  const status = isRoot()
    ? spawnSync("runuser", ["-u", "postgres", "--", `${bin}/pg_ctl`, "status", "-D", dataDir], { stdio: "ignore" })
    : spawnSync(`${bin}/pg_ctl`, ["status", "-D", dataDir], { stdio: "ignore" });
  return status.status === 0;
}

function removeStalePidFile(dataDir: string): void {
  const pidFile = path.join(dataDir, "postmaster.pid");
  if (!existsSync(pidFile)) return;
  const pid = Number(readFileSync(pidFile, "utf8").split("\n")[0]);
  const alive = Number.isInteger(pid) && pid > 0 && spawnSync("kill", ["-0", String(pid)]).status === 0;
  if (!alive) {
    log("removing a stale PostgreSQL pid file");
    rmSync(pidFile);
  }
}

function waitUntilReady(bin: string): void {
  for (let attempt = 0; attempt < 100; attempt++) {
    const ready = spawnSync(`${bin}/pg_isready`, ["-h", LOCAL_PG.host, "-p", String(LOCAL_PG.port)], { stdio: "ignore" });
    if (ready.status === 0) return;
    spawnSync("sleep", ["0.1"]);
  }
  throw new Error(`PostgreSQL did not accept connections on ${LOCAL_PG.host}:${LOCAL_PG.port}`);
}

/** Makes sure the local cluster exists and runs; returns its data folder. */
export function ensureLocalPostgres(): string {
  ensureSystemPackages(["postgresql"]);
  const bin = postgresBinDir();
  if (!bin) throw new Error("PostgreSQL server binaries not found after install");
  const root = clusterRoot();
  const dataDir = path.join(root, "postgres");
  if (!existsSync(path.join(dataDir, "PG_VERSION"))) {
    rmSync(dataDir, { recursive: true, force: true });
    makeOwnedDir(dataDir);
    initCluster(bin, dataDir);
  }
  if (!isRunning(bin, dataDir)) {
    removeStalePidFile(dataDir);
    log(`starting PostgreSQL on ${LOCAL_PG.host}:${LOCAL_PG.port}`);
    const logFile = path.join(dataDir, "server.log");
    // No Unix socket: the repo path may be longer than a socket path allows; loopback TCP only.
    asClusterOwner(`${bin}/pg_ctl`, [
      "start", "-w", "-D", dataDir, "-l", logFile,
      "-o", `-p ${LOCAL_PG.port} -c listen_addresses=${LOCAL_PG.host} -c unix_socket_directories=''`,
    ]);
  }
  waitUntilReady(bin);
  return dataDir;
}

export function stopLocalPostgres(): void {
  const bin = postgresBinDir();
  if (!bin) return;
  const dataDir = path.join(clusterRoot(), "postgres");
  if (existsSync(dataDir) && isRunning(bin, dataDir)) asClusterOwner(`${bin}/pg_ctl`, ["stop", "-D", dataDir, "-m", "fast"]);
}
