// /api/sets and /api/sets/[setId]: recording set metadata and the read rules —
// an athlete reads their own sets, a coach their team's, nobody another team's, an admin everything.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { MailFake } from "@/dev/fakes/mail-fake";
import { closeDb } from "@/db";
import * as setsRoute from "@/app/api/sets/route";
import * as setRoute from "@/app/api/sets/[setId]/route";
import { buildWorld, call, json, startTestMail, type TestPerson, type World } from "./helpers";

let mail: MailFake;
let world: World;
const ids: Record<string, string> = {};

interface SetBody {
  id: string;
  athleteId: string;
  athleteName: string;
  teamId: string | null;
  teamName: string | null;
  sessionId: string;
  sessionDate: string;
  lift: string;
  loadKg: number;
  reps: number;
  rpe: number | null;
  status: string;
  clipStatus: string;
  recordedAt: string;
}
interface ErrorBody {
  error: { code: string; message: string; fields?: Record<string, string> };
}

const post = (person: TestPerson | undefined, body: unknown) => call(setsRoute.POST, "/api/sets", { method: "POST", cookie: person?.cookie, body });
const list = (person: TestPerson | undefined, query = "") => call(setsRoute.GET, `/api/sets${query}`, { cookie: person?.cookie });
const getOne = (person: TestPerson | undefined, setId: string) => call(setRoute.GET, "", { cookie: person?.cookie, params: { setId } });

async function listedIds(person: TestPerson, query = ""): Promise<string[]> {
  const response = await list(person, query);
  expect(response.status).toBe(200);
  return (await json<{ sets: SetBody[] }>(response)).sets.map((s) => s.id).sort();
}

const squat = { sessionDate: "2026-02-10", lift: "squat", loadKg: 140, reps: 5, rpe: 8, cameraView: "side" };

beforeAll(async () => {
  mail = await startTestMail();
  world = await buildWorld("sets");
  const make = async (key: string, person: TestPerson, body: Record<string, unknown>) => {
    const response = await post(person, body);
    expect(response.status).toBe(201);
    ids[key] = (await json<{ set: SetBody }>(response)).set.id;
  };
  await make("a1Team", world.athleteA1, { ...squat, teamId: world.teamA.id });
  await make("a1Personal", world.athleteA1, { ...squat, teamId: null, lift: "bench", loadKg: 90 });
  await make("a2Team", world.athleteA2, { ...squat, teamId: world.teamA.id, loadKg: 120 });
  await make("b1Team", world.athleteB1, { ...squat, teamId: world.teamB.id, lift: "deadlift", loadKg: 180 });
});

afterAll(async () => {
  await mail.stop();
  await closeDb();
});

describe("POST /api/sets", () => {
  it("files the set under the athlete's training session of that day and returns it", async () => {
    const first = await json<{ set: SetBody }>(
      await post(world.athleteA1, { ...squat, teamId: world.teamA.id, sessionDate: "2026-02-11", recordedAt: "2026-02-11T18:30:00+01:00" }),
    );
    expect(first.set).toMatchObject({
      athleteId: world.athleteA1.id,
      athleteName: world.athleteA1.name,
      teamId: world.teamA.id,
      teamName: world.teamA.name,
      sessionDate: "2026-02-11",
      lift: "squat",
      loadKg: 140,
      reps: 5,
      rpe: 8,
      status: "draft",
      clipStatus: "none",
      recordedAt: "2026-02-11T17:30:00.000Z",
    });
    const second = await json<{ set: SetBody }>(await post(world.athleteA1, { ...squat, teamId: world.teamA.id, sessionDate: "2026-02-11" }));
    expect(second.set.sessionId).toBe(first.set.sessionId);
    const personal = await json<{ set: SetBody }>(await post(world.athleteA1, { ...squat, sessionDate: "2026-02-11" }));
    expect(personal.set.teamId).toBeNull();
    expect(personal.set.sessionId).not.toBe(first.set.sessionId);
  });

  it("refuses filing under a team the person does not lift on — its coach included (403)", async () => {
    for (const person of [world.outsider, world.coachA, world.athleteB1]) {
      const response = await post(person, { ...squat, teamId: world.teamA.id });
      expect(response.status).toBe(403);
      expect((await json<ErrorBody>(response)).error.code).toBe("forbidden:team");
    }
  });

  it("gives 400 with a message per field for bad input, never a 500", async () => {
    const response = await post(world.athleteA1, {
      teamId: "nope",
      sessionDate: "2026-02-30",
      lift: "snatch",
      loadKg: -20,
      reps: 2.5,
      rpe: 7.2,
      cameraView: "overhead",
    });
    expect(response.status).toBe(400);
    const body = await json<ErrorBody>(response);
    expect(body.error.code).toBe("bad_request:set");
    expect(body.error.fields).toEqual({
      teamId: "Not a valid id.",
      sessionDate: "Enter the session date as YYYY-MM-DD.",
      lift: "Choose squat, bench or deadlift.",
      loadKg: "The load cannot be negative.",
      reps: "Reps must be a whole number.",
      rpe: "RPE goes in steps of 0.5.",
      cameraView: "Choose side, front or 45°.",
    });
    expect((await post(world.athleteA1, null)).status).toBe(400);
    expect((await call(setsRoute.POST, "/api/sets", { method: "POST", cookie: world.athleteA1.cookie, rawBody: "not json" })).status).toBe(400);
  });

  it("is 401 signed out", async () => {
    expect((await post(undefined, squat)).status).toBe(401);
  });
});

