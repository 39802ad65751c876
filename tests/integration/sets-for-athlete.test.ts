// POST /api/sets with an athleteId: a coach records a set for an athlete of a team they coach (admins for
// anyone on a team); everyone else is refused, and a set recorded for an athlete is the athlete's.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { MailFake } from "@/dev/fakes/mail-fake";
import { closeDb } from "@/db";
import * as setsRoute from "@/app/api/sets/route";
import { buildWorld, call, json, startTestMail, type TestPerson, type World } from "./helpers";

let mail: MailFake;
let world: World;

interface SetBody {
  id: string;
  athleteId: string;
  teamId: string | null;
}
interface ErrorBody {
  error: { code: string; message: string };
}

const squat = { sessionDate: "2026-02-12", lift: "squat", loadKg: 150, reps: 3, rpe: 8, cameraView: "side" };
const post = (person: TestPerson, body: unknown) => call(setsRoute.POST, "/api/sets", { method: "POST", cookie: person.cookie, body });
const list = (person: TestPerson) => call(setsRoute.GET, "/api/sets", { cookie: person.cookie });

async function listedIds(person: TestPerson): Promise<string[]> {
  const response = await list(person);
  expect(response.status).toBe(200);
  return (await json<{ sets: SetBody[] }>(response)).sets.map((s) => s.id);
}

async function refused(person: TestPerson, body: Record<string, unknown>, status: number, code: string): Promise<void> {
  const response = await post(person, { ...squat, ...body });
  expect(response.status).toBe(status);
  expect((await json<ErrorBody>(response)).error.code).toBe(code);
}

beforeAll(async () => {
  mail = await startTestMail();
  world = await buildWorld("sets-for-athlete");
});

afterAll(async () => {
  await mail.stop();
  await closeDb();
});

describe("POST /api/sets for an athlete", () => {
  it("lets a coach record a set for an athlete of their team: the set is the athlete's, seen by both", async () => {
    const response = await post(world.coachA, { ...squat, athleteId: world.athleteA1.id, teamId: world.teamA.id });
    expect(response.status).toBe(201);
    const { set } = await json<{ set: SetBody }>(response);
    expect(set).toMatchObject({ athleteId: world.athleteA1.id, teamId: world.teamA.id });
    await expect(listedIds(world.athleteA1)).resolves.toContain(set.id);
    await expect(listedIds(world.coachA)).resolves.toContain(set.id);
    await expect(listedIds(world.athleteA2)).resolves.not.toContain(set.id);
    await expect(listedIds(world.coachB)).resolves.not.toContain(set.id);
  });

  it("lets an admin record a set for an athlete of any team", async () => {
    const response = await post(world.admin, { ...squat, athleteId: world.athleteB1.id, teamId: world.teamB.id });
    expect(response.status).toBe(201);
    expect((await json<{ set: SetBody }>(response)).set).toMatchObject({ athleteId: world.athleteB1.id, teamId: world.teamB.id });
  });

  it("refuses a coach recording for another team's athlete, or under another team", async () => {
    await refused(world.coachA, { athleteId: world.athleteB1.id, teamId: world.teamA.id }, 403, "forbidden:athlete");
    await refused(world.coachA, { athleteId: world.athleteB1.id, teamId: world.teamB.id }, 403, "forbidden:team");
    await refused(world.coachB, { athleteId: world.athleteA1.id, teamId: world.teamA.id }, 403, "forbidden:team");
  });

  it("refuses athletes and outsiders recording for someone else", async () => {
    await refused(world.athleteA2, { athleteId: world.athleteA1.id, teamId: world.teamA.id }, 403, "forbidden:team");
    await refused(world.outsider, { athleteId: world.athleteA1.id, teamId: world.teamA.id }, 403, "forbidden:team");
  });

  it("refuses naming someone who does not lift on the team as the athlete", async () => {
    await refused(world.admin, { athleteId: world.outsider.id, teamId: world.teamA.id }, 403, "forbidden:athlete");
    await refused(world.coachA, { athleteId: world.coachB.id, teamId: world.teamA.id }, 403, "forbidden:athlete");
  });

  it("needs the team, since only a team's coaches may see the set", async () => {
    await refused(world.coachA, { athleteId: world.athleteA1.id, teamId: null }, 400, "bad_request:set");
  });

  it("refuses a malformed athlete id as bad input", async () => {
    const response = await post(world.coachA, { ...squat, athleteId: 42, teamId: world.teamA.id });
    expect(response.status).toBe(400);
  });

  it("still records a coach's own set without an athleteId", async () => {
    const response = await post(world.coachA, { ...squat, teamId: null });
    expect(response.status).toBe(201);
    expect((await json<{ set: SetBody }>(response)).set).toMatchObject({ athleteId: world.coachA.id, teamId: null });
  });
});
