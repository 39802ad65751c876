// The review desk in a real Chromium against the production build: the demo coach finds a waiting set on the desk
// (filtered by athlete through the URL, opened with the keyboard), comments at a moment of the clip, clicks comments
// to seek the player, writes a summary with a cue and sends it; the mail fake receives the e-mail, and the athlete
// follows its link, which marks the review seen and shows the answer. The analysed set is made through the app's own
// routes (clip upload to the S3 fake, then the engine's result on a synthetic track) instead of running the worker.
import { readFileSync } from "node:fs";
import type { Browser, BrowserContext, Page } from "playwright-core";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { z } from "zod";
import { analyseTrack } from "@/lib/analysis/analyse";
import { parseTrack } from "@/lib/analysis/track";
import { CLIP_PART_BYTES } from "@/lib/clips/limits";
import { DEMO_ATHLETES, DEMO_COACH, DEMO_PASSWORD, DEMO_TEAM_ID, seedDemoData } from "@/dev/demo/seed";
import { generateSyntheticSet } from "@/tests/fixtures/synthetic";
import { ensureClip } from "@/tests/fixtures/clips/generate-clip";
import { launchBrowser } from "./browser";

const baseUrl = inject("baseUrl");
const mailUrl = inject("mailUrl");
const databaseUrl = inject("databaseUrl");
const athlete = DEMO_ATHLETES[1];

// Client-side navigations never fire a load event; the URL changing is what to wait for.
const SOFT = { waitUntil: "commit" } as const;

const messagesSchema = z.object({
  messages: z.array(z.object({ to: z.array(z.string()), subject: z.string(), text: z.string() })),
});

let browser: Browser;
let coachContext: BrowserContext;
let athleteContext: BrowserContext;
let coachPage: Page;
let athletePage: Page;
let db: pg.Client;
let setId: string;

/** Signs in through better-auth's route, as the browser's form does, and returns the session cookie. */
async function apiSignIn(email: string): Promise<string> {
  const response = await fetch(`${baseUrl}/api/auth/sign-in/email`, {
    method: "POST",
    headers: { "content-type": "application/json", origin: baseUrl },
    body: JSON.stringify({ email, password: DEMO_PASSWORD }),
  });
  expect(response.status).toBe(200);
  return response.headers
    .getSetCookie()
    .map((c) => c.split(";")[0])
    .join("; ");
}

async function api<T>(cookie: string, path: string, body: unknown, expected = 200): Promise<T> {
  const response = await fetch(`${baseUrl}${path}`, {
    method: "POST",
    headers: { "content-type": "application/json", origin: baseUrl, cookie },
    body: JSON.stringify(body),
  });
  expect(response.status, `${path}: ${await response.clone().text()}`).toBe(expected);
  return (await response.json()) as T;
}

/** A set of the athlete's with its clip uploaded (multipart, straight to storage) and an analysis saved. */
async function createAnalysedSet(cookie: string): Promise<string> {
  const { set } = await api<{ set: { id: string } }>(
    cookie,
    "/api/sets",
    { teamId: DEMO_TEAM_ID, sessionDate: "2026-03-02", lift: "squat", loadKg: 150, reps: 3, rpe: 8, cameraView: "side" },
    201,
  );
  const bytes = readFileSync((await ensureClip({ width: 640, height: 360, durationS: 12 })).videoPath);
  const clipPath = `/api/sets/${set.id}/clip`;
  const { upload } = await api<{ upload: { uploadId: string; partCount: number } }>(cookie, clipPath, { sizeBytes: bytes.length, contentType: "video/mp4" }, 201);
  const numbers = Array.from({ length: upload.partCount }, (_, i) => i + 1);
  const { parts } = await api<{ parts: { partNumber: number; url: string }[] }>(cookie, `${clipPath}/parts`, { uploadId: upload.uploadId, partNumbers: numbers });
  const etags = [];
  for (const part of parts) {
    const chunk = bytes.subarray((part.partNumber - 1) * CLIP_PART_BYTES, part.partNumber * CLIP_PART_BYTES);
    const put = await fetch(part.url, { method: "PUT", body: new Uint8Array(chunk) });
    expect(put.status).toBe(200);
    etags.push({ partNumber: part.partNumber, etag: put.headers.get("etag") as string });
  }
  await api(cookie, `${clipPath}/complete`, { uploadId: upload.uploadId, parts: etags });
  // Without noise the track's frames fall exactly on the clip's 30 fps frames, as a real analysis of this clip would.
  const { track } = generateSyntheticSet({ lift: "squat", seed: 7, reps: 3, view: "side", fps: 30, noise: "none" });
  const result = analyseTrack(parseTrack(track), { includeFrames: true, loadKg: 150 });
  await api(cookie, `/api/sets/${set.id}/analysis`, { model: { id: "movenet-lightning", version: "test" }, calibration: track.calibration, result, track }, 201);
  return set.id;
}

