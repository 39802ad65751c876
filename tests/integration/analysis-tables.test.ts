// The analysis tables accept what later issues will store, and the database itself refuses broken data:
// a second current analysis for a set, a series that is not 101 points long, a rep index below 1.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, eq } from "drizzle-orm";
import { closeDb, db } from "@/db";
import { analyses, repSeries, reps, setMeasures } from "@/db/schema";
import { createSet } from "@/db/queries/sets";
import type { MailFake } from "@/dev/fakes/mail-fake";
import { signUp, startTestMail } from "./helpers";

let mail: MailFake;
let setId: string;

const analysisRow = (id: string) => ({
  setId: id,
  model: "movenet-lightning",
  engineVersion: "0.1.0",
  settings: { cutoffHz: 6, sampleRateHz: 30 },
  scaleMetresPerPixel: 0.0021,
  scaleMethod: "plate" as const,
  scaleUncertaintyPct: 3,
  cautions: ["Estimates from video, not medical advice."],
});

beforeAll(async () => {
  mail = await startTestMail();
  const athlete = await signUp("analysis-tables");
  const set = await createSet(athlete.id, {
    teamId: null, sessionDate: "2026-01-05", lift: "squat", variant: null, loadKg: 100, reps: 3, rpe: null,
    cameraView: "side", note: null, recordedAt: null,
  });
  setId = set.id;
});

afterAll(async () => {
  await mail.stop();
  await closeDb();
});

describe("analysis tables", () => {
  it("store an analysis with reps, 101-point series and set measures, and read them back through relations", async () => {
    const [analysis] = await db.insert(analyses).values(analysisRow(setId)).returning();
    const [rep] = await db
      .insert(reps)
      .values({ analysisId: analysis.id, repIndex: 1, startS: 0.4, endS: 2.9, romM: 0.62, meanConcentricVelocityMps: 0.51, depthReached: true, flags: [] })
      .returning();
    const points = Array.from({ length: 101 }, (_, i) => i / 100);
    await db.insert(repSeries).values({ repId: rep.id, name: "barVelocityMps", points });
    await db.insert(setMeasures).values({ analysisId: analysis.id, repCount: 1, bestMeanVelocityMps: 0.51 });

    const stored = await db.query.analyses.findFirst({
      where: eq(analyses.id, analysis.id),
      with: { reps: { with: { series: true } }, setMeasures: true },
    });
    expect(stored?.reps[0].romM).toBe(0.62);
    expect(stored?.reps[0].kneeAngleAtBottomDeg).toBeNull();
    expect(stored?.reps[0].series[0].points).toHaveLength(101);
    expect(stored?.reps[0].series[0].points[37]).toBeCloseTo(0.37, 6);
    expect(stored?.setMeasures?.repCount).toBe(1);
  });

  it("refuse a second current analysis for the same set, but keep older ones once they are no longer current", async () => {
    await expect(db.insert(analyses).values(analysisRow(setId))).rejects.toThrow();
    await db.update(analyses).set({ isCurrent: false }).where(eq(analyses.setId, setId));
    await db.insert(analyses).values(analysisRow(setId));
    expect(await db.select().from(analyses).where(eq(analyses.setId, setId))).toHaveLength(2);
  });

  it("refuse a series that is not 101 points and a rep index below 1", async () => {
    const [current] = await db.select().from(analyses).where(and(eq(analyses.setId, setId), eq(analyses.isCurrent, true)));
    const [rep] = await db.insert(reps).values({ analysisId: current.id, repIndex: 1, startS: 0, endS: 1 }).returning();
    await expect(db.insert(repSeries).values({ repId: rep.id, name: "kneeAngleDeg", points: [1, 2, 3] })).rejects.toThrow();
    await expect(db.insert(reps).values({ analysisId: current.id, repIndex: 0, startS: 0, endS: 1 })).rejects.toThrow();
  });
});
