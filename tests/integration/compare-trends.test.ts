// Rep compare, trends, CSV export and display units on the real database: the queries return the series and
// measures that were saved, in order; coaches of other teams and other athletes are refused; the export
// route writes CSV that csv-parse reads back, in the viewer's units; bad input is a 400.
import { parse } from "csv-parse/sync";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { closeDb } from "@/db";
import { getCompareReps, listPickableSets } from "@/db/queries/compare";
import { defaultTrendAthlete, getTrendSets, listTrendAthletes } from "@/db/queries/trends";
import { ApiError } from "@/lib/errors";
import * as exportRoute from "@/app/api/exports/reps/route";
import * as preferencesRoute from "@/app/api/preferences/route";
import { createAnalysedSet, viewerFor, type AnalysedSet } from "@/tests/fixtures/analysed-set";
import type { MailFake } from "@/dev/fakes/mail-fake";
import { buildWorld, call, json, startTestMail, type World } from "./helpers";

let mail: MailFake;
let world: World;
let squat100: AnalysedSet;
let squat120: AnalysedSet;
let squat140: AnalysedSet;
let bench: AnalysedSet;
let otherTeamSet: AnalysedSet;

const viewer = (key: keyof Omit<World, "teamA" | "teamB">) => viewerFor(world[key], key === "admin" ? "admin" : "user");

async function refusal(promise: Promise<unknown>): Promise<string> {
  try {
    await promise;
  } catch (error) {
    if (error instanceof ApiError) return error.code;
    throw error;
  }
  throw new Error("expected a refusal");
}

beforeAll(async () => {
  mail = await startTestMail();
  world = await buildWorld("compare");
  const a1 = viewerFor(world.athleteA1);
  const teamId = world.teamA.id;
  squat100 = await createAnalysedSet(a1, { teamId, loadKg: 100, seed: 11, reps: 4, sessionDate: "2026-02-01", recordedAt: "2026-02-01T10:00:00Z" });
  squat140 = await createAnalysedSet(a1, { teamId, loadKg: 140, seed: 13, reps: 3, sessionDate: "2026-03-01", recordedAt: "2026-03-01T10:00:00Z" });
  squat120 = await createAnalysedSet(a1, { teamId, loadKg: 120, seed: 12, reps: 3, sessionDate: "2026-02-15", recordedAt: "2026-02-15T10:00:00Z" });
  bench = await createAnalysedSet(a1, { teamId, lift: "bench", loadKg: 80, seed: 14, reps: 3, sessionDate: "2026-03-01" });
  otherTeamSet = await createAnalysedSet(viewerFor(world.athleteB1), { teamId: world.teamB.id, loadKg: 90, seed: 15, reps: 3 });
}, 120_000);

afterAll(async () => {
  await mail?.stop();
  await closeDb();
});

describe("getCompareReps", () => {
  it("returns rep 1 and the last rep with the saved measures and 101-point series, in the order asked", async () => {
    const first = squat100.repIds[0];
    const last = squat100.repIds[squat100.repIds.length - 1];
    const got = await getCompareReps(viewer("athleteA1"), [last, first]);
    expect(got.map((g) => g.rep.id)).toEqual([last, first]);
    const saved = squat100.result.reps;
    expect(got[1].rep.repIndex).toBe(1);
    expect(got[0].rep.repIndex).toBe(saved.length);
    expect(got[1].rep.meanConcentricVelocityMps).toBe(saved[0].meanConcentricVelocityMps);
    expect(got[1].rep.bottomS).toBe(saved[0].bottomS);
    for (const name of ["barVelocityMps", "kneeAngleDeg", "barYM"] as const) {
      const expected = saved[0].series[name] as number[];
      expect(got[1].series[name]).toHaveLength(101);
      // Stored as float4 (real[]): about 7 significant digits.
      got[1].series[name]?.forEach((v, k) => expect(v).toBeCloseTo(expected[k], 4));
    }
    expect(got[0].set).toMatchObject({ id: squat100.setId, lift: "squat", loadKg: 100, athleteId: world.athleteA1.id });
  });

  it("compares reps across sessions for the coach and the admin", async () => {
    const ids = [squat100.repIds[0], squat140.repIds[0], squat120.repIds[2]];
    expect((await getCompareReps(viewer("coachA"), ids)).map((g) => g.set.id)).toEqual([squat100.setId, squat140.setId, squat120.setId]);
    expect(await getCompareReps(viewer("admin"), ids)).toHaveLength(3);
  });

  it("refuses another team's coach, another athlete and a rep outside the viewer's reach", async () => {
    const ids = [squat100.repIds[0], squat100.repIds[1]];
    expect(await refusal(getCompareReps(viewer("coachB"), ids))).toBe("forbidden:rep");
    expect(await refusal(getCompareReps(viewer("athleteA2"), ids))).toBe("forbidden:rep");
    expect(await refusal(getCompareReps(viewer("outsider"), ids))).toBe("forbidden:rep");
    expect(await refusal(getCompareReps(viewer("athleteA1"), [squat100.repIds[0], otherTeamSet.repIds[0]]))).toBe("forbidden:rep");
    expect(await refusal(getCompareReps(viewer("athleteA1"), [squat100.repIds[0], "00000000-0000-4000-8000-000000000000"]))).toBe("forbidden:rep");
  });

  it("refuses reps of different lifts", async () => {
    expect(await refusal(getCompareReps(viewer("athleteA1"), [squat100.repIds[0], bench.repIds[0]]))).toBe("bad_request:compare");
  });

  it("lists the athlete's other analysed sets of the lift, newest first, with their reps", async () => {
    const sets = await listPickableSets(viewer("coachA"), { athleteId: world.athleteA1.id, lift: "squat", limit: 10, excludeSetId: squat140.setId });
    expect(sets.map((s) => s.setId)).toEqual([squat120.setId, squat100.setId]);
    expect(sets[1].reps.map((r) => r.id)).toEqual(squat100.repIds);
    expect(await listPickableSets(viewer("coachB"), { athleteId: world.athleteA1.id, lift: "squat", limit: 10 })).toEqual([]);
  });
});