describe("GET /api/sets", () => {
  it("an athlete sees only their own sets", async () => {
    const seen = await listedIds(world.athleteA1);
    expect(seen).toEqual(expect.arrayContaining([ids.a1Team, ids.a1Personal]));
    expect(seen).not.toContain(ids.a2Team);
    expect(seen).not.toContain(ids.b1Team);
    expect(await listedIds(world.athleteA2)).toEqual([ids.a2Team]);
  });

  it("a coach sees their team's sets, not the athletes' personal ones and not another team's", async () => {
    const seen = await listedIds(world.coachA);
    expect(seen).toEqual(expect.arrayContaining([ids.a1Team, ids.a2Team]));
    expect(seen).not.toContain(ids.a1Personal);
    expect(seen).not.toContain(ids.b1Team);
    expect(await listedIds(world.coachB)).toEqual([ids.b1Team]);
  });

  it("someone on no team sees nothing; an admin sees everything", async () => {
    expect(await listedIds(world.outsider)).toEqual([]);
    // Per athlete: the unfiltered list holds only the newest sets, and other tests (the demo seed) add newer ones.
    expect(await listedIds(world.admin, `?athleteId=${world.athleteA1.id}`)).toEqual(expect.arrayContaining([ids.a1Team, ids.a1Personal]));
    expect(await listedIds(world.admin, `?athleteId=${world.athleteA2.id}`)).toEqual(expect.arrayContaining([ids.a2Team]));
    expect(await listedIds(world.admin, `?athleteId=${world.athleteB1.id}`)).toEqual(expect.arrayContaining([ids.b1Team]));
  });

  it("filters by team for its members and refuses the filter to others (403)", async () => {
    expect(await listedIds(world.coachA, `?teamId=${world.teamA.id}`)).toEqual(expect.arrayContaining([ids.a1Team, ids.a2Team]));
    const athleteView = await listedIds(world.athleteA2, `?teamId=${world.teamA.id}`);
    expect(athleteView).toEqual([ids.a2Team]);
    for (const person of [world.coachB, world.outsider]) {
      const response = await list(person, `?teamId=${world.teamA.id}`);
      expect(response.status).toBe(403);
    }
  });

  it("filters by athlete for the athlete, their coach and admins, and refuses others (403)", async () => {
    const byCoach = await listedIds(world.coachA, `?athleteId=${world.athleteA1.id}`);
    expect(byCoach).toContain(ids.a1Team);
    expect(byCoach).not.toContain(ids.a1Personal);
    expect(await listedIds(world.admin, `?athleteId=${world.athleteA1.id}`)).toContain(ids.a1Personal);
    for (const person of [world.coachB, world.athleteA2, world.outsider]) {
      const response = await list(person, `?athleteId=${world.athleteA1.id}`);
      expect(response.status).toBe(403);
      expect((await json<ErrorBody>(response)).error.code).toBe("forbidden:athlete");
    }
  });

  it("gives 400 for a malformed filter and 401 signed out", async () => {
    const response = await list(world.coachA, "?teamId=abc&limit=0");
    expect(response.status).toBe(400);
    expect(Object.keys((await json<ErrorBody>(response)).error.fields!).sort()).toEqual(["limit", "teamId"]);
    expect((await list(undefined)).status).toBe(401);
  });
});

describe("GET /api/sets/[setId]", () => {
  it("the athlete, their coach and an admin may read a team set", async () => {
    for (const person of [world.athleteA1, world.coachA, world.admin]) {
      const response = await getOne(person, ids.a1Team);
      expect(response.status).toBe(200);
      expect((await json<{ set: SetBody }>(response)).set.id).toBe(ids.a1Team);
    }
  });

  it("a teammate, another team's coach and outsiders are refused (403)", async () => {
    for (const person of [world.athleteA2, world.coachB, world.athleteB1, world.outsider]) {
      const response = await getOne(person, ids.a1Team);
      expect(response.status).toBe(403);
      expect((await json<ErrorBody>(response)).error.code).toBe("forbidden:set");
    }
  });

  it("a personal set is the athlete's alone (and an admin's)", async () => {
    expect((await getOne(world.athleteA1, ids.a1Personal)).status).toBe(200);
    expect((await getOne(world.admin, ids.a1Personal)).status).toBe(200);
    expect((await getOne(world.coachA, ids.a1Personal)).status).toBe(403);
  });

  it("is 404 for unknown or malformed ids and 401 signed out", async () => {
    expect((await getOne(world.admin, "00000000-0000-4000-8000-000000000000")).status).toBe(404);
    expect((await getOne(world.athleteA1, "123")).status).toBe(404);
    expect((await getOne(undefined, ids.a1Team)).status).toBe(401);
  });
});
