// The demo data: loads into the test database, a second run changes nothing, and the demo accounts work.
// The analysed history: real engine output for every planned set, bar speed falling with load, fault
// flags, and clips with their tracks in the object-storage fake for the sets left for review.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { and, count, eq, inArray } from "drizzle-orm";
import { linearRegression } from "simple-statistics";
import type { MailFake } from "@/dev/fakes/mail-fake";
import { closeDb, db } from "@/db";
import {
  account,
  analyses,
  athleteProfiles,
  invitations,
  memberships,
  oneRepMaxes,
  repSeries,
  reps,
  setMeasures,
  sets,
  teams,
  trainingSessions,
  user,
} from "@/db/schema";
import { setComments, setReviews } from "@/db/schema-review";
import { getAnalysis } from "@/db/queries/analyses";
import { getJson, objectSize } from "@/lib/clips/storage";
import { DEMO_ATHLETES, DEMO_COACH, DEMO_INVITATION_TOKEN, DEMO_OPERATOR, DEMO_PASSWORD, DEMO_TEAM_ID, seedDemoData } from "@/dev/demo/seed";
import { DEMO_ANALYSIS_MODEL, DEMO_ANALYSIS_NOTE, demoSetId, demoTrainingPlan, demoWaitingSetIds } from "@/dev/demo/seed-sets";
import { DEMO_WEEKS } from "@/dev/demo/demo-training";
import { startTestStorage, type TestStorage } from "./clip-helpers";
import * as roster from "@/app/api/teams/[teamId]/roster/route";
import * as lookup from "@/app/api/invitations/[token]/route";
import * as me from "@/app/api/me/route";
import { call, cookiesFrom, json, signIn, startTestMail } from "./helpers";

let mail: MailFake;
let storage: TestStorage;

/** The first seed analyses a few hundred sets and renders four clips: allow for a busy 2-core machine. */
const SEED_TIMEOUT_MS = 300_000;

beforeAll(async () => {
  mail = await startTestMail();
  storage = await startTestStorage();
  // Another file (seed-billing.test.ts) may have loaded the demo data into this run's database already: remove it
  // (users and the team cascade to everything else), so the first load below is a first load in any file order.
  await db.delete(user).where(inArray(user.id, [DEMO_COACH.id, DEMO_OPERATOR.id, ...DEMO_ATHLETES.map((a) => a.id)]));
  await db.delete(teams).where(eq(teams.id, DEMO_TEAM_ID));
});

afterAll(async () => {
  await storage.stop();
  await mail.stop();
  await closeDb();
});

async function tableCounts(): Promise<Record<string, number>> {
  const tables = {
    user,
    account,
    teams,
    memberships,
    invitations,
    athleteProfiles,
    oneRepMaxes,
    trainingSessions,
    sets,
    analyses,
    reps,
    repSeries,
    setMeasures,
    setReviews,
    setComments,
  };
  const entries = await Promise.all(
    Object.entries(tables).map(async ([name, table]) => [name, (await db.select({ n: count() }).from(table))[0].n] as const),
  );
  return Object.fromEntries(entries);
}

