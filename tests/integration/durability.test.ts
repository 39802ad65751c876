// Concurrency and durability of saved analyses: two re-analyses of one set racing through the route leave
// exactly one consistent analysis and one track object; a process killed (SIGKILL) in the middle of saving
// loses nothing it had acknowledged and leaves no half-written analysis behind.
import { spawn } from "node:child_process";
import { readFileSync } from "node:fs";
import path from "node:path";
import { createInterface } from "node:readline";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { count, eq, inArray, sql } from "drizzle-orm";
import { ListObjectsV2Command } from "@aws-sdk/client-s3";
import { closeDb, db } from "@/db";
import { analyses, repSeries, reps, setMeasures, sets } from "@/db/schema";
import { s3Client, storageConfig } from "@/lib/storage";
import type { MailFake } from "@/dev/fakes/mail-fake";
import { analyseTrack } from "@/lib/analysis/analyse";
import { parseTrack } from "@/lib/analysis/track";
import { generateSyntheticSet } from "@/tests/fixtures/synthetic";
import * as analysisRoute from "@/app/api/sets/[setId]/analysis/route";
import { createOldSet } from "./access-matrix/world";
import { buildWorld, call, startTestMail, type World } from "./helpers";
import { startTestStorage, uploadWhole, type TestStorage } from "./clip-helpers";
import { ensureClip } from "@/tests/fixtures/clips/generate-clip";

const ROOT = path.resolve(import.meta.dirname, "../..");

let mail: MailFake;
let storage: TestStorage;
let world: World;

beforeAll(async () => {
  mail = await startTestMail();
  storage = await startTestStorage();
  world = await buildWorld("durability");
});

afterAll(async () => {
  await storage?.stop();
  await mail?.stop();
  await closeDb();
});

/** Every analysis of the sets is whole: its measures row, reps matching the rep count, six series per rep. */
async function assertWhole(setIds: string[]): Promise<void> {
  const rows = await db.select({ id: analyses.id }).from(analyses).where(inArray(analyses.setId, setIds));
  for (const { id } of rows) {
    const [measures] = await db.select({ repCount: setMeasures.repCount }).from(setMeasures).where(eq(setMeasures.analysisId, id));
    expect(measures, `measures of ${id}`).toBeDefined();
    const repIds = (await db.select({ id: reps.id }).from(reps).where(eq(reps.analysisId, id))).map((r) => r.id);
    expect(repIds).toHaveLength(measures.repCount);
    const [series] = repIds.length ? await db.select({ n: count() }).from(repSeries).where(inArray(repSeries.repId, repIds)) : [{ n: 0 }];
    expect(series.n).toBe(6 * repIds.length);
  }
  const [orphans] = await db.execute<{ n: number }>(sql`
    select (select count(*) from ${reps} r where not exists (select 1 from ${analyses} a where a.id = r.analysis_id))
         + (select count(*) from ${setMeasures} m where not exists (select 1 from ${analyses} a where a.id = m.analysis_id)) as n`).then((r) => r.rows);
  expect(Number(orphans.n)).toBe(0);
}

describe("two re-analyses racing through the route", () => {
  it("leave one analysis, whole, and one track object — the one it points at", async () => {
    const clip = readFileSync((await ensureClip({ width: 640, height: 360, durationS: 12 })).videoPath);
    const bodies = [3, 5].map((repCount, seed) => {
      const { track } = generateSyntheticSet({ lift: "squat", seed: seed + 20, reps: repCount, view: "side" });
      const result = analyseTrack(parseTrack(track), { includeFrames: true, loadKg: 140 });
      return { model: { id: "movenet-lightning", version: `race-${repCount}` }, settings: {}, calibration: track.calibration, result, track };
    });
    for (let round = 0; round < 3; round++) {
      const setId = await createOldSet(world.athleteA1, { teamId: world.teamA.id });
      expect((await uploadWhole(world.athleteA1, setId, clip)).status).toBe(200);
      const [a, b] = await Promise.all([
        call(analysisRoute.POST, "", { method: "POST", cookie: world.athleteA1.cookie, params: { setId }, body: bodies[0] }),
        call(analysisRoute.POST, "", { method: "POST", cookie: world.coachA.cookie, params: { setId }, body: bodies[1] }),
      ]);
      expect([a.status, b.status]).toEqual([201, 201]);
      const current = await db.select().from(analyses).where(eq(analyses.setId, setId));
      expect(current).toHaveLength(1);
      await assertWhole([setId]);
      const listed = await s3Client().send(new ListObjectsV2Command({ Bucket: storageConfig().bucket, Prefix: `sets/${setId}/` }));
      const tracks = (listed.Contents ?? []).map((o) => o.Key as string).filter((k) => k.includes("/tracks/"));
      expect(tracks).toEqual([current[0].trackStorageKey]);
    }
  });
});

describe("a process killed mid-save", () => {
  it("loses no acknowledged save and leaves no half-written analysis", { timeout: 120_000 }, async () => {
    const setIds = await Promise.all([1, 2, 3].map(() => createOldSet(world.athleteA1, { teamId: world.teamA.id })));
    // The clip itself plays no part here: the sets only need to count as having a checked one.
    await db.update(sets).set({ clipStatus: "uploaded", clipStorageKey: "durability/none" }).where(inArray(sets.id, setIds));
    const child = spawn(process.execPath, ["--conditions=react-server", "--import", "tsx", "tests/integration/support/save-loop.ts", world.admin.id, ...setIds], {
      cwd: ROOT,
      env: process.env,
      stdio: ["ignore", "pipe", "inherit"],
    });
    const acked = new Map<string, number>();
    let acks = 0;
    const killed = new Promise<void>((resolve) => child.on("exit", () => resolve()));
    for await (const line of createInterface({ input: child.stdout })) {
      const [word, setId, index] = line.split(" ");
      if (word !== "ack") continue;
      acked.set(setId, Number(index));
      // Kill at an uneven moment after a warm-up, while the next save is under way.
      if (++acks === 25) {
        await new Promise((resolve) => setTimeout(resolve, 7));
        child.kill("SIGKILL");
        break;
      }
    }
    await killed;
    expect(acks).toBe(25);
    for (const [setId, lastAcked] of acked) {
      const [current] = await db.select({ model: analyses.model }).from(analyses).where(eq(analyses.setId, setId));
      // The set's analysis is the last acknowledged save, or one that committed after it.
      expect(Number(current.model.split("@")[1])).toBeGreaterThanOrEqual(lastAcked);
    }
    await assertWhole(setIds);
    for (const setId of setIds) expect((await db.select({ n: count() }).from(analyses).where(eq(analyses.setId, setId)))[0].n).toBe(1);
  });
});
