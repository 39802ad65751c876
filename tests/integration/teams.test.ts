// /api/me, creating teams, the coach's roster and removing an athlete — each access rule allowed and refused.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { MailFake } from "@/dev/fakes/mail-fake";
import { closeDb } from "@/db";
import * as me from "@/app/api/me/route";
import * as teamsRoute from "@/app/api/teams/route";
import * as roster from "@/app/api/teams/[teamId]/roster/route";
import * as member from "@/app/api/teams/[teamId]/members/[userId]/route";
import * as setsRoute from "@/app/api/sets/route";
import * as invitationsRoute from "@/app/api/teams/[teamId]/invitations/route";
import { buildWorld, call, json, signUp, startTestMail, type World } from "./helpers";

let mail: MailFake;
let world: World;

beforeAll(async () => {
  mail = await startTestMail();
  world = await buildWorld("teams");
});

afterAll(async () => {
  await mail.stop();
  await closeDb();
});

interface RosterBody {
  team: { id: string; name: string };
  athletes: { userId: string; name: string; email: string; joinedAt: string; lastSetAt: string | null }[];
  invitations: { id: string; email: string; status: string; expiresAt: string; createdAt: string }[];
}

const rosterOf = (teamId: string, cookie?: string) => call(roster.GET, `/api/teams/${teamId}/roster`, { cookie, params: { teamId } });

describe("GET /api/me", () => {
  it("returns the person, their memberships in both roles and no profile yet", async () => {
    const body = await json<{ user: { id: string; role: string }; memberships: unknown[]; profile: null }>(
      await call(me.GET, "/api/me", { cookie: world.coachA.cookie }),
    );
    expect(body.user).toMatchObject({ id: world.coachA.id, role: "user", emailVerified: false });
    expect(body.memberships).toEqual([{ teamId: world.teamA.id, teamName: world.teamA.name, role: "coach" }]);
    expect(body.profile).toBeNull();
  });

  it("reports the admin role", async () => {
    const body = await json<{ user: { role: string } }>(await call(me.GET, "/api/me", { cookie: world.admin.cookie }));
    expect(body.user.role).toBe("admin");
  });

  it("is 401 without a session and with a forged cookie", async () => {
    expect((await call(me.GET, "/api/me")).status).toBe(401);
    const forged = await call(me.GET, "/api/me", { cookie: "better-auth.session_token=forged.value" });
    expect(forged.status).toBe(401);
    expect(await json(forged)).toEqual({ error: { code: "unauthorized:auth", message: "Please sign in first." } });
  });
});

describe("POST /api/teams", () => {
  it("creates the team and makes the creator its coach; the same person may lift on another team", async () => {
    const lifter = world.athleteB1;
    const created = await call(teamsRoute.POST, "/api/teams", { method: "POST", cookie: lifter.cookie, body: { name: "  Night Owls  " } });
    expect(created.status).toBe(201);
    const { team } = await json<{ team: { id: string; name: string } }>(created);
    expect(team.name).toBe("Night Owls");
    const body = await json<{ memberships: { teamId: string; role: string }[] }>(await call(me.GET, "/api/me", { cookie: lifter.cookie }));
    expect(body.memberships).toEqual(
      expect.arrayContaining([
        expect.objectContaining({ teamId: world.teamB.id, role: "athlete" }),
        expect.objectContaining({ teamId: team.id, role: "coach" }),
      ]),
    );
  });

  it("gives 400 with a field message for a bad name, and for a body that is not JSON", async () => {
    const short = await call(teamsRoute.POST, "/api/teams", { method: "POST", cookie: world.outsider.cookie, body: { name: "x" } });
    expect(short.status).toBe(400);
    const body = await json<{ error: { code: string; fields: Record<string, string> } }>(short);
    expect(body.error.code).toBe("bad_request:team");
    expect(body.error.fields).toEqual({ name: "Use at least 2 characters." });

    const missing = await call(teamsRoute.POST, "/api/teams", { method: "POST", cookie: world.outsider.cookie, body: {} });
    expect((await json<{ error: { fields: Record<string, string> } }>(missing)).error.fields.name).toBe("A team name is required.");

    const garbage = await call(teamsRoute.POST, "/api/teams", { method: "POST", cookie: world.outsider.cookie, rawBody: "{name:" });
    expect(garbage.status).toBe(400);
    expect((await json<{ error: { message: string } }>(garbage)).error.message).toBe("The request body must be JSON.");
  });

  it("is 401 when signed out", async () => {
    expect((await call(teamsRoute.POST, "/api/teams", { method: "POST", body: { name: "Ghosts" } })).status).toBe(401);
  });
});