describe("seedDemoData", () => {
  it("is idempotent: the second run adds nothing", { timeout: SEED_TIMEOUT_MS }, async () => {
    const url = process.env.DATABASE_URL!;
    const before = await tableCounts();
    await seedDemoData(url);
    const once = await tableCounts();
    expect(once.user - before.user).toBe(2 + DEMO_ATHLETES.length);
    expect(once.teams - before.teams).toBe(1);
    expect(once.sets - before.sets).toBeGreaterThanOrEqual(5 + demoTrainingPlan().length);
    expect(once.analyses - before.analyses).toBe(demoTrainingPlan().length);
    await seedDemoData(url);
    expect(await tableCounts()).toEqual(once);
  });

  it("lets the demo coach sign in with the documented password and see four athletes and a pending invitation", async () => {
    const response = await signIn(DEMO_COACH.email, DEMO_PASSWORD);
    expect(response.status).toBe(200);
    const cookie = cookiesFrom(response);
    const body = await json<{ athletes: { name: string; lastSetAt: string | null }[]; invitations: { status: string }[] }>(
      await call(roster.GET, "", { cookie, params: { teamId: DEMO_TEAM_ID } }),
    );
    expect(body.athletes.map((a) => a.name).sort()).toEqual(DEMO_ATHLETES.map((a) => a.name).sort());
    expect(body.athletes.filter((a) => a.lastSetAt !== null)).toHaveLength(3);
    expect(body.invitations.map((i) => i.status)).toEqual(["pending"]);
    const invitation = await json<{ status: string }>(await call(lookup.GET, "", { params: { token: DEMO_INVITATION_TOKEN } }));
    expect(invitation.status).toBe("valid");
  });

  it("gives athletes their profiles and the operator the admin role", async () => {
    const athlete = cookiesFrom(await signIn(DEMO_ATHLETES[0].email, DEMO_PASSWORD));
    const mine = await json<{ profile: { oneRepMaxes: Record<string, number> }; memberships: { role: string }[] }>(
      await call(me.GET, "/api/me", { cookie: athlete }),
    );
    expect(mine.profile.oneRepMaxes).toEqual(DEMO_ATHLETES[0].profile!.oneRepMaxesKg);
    expect(mine.memberships).toEqual([expect.objectContaining({ teamId: DEMO_TEAM_ID, role: "athlete" })]);
    const operator = cookiesFrom(await signIn(DEMO_OPERATOR.email, DEMO_PASSWORD));
    expect((await json<{ user: { role: string } }>(await call(me.GET, "/api/me", { cookie: operator }))).user.role).toBe("admin");
  });
});

