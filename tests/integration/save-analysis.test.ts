// Saving an analysis: the route checks the posted result and track, saveAnalysis writes analysis, reps,
// series and set measures in one transaction, a failure half-way keeps the previous analysis whole, and
// concurrent saves leave exactly one consistent analysis. Results come from the real engine on
// synthetic tracks (tests/fixtures/synthetic), so nothing here is a hand-made stand-in.
import { readFileSync } from "node:fs";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { count, eq, inArray } from "drizzle-orm";
import { ListObjectsV2Command } from "@aws-sdk/client-s3";
import { closeDb, db } from "@/db";
import { analyses, repSeries, reps, setMeasures, sets } from "@/db/schema";
import { saveAnalysis, getAnalysis } from "@/db/queries/analyses";
import { analyseTrack } from "@/lib/analysis/analyse";
import { parseTrack } from "@/lib/analysis/track";
import type { AnalysisResult } from "@/lib/analysis/result";
import { s3Client, storageConfig } from "@/lib/storage";
import type { MailFake } from "@/dev/fakes/mail-fake";
import { generateSyntheticSet, type TrackJson } from "@/tests/fixtures/synthetic";
import { ensureClip } from "@/tests/fixtures/clips/generate-clip";
import * as analysisRoute from "@/app/api/sets/[setId]/analysis/route";
import { buildWorld, call, json, startTestMail, type World } from "./helpers";
import { createTestSet, startTestStorage, uploadWhole, type TestStorage } from "./clip-helpers";

interface ErrorBody {
  error: { code: string; message: string };
}
interface AnalysisBody {
  analysis: {
    id: string;
    model: string;
    reps: { repIndex: number; meanConcentricVelocityMps: number; romM: number; flags: unknown[]; series: Record<string, number[]> }[];
    set: { repCount: number; velocityLossPct: number | null };
    frames: { t: number; bar: { x: number; y: number } | null }[] | null;
    cautions: string[];
  };
  trackUrl: string | null;
}

let mail: MailFake;
let storage: TestStorage;
let world: World;
let clipBytes: Uint8Array;

interface Analysed {
  track: TrackJson;
  result: AnalysisResult;
}

function analysed(seed: number, repCount: number): Analysed {
  const { track } = generateSyntheticSet({ lift: "squat", seed, reps: repCount, view: "side" });
  return { track, result: analyseTrack(parseTrack(track), { includeFrames: true, loadKg: 140 }) };
}

const bodyOf = ({ track, result }: Analysed) => ({
  model: { id: "movenet-lightning", version: "test" },
  settings: { poseSchedule: "every-frame" },
  calibration: track.calibration,
  result,
  track,
});

function post(setId: string, body: unknown, cookie = world.athleteA1.cookie): Promise<Response> {
  return call(analysisRoute.POST, "", { method: "POST", cookie, params: { setId }, body });
}

async function setWithClip(): Promise<string> {
  const setId = await createTestSet(world.athleteA1, { teamId: world.teamA.id });
  expect((await uploadWhole(world.athleteA1, setId, clipBytes)).status).toBe(200);
  return setId;
}

async function objectsUnder(setId: string): Promise<string[]> {
  const listed = await s3Client().send(new ListObjectsV2Command({ Bucket: storageConfig().bucket, Prefix: `sets/${setId}/` }));
  return (listed.Contents ?? []).map((o) => o.Key as string).sort();
}

async function rowCounts(setId: string) {
  const ids = (await db.select({ id: analyses.id }).from(analyses).where(eq(analyses.setId, setId))).map((a) => a.id);
  if (ids.length === 0) return { analyses: 0, reps: 0, series: 0, measures: 0 };
  const repIds = (await db.select({ id: reps.id }).from(reps).where(inArray(reps.analysisId, ids))).map((r) => r.id);
  const [series] = repIds.length ? await db.select({ n: count() }).from(repSeries).where(inArray(repSeries.repId, repIds)) : [{ n: 0 }];
  const [measures] = await db.select({ n: count() }).from(setMeasures).where(inArray(setMeasures.analysisId, ids));
  return { analyses: ids.length, reps: repIds.length, series: series.n, measures: measures.n };
}

