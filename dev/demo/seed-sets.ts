// The demo's analysed training history: eight weeks of squat, bench press and deadlift sets for three of
// the Ironbark lifters (dev/demo/demo-training.ts), each analysed by the real engine from a synthetic
// track with scripted motion and saved with the same writes as the app (replaceAnalysis). The newest top
// sets also get a rendered stick-figure clip and their track in object storage, and stay unreviewed so
// the coach's review desk has work. Idempotent: fixed set ids; a set already analysed is left alone.
import { randomUUID } from "node:crypto";
import { stat } from "node:fs/promises";
import { and, eq, inArray, sql } from "drizzle-orm";
import { createDatabase, type Database, type Transaction } from "@/db";
import { analyses, sets, trainingSessions } from "@/db/schema";
import { replaceAnalysis } from "@/db/queries/analyses";
import type { Viewer } from "@/db/queries/viewer";
import type { CheckedClip } from "@/db/queries/clips";
import type { Track } from "@/lib/analysis/track";
import { deleteObject, folderOf, newClipFolder, objectSize, putJson, uploadFile } from "@/lib/clips/storage";
import { verifyStoredClip } from "@/lib/clips/verify";
import { storageConfig } from "@/lib/storage";
import { generateSyntheticScene, type SyntheticOptions, type SyntheticScene } from "@/lib/synthetic";
import { analyseDemoScene, DEMO_ANALYSIS_NOTE, demoSyntheticOptions, type AnalysedDemoSet } from "./demo-analysis";
import { startDemoAnalysisPool } from "./demo-analysis-pool";
import { ensureDemoClip } from "./demo-clips";
import { pickClipSets, planDemoTraining, type DemoSetPlan } from "./demo-training";
import { log, succeeds } from "@/scripts/run";
import { DEMO_ATHLETES, DEMO_TEAM_ID } from "./seed";

/** Stands where the pose model's `id@version` goes: these keypoints were scripted, not detected. */
export const DEMO_ANALYSIS_MODEL = "demo-scripted@1";
export { DEMO_ANALYSIS_NOTE };
/** Sets analysed at once: enough to keep both workers busy, few enough to hold in memory. */
const LANES = 12;

/** Stable ids of the demo history's sets (a range of its own beside dev/demo/seed.ts's ids). */
export function demoSetId(ordinal: number): string {
  return `5e1d0c0a-7c3b-4a51-9a8e-d5${ordinal.toString(16).padStart(10, "0")}`;
}

/** The planned history for the demo athletes (the same every run). */
export function demoTrainingPlan(): DemoSetPlan[] {
  return planDemoTraining(
    DEMO_ATHLETES.flatMap((a) => (a.profile?.heightM ? [{ athleteId: a.id, statureM: a.profile.heightM, oneRepMaxesKg: a.profile.oneRepMaxesKg }] : [])),
  );
}

/** Ids of the sets with a clip, analysed and left for the coach to review. */
export function demoWaitingSetIds(): string[] {
  return pickClipSets(demoTrainingPlan()).map((p) => demoSetId(p.ordinal));
}

interface ExistingSet {
  analysed: boolean;
  clipStorageKey: string | null;
  trackStorageKey: string | null;
}

async function existingSets(db: Database, ids: string[]): Promise<Map<string, ExistingSet>> {
  const rows = await db
    .select({ id: sets.id, clipStorageKey: sets.clipStorageKey, analysisId: analyses.id, trackStorageKey: analyses.trackStorageKey })
    .from(sets)
    .leftJoin(analyses, and(eq(analyses.setId, sets.id), eq(analyses.isCurrent, true)))
    .where(inArray(sets.id, ids));
  return new Map(rows.map((r) => [r.id, { analysed: r.analysisId !== null, clipStorageKey: r.clipStorageKey, trackStorageKey: r.trackStorageKey }]));
}

/** Object storage answers and ffmpeg is installed: clips can be made and stored. */
async function clipsPossible(): Promise<{ ok: true } | { ok: false; reason: string }> {
  if (!succeeds("ffmpeg", ["-version"]) || !succeeds("ffprobe", ["-version"])) return { ok: false, reason: "ffmpeg is not installed" };
  const { endpoint } = storageConfig();
  try {
    await fetch(endpoint, { signal: AbortSignal.timeout(2000) });
    return { ok: true };
  } catch {
    return { ok: false, reason: `object storage at ${endpoint} does not answer` };
  }
}