describe("the demo's analysed history", () => {
  const plan = demoTrainingPlan();
  const athletesWithHistory = [...new Set(plan.map((p) => p.athleteId))];

  it("gives three athletes about eight weeks of squat, bench press and deadlift sets", () => {
    expect(athletesWithHistory.sort()).toEqual(["demo-athlete-bea", "demo-athlete-noor", "demo-athlete-tobin"]);
    for (const athleteId of athletesWithHistory) {
      const mine = plan.filter((p) => p.athleteId === athleteId);
      expect(new Set(mine.map((p) => p.lift))).toEqual(new Set(["squat", "bench", "deadlift"]));
      expect(new Set(mine.map((p) => p.week)).size).toBe(DEMO_WEEKS);
      expect(Math.max(...mine.map((p) => p.daysAgo))).toBeGreaterThanOrEqual(7 * (DEMO_WEEKS - 1));
    }
  });

  it("stores every planned set analysed by the engine: reps as done, measures and 101-point series", async () => {
    const rows = await db
      .select({ setId: sets.id, athleteId: sets.athleteId, plannedReps: sets.reps, status: sets.status, model: analyses.model, notes: analyses.notes, analysisId: analyses.id })
      .from(sets)
      .innerJoin(analyses, and(eq(analyses.setId, sets.id), eq(analyses.isCurrent, true)))
      .where(inArray(sets.id, plan.map((p) => demoSetId(p.ordinal))));
    expect(rows).toHaveLength(plan.length);
    for (const athleteId of athletesWithHistory) {
      expect(rows.filter((r) => r.athleteId === athleteId)).toHaveLength(plan.filter((p) => p.athleteId === athleteId).length);
    }
    for (const row of rows) {
      expect(row.status).toBe("analysed");
      expect(row.model).toBe(DEMO_ANALYSIS_MODEL);
      expect(row.notes).toContain(DEMO_ANALYSIS_NOTE);
    }
    const repCounts = await db.select({ analysisId: reps.analysisId, n: count() }).from(reps).groupBy(reps.analysisId);
    const byAnalysis = new Map(repCounts.map((r) => [r.analysisId, r.n]));
    for (const row of rows) expect(byAnalysis.get(row.analysisId), row.setId).toBe(row.plannedReps);
    const sample = await getAnalysis(rows[0].setId, { frames: false });
    for (const rep of sample!.reps) {
      expect(rep.series.barVelocityMps).toHaveLength(101);
      expect(rep.series.barYM).toHaveLength(101);
      expect(rep.meanConcentricVelocityMps).toBeGreaterThan(0);
    }
    expect(sample!.set?.repCount).toBe(rows[0].plannedReps);
  });

  it("has bar speed falling with load for every athlete and lift (negative load–velocity slope)", async () => {
    const points = await db
      .select({ athleteId: sets.athleteId, lift: sets.lift, loadKg: sets.loadKg, velocityMps: setMeasures.bestMeanVelocityMps })
      .from(sets)
      .innerJoin(analyses, and(eq(analyses.setId, sets.id), eq(analyses.isCurrent, true)))
      .innerJoin(setMeasures, eq(setMeasures.analysisId, analyses.id))
      .where(inArray(sets.id, plan.map((p) => demoSetId(p.ordinal))));
    for (const athleteId of athletesWithHistory) {
      for (const lift of ["squat", "bench", "deadlift"] as const) {
        const mine = points.filter((p) => p.athleteId === athleteId && p.lift === lift);
        const { m } = linearRegression(mine.map((p) => [p.loadKg, p.velocityMps!]));
        expect(m, `${athleteId} ${lift}`).toBeLessThan(0);
      }
    }
  });

  it("flags the scripted faults: hips rising first, bar drift, depth not reached", async () => {
    const flagged = await db
      .select({ flags: reps.flags })
      .from(reps)
      .innerJoin(analyses, eq(analyses.id, reps.analysisId))
      .where(inArray(analyses.setId, plan.map((p) => demoSetId(p.ordinal))));
    const codes = new Set(flagged.flatMap((r) => r.flags.map((f) => f.code)));
    for (const code of ["hips-rise-first", "bar-drift", "depth-not-reached"]) expect(codes).toContain(code);
  });

  it("keeps a checked H.264 clip and the per-frame track in storage for each set left for review", async () => {
    const waiting = demoWaitingSetIds();
    expect(waiting.length).toBeGreaterThanOrEqual(3);
    expect(waiting.length).toBeLessThanOrEqual(5);
    for (const setId of waiting) {
      const [row] = await db
        .select({ clipStatus: sets.clipStatus, clipCodec: sets.clipCodec, clipKey: sets.clipStorageKey, durationS: sets.clipDurationS, widthPx: sets.clipWidthPx, trackKey: analyses.trackStorageKey })
        .from(sets)
        .innerJoin(analyses, and(eq(analyses.setId, sets.id), eq(analyses.isCurrent, true)))
        .where(eq(sets.id, setId));
      expect(row).toMatchObject({ clipStatus: "uploaded", clipCodec: "h264", widthPx: 640 });
      expect(row.clipKey).toMatch(new RegExp(`^sets/${setId}/[A-Za-z0-9_-]{22}/original$`));
      expect(await objectSize(row.clipKey!)).toBeGreaterThan(10_000);
      const track = (await getJson(row.trackKey!)) as { fps: number; frames: { t: number }[] };
      // The clip shows the same motion as the track: they last as long (within a frame or two).
      expect(Math.abs(track.frames.at(-1)!.t - row.durationS!)).toBeLessThan(0.2);
    }
  });

  it("leaves only those sets waiting on the coach's desk; the rest are answered and read, with cues", async () => {
    const waiting = demoWaitingSetIds();
    const demoIds = demoTrainingPlan().map((p) => demoSetId(p.ordinal));
    const reviewed = await db
      .select({ setId: setReviews.setId, status: setReviews.status, cues: setReviews.cues })
      .from(setReviews)
      .where(inArray(setReviews.setId, demoIds));
    const reviewedIds = new Set(reviewed.map((r) => r.setId));
    for (const setId of waiting) expect(reviewedIds.has(setId)).toBe(false);
    expect(reviewed.length).toBe(demoTrainingPlan().length - waiting.length);
    for (const review of reviewed) {
      expect(review.status).toBe("seen");
      expect(review.cues.length).toBeGreaterThan(0);
    }
    const comments = await db.select({ n: count() }).from(setComments).where(inArray(setComments.setId, demoIds));
    expect(comments[0].n).toBeGreaterThanOrEqual(2);
  });
});