describe("GET /api/teams/[teamId]/roster", () => {
  it("shows the coach their athletes, with the date of each one's last set", async () => {
    const recorded = await call(setsRoute.POST, "/api/sets", {
      method: "POST",
      cookie: world.athleteA1.cookie,
      body: { teamId: world.teamA.id, sessionDate: "2026-03-02", lift: "squat", loadKg: 100, reps: 5, cameraView: "side" },
    });
    expect(recorded.status).toBe(201);
    const response = await rosterOf(world.teamA.id, world.coachA.cookie);
    expect(response.status).toBe(200);
    const body = await json<RosterBody>(response);
    expect(body.team).toEqual(world.teamA);
    const byId = new Map(body.athletes.map((a) => [a.userId, a]));
    expect([...byId.keys()].sort()).toEqual([world.athleteA1.id, world.athleteA2.id].sort());
    expect(byId.get(world.athleteA1.id)?.lastSetAt).toBe("2026-03-02T12:00:00.000Z");
    expect(byId.get(world.athleteA2.id)?.lastSetAt).toBeNull();
    expect(byId.get(world.athleteA2.id)?.email).toBe(world.athleteA2.email);
  });

  it("lists pending invitations", async () => {
    const invited = await call(invitationsRoute.POST, "", {
      method: "POST",
      cookie: world.coachA.cookie,
      params: { teamId: world.teamA.id },
      body: { emails: ["roster-pending@test.example"] },
    });
    expect(invited.status).toBe(201);
    const body = await json<RosterBody>(await rosterOf(world.teamA.id, world.coachA.cookie));
    expect(body.invitations).toEqual([expect.objectContaining({ email: "roster-pending@test.example", status: "pending" })]);
  });

  it("lets an admin read any roster", async () => {
    expect((await rosterOf(world.teamB.id, world.admin.cookie)).status).toBe(200);
  });

  it("refuses athletes of the team, another team's coach and outsiders (403), and signed-out callers (401)", async () => {
    for (const person of [world.athleteA1, world.coachB, world.outsider]) {
      const response = await rosterOf(world.teamA.id, person.cookie);
      expect(response.status).toBe(403);
      expect((await json<{ error: { code: string } }>(response)).error.code).toBe("forbidden:team");
    }
    expect((await rosterOf(world.teamA.id)).status).toBe(401);
  });

  it("is 404 for a team that does not exist (admin) or an id that is not one", async () => {
    expect((await rosterOf("00000000-0000-4000-8000-000000000000", world.admin.cookie)).status).toBe(404);
    expect((await rosterOf("not-a-uuid", world.coachA.cookie)).status).toBe(404);
  });
});

describe("DELETE /api/teams/[teamId]/members/[userId]", () => {
  const remove = (teamId: string, userId: string, cookie?: string) =>
    call(member.DELETE, "", { method: "DELETE", cookie, params: { teamId, userId } });

  it("refuses the athlete themselves, another team's coach and outsiders", async () => {
    for (const person of [world.athleteA2, world.coachB, world.outsider]) {
      expect((await remove(world.teamA.id, world.athleteA2.id, person.cookie)).status).toBe(403);
    }
    expect((await remove(world.teamA.id, world.athleteA2.id)).status).toBe(401);
  });

  it("lets the coach remove an athlete: the athlete keeps their sets, the coach no longer sees them", async () => {
    const lifter = await signUp("teams-leaver");
    const { id: teamId } = world.teamA;
    await call(teamsRoute.POST, "/api/teams", { method: "POST", cookie: lifter.cookie, body: { name: "Leaver's own team" } });
    const { memberships } = await import("@/db/schema");
    const { db } = await import("@/db");
    await db.insert(memberships).values({ teamId, userId: lifter.id, role: "athlete" });
    const created = await call(setsRoute.POST, "/api/sets", {
      method: "POST",
      cookie: lifter.cookie,
      body: { teamId, sessionDate: "2026-03-03", lift: "bench", loadKg: 80, reps: 3, cameraView: "side" },
    });
    const { set } = await json<{ set: { id: string } }>(created);
    const coachSees = async () =>
      (await json<{ sets: { id: string }[] }>(await call(setsRoute.GET, `/api/sets?teamId=${teamId}`, { cookie: world.coachA.cookie }))).sets.map((s) => s.id);
    expect(await coachSees()).toContain(set.id);

    const response = await remove(teamId, lifter.id, world.coachA.cookie);
    expect(response.status).toBe(204);
    expect(await response.text()).toBe("");

    expect(await coachSees()).not.toContain(set.id);
    const own = await json<{ sets: { id: string }[] }>(await call(setsRoute.GET, "/api/sets", { cookie: lifter.cookie }));
    expect(own.sets.map((s) => s.id)).toContain(set.id);
    const body = await json<{ memberships: { role: string }[] }>(await call(me.GET, "/api/me", { cookie: lifter.cookie }));
    expect(body.memberships).toEqual([expect.objectContaining({ role: "coach" })]);
  });

  it("is 404 for someone who is not an athlete on the team", async () => {
    const response = await remove(world.teamA.id, world.athleteB1.id, world.coachA.cookie);
    expect(response.status).toBe(404);
    expect((await json<{ error: { code: string } }>(response)).error.code).toBe("not_found:member");
  });
});