describe("getTrendSets", () => {
  it("returns one row per analysed set, oldest first, with set measures and rep aggregates", async () => {
    const rows = await getTrendSets(viewer("athleteA1"), world.athleteA1.id, "squat");
    expect(rows.map((r) => r.setId)).toEqual([squat100.setId, squat120.setId, squat140.setId]);
    const [first] = rows;
    const result = squat100.result;
    expect(first.loadKg).toBe(100);
    expect(first.repCount).toBe(result.set.repCount);
    expect(first.bestMeanVelocityMps).toBe(result.set.bestMeanVelocityMps);
    expect(first.velocityLossPct).toBe(result.set.velocityLossPct);
    expect(first.startTorsoAngleSpreadDeg).toBe(result.set.startTorsoAngleSpreadDeg);
    const depth = result.reps.map((r) => r.depthMarginCm).filter((v): v is number => v !== null);
    expect(first.minDepthMarginCm).toBeCloseTo(Math.min(...depth), 9);
    const deviation = result.reps.map((r) => r.maxHorizontalDeviationCm);
    expect(first.meanMaxHorizontalDeviationCm).toBeCloseTo(deviation.reduce((s, v) => s + v, 0) / deviation.length, 9);
    const drift = result.reps.map((r) => Math.abs(r.netHorizontalDriftCm));
    expect(first.meanAbsNetDriftCm).toBeCloseTo(drift.reduce((s, v) => s + v, 0) / drift.length, 9);
  });

  it("serves the athlete's coach and the admin, and refuses other coaches and athletes", async () => {
    expect(await getTrendSets(viewer("coachA"), world.athleteA1.id, "squat")).toHaveLength(3);
    expect(await getTrendSets(viewer("admin"), world.athleteA1.id, "bench")).toHaveLength(1);
    expect(await refusal(getTrendSets(viewer("coachB"), world.athleteA1.id, "squat"))).toBe("forbidden:athlete");
    expect(await refusal(getTrendSets(viewer("athleteA2"), world.athleteA1.id, "squat"))).toBe("forbidden:athlete");
  });

  it("offers a coach the athletes with sets on their teams only", async () => {
    const athletes = await listTrendAthletes(viewer("coachA"));
    const ids = athletes.map((a) => a.id);
    expect(defaultTrendAthlete(athletes)).toBe(world.athleteA1.id);
    // The bench set has no time of its own: filed at midday UTC of its session date.
    expect(athletes.find((a) => a.id === world.athleteA1.id)?.lastAnalysedAt?.toISOString()).toBe("2026-03-01T12:00:00.000Z");
    expect(ids).toContain(world.athleteA1.id);
    expect(ids).not.toContain(world.athleteB1.id);
    expect((await listTrendAthletes(viewer("athleteA1"))).map((a) => a.id)).toEqual([world.athleteA1.id]);
  });
});

