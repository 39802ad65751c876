// Enqueues jobs from route handlers, inside the caller's database transaction (see requestClipConversion).
import "server-only";
import type PgBoss from "pg-boss";
import { databaseUrl } from "@/scripts/database-url";
import type { SqlExecutor } from "@/db/queries/clips";
import { CONVERT_CLIP_QUEUE, createBoss, startBoss, type ConvertClipJob } from "./queue";

const globalForJobs = globalThis as unknown as { plumblineBoss?: Promise<PgBoss> };

function sender(): Promise<PgBoss> {
  globalForJobs.plumblineBoss ??= startBoss(createBoss(databaseUrl(), "sender")).catch((error: unknown) => {
    globalForJobs.plumblineBoss = undefined;
    throw error;
  });
  return globalForJobs.plumblineBoss;
}

export async function enqueueClipConversion(executor: SqlExecutor, job: ConvertClipJob): Promise<void> {
  const boss = await sender();
  await boss.send(CONVERT_CLIP_QUEUE, job, { singletonKey: job.setId, db: executor as PgBoss.Db });
}
