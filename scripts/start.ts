// `npm start`: installs what is missing, starts PostgreSQL and the local fakes, migrates,
// loads the demo data into an empty database, starts the job runner (clip conversion), then serves
// the app on http://127.0.0.1:3000.
import { spawn } from "node:child_process";
import { ensureSystemPackages } from "./system-packages";
import { ensureLocalPostgres } from "./postgres";
import { ensureDatabase, migrateDatabase } from "./databases";
import { databaseUrl } from "./database-url";
import { ensureModels } from "./models";
import { buildAnalysisWorker } from "./build-worker";
import { startFakes } from "@/dev/fakes";
import { seedDemoData } from "@/dev/demo/seed";
import { spawnJobRunner } from "@/lib/jobs/spawn";
import { log } from "./run";

ensureSystemPackages(["postgresql", "ffmpeg"]);
await ensureModels();
await buildAnalysisWorker();
if (!process.env.DATABASE_URL) ensureLocalPostgres();
const url = databaseUrl();
await ensureDatabase(url);
await migrateDatabase(url);
// The fakes first: the demo seed stores its clips in the object-storage fake.
const fakes = await startFakes({ ephemeral: false, appUrl: "http://127.0.0.1:3000" });
log(`mail fake: read sent mails at ${fakes.mailUrl}`);
log(`payment fake: ${fakes.paymentsUrl} (hosted checkout and portal pages; webhooks to the app)`);
Object.assign(process.env, fakes.env);
await seedDemoData(url);

const appEnv = { ...process.env, ...fakes.env, DATABASE_URL: url, NEXT_TELEMETRY_DISABLED: "1" };
const jobs = spawnJobRunner(appEnv);
const app = spawn("npx", ["next", "dev", "-H", "127.0.0.1", "-p", "3000"], {
  stdio: "inherit",
  env: appEnv,
});
log("Plumbline: http://127.0.0.1:3000");

const shutdown = async () => {
  app.kill("SIGTERM");
  jobs.kill("SIGTERM");
  await fakes.stop();
  process.exit(0);
};
process.on("SIGINT", shutdown);
process.on("SIGTERM", shutdown);
app.on("exit", async (code) => {
  jobs.kill("SIGTERM");
  await fakes.stop();
  process.exit(code ?? 0);
});