describe("GET /api/exports/reps", () => {
  const get = (query: string, cookie?: string) => call(exportRoute.GET, `/api/exports/reps?${query}`, { cookie });

  it("writes one row per rep of the set with units in the headers", async () => {
    const response = await get(`set=${squat100.setId}`, world.coachA.cookie);
    expect(response.status).toBe(200);
    expect(response.headers.get("content-type")).toMatch(/^text\/csv/);
    expect(response.headers.get("content-disposition")).toMatch(/^attachment; filename="plumbline-reps_set-[0-9a-f]{8}\.csv"$/);
    const rows = parse(await response.text(), { columns: true }) as Record<string, string>[];
    expect(rows.map((r) => r.rep)).toEqual(squat100.result.reps.map((r) => String(r.index)));
    expect(Number(rows[0].mean_concentric_velocity_mps)).toBeCloseTo(squat100.result.reps[0].meanConcentricVelocityMps, 3);
    expect(rows[0].load_kg).toBe("100");
    expect(rows[0].athlete).toBe(world.athleteA1.name);
  });

  it("exports an athlete's sets of a lift and a date range of readable sets only", async () => {
    const athlete = parse(await (await get(`athlete=${world.athleteA1.id}&lift=squat`, world.athleteA1.cookie)).text(), { columns: true }) as Record<string, string>[];
    expect(new Set(athlete.map((r) => r.set_id))).toEqual(new Set([squat100.setId, squat120.setId, squat140.setId]));
    const range = parse(await (await get("from=2026-02-10&to=2026-03-01", world.coachA.cookie)).text(), { columns: true }) as Record<string, string>[];
    expect(new Set(range.map((r) => r.set_id))).toEqual(new Set([squat120.setId, squat140.setId, bench.setId]));
    const otherCoach = parse(await (await get("from=2026-01-01&to=2026-12-31", world.coachB.cookie)).text(), { columns: true }) as Record<string, string>[];
    expect(new Set(otherCoach.map((r) => r.set_id))).toEqual(new Set([otherTeamSet.setId]));
  });

  it("refuses other teams' coaches, other athletes, strangers and bad queries", async () => {
    expect((await get(`set=${squat100.setId}`, world.coachB.cookie)).status).toBe(403);
    expect((await get(`set=${squat100.setId}`, world.athleteA2.cookie)).status).toBe(403);
    expect((await get(`athlete=${world.athleteA1.id}`, world.coachB.cookie)).status).toBe(403);
    expect((await get(`set=${squat100.setId}`)).status).toBe(401);
    expect((await get("", world.coachA.cookie)).status).toBe(400);
    expect((await get("set=not-a-uuid", world.coachA.cookie)).status).toBe(400);
    expect((await get("from=2026-03-01&to=2026-02-01", world.coachA.cookie)).status).toBe(400);
  });
});

describe("/api/preferences", () => {
  it("defaults from the profile, saves per user (coaches too) and the export follows", async () => {
    const before = await json<{ preferences: { mass: string; length: string; saved: boolean } }>(
      await call(preferencesRoute.GET, "/api/preferences", { cookie: world.coachA.cookie }),
    );
    expect(before.preferences).toEqual({ mass: "kg", length: "metric", saved: false });
    const put = await call(preferencesRoute.PUT, "/api/preferences", { method: "PUT", cookie: world.coachA.cookie, body: { massUnit: "lb", lengthUnit: "imperial" } });
    expect(put.status).toBe(200);
    const rows = parse(await (await call(exportRoute.GET, `/api/exports/reps?set=${squat100.setId}`, { cookie: world.coachA.cookie })).text(), {
      columns: true,
    }) as Record<string, string>[];
    // 100 kg / 0.45359237 kg per lb (exact by the 1959 International Yard and Pound Agreement) = 220.46 lb.
    expect(rows[0].load_lb).toBe("220.46");
    expect(rows[0].max_horizontal_deviation_in).toBeDefined();
    const other = await json<{ preferences: { mass: string } }>(await call(preferencesRoute.GET, "/api/preferences", { cookie: world.coachB.cookie }));
    expect(other.preferences.mass).toBe("kg");
  });

  it("rejects bad units and strangers", async () => {
    expect((await call(preferencesRoute.PUT, "/api/preferences", { method: "PUT", cookie: world.coachA.cookie, body: { massUnit: "stone", lengthUnit: "metric" } })).status).toBe(400);
    expect((await call(preferencesRoute.PUT, "/api/preferences", { method: "PUT", body: { massUnit: "kg", lengthUnit: "metric" } })).status).toBe(401);
  });
});
