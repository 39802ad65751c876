// The load behind tests/bench/trends-queries.ts: one team (a coach, athletes) with a few thousand analysed
// sets inserted in bulk (sets, analyses, reps, 101-point series, set measures), then the compare and trends
// queries timed one call at a time under concurrent callers. Prints latency percentiles.
import { loadavg } from "node:os";
import { performance } from "node:perf_hooks";
import { closeDb, db } from "@/db";
import { analyses, memberships, repSeries, reps, setMeasures, sets, teams, trainingSessions, user, type NewRep } from "@/db/schema";
import { getCompareReps, listPickableSets } from "@/db/queries/compare";
import { listRepsForExport } from "@/db/queries/exports";
import { STORED_SERIES } from "@/db/queries/analyses";
import { getTrendSets, listTrendAthletes } from "@/db/queries/trends";
import type { Viewer } from "@/db/queries/viewer";
import { analyseTrack } from "@/lib/analysis/analyse";
import { LIFTS } from "@/lib/validation/common";
import { generateSyntheticSet } from "@/tests/fixtures/synthetic";

const ATHLETES = 20;
const SETS_PER_ATHLETE = 150;
const CONCURRENCY = Number(process.env.BENCH_CONCURRENCY ?? 8);
const CHUNK = 1000;

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
  console.log(`${label.padEnd(34)} n=${String(times.length).padStart(5)}  p50 ${fmt(percentile(times, 50))} ms  p95 ${fmt(percentile(times, 95))} ms  p99 ${fmt(percentile(times, 99))} ms`);
}

async function insertChunked<T>(rows: T[], insert: (chunk: T[]) => Promise<unknown>): Promise<void> {
  for (let i = 0; i < rows.length; i += CHUNK) await insert(rows.slice(i, i + CHUNK));
}

const { track } = generateSyntheticSet({ lift: "squat", seed: 77, reps: 4, view: "side" });
const result = analyseTrack(track, { loadKg: 140 });

const started = performance.now();
const coach = { id: "bench-coach", name: "Bench Coach", email: "coach@bench.example" };
const athletes = Array.from({ length: ATHLETES }, (_, i) => ({ id: `bench-athlete-${i}`, name: `Bench Athlete ${i}`, email: `a${i}@bench.example` }));
await db.insert(user).values([coach, ...athletes].map((p) => ({ ...p, emailVerified: true })));
const [team] = await db.insert(teams).values({ name: "Bench Barbell", createdBy: coach.id }).returning();
await db.insert(memberships).values([
  { teamId: team.id, userId: coach.id, role: "coach" as const },
  ...athletes.map((a) => ({ teamId: team.id, userId: a.id, role: "athlete" as const })),
]);

const day = (k: number) => new Date(Date.UTC(2025, 0, 1) + k * 86_400_000);
const sessionRows = athletes.flatMap((a) =>
  Array.from({ length: SETS_PER_ATHLETE }, (_, k) => ({ athleteId: a.id, teamId: team.id, sessionDate: day(k).toISOString().slice(0, 10) })),
);
const sessionIds: string[] = [];
await insertChunked(sessionRows, async (chunk) => sessionIds.push(...(await db.insert(trainingSessions).values(chunk).returning({ id: trainingSessions.id })).map((r) => r.id)));

const setRows = sessionRows.map((s, i) => ({
  sessionId: sessionIds[i],
  athleteId: s.athleteId,
  teamId: team.id,
  // Mostly squats, like a squat-focused block; every lift present.
  lift: LIFTS[i % 5 === 0 ? 1 : i % 7 === 0 ? 2 : 0],
  loadKg: 100 + (i % 9) * 5,
  reps: 4,
  cameraView: "side" as const,
  clipStatus: "uploaded" as const,
  status: "analysed" as const,
  recordedAt: new Date(`${s.sessionDate}T10:00:00Z`),
}));
const setIds: string[] = [];
await insertChunked(setRows, async (chunk) => setIds.push(...(await db.insert(sets).values(chunk).returning({ id: sets.id })).map((r) => r.id)));