const threeReps = analysed(3, 3);
const fourReps = analysed(4, 4);

beforeAll(async () => {
  mail = await startTestMail();
  storage = await startTestStorage();
  world = await buildWorld("save-analysis");
  clipBytes = readFileSync((await ensureClip({ width: 640, height: 360, durationS: 12 })).videoPath);
});

afterAll(async () => {
  await storage?.stop();
  await mail?.stop();
  await closeDb();
});

describe("POST and GET /api/sets/[setId]/analysis", () => {
  it("saves reps with measures, flags and 101-point series, set measures, and the track beside the clip", async () => {
    const setId = await setWithClip();
    expect((await call(analysisRoute.GET, "", { cookie: world.athleteA1.cookie, params: { setId } })).status).toBe(404);
    const response = await post(setId, bodyOf(threeReps));
    expect(response.status).toBe(201);

    const read = await call(analysisRoute.GET, "", { cookie: world.coachA.cookie, params: { setId } });
    expect(read.status).toBe(200);
    const { analysis, trackUrl } = await json<AnalysisBody>(read);
    expect(analysis.model).toBe("movenet-lightning@test");
    expect(analysis.reps.map((r) => r.repIndex)).toEqual([1, 2, 3]);
    for (const [i, rep] of analysis.reps.entries()) {
      const expected = threeReps.result.reps[i];
      expect(rep.meanConcentricVelocityMps).toBe(expected.meanConcentricVelocityMps);
      expect(rep.romM).toBe(expected.romM);
      expect(rep.flags).toEqual(expected.flags);
      expect(Object.keys(rep.series).sort()).toEqual(["barVelocityMps", "barXM", "barYM", "hipAngleDeg", "kneeAngleDeg", "torsoAngleDeg"]);
      // Stored as float4 (real[]): about 7 significant digits.
      rep.series.barVelocityMps.forEach((v, k) => expect(v).toBeCloseTo(expected.series.barVelocityMps?.[k] as number, 5));
    }
    expect(analysis.set.repCount).toBe(3);
    expect(analysis.set.velocityLossPct).toBe(threeReps.result.set.velocityLossPct);
    // The per-frame bar positions keep the route's shape ([{ t, bar: { x, y } | null }]) and every digit.
    expect(analysis.frames?.length).toBe(threeReps.result.frames?.length);
    expect(analysis.frames).toEqual(JSON.parse(JSON.stringify(threeReps.result.frames)));
    expect(analysis.cautions).toEqual(threeReps.result.cautions);

    const stored = await (await fetch(trackUrl as string)).json();
    expect(stored).toEqual(JSON.parse(JSON.stringify(parseTrack(threeReps.track))));
    expect(await rowCounts(setId)).toEqual({ analyses: 1, reps: 3, series: 18, measures: 1 });
    const [row] = await db.select({ status: sets.status }).from(sets).where(eq(sets.id, setId));
    expect(row.status).toBe("analysed");
  });

  it("replaces the analysis on re-analysis, with its old track object", async () => {
    const setId = await setWithClip();
    expect((await post(setId, bodyOf(threeReps))).status).toBe(201);
    const before = await objectsUnder(setId);
    expect((await post(setId, bodyOf(fourReps), world.coachA.cookie)).status).toBe(201);
    expect(await rowCounts(setId)).toEqual({ analyses: 1, reps: 4, series: 24, measures: 1 });
    const after = await objectsUnder(setId);
    expect(after).toHaveLength(before.length);
    expect(after.filter((k) => k.includes("/tracks/"))).not.toEqual(before.filter((k) => k.includes("/tracks/")));
  });

  it("refuses a result for another lift, a malformed track and a set without a clip, changing nothing", async () => {
    const setId = await setWithClip();
    expect((await post(setId, bodyOf(threeReps))).status).toBe(201);
    const objects = await objectsUnder(setId);
    const counts = await rowCounts(setId);

    const bench = analysed(5, 3);
    const benchTrack = generateSyntheticSet({ lift: "bench", seed: 5, reps: 3, view: "side" }).track;
    const benchBody = bodyOf({ track: benchTrack, result: analyseTrack(parseTrack(benchTrack), {}) });
    const wrongLift = await post(setId, benchBody);
    expect(wrongLift.status).toBe(400);
    expect((await json<ErrorBody>(wrongLift)).error.message).toBe("The analysis is for a bench, but the set is a squat.");

    const broken = bodyOf(bench);
    broken.track = { ...bench.track, frames: bench.track.frames.map((f, i) => (i === 12 ? { ...f, bar: { x: "left", y: 1, score: 1 } } : f)) } as never;
    const badTrack = await post(setId, broken);
    expect(badTrack.status).toBe(400);
    expect((await json<ErrorBody>(badTrack)).error.message).toMatch(/^The track is not valid: frames\[12\]\.bar\.x/);

    const renumbered = bodyOf(threeReps);
    renumbered.result = { ...threeReps.result, reps: threeReps.result.reps.map((r) => ({ ...r, index: 1 })) };
    expect((await post(setId, renumbered)).status).toBe(400);

    expect(await rowCounts(setId)).toEqual(counts);
    expect(await objectsUnder(setId)).toEqual(objects);

    const noClip = await createTestSet(world.athleteA1);
    const refused = await post(noClip, bodyOf(threeReps));
    expect(refused.status).toBe(409);
    expect(await objectsUnder(noClip)).toEqual([]);
  });
});

