// Rep compare and trends queries over a few thousand analysed sets, against a fresh local PostgreSQL
// database: p50/p95/p99 of getCompareReps, listPickableSets, getTrendSets, listTrendAthletes and the CSV
// export query. The queries are server-only modules, so the load runs in a child process started with the
// react-server condition (as the job runner is).
import { spawnSync } from "node:child_process";
import path from "node:path";
import { freshTestDatabase } from "@/scripts/test-database";

const repoRoot = path.resolve(import.meta.dirname, "../..");

export async function run(): Promise<void> {
  const databaseUrl = await freshTestDatabase("plumbline_bench_trends");
  const result = spawnSync(process.execPath, ["--conditions=react-server", "--import", "tsx", "tests/bench/support/trends-queries-load.ts"], {
    cwd: repoRoot,
    env: { ...process.env, DATABASE_URL: databaseUrl },
    stdio: "inherit",
  });
  if (result.status !== 0) throw new Error(`the trends-queries load exited with ${result.status}`);
}
