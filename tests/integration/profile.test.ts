// GET/PUT /api/profile: saving, replacing and validating the athlete profile (SI units stored).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { MailFake } from "@/dev/fakes/mail-fake";
import { closeDb } from "@/db";
import * as profile from "@/app/api/profile/route";
import * as me from "@/app/api/me/route";
import { KG_PER_LB } from "@/lib/validation/common";
import { call, json, signUp, startTestMail, type TestPerson } from "./helpers";

let mail: MailFake;
let athlete: TestPerson;
let other: TestPerson;

beforeAll(async () => {
  mail = await startTestMail();
  [athlete, other] = await Promise.all([signUp("profile-athlete"), signUp("profile-other")]);
});

afterAll(async () => {
  await mail.stop();
  await closeDb();
});

const put = (body: unknown, cookie?: string) => call(profile.PUT, "/api/profile", { method: "PUT", cookie, body });
const get = (cookie?: string) => call(profile.GET, "/api/profile", { cookie });

interface ProfileBody {
  profile: { bodyMassKg: number | null; heightM: number | null; unitPreference: string; oneRepMaxes: Record<string, number> } | null;
}
interface ErrorBody {
  error: { code: string; fields: Record<string, string> };
}

describe("/api/profile", () => {
  it("is null before the first save", async () => {
    expect(await json(await get(athlete.cookie))).toEqual({ profile: null });
  });

  it("saves and returns the profile; /api/me carries it too", async () => {
    // A lifter entering 315 lb: the form converts with the exact pound (0.45359237 kg, 1959 international agreement).
    const squatKg = 315 * KG_PER_LB;
    const saved = await put({ bodyMassKg: 82.5, heightM: 1.78, unitPreference: "lb", oneRepMaxes: { squat: squatKg, bench: 110 } }, athlete.cookie);
    expect(saved.status).toBe(200);
    const body = await json<ProfileBody>(saved);
    expect(body.profile).toMatchObject({ bodyMassKg: 82.5, heightM: 1.78, unitPreference: "lb", oneRepMaxes: { squat: squatKg, bench: 110 } });
    expect(await json<ProfileBody>(await get(athlete.cookie))).toEqual(body);
    const mine = await json<ProfileBody>(await call(me.GET, "/api/me", { cookie: athlete.cookie }));
    expect(mine.profile).toEqual(body.profile);
  });

  it("replaces the whole profile: lifts left out are cleared, unknown body mass may be null", async () => {
    const body = await json<ProfileBody>(
      await put({ bodyMassKg: null, heightM: 1.78, unitPreference: "kg", oneRepMaxes: { deadlift: 200 } }, athlete.cookie),
    );
    expect(body.profile).toMatchObject({ bodyMassKg: null, unitPreference: "kg", oneRepMaxes: { deadlift: 200 } });
    expect(Object.keys(body.profile!.oneRepMaxes)).toEqual(["deadlift"]);
  });

  it("is private: another person sees only their own (empty) profile", async () => {
    expect(await json(await get(other.cookie))).toEqual({ profile: null });
  });

  it("gives 400 with a message per field for values out of range or of the wrong kind", async () => {
    const response = await put(
      { bodyMassKg: 4, heightM: "tall", unitPreference: "stone", oneRepMaxes: { squat: -5, snatch: 100 } },
      athlete.cookie,
    );
    expect(response.status).toBe(400);
    const body = await json<ErrorBody>(response);
    expect(body.error.code).toBe("bad_request:profile");
    expect(body.error.fields).toEqual({
      bodyMassKg: "Body mass must be at least 25 kg.",
      heightM: "Enter the height in metres.",
      unitPreference: 'Choose "kg" or "lb".',
      "oneRepMaxes.squat": "A one-rep max must be above 0 kg.",
      oneRepMaxes: "One-rep maxes are kept for squat, bench and deadlift only (not snatch).",
    });
    expect(await json<ProfileBody>(await get(athlete.cookie))).toMatchObject({ profile: { oneRepMaxes: { deadlift: 200 } } });
  });

  it("is 401 signed out", async () => {
    expect((await get()).status).toBe(401);
    expect((await put({ bodyMassKg: 80, heightM: 1.8, unitPreference: "kg" })).status).toBe(401);
  });
});