/** The clip is stored and its track beside it, where a set's clip would be after an upload and an analysis. */
async function storedClipIsWhole(existing: ExistingSet | undefined): Promise<boolean> {
  if (!existing?.analysed || !existing.clipStorageKey || !existing.trackStorageKey) return false;
  const [clip, track] = await Promise.all([objectSize(existing.clipStorageKey), objectSize(existing.trackStorageKey)]);
  return clip !== null && track !== null;
}

interface StoredClip {
  storageKey: string;
  trackStorageKey: string;
  checked: CheckedClip;
}

/** Renders (or reuses) the clip, uploads it and the track, and checks the clip the way an upload is checked. */
async function storeClip(setId: string, previousKey: string | null, options: SyntheticOptions, scene: SyntheticScene, track: Track): Promise<StoredClip> {
  const file = await ensureDemoClip(options, scene);
  const storageKey = previousKey ?? `${newClipFolder(setId)}original`;
  const { size } = await stat(file);
  await uploadFile(storageKey, file, "video/mp4");
  const checked = await verifyStoredClip(storageKey, size);
  const trackStorageKey = `${folderOf(storageKey)}tracks/${randomUUID()}.json`;
  await putJson(trackStorageKey, track);
  return { storageKey, trackStorageKey, checked };
}

function dayOf(now: Date, daysAgo: number): string {
  return new Date(now.getTime() - daysAgo * 24 * 3600 * 1000).toISOString().slice(0, 10);
}

/** The athlete's training day on the team, created when missing (found by its natural key). */
async function sessionIdFor(tx: Transaction, athleteId: string, sessionDate: string): Promise<string> {
  await tx.insert(trainingSessions).values({ athleteId, teamId: DEMO_TEAM_ID, sessionDate }).onConflictDoNothing();
  const [row] = await tx
    .select({ id: trainingSessions.id })
    .from(trainingSessions)
    .where(and(eq(trainingSessions.athleteId, athleteId), eq(trainingSessions.teamId, DEMO_TEAM_ID), eq(trainingSessions.sessionDate, sessionDate)));
  return row.id;
}

function viewerFor(athleteId: string): Viewer {
  const person = DEMO_ATHLETES.find((a) => a.id === athleteId);
  if (!person) throw new Error(`no demo athlete ${athleteId}`);
  return { userId: person.id, name: person.name, email: person.email, role: "user", emailVerified: true };
}

interface Work {
  plan: DemoSetPlan;
  id: string;
  before: ExistingSet | undefined;
  wantsClip: boolean;
}

async function writeSet(db: Database, now: Date, work: Work, analysed: AnalysedDemoSet, clip: StoredClip | null): Promise<void> {
  const { plan: p, id, before } = work;
  const saved = await db.transaction(async (tx) => {
    // Demo rows can be written again by the next run: no need to wait for each commit to reach the disk.
    await tx.execute(sql`set local synchronous_commit = off`);
    if (!before) {
      const sessionDate = dayOf(now, p.daysAgo);
      await tx.insert(sets).values({
        id,
        sessionId: await sessionIdFor(tx, p.athleteId, sessionDate),
        athleteId: p.athleteId,
        teamId: DEMO_TEAM_ID,
        lift: p.lift,
        variant: p.variant,
        loadKg: p.loadKg,
        reps: p.reps,
        rpe: p.rpe,
        cameraView: "side",
        note: p.note,
        recordedAt: new Date(Date.parse(`${sessionDate}T17:30:00Z`) + p.orderInDay * 6 * 60 * 1000),
        createdBy: p.athleteId,
      });
    }
    if (clip) {
      // The columns finishClipUpload writes once an upload is checked.
      await tx
        .update(sets)
        .set({
          clipStatus: "uploaded",
          clipStorageKey: clip.storageKey,
          clipUploadId: null,
          clipSizeBytes: clip.checked.sizeBytes,
          clipContainer: clip.checked.container,
          clipCodec: clip.checked.codec,
          clipDurationS: clip.checked.durationS,
          clipWidthPx: clip.checked.widthPx,
          clipHeightPx: clip.checked.heightPx,
          clipError: null,
        })
        .where(eq(sets.id, id));
    }
    return replaceAnalysis(tx, viewerFor(p.athleteId), id, {
      model: DEMO_ANALYSIS_MODEL,
      settings: { source: "demo-scripted", barSource: "tracked", plateDiameterM: 0.45, note: DEMO_ANALYSIS_NOTE },
      calibration: analysed.calibration,
      result: analysed.result,
      trackStorageKey: clip?.trackStorageKey ?? null,
    });
  });
  await Promise.all(saved.replacedTrackKeys.map(deleteObject));
}

