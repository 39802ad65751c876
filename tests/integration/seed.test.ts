// The demo data: loads into the test database, a second run changes nothing, and the demo accounts work.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { count, eq, inArray } from "drizzle-orm";
import type { MailFake } from "@/lib/dev/mail-fake";
import { closeDb, db } from "@/db";
import { account, athleteProfiles, invitations, memberships, oneRepMaxes, sets, teams, trainingSessions, user } from "@/db/schema";
import { DEMO_ATHLETES, DEMO_COACH, DEMO_INVITATION_TOKEN, DEMO_OPERATOR, DEMO_PASSWORD, DEMO_TEAM_ID, seedDemoData } from "@/lib/dev/seed";
import * as roster from "@/app/api/teams/[teamId]/roster/route";
import * as lookup from "@/app/api/invitations/[token]/route";
import * as me from "@/app/api/me/route";
import { call, cookiesFrom, json, signIn, startTestMail } from "./helpers";

let mail: MailFake;

beforeAll(async () => {
  mail = await startTestMail();
  // Another file (seed-billing.test.ts) may have loaded the demo data into this run's database already: remove it
  // (users and the team cascade to everything else), so the first load below is a first load in any file order.
  await db.delete(user).where(inArray(user.id, [DEMO_COACH.id, DEMO_OPERATOR.id, ...DEMO_ATHLETES.map((a) => a.id)]));
  await db.delete(teams).where(eq(teams.id, DEMO_TEAM_ID));
});

afterAll(async () => {
  await mail.stop();
  await closeDb();
});

async function tableCounts(): Promise<Record<string, number>> {
  const tables = { user, account, teams, memberships, invitations, athleteProfiles, oneRepMaxes, trainingSessions, sets };
  const entries = await Promise.all(
    Object.entries(tables).map(async ([name, table]) => [name, (await db.select({ n: count() }).from(table))[0].n] as const),
  );
  return Object.fromEntries(entries);
}

describe("seedDemoData", () => {
  it("is idempotent: the second run adds nothing", async () => {
    const url = process.env.DATABASE_URL!;
    const before = await tableCounts();
    await seedDemoData(url);
    const once = await tableCounts();
    expect(once.user - before.user).toBe(2 + DEMO_ATHLETES.length);
    expect(once.teams - before.teams).toBe(1);
    expect(once.sets - before.sets).toBeGreaterThanOrEqual(5);
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