const analysisIds: string[] = [];
await insertChunked(setIds, async (chunk) =>
  analysisIds.push(
    ...(
      await db
        .insert(analyses)
        .values(chunk.map((setId) => ({ setId, model: "bench@0", engineVersion: result.engineVersion, settings: {}, scaleMetresPerPixel: 0.001, scaleMethod: "plate" as const, scaleUncertaintyPct: 1 })))
        .returning({ id: analyses.id })
    ).map((r) => r.id),
  ),
);
await insertChunked(analysisIds, (chunk) =>
  db.insert(setMeasures).values(
    chunk.map((analysisId, i) => ({
      analysisId,
      repCount: result.set.repCount,
      bestMeanVelocityMps: (result.set.bestMeanVelocityMps ?? 0.5) - (i % 9) * 0.03,
      lastMeanVelocityMps: result.set.lastMeanVelocityMps,
      velocityLossPct: result.set.velocityLossPct,
      startTorsoAngleSpreadDeg: result.set.startTorsoAngleSpreadDeg,
      barPathConsistencyCm: result.set.barPathConsistencyCm,
    })),
  ),
);
const repRows: NewRep[] = analysisIds.flatMap((analysisId) =>
  result.reps.map((r) => ({
    analysisId,
    repIndex: r.index,
    startS: r.startS,
    endS: r.endS,
    bottomS: r.bottomS,
    concentricEndS: r.concentricEndS,
    romM: r.romM,
    meanConcentricVelocityMps: r.meanConcentricVelocityMps,
    peakConcentricVelocityMps: r.peakConcentricVelocityMps,
    maxHorizontalDeviationCm: r.maxHorizontalDeviationCm,
    netHorizontalDriftCm: r.netHorizontalDriftCm,
    torsoAngleAtStartDeg: r.torsoAngleAtStartDeg,
    depthMarginCm: r.depthMarginCm,
    flags: r.flags,
  })),
);
const repIds: string[] = [];
await insertChunked(repRows, async (chunk) => repIds.push(...(await db.insert(reps).values(chunk).returning({ id: reps.id })).map((r) => r.id)));
const seriesRows = repIds.flatMap((repId, i) => {
  const series = result.reps[i % result.reps.length].series;
  return STORED_SERIES.flatMap((name) => (series[name] ? [{ repId, name, points: series[name] }] : []));
});
await insertChunked(seriesRows, (chunk) => db.insert(repSeries).values(chunk));
await db.execute("analyze");
const seconds = ((performance.now() - started) / 1000).toFixed(1);
console.log(
  `${setIds.length} analysed sets, ${repIds.length} reps, ${seriesRows.length} series rows, ${ATHLETES} athletes, inserted in ${seconds} s; ${CONCURRENCY} concurrent callers; machine load average ${loadavg()[0].toFixed(1)}`,
);

const coachViewer: Viewer = { userId: coach.id, name: coach.name, email: coach.email, role: "user", emailVerified: true };
const athleteViewer = (i: number): Viewer => ({ userId: athletes[i % ATHLETES].id, name: "x", email: "x", role: "user", emailVerified: true });
const repsPerSet = result.reps.length;
const repOf = (set: number, rep: number) => repIds[set * repsPerSet + rep];
const squatSetOf = (i: number) => {
  for (let k = (i * 37) % setIds.length; ; k = (k + 1) % setIds.length) if (setRows[k].lift === "squat") return k;
};

report("getCompareReps, rep 1 vs last", await timed(1000, (i) => {
  const s = squatSetOf(i);
  return getCompareReps(coachViewer, [repOf(s, 0), repOf(s, repsPerSet - 1)]);
}));
report("getCompareReps, 4 reps, 4 sets", await timed(1000, (i) => {
  const base = Math.floor(squatSetOf(i) / SETS_PER_ATHLETE) * SETS_PER_ATHLETE;
  const picks = Array.from({ length: 4 }, (_, k) => base + k * 35).filter((s) => setRows[s].lift === setRows[base].lift);
  const ids = picks.length >= 2 ? picks.map((s) => repOf(s, 0)) : [repOf(base, 0), repOf(base, 1)];
  return getCompareReps(coachViewer, ids);
}));
report("listPickableSets (12 sets)", await timed(1000, (i) => listPickableSets(coachViewer, { athleteId: athletes[i % ATHLETES].id, lift: "squat", limit: 12 })));
report("getTrendSets, coach", await timed(500, (i) => getTrendSets(coachViewer, athletes[i % ATHLETES].id, "squat")));
report("getTrendSets, athlete", await timed(500, (i) => getTrendSets(athleteViewer(i), athletes[i % ATHLETES].id, "squat")));
report("listTrendAthletes, coach", await timed(500, () => listTrendAthletes(coachViewer)));
report("listRepsForExport, one set", await timed(500, (i) => listRepsForExport(coachViewer, { set: setIds[(i * 13) % setIds.length] })));
report("listRepsForExport, athlete", await timed(200, (i) => listRepsForExport(coachViewer, { athlete: athletes[i % ATHLETES].id })));
await closeDb();