/** Loads the analysed history into the (migrated, demo-seeded) database at `url`; safe to run again. */
export async function seedDemoSets(url: string, now = new Date()): Promise<void> {
  const started = performance.now();
  const cpuBefore = process.cpuUsage();
  const { db, pool } = createDatabase(url, 2);
  try {
    const plan = demoTrainingPlan();
    const withClip = new Set(pickClipSets(plan).map((p) => p.ordinal));
    const existing = await existingSets(db, plan.map((p) => demoSetId(p.ordinal)));
    const possible = await clipsPossible();
    let storage = possible.ok;
    if (!possible.ok) log(`demo sets: seeding without clips (${possible.reason}); run the seed again with the fakes up to add them`);
    const todo: Work[] = [];
    for (const p of plan) {
      const id = demoSetId(p.ordinal);
      const before = existing.get(id);
      const wantsClip = storage && withClip.has(p.ordinal);
      if (before?.analysed && !(wantsClip && !(await storedClipIsWhole(before)))) continue;
      todo.push({ plan: p, id, before, wantsClip });
    }
    let clipsStored = 0;
    if (todo.length > 0) {
      // One writer at a time, in the order the analyses come back.
      let writes = Promise.resolve();
      const write = (work: Work, analysed: AnalysedDemoSet, clip: StoredClip | null) => (writes = writes.then(() => writeSet(db, now, work, analysed, clip)));
      const analyses = startDemoAnalysisPool();
      try {
        // Lanes that each take the next set once theirs is written: the workers stay busy while this
        // thread draws the clips below, and no more than a few analyses wait in memory for the writer.
        const queue = todo.filter((w) => !w.wantsClip);
        let next = 0;
        let failed = false;
        const lane = async (): Promise<void> => {
          while (!failed && next < queue.length) {
            const work = queue[next++];
            try {
              await write(work, await analyses.analyse(work.plan), null);
            } catch (error) {
              failed = true;
              throw error;
            }
          }
        };
        const lanes = Promise.all(Array.from({ length: LANES }, lane));
        // Awaited below; handled now so a failure while the clips are drawn does not end the process first.
        lanes.catch(() => undefined);
        // The clip sets in this thread: each clip is drawn from the same scene as its track.
        for (const work of todo.filter((w) => w.wantsClip)) {
          const options = demoSyntheticOptions(work.plan);
          const scene = generateSyntheticScene(options);
          const analysed = analyseDemoScene(work.plan, scene);
          let clip: StoredClip | null = null;
          if (storage) {
            try {
              clip = await storeClip(work.id, work.before?.clipStorageKey ?? null, options, scene, analysed.track);
              clipsStored++;
            } catch (error) {
              storage = false;
              log(`demo sets: continuing without clips, storing one failed: ${error instanceof Error ? error.message : String(error)}`);
            }
          }
          void write(work, analysed, clip);
        }
        await lanes;
        await writes;
      } finally {
        await analyses.close();
      }
    }
    const durationMs = performance.now() - started;
    // CPU time beside the wall time: on a shared machine the wall time says more about the neighbours.
    const cpu = process.cpuUsage(cpuBefore);
    log(
      `demo sets: ${plan.length} analysed sets in the history (${todo.length} analysed now, ${clipsStored} clips stored) ` +
        `in ${(durationMs / 1000).toFixed(1)} s (${((cpu.user + cpu.system) / 1e6).toFixed(1)} s of CPU in this process)`,
    );
  } finally {
    await pool.end();
  }
}
