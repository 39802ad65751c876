// The background job queue: pg-boss on the app's own PostgreSQL (pg-boss 10: the last major that runs on
// Node 20). The app enqueues inside its own transactions; the runner (lib/jobs/runner.ts) works the jobs.
import PgBoss from "pg-boss";

export const CONVERT_CLIP_QUEUE = "convert-clip";

export interface ConvertClipJob {
  setId: string;
}

/** A converted clip that still fails after this many tries is marked failed (ffmpeg errors repeat). */
const CONVERT_RETRY_LIMIT = 1;
/** ffmpeg on 2 cores converts 3 minutes of 1080p in a few minutes; longer means it is stuck. */
const CONVERT_EXPIRE_S = 30 * 60;

export function createBoss(databaseUrl: string, role: "sender" | "worker"): PgBoss {
  return new PgBoss({
    connectionString: databaseUrl,
    max: role === "sender" ? 2 : 4,
    // Only the runner keeps the queue tidy; senders just insert jobs.
    supervise: role === "worker",
    schedule: false,
  });
}

/** Installs pg-boss's schema (first start only) and the queues, idempotently. */
export async function startBoss(boss: PgBoss): Promise<PgBoss> {
  await boss.start();
  if (!(await boss.getQueue(CONVERT_CLIP_QUEUE))) {
    // "stately": at most one queued job per set (singletonKey), so repeated requests do not pile up.
    await boss.createQueue(CONVERT_CLIP_QUEUE, {
      name: CONVERT_CLIP_QUEUE,
      policy: "stately",
      retryLimit: CONVERT_RETRY_LIMIT,
      expireInSeconds: CONVERT_EXPIRE_S,
    });
  }
  return boss;
}
