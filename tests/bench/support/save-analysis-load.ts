// The load behind tests/bench/save-analysis.ts: sets with checked clips, then concurrent saves and reads
// of real engine results (synthetic tracks), timed one call at a time. Prints latency percentiles.
import { performance } from "node:perf_hooks";
import { closeDb, db } from "@/db";
import { sets, trainingSessions, user } from "@/db/schema";
import { getAnalysis, saveAnalysis } from "@/db/queries/analyses";
import { analyseTrack } from "@/lib/analysis/analyse";
import { parseTrack } from "@/lib/analysis/track";
import { generateSyntheticSet } from "@/tests/fixtures/synthetic";

const SETS = 40;
const SAVES = 200;
const READS = 1000;
const CONCURRENCY = Number(process.env.BENCH_CONCURRENCY ?? 8);

function percentile(sorted: number[], p: number): number {
  return sorted[Math.min(sorted.length - 1, Math.floor((p / 100) * sorted.length))];
}

async function timed(count: number, call: (i: number) => Promise<unknown>): Promise<number[]> {
  const times: number[] = [];
  let next = 0;
  const lane = async () => {
    for (let i = next++; i < count; i = next++) {
      const started = performance.now();
      await call(i);
      times.push(performance.now() - started);
    }
  };
  await Promise.all(Array.from({ length: CONCURRENCY }, lane));
  return times.sort((a, b) => a - b);
}

function report(label: string, times: number[]): void {
  const fmt = (v: number) => v.toFixed(1).padStart(7);
  console.log(`${label.padEnd(28)} n=${String(times.length).padStart(5)}  p50 ${fmt(percentile(times, 50))} ms  p95 ${fmt(percentile(times, 95))} ms  p99 ${fmt(percentile(times, 99))} ms`);
}

const results = [3, 5].map((reps, i) => {
  const { track } = generateSyntheticSet({ lift: "squat", seed: 40 + i, reps, view: "side" });
  return { track, result: analyseTrack(parseTrack(track), { includeFrames: true, loadKg: 150 }) };
});

await db.insert(user).values({ id: "bench-athlete", name: "Bench Athlete", email: "bench@bench.example", emailVerified: true });
const [session] = await db.insert(trainingSessions).values({ athleteId: "bench-athlete", sessionDate: "2026-01-01" }).returning();
const setIds = (
  await db
    .insert(sets)
    .values(
      Array.from({ length: SETS }, () => ({
        sessionId: session.id,
        athleteId: "bench-athlete",
        lift: "squat" as const,
        loadKg: 150,
        reps: 5,
        cameraView: "side" as const,
        clipStatus: "uploaded" as const,
        clipStorageKey: "bench/original",
      })),
    )
    .returning({ id: sets.id })
).map((s) => s.id);

const viewer = { userId: "bench-athlete", name: "Bench Athlete", email: "bench@bench.example", role: "user" as const, emailVerified: true };
console.log(`${SETS} sets, ${CONCURRENCY} concurrent callers, results of 3 and 5 reps (6 series of 101 points per rep)`);
report("saveAnalysis", await timed(SAVES, (i) => {
  const { track, result } = results[i % results.length];
  return saveAnalysis(viewer, setIds[i % SETS], { model: "bench@0", settings: {}, calibration: track.calibration, result, trackStorageKey: null });
}));
report("getAnalysis", await timed(READS, (i) => getAnalysis(setIds[i % SETS])));
report("getAnalysis, no frames", await timed(READS, (i) => getAnalysis(setIds[i % SETS], { frames: false })));
await closeDb();
