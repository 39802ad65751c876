// Starts the job runner as a child process with the given environment (database, object storage).
import { spawn, type ChildProcess } from "node:child_process";
import path from "node:path";

const repoRoot = path.resolve(import.meta.dirname, "../..");

export function spawnJobRunner(env: NodeJS.ProcessEnv): ChildProcess {
  return spawn(process.execPath, ["--conditions=react-server", "--import", "tsx", "lib/jobs/main.ts"], {
    cwd: repoRoot,
    env,
    stdio: ["ignore", "inherit", "inherit"],
  });
}