describe("saveAnalysis", () => {
  const input = ({ track, result }: Analysed) => ({
    model: "movenet-lightning@test",
    settings: {},
    calibration: track.calibration,
    result,
    trackStorageKey: null,
  });

  it("keeps the previous analysis whole when a save fails half-way", async () => {
    const setId = await setWithClip();
    const first = await saveAnalysis(
      { userId: world.athleteA1.id, name: "", email: "", role: "user", emailVerified: true },
      setId,
      input(threeReps),
    );
    // Two reps numbered 1: the analysis row and the first rep go in, then the unique (analysis, rep) index refuses.
    const duplicated = { ...fourReps.result, reps: fourReps.result.reps.map((r) => ({ ...r, index: 1 })) };
    await expect(
      saveAnalysis({ userId: world.athleteA1.id, name: "", email: "", role: "user", emailVerified: true }, setId, {
        ...input(fourReps),
        result: duplicated,
      }),
    ).rejects.toThrow();
    const kept = await getAnalysis(setId);
    expect(kept?.id).toBe(first.analysisId);
    expect(kept?.reps.map((r) => r.meanConcentricVelocityMps)).toEqual(threeReps.result.reps.map((r) => r.meanConcentricVelocityMps));
    expect(await rowCounts(setId)).toEqual({ analyses: 1, reps: 3, series: 18, measures: 1 });
  });

  it("leaves exactly one consistent analysis after concurrent saves", async () => {
    const viewer = { userId: world.coachA.id, name: "", email: "", role: "user" as const, emailVerified: true };
    const candidates = [threeReps, fourReps].map((a) => a.result.reps.map((r) => r.meanConcentricVelocityMps));
    for (let round = 0; round < 4; round++) {
      const setId = await setWithClip();
      await Promise.all([saveAnalysis(viewer, setId, input(threeReps)), saveAnalysis(viewer, setId, input(fourReps))]);
      const current = await getAnalysis(setId);
      const velocities = current?.reps.map((r) => r.meanConcentricVelocityMps);
      expect(candidates).toContainEqual(velocities);
      expect(current?.set?.repCount).toBe(velocities?.length);
      const counts = await rowCounts(setId);
      expect(counts).toEqual({ analyses: 1, reps: velocities?.length, series: 6 * (velocities?.length ?? 0), measures: 1 });
    }
  });

  it("refuses a viewer without access to the set", async () => {
    const setId = await setWithClip();
    const outsider = { userId: world.coachB.id, name: "", email: "", role: "user" as const, emailVerified: true };
    await expect(saveAnalysis(outsider, setId, input(threeReps))).rejects.toThrow("You do not have access to this set.");
    expect(await rowCounts(setId)).toEqual({ analyses: 0, reps: 0, series: 0, measures: 0 });
  });
});