async function signIn(page: Page, email: string): Promise<void> {
  await page.goto("/sign-in");
  await page.getByLabel("E-mail").fill(email);
  await page.getByLabel("Password").fill(DEMO_PASSWORD);
  await page.getByRole("button", { name: "Sign in" }).click();
  await page.waitForURL("**/app/**", SOFT);
}

/** Polls the mail fake until a mail to `address` links to this set's review. */
async function reviewLink(address: string): Promise<string> {
  const url = new URL(`api/messages?to=${encodeURIComponent(address)}`, mailUrl);
  const pattern = new RegExp(`https?://\\S+/app/sets/${setId}/review`);
  for (let attempt = 0; attempt < 50; attempt += 1) {
    const { messages } = messagesSchema.parse(await (await fetch(url)).json());
    const link = messages.map((m) => pattern.exec(m.text)?.[0]).find(Boolean);
    if (link) return link;
    await new Promise((resolve) => setTimeout(resolve, 200));
  }
  throw new Error(`no review mail reached ${address}`);
}

async function playerTimeS(page: Page): Promise<number> {
  return Number(await page.getByTestId("player-frame").getAttribute("data-time-s"));
}

/** Clicks a comment's moment and waits until the player shows the frame nearest to it. */
async function seekBy(page: Page, commentText: string, expectedTimeS: number, toleranceS: number): Promise<number> {
  const comment = page.getByTestId("comment").filter({ hasText: commentText });
  await comment.getByTestId("comment-seek").click();
  await page.waitForFunction(
    ([target, tolerance]) => {
      const frame = document.querySelector("[data-testid=player-frame]");
      return frame !== null && Math.abs(Number(frame.getAttribute("data-time-s")) - target) <= tolerance;
    },
    [expectedTimeS, toleranceS] as const,
  );
  return playerTimeS(page);
}

beforeAll(async () => {
  await seedDemoData(databaseUrl);
  db = new pg.Client({ connectionString: databaseUrl });
  await db.connect();
  const athleteCookie = await apiSignIn(athlete.email);
  setId = await createAnalysedSet(athleteCookie);
  // Two questions from the athlete at two moments, for the coach to jump between.
  for (const [body, timeS, frameIndex] of [["Depth here?", 1.0, 30], ["Knees cave at this point?", 3.0, 90]] as const) {
    await api(athleteCookie, `/api/sets/${setId}/comments`, { body, timeS, frameIndex }, 201);
  }
  browser = await launchBrowser();
  coachContext = await browser.newContext({ baseURL: baseUrl, viewport: { width: 1400, height: 1000 } });
  athleteContext = await browser.newContext({ baseURL: baseUrl, viewport: { width: 390, height: 844 }, isMobile: true });
  coachPage = await coachContext.newPage();
  athletePage = await athleteContext.newPage();
  await signIn(coachPage, DEMO_COACH.email);
  await signIn(athletePage, athlete.email);
});

afterAll(async () => {
  await browser?.close();
  await db?.end();
});

