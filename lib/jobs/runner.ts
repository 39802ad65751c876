// Works the background jobs (clip conversion) against the app's database and object storage.
// Started by `npm start`, by the browser tests' global setup, and in-process by integration tests.
import { CONVERT_CLIP_QUEUE, createBoss, startBoss, type ConvertClipJob } from "./queue";
import { convertClip } from "./convert-clip";

export interface JobRunner {
  stop: () => Promise<void>;
}

/** Checks for new jobs this often when idle; conversions take seconds, so a second's delay is unnoticed. */
const POLLING_INTERVAL_S = 1;

export async function startJobRunner(databaseUrl: string): Promise<JobRunner> {
  const boss = await startBoss(createBoss(databaseUrl, "worker"));
  boss.on("error", (error) => console.error("[jobs] queue error:", error));
  await boss.work<ConvertClipJob>(CONVERT_CLIP_QUEUE, { pollingIntervalSeconds: POLLING_INTERVAL_S, batchSize: 1 }, async (jobs) => {
    for (const job of jobs) await convertClip(job.data.setId);
  });
  return { stop: () => boss.stop({ graceful: true, timeout: 15_000 }) };
}
