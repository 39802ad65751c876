// Recording in the browser and recording for someone else, in a real Chromium against the production
// build: an athlete records a few seconds with Chromium's test camera and the recording is uploaded as
// the set's clip; the demo coach records a set for one of the team's athletes, which becomes the
// athlete's set, on their list and on the coach's. Demo data from dev/demo/seed.ts.
import type { Browser, Page } from "playwright-core";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { DEMO_ATHLETES, DEMO_COACH, DEMO_PASSWORD, DEMO_TEAM_ID, seedDemoData } from "@/dev/demo/seed";
import { ensureClip } from "@/tests/fixtures/clips/generate-clip";
import { launchBrowser } from "./browser";

const baseUrl = inject("baseUrl");
const databaseUrl = inject("databaseUrl");
const SOFT = { waitUntil: "commit" } as const;
const SET_URL = /\/app\/sets\/[0-9a-f-]{36}$/;

let browser: Browser;
let db: pg.Client;

beforeAll(async () => {
  await seedDemoData(databaseUrl);
  db = new pg.Client({ connectionString: databaseUrl });
  await db.connect();
  browser = await launchBrowser({ fakeCamera: true });
});

afterAll(async () => {
  await browser?.close();
  await db?.end();
});

async function signedInPage(person: { email: string }): Promise<Page> {
  const context = await browser.newContext({ baseURL: baseUrl, viewport: { width: 1100, height: 900 } });
  const page = await context.newPage();
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill(person.email);
  await page.getByLabel("Password").fill(DEMO_PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL("**/app/**", SOFT);
  return page;
}

async function fillDetails(page: Page): Promise<void> {
  await page.getByLabel("Load").fill("150");
  await page.getByLabel("Reps").fill("3");
  await page.getByLabel("RPE").fill("8");
}

describe("recording and recording for an athlete", () => {
  it("records a clip with the camera, uploads it and opens the new set", { timeout: 180_000 }, async () => {
    // Tobin: the demo coach comps his membership, so his uploads are never paused (dev/demo/seed-billing.ts).
    const athlete = DEMO_ATHLETES[0];
    const page = await signedInPage(athlete);
    try {
      await page.goto("/app/sets/new");
      await fillDetails(page);
      await page.getByRole("button", { name: "Record with the camera" }).click();
      await page.getByRole("button", { name: "Start recording" }).click();
      await page.waitForTimeout(3000);
      await page.getByRole("button", { name: "Stop recording" }).click();
      await expect(page.getByTestId("clip-facts").textContent({ timeout: 30_000 })).resolves.toMatch(/^recorded-set\.(webm|mp4) — /);
      await page.getByRole("button", { name: "Save and upload" }).click();
      await page.waitForURL(SET_URL, { ...SOFT, timeout: 60_000 });
      const setId = page.url().split("/").pop() as string;
      const { rows } = await db.query("select athlete_id, created_by, clip_status, clip_size_bytes from sets where id = $1", [setId]);
      expect(rows[0]).toMatchObject({ athlete_id: athlete.id, created_by: athlete.id, clip_status: "uploaded" });
      expect(Number(rows[0].clip_size_bytes)).toBeGreaterThan(0);
      // The test camera films no lifter and no plate: the analysis step opens on the first frame and says what to do.
      await page.getByTestId("plate-marker").waitFor({ timeout: 120_000 });
      await expect(page.getByText("Tap the centre of the plate on the first frame.").isVisible()).resolves.toBe(true);
    } finally {
      await page.context().close();
    }
  });

  it("lets the coach record a set for an athlete of the team, which is the athlete's", { timeout: 180_000 }, async () => {
    const athlete = DEMO_ATHLETES[3];
    const clip = await ensureClip({ width: 640, height: 360, durationS: 3 });
    const coach = await signedInPage(DEMO_COACH);
    let setId: string;
    try {
      await coach.goto("/app/sets/new");
      await coach.getByLabel("Athlete").selectOption(`${DEMO_TEAM_ID}/${athlete.id}`);
      // The set is filed under the athlete's team: no team to choose.
      await expect(coach.getByLabel("Team").count()).resolves.toBe(0);
      await fillDetails(coach);
      await coach.getByLabel("Clip").setInputFiles(clip.videoPath);
      await coach.getByTestId("clip-facts").waitFor();
      await coach.getByRole("button", { name: "Save and upload" }).click();
      await coach.waitForURL(SET_URL, { ...SOFT, timeout: 60_000 });
      setId = coach.url().split("/").pop() as string;
      const { rows } = await db.query("select athlete_id, team_id, created_by, clip_status from sets where id = $1", [setId]);
      expect(rows[0]).toEqual({ athlete_id: athlete.id, team_id: DEMO_TEAM_ID, created_by: DEMO_COACH.id, clip_status: "uploaded" });
      await coach.goto("/app/sets");
      await expect(coach.locator(`a[href="/app/sets/${setId}"]`).count()).resolves.toBeGreaterThan(0);
    } finally {
      await coach.context().close();
    }
    const own = await signedInPage(athlete);
    try {
      await own.goto("/app/sets");
      await expect(own.locator(`a[href="/app/sets/${setId}"]`).count()).resolves.toBeGreaterThan(0);
    } finally {
      await own.context().close();
    }
  });
});