describe("review desk", () => {
  it("lists the waiting set for the coach, filtered through the URL, and opens it from the keyboard", async () => {
    await coachPage.goto("/app/desk");
    const row = coachPage.locator(`[data-testid=desk-row-link][data-set-id="${setId}"]`);
    await row.waitFor();
    const status = coachPage.locator("tr", { has: row }).getByTestId("review-status");
    await expect(status.getAttribute("data-status")).resolves.toBe("waiting");

    await coachPage.getByLabel("Athlete").selectOption({ label: athlete.name });
    await coachPage.waitForURL((url) => url.searchParams.get("athlete") === athlete.id, SOFT);
    // Only this athlete's open sets remain (the demo leaves some of theirs waiting too), the oldest, ours, first.
    await coachPage.waitForFunction((name) => {
      const links = [...document.querySelectorAll("[data-testid=desk-row-link]")];
      return links.length > 0 && links.every((link) => link.textContent?.includes(name));
    }, athlete.name);
    await expect(coachPage.locator("[data-testid=desk-row-link]").first().getAttribute("data-set-id")).resolves.toBe(setId);

    // Out of the filter box first: keys typed into a form control are the control's.
    await coachPage.getByRole("heading", { level: 1 }).click();
    await coachPage.keyboard.press("j");
    await coachPage.keyboard.press("Enter");
    await coachPage.waitForURL((url) => url.pathname === `/app/sets/${setId}/review`, SOFT);
    await coachPage.locator("[data-testid=review-status][data-status=in_review]").waitFor();
    const { rows } = await db.query("select status, started_by from set_reviews where set_id = $1", [setId]);
    expect(rows).toEqual([{ status: "in_review", started_by: DEMO_COACH.id }]);
    await expect(coachPage.getByTestId("cautions").textContent()).resolves.toMatch(/not medical advice/);
  });

  it("pins the coach's comment to the player's frame and seeks the player when a comment is clicked", async () => {
    await coachPage.getByTestId("player-frame").waitFor({ timeout: 60_000 });
    // One frame at 30 fps is 1/30 s: the player shows the analysed frame nearest to the comment's time.
    const atQuestion = await seekBy(coachPage, "Knees cave", 3.0, 1 / 30);
    await coachPage.getByLabel(/Comment at/).fill("Hips rise before the bar here");
    await coachPage.getByRole("button", { name: "Post comment" }).click();
    const mine = coachPage.getByTestId("comment").filter({ hasText: "Hips rise before the bar here" });
    await mine.waitFor();
    const { rows } = await db.query("select time_s, frame_index from set_comments where set_id = $1 and author_id = $2", [setId, DEMO_COACH.id]);
    expect(rows).toHaveLength(1);
    expect(rows[0].time_s).toBeCloseTo(atQuestion, 4);
    await expect(coachPage.getByTestId("player-frame").getAttribute("data-frame-index")).resolves.toBe(String(rows[0].frame_index));

    await seekBy(coachPage, "Depth here?", 1.0, 1 / 30);
    const back = await seekBy(coachPage, "Hips rise before the bar here", rows[0].time_s, 1e-4);
    expect(back).toBeCloseTo(rows[0].time_s, 4);
  });

  it("sends the summary with a cue, and the athlete gets the e-mail", async () => {
    await coachPage.getByLabel("What you saw").fill("Solid depth on every rep; the bar drifts forward out of the hole on rep 3.");
    await coachPage.getByRole("button", { name: "Add a cue" }).click();
    await coachPage.getByLabel("Cue 1: what to change").fill("Drive the upper back into the bar out of the hole");
    await coachPage.getByLabel("Cue 1: drill or accessory").fill("Pause squats, 2 s at the bottom");
    await coachPage.getByLabel("Cue 1: priority").selectOption("high");
    await coachPage.getByRole("button", { name: "Send to athlete" }).click();
    await expect(coachPage.getByTestId("summary-notice").textContent()).resolves.toMatch(/e-mail/);
    await coachPage.locator("[data-testid=review-status][data-status=answered]").waitFor();
    const link = await reviewLink(athlete.email);
    expect(new URL(link).pathname).toBe(`/app/sets/${setId}/review`);
  });

  it("shows the athlete the answer from the mailed link and marks the review seen", async () => {
    const link = await reviewLink(athlete.email);
    await athletePage.goto(new URL(link).pathname);
    await athletePage.locator("[data-testid=review-status][data-status=seen]").waitFor();
    const read = athletePage.getByTestId("summary-read");
    await expect(read.textContent()).resolves.toContain("bar drifts forward");
    await expect(read.textContent()).resolves.toContain("Pause squats, 2 s at the bottom");
    await athletePage.getByTestId("comment").filter({ hasText: "Hips rise before the bar here" }).waitFor();
    await expect(athletePage.getByRole("button", { name: "Send to athlete" }).count()).resolves.toBe(0);
    const { rows } = await db.query("select status, seen_at is not null as seen from set_reviews where set_id = $1", [setId]);
    expect(rows).toEqual([{ status: "seen", seen: true }]);

    await coachPage.goto("/app/desk?status=seen");
    await coachPage.locator(`[data-testid=desk-row-link][data-set-id="${setId}"]`).waitFor();
  });
});
