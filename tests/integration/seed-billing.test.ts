// The demo billing: prices on the demo team and one comped, active and lapsed membership each; seeding twice
// adds nothing; the lapsed athlete can read her sets but not file new ones.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { count } from "drizzle-orm";
import type { MailFake } from "@/dev/fakes/mail-fake";
import { closeDb, db } from "@/db";
import { billingMemberships, payments, teamPrices } from "@/db/schema-billing";
import { membershipAccess } from "@/db/queries/billing";
import { DEMO_ATHLETES, DEMO_PASSWORD, DEMO_TEAM_ID, seedDemoData } from "@/dev/demo/seed";
import * as setsRoute from "@/app/api/sets/route";
import { call, cookiesFrom, json, signIn, startTestMail } from "./helpers";

let mail: MailFake;
const [tobin, noor, bea, oskar] = DEMO_ATHLETES;

beforeAll(async () => {
  mail = await startTestMail();
  await seedDemoData(process.env.DATABASE_URL!);
});

afterAll(async () => {
  await mail.stop();
  await closeDb();
});

const counts = async () => ({
  prices: (await db.select({ n: count() }).from(teamPrices))[0].n,
  memberships: (await db.select({ n: count() }).from(billingMemberships))[0].n,
  payments: (await db.select({ n: count() }).from(payments))[0].n,
});

describe("demo billing", () => {
  it("is idempotent", async () => {
    const once = await counts();
    expect(once.prices).toBeGreaterThanOrEqual(2);
    await seedDemoData(process.env.DATABASE_URL!);
    expect(await counts()).toEqual(once);
  });

  it("has one comped, active and lapsed membership on a priced team", async () => {
    const status = async (athleteId: string) => (await membershipAccess(athleteId, DEMO_TEAM_ID)).view;
    expect(await status(tobin.id)).toMatchObject({ status: "comped", uploadsAllowed: true });
    expect(await status(noor.id)).toMatchObject({ status: "active", uploadsAllowed: true });
    expect(await status(oskar.id)).toMatchObject({ status: "active", uploadsAllowed: true });
    expect(await status(bea.id)).toMatchObject({ status: "lapsed", uploadsAllowed: false });
    expect((await membershipAccess(bea.id, DEMO_TEAM_ID)).priced).toBe(true);
  });

  it("the lapsed athlete reads her sets but cannot file a new one (402)", async () => {
    const cookie = cookiesFrom(await signIn(bea.email, DEMO_PASSWORD));
    const list = await call(setsRoute.GET, "/api/sets", { cookie });
    expect(list.status).toBe(200);
    expect((await json<{ sets: unknown[] }>(list)).sets.length).toBeGreaterThan(0);
    const body = { teamId: DEMO_TEAM_ID, sessionDate: "2026-03-02", lift: "squat", loadKg: 100, reps: 3, cameraView: "side" };
    const refused = await call(setsRoute.POST, "/api/sets", { method: "POST", cookie, body });
    expect(refused.status).toBe(402);
    const noorCookie = cookiesFrom(await signIn(noor.email, DEMO_PASSWORD));
    expect((await call(setsRoute.POST, "/api/sets", { method: "POST", cookie: noorCookie, body })).status).toBe(201);
  });
});
