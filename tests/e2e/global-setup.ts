// Browser tests run against the production build, on a fresh database, with the local fakes in-process.
import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import path from "node:path";
import type {} from "vitest";
import type { TestProject } from "vitest/node";
import { freshTestDatabase } from "@/scripts/test-database";
import { freePort, waitForHttp } from "@/scripts/ports";
import { startFakes } from "@/dev/fakes";
import { spawnJobRunner } from "@/lib/jobs/spawn";
import { buildAnalysisWorker } from "@/scripts/build-worker";
import { ensureModels } from "@/scripts/models";

declare module "vitest" {
  export interface ProvidedContext {
    baseUrl: string;
    mailUrl: string;
    paymentsUrl: string;
    databaseUrl: string;
  }
}

const repoRoot = path.resolve(import.meta.dirname, "../..");

function buildApp(env: NodeJS.ProcessEnv): void {
  if (process.env.PLUMBLINE_SKIP_BUILD === "1") return;
  const result = spawnSync("npx", ["next", "build"], { cwd: repoRoot, env, stdio: "inherit" });
  if (result.status !== 0) throw new Error("next build failed");
}

export default async function setup(project: TestProject): Promise<() => Promise<void>> {
  const databaseUrl = await freshTestDatabase("plumbline_e2e");
  const fakes = await startFakes({ ephemeral: true });
  const port = await freePort();
  const baseUrl = `http://127.0.0.1:${port}`;
  fakes.setAppUrl(baseUrl);
  const env = { ...process.env, ...fakes.env, DATABASE_URL: databaseUrl, BETTER_AUTH_URL: baseUrl, NODE_ENV: "production" as const, NEXT_TELEMETRY_DISABLED: "1",
    // The browser tests sign several people up and in from one address.
    PLUMBLINE_RATE_LIMIT_FACTOR: process.env.PLUMBLINE_RATE_LIMIT_FACTOR ?? "1000",
  };
  // The worker and the pose models are served from public/: both must be there before `next build`.
  await ensureModels();
  await buildAnalysisWorker();
  buildApp(env);
  const server: ChildProcess = spawn("npx", ["next", "start", "-H", "127.0.0.1", "-p", String(port)], {
    cwd: repoRoot,
    env,
    stdio: ["ignore", "inherit", "inherit"],
    detached: true,
  });
  const jobs = spawnJobRunner(env);
  await waitForHttp(`${baseUrl}/`, 60_000);
  project.provide("baseUrl", baseUrl);
  project.provide("mailUrl", fakes.mailUrl);
  project.provide("paymentsUrl", fakes.paymentsUrl);
  project.provide("databaseUrl", databaseUrl);
  return async () => {
    if (server.pid) process.kill(-server.pid, "SIGTERM");
    jobs.kill("SIGTERM");
    await fakes.stop();
  };
}
