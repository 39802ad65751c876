// Small helpers for the set-up scripts: run a command and fail loudly with its output.
import { spawnSync, type SpawnSyncOptions } from "node:child_process";

export function run(command: string, args: string[], options: SpawnSyncOptions = {}): string {
  const result = spawnSync(command, args, { encoding: "utf8", ...options });
  if (result.error) throw new Error(`${command} could not start: ${result.error.message}`);
  if (result.status !== 0) {
    const output = `${result.stdout ?? ""}${result.stderr ?? ""}`.trim();
    throw new Error(`${command} ${args.join(" ")} failed (exit ${result.status}):\n${output}`);
  }
  return String(result.stdout ?? "");
}

export function succeeds(command: string, args: string[], options: SpawnSyncOptions = {}): boolean {
  const result = spawnSync(command, args, { stdio: "ignore", ...options });
  return result.status === 0;
}

export function log(message: string): void {
  console.log(`[plumbline] ${message}`);
}
